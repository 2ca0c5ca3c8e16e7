import { expect as baseExpect, test, type Page } from '@playwright/test'
import { execFileSync } from 'node:child_process'
import { DEMO, shot, signIn } from './support/helpers'
import { snap } from './support/lab'

// An isothermal P–x–y series typed into the grid (INVENTED points of the demo's acetone/methanol Wilson model at
// 50 °C, one raised by 0.5 kPa), fitted on pressures, with ΔP residuals and the data-quality score on screen; the
// numbers on screen are compared with the engine's own for the same inputs (tests/e2e/support/engine-isothermal.ts).
const run = Date.now().toString(36)
const expect = baseExpect.configure({ timeout: 30_000 })
test.describe.configure({ timeout: 180_000 })

interface Engine {
  typed: { t: string; p: string; x1: string; y1: string; up: string }[]
  rmsP: number
  dP: number[]
  quality: number
  maxSigmaP: number
}
const engine = (): Engine =>
  JSON.parse(execFileSync('node_modules/.bin/tsx', ['tests/e2e/support/engine-isothermal.ts'], { encoding: 'utf8' }))

async function pick(page: Page, label: string, text: string, option: string | RegExp) {
  await page.getByLabel(label, { exact: true }).fill(text)
  await page.getByRole('option', { name: option }).first().click()
}

test('an analyst records an isothermal P–x–y series, fits it on pressures and reads ΔP and the quality score', async ({
  page,
}) => {
  const e = engine()
  await signIn(page, DEMO.analyst)
  await page.goto('/datasets/new')
  await page.getByLabel('Title').fill(`Static cell at 50 °C ${run}`)
  await pick(page, 'Binary system', 'acetone', /acetone \/ methanol/)
  await page.getByTestId('origin-other-method').click()
  await page.getByTestId('origin-method').fill('Static cell; liquid made up by weighing, vapour by GC')
  await page.getByTestId('layout').click()
  await page.getByRole('option', { name: 'P–x–y at constant temperature' }).click()
  // isothermal: the temperature of the series replaces the nominal pressure
  await expect(page.locator('#nd-p')).toHaveCount(0)
  await page.locator('#nd-t').fill('50')
  await page.locator('#nd-t').press('Tab')
  await expect(page.getByTestId('vapour-ideal').locator('input')).toBeChecked()
  await shot(page, 'iso-01-new-isothermal')
  await page.getByTestId('create-dataset').click()

  const grid = page.getByTestId('points-grid')
  await expect(grid).toBeVisible()
  await page.getByRole('button', { name: 'Add 5 rows' }).click()
  for (const [i, r] of e.typed.entries()) {
    for (const k of ['t', 'p', 'x1', 'y1', 'up'] as const) await page.getByTestId(`cell-${i + 1}-${k}`).fill(r[k])
  }
  await shot(page, 'iso-02-grid')
  await page.getByTestId('points-save').click()
  await expect(page.getByText('Points stored')).toBeVisible()
  await expect(page.getByTestId('record-kind')).toContainText('P–x–y at constant temperature')
  // the header states the condition and the vapour model of the series
  await expect(page.getByTestId('fact-temperature')).toHaveText('50.00 °C (isothermal)')
  await expect(page.getByTestId('fact-vapour')).toHaveText('ideal')

  await page.getByTestId('run-fits').click()
  const wilson = page.getByTestId('fit-wilson')
  await expect(wilson).toBeVisible()
  await expect(wilson.getByTestId('fit-method')).toContainText('on ΔP and Δy₁ · ideal vapour')
  // RMS ΔP on screen (kPa, 3 decimals) is the engine's for the same points
  await expect(wilson.getByTestId('fit-rms-p')).toHaveText((e.rmsP / 1000).toFixed(3))
  await expect(page.getByTestId('txy-plot')).toContainText('P–x–y diagram')
  await expect(page.getByTestId('residual-p')).toBeVisible()
  await expect(page.getByTestId('residual-t')).toHaveCount(0)
  // the raised point's residual is about +0.5 kPa (the fit leans a little towards it)
  expect(e.dP[4]).toBeGreaterThan(300)

  await shot(page, 'iso-03-pxy-and-dp')
  // The fit's ±2σ band is the P–x–y band at the series' temperature, under its vapour model; the server's band is
  // the engine's for the same points.
  const unc = page.getByTestId('uncertainty-panel')
  await unc.getByTestId('band-toggle').click()
  await expect(unc.getByTestId('band-note')).toContainText("P–x–y band at 50.00 °C, the data set's temperature.")
  await expect(unc.getByTestId('band-note')).toContainText('Vapour: ideal gas (modified Raoult’s law).')
  await expect(page.getByTestId('curves-drawn')).toContainText('shaded: ±2σ band of')
  await expect(unc.getByTestId('suggestions-isothermal')).toContainText('not offered for isothermal data')
  const dataSetId = page.url().match(/\/datasets\/([\w-]+)/)![1]
  const detail = await (await page.request.get(`/api/data-sets/${dataSetId}`)).json()
  const fitId = detail.fits.find((f: { model: string }) => f.model === 'wilson').id
  const band = await (await page.request.get(`/api/data-sets/${dataSetId}/fits/${fitId}/band`)).json()
  expect(band.kind).toBe('isothermal')
  expect(Math.abs(Math.max(...band.sigmaP) - e.maxSigmaP)).toBeLessThan(1e-3 * e.maxSigmaP)
  await snap(page, 'iso-03b-pxy-band')
  await page.getByRole('tab', { name: 'Consistency' }).click()
  await page.getByTestId('run-consistency').click()
  const q = page.getByTestId('quality-score')
  await expect(q).toBeVisible()
  await expect(q.getByTestId('quality-figure')).toHaveText(e.quality.toFixed(2))
  await expect(q.getByTestId('quality-test-area')).toBeVisible()
  await q.scrollIntoViewIfNeeded()
  // the point test on isothermal data fits P–x, and says so
  await expect(page.getByText('Model fitted to P–x')).toBeVisible()
  await expect(page.getByText('Model fitted to T–x')).toHaveCount(0)
  await shot(page, 'iso-04-quality-score')
})
