import { execFileSync } from 'node:child_process'
import path from 'node:path'
import { expect, test, type Page } from '@playwright/test'
import pg from 'pg'
import { DEMO, shot, signIn } from './support/helpers'

// The demo's partially miscible pair (db/seeds/lab-scenario.ts, invented points from published NRTL parameters):
// an engineer sees the three-phase line and the heterogeneous azeotrope; an analyst uploads two-layer samples.
const SYSTEM = 'water / 1-butanol'
const APPROVED = 'SR-31 decanter feed: water/1-butanol at 1 atm'
const examples = path.resolve('docs/examples')
const dbUrl = process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/ebullio_e2e_test'

type Engine = {
  azeotropes: { x1: number; T: number; kind: string; liquidPhases?: [number, number] }[]
  threePhase: { T: number; x1I: number; x1II: number; y1: number } | null
}

/** The engine's numbers for the approved version's recommended fit at P (Pa), computed outside the browser. */
async function engineNumbers(P: number): Promise<Engine> {
  const client = new pg.Client({ connectionString: dbUrl })
  await client.connect()
  try {
    const r = await client.query(
      `select f.activity from data_set d join fit f on f.id = d.recommended_fit_id where d.title = $1 and d.state = 'approved'`,
      [APPROVED],
    )
    const out = execFileSync('node_modules/.bin/tsx', [
      'tests/e2e/support/engine-water-butanol.ts',
      JSON.stringify(r.rows[0].activity),
      String(P),
    ])
    return JSON.parse(out.toString()) as Engine
  } finally {
    await client.end()
  }
}

const numbers = (s: string) => [...s.matchAll(/-?\d+\.\d+/g)].map((m) => Number(m[0]))

async function snapTop(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0))
  await shot(page, name)
}

test('an engineer opens the partially miscible system and reads the three-phase line and the heterogeneous azeotrope', async ({
  page,
}) => {
  const engine = await engineNumbers(101325)
  expect(engine.azeotropes.map((a) => a.kind)).toEqual(['heterogeneous'])
  const az = engine.azeotropes[0]
  const tp = engine.threePhase!

  await signIn(page, DEMO.engineer)
  await page.getByRole('link', { name: 'Approved systems' }).first().click()
  await page.getByTestId('catalogue-search').fill('butanol')
  const table = page.getByTestId('catalogue-table')
  await expect(table).toContainText(SYSTEM)
  const mark = table.getByTestId('catalogue-partially-miscible')
  await expect(mark).toContainText('Partially miscible')
  // the catalogue's three-phase temperature is the engine's, as shown (°C, two decimals)
  await expect(mark).toContainText(`${(tp.T - 273.15).toFixed(2)} °C`)
  await snapTop(page, 'lle-01-catalogue')
  await table.getByRole('link', { name: SYSTEM }).click()
  await expect(page.getByTestId('system-title')).toHaveText(SYSTEM)

  // One azeotrope, heterogeneous: vapour and temperature as the engine computes them for the same inputs.
  await expect(page.getByTestId('azeotrope-item')).toHaveCount(1)
  const [y1, tC] = numbers((await page.getByTestId('azeotrope-value').textContent()) ?? '')
  expect(y1).toBeCloseTo(az.x1, 3)
  expect(tC).toBeCloseTo(az.T - 273.15, 2)
  // and near the handbook: about 92.7 °C at 1 atm (CRC Handbook azeotrope table; from memory)
  expect(Math.abs(tC - 92.7)).toBeLessThan(1)
  const kind = (await page.getByTestId('azeotrope-kind').textContent()) ?? ''
  expect(kind).toContain('heterogeneous')
  expect(kind).toContain('decanter')
  const [xI, xII] = numbers(kind)
  expect(xI).toBeCloseTo(az.liquidPhases![0], 3)
  expect(xII).toBeCloseTo(az.liquidPhases![1], 3)

  // The three-phase line: the note above the plots and the plots' own descriptions carry the engine's numbers.
  const note = (await page.getByTestId('three-phase-note').textContent()) ?? ''
  const [nI, nII, nT, nY] = numbers(note.slice(note.indexOf('Liquids')))
  expect([nI, nII, nY]).toEqual([tp.x1I, tp.x1II, tp.y1].map((v) => Number(v.toFixed(3))))
  expect(nT).toBeCloseTo(tp.T - 273.15, 2)
  const txy = page.getByTestId('plot-txy')
  await expect(txy).toContainText(`three-phase line at ${(tp.T - 273.15).toFixed(2)} °C`)
  await expect(txy).toContainText('two-liquid region shaded')
  await expect(page.getByTestId('plot-xy').first()).toContainText(
    `flat from x₁ = ${tp.x1I.toFixed(3)} to ${tp.x1II.toFixed(3)} where the liquid boils as two layers`,
  )
  await snapTop(page, 'lle-02-system-diagrams')
  await txy.scrollIntoViewIfNeeded()
  await txy.screenshot({ path: 'tests/artifacts/screens/lle-03-txy.png' })
})

test('an analyst uploads a run file whose samples split into two liquid layers', async ({ page }) => {
  await signIn(page, DEMO.analyst)
  await page.goto('/datasets')
  await page.getByTestId('new-dataset').click()
  await page.getByLabel('Title').fill(`Decanter feed repeat ${Date.now().toString(36)}`)
  await page.getByLabel('Binary system').fill('butanol')
  await page.getByRole('option', { name: /water \/ 1-butanol/ }).click()
  await page.getByTestId('create-dataset').click()

  const dialog = page.getByTestId('upload-dialog')
  await expect(dialog).toBeVisible()
  await dialog.getByTestId('upload-kind').getByText('Run file').click()
  await dialog.getByTestId('file-input').setInputFiles(path.join(examples, 'run-water-1-butanol-two-layers.csv'))
  await expect(dialog.getByTestId('preview-samples')).toContainText('WB-12')
  // five samples boiled as two layers (docs/examples, generated where the published model splits the liquid)
  await expect(dialog.getByTestId('preview-two-layers')).toHaveCount(5)
  await expect(dialog.getByTestId('preview-two-layers').first()).toContainText(/upper 0\.\d{4}, lower 0\.9\d{3}/)
  await expect(dialog.locator('td[data-problem="error"]')).toHaveCount(0)
  await shot(page, 'lle-04-upload-preview')
  if (await dialog.getByTestId('ack-warnings').count()) await dialog.getByText(/I have checked the/).click()
  await dialog.getByTestId('commit-upload').click()
  await expect(dialog).toBeHidden()

  const points = page.getByTestId('points-table')
  await expect(points.locator('tbody tr')).toHaveCount(12)
  await expect(points.getByTestId('point-two-layers')).toHaveCount(5)
  await points.locator('tbody tr').filter({ hasText: 'WB-08' }).click()
  const details = page.getByTestId('point-layers')
  await expect(details).toContainText('two layers in the still')
  const [lI, , lII] = numbers((await details.textContent()) ?? '')
  expect(lI).toBeLessThan(lII)
  await shot(page, 'lle-05-points-two-layers')
})
