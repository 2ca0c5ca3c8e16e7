import { expect as baseExpect, test, type Page } from '@playwright/test'
import { DEMO, shot, signIn } from './support/helpers'

// An analyst chooses a Hayden–O'Connell virial vapour for a new methanol/water data set (the demo's methanol and
// water carry RD and η, db/seeds/demo-properties.ts): the header then names the correlation. A hostile source of
// η12 stays text. The numbers behind it are checked in packages/thermo and apps/api tests.
const run = Date.now().toString(36)
const expect = baseExpect.configure({ timeout: 30_000 })
test.describe.configure({ timeout: 120_000 })

async function pick(page: Page, label: string, text: string, option: string | RegExp) {
  await page.getByLabel(label, { exact: true }).fill(text)
  await page.getByRole('option', { name: option }).first().click()
}

test("an analyst chooses a Hayden–O'Connell vapour with η12 and its source, and the data set says so", async ({
  page,
}) => {
  await signIn(page, DEMO.analyst)
  await page.goto('/datasets/new')
  await page.getByLabel('Title').fill(`HOC vapour ${run}`)
  await pick(page, 'Binary system', 'methanol', /methanol \/ water/)
  await page.locator('#nd-p').fill('60')
  await page.locator('#nd-p').press('Tab')
  await page.getByTestId('vapour-virial').click()
  await expect(page.getByTestId('vapour-tsonopoulos').locator('input')).toBeChecked()
  await expect(page.getByTestId('vapour-eta12')).toHaveCount(0)
  await page.getByTestId('vapour-hayden-oconnell').click()
  await page.getByTestId('vapour-eta12').locator('input').fill('0.5')
  await page.getByTestId('vapour-eta12').locator('input').press('Tab')
  const hostile = '<img src=x onerror=alert(1)> invented for this check'
  await page.getByTestId('vapour-eta12-source').fill(hostile)
  await shot(page, 'hoc-01-vapour-choice')
  await page.getByTestId('create-dataset').click()
  await expect(page.getByTestId('fact-vapour')).toHaveText('virial (Hayden–O’Connell)')
  expect(await page.locator('img[src="x"]').count()).toBe(0)
})

test("the demo's Hayden–O'Connell series states the size of the correction its vapour applies", async ({ page }) => {
  // db/seeds/lab-scenario-vapour.ts: methanol/water at 60 kPa under a HOC vapour (INVENTED points); the server's
  // figures are thermo's vaporCorrectionSize under that vapour (apps/api/test/lab-vapour-correction.test.ts)
  await signIn(page, DEMO.analyst)
  await page.goto('/datasets')
  await page.getByLabel('Search').fill('Vacuum recovery trial')
  await page
    .getByRole('link', { name: /Vacuum recovery trial/ })
    .first()
    .click()
  await page.waitForURL(/\/datasets\/[0-9a-f-]{36}/)
  const id = page.url().match(/\/datasets\/([\w-]+)/)![1]
  const vc = (await (await page.request.get(`/api/data-sets/${id}`)).json()).vapourCorrection
  expect(vc).toMatchObject({ vapour: 'virial', correlation: 'hayden-oconnell', exceeds: false })
  const note = page.getByTestId('vapour-correction-size')
  await expect(note).toContainText('The Hayden–O’Connell virial vapour this data set uses moves its bubble points')
  await expect(note).toContainText(`|ΔT| up to ${vc.maxAbsDT.toFixed(3)} K, |Δy₁| up to ${vc.maxAbsDy.toFixed(4)}`)
  await expect(page.getByTestId('vapour-warning')).toHaveCount(0)
  await shot(page, 'hoc-02-correction-size')
})
