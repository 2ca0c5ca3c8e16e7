import { expect as baseExpect, test, type Page } from '@playwright/test'
import path from 'node:path'
import { DEMO, shot, signIn } from './support/helpers'

// A lab's day without API calls: a new ethanol/water system from its components, data that did not come
// through the GC (typed into the grid; a literature point sheet, docs/examples — INVENTED points generated from
// the demo's acetone/methanol Wilson model), deleting a draft, boiling points and instrument checks.
// The typed ethanol/water points are INVENTED, shaped like the published diagram (from memory).
const examples = path.resolve('docs/examples')
const run = Date.now().toString(36)
// This machine is shared and slow at times: screens get longer than the default 10 s to settle.
const expect = baseExpect.configure({ timeout: 30_000 })

async function pick(page: Page, label: string, text: string, option: string | RegExp) {
  await page.getByLabel(label, { exact: true }).fill(text)
  await page.getByRole('option', { name: option }).first().click()
}

test.describe.configure({ timeout: 180_000 })

test('an analyst creates ethanol/water from its components, types points measured by another method, and imports literature data', async ({
  page,
}) => {
  await signIn(page, DEMO.analyst)
  await page.goto('/datasets/new')
  await page.getByLabel('Title').fill(`Refractometry series ${run}`)
  await page.getByTestId('open-new-system').click()
  const dlg = page.getByTestId('system-dialog')
  // Typing "ethanol" offers ethanol itself first, before methanol (which merely contains the word).
  await dlg.getByLabel('Component 1').fill('ethanol')
  const options = page.getByRole('option')
  await expect(options.first()).toContainText('ethanol', { timeout: 30_000 })
  await expect(options.first()).not.toContainText('methanol')
  await shot(page, 'day-01-component-search') // no scrolling: it would close the suggestion list
  await options.first().click()
  await dlg.getByLabel('Component 2').fill('H2O')
  await page.getByRole('option', { name: /water/ }).first().click()
  // Order chosen the wrong way round first, then swapped.
  await dlg.getByTestId('system-swap').click()
  await expect(dlg.getByTestId('system-preview')).toContainText('water / ethanol')
  await dlg.getByTestId('system-swap').click()
  await expect(dlg.getByTestId('system-preview')).toContainText('ethanol / water')
  await dlg.getByLabel('Note (optional)').fill('Feed of the new recovery column')
  await snap(page, 'day-02-new-system')
  await dlg.getByTestId('system-create').click()
  await expect(dlg).toBeHidden()
  await expect(page.getByLabel('Binary system', { exact: true })).toHaveValue('ethanol / water')

  await page.getByTestId('origin-other-method').click()
  await page
    .getByTestId('origin-method')
    .fill('Refractive index at 25 °C of both phases against a gravimetric calibration')
  await snap(page, 'day-03-new-dataset-origin')
  await page.getByTestId('create-dataset').click()

  // The grid opens at once; one bad cell is named and nothing is stored.
  const grid = page.getByTestId('points-grid')
  await expect(grid).toBeVisible()
  const rows = [
    ['86.4', '101.325', '0.10', '0.44'],
    ['81.5', '101.325', '1.30', '0.575'],
    ['79.3', '101.325', '0.60', '0.70'],
  ]
  for (const [i, [t, p, x, y]] of rows.entries()) {
    await page.getByTestId(`cell-${i + 1}-t`).fill(t)
    await page.getByTestId(`cell-${i + 1}-p`).fill(p)
    await page.getByTestId(`cell-${i + 1}-x1`).fill(x)
    await page.getByTestId(`cell-${i + 1}-y1`).fill(y)
  }
  await page.getByTestId('points-save').click()
  await expect(page.getByTestId('grid-problems')).toContainText('Row 2, column x1: x1 must be between 0 and 1')
  await snap(page, 'day-04-grid-problem')
  await page.getByTestId('cell-2-x1').fill('0.30')
  await page.getByTestId('points-save').click()
  await expect(page.getByText('Points stored')).toBeVisible()
  await expect(page.getByTestId('fact-origin')).toContainText('measured here by another method')
  await expect(page.getByRole('main')).toContainText('3 (0 excluded)')
  await expect(page.getByTestId('open-upload')).toHaveCount(0)
  await snap(page, 'day-05-typed-points')

  // Literature data: the citation is required, then the point sheet is imported.
  await page.goto('/datasets/new')
  await page.getByLabel('Title').fill(`Literature acetone/methanol ${run}`)
  await pick(page, 'Binary system', 'acetone', /acetone \/ methanol/)
  await page.getByTestId('origin-literature').click()
  await page.getByTestId('create-dataset').click()
  await expect(page.getByText('Enter the authors')).toBeVisible()
  await page.getByTestId('cite-authors').fill('A. Invented, B. Example')
  await page.getByTestId('cite-title').fill('Isobaric vapour–liquid equilibrium of acetone and methanol')
  await page.getByTestId('cite-source').fill('Journal of Invented Data')
  await page.getByTestId('cite-year').fill('1987')
  await page.getByTestId('cite-table').fill('Table 2')
  await snap(page, 'day-06-literature-citation')
  await page.getByTestId('create-dataset').click()
  await expect(page.getByTestId('points-grid')).toBeVisible()
  await page.getByRole('tab', { name: 'Import a point sheet' }).click()
  await page.getByTestId('sheet-file').setInputFiles(path.join(examples, 'points-acetone-methanol-literature.csv'))
  await expect(page.getByTestId('sheet-summary')).toContainText('11 point(s) read')
  await snap(page, 'day-07-point-sheet')
  await page.getByTestId('sheet-commit').click()
  await expect(page.getByText('Points stored')).toBeVisible()
  await expect(page.getByTestId('fact-citation')).toContainText('A. Invented, B. Example (1987)')
  await expect(page.getByTestId('fact-origin')).toContainText('for comparison, not the lab’s own')
  await snap(page, 'day-08-literature-set')
})

test('a draft is deleted by its author after confirming', async ({ page }) => {
  await signIn(page, DEMO.analyst)
  await page.goto('/datasets/new')
  const title = `Scratch ${run}`
  await page.getByLabel('Title').fill(title)
  await pick(page, 'Binary system', 'water', /methanol \/ water/)
  await page.getByTestId('create-dataset').click()
  await page.getByRole('button', { name: 'Close', exact: true }).last().click()
  await expect(page.getByText('Upload GC results')).toBeHidden()
  await page.getByTestId('delete-draft').click()
  await expect(page.getByRole('alertdialog')).toContainText('This cannot be undone')
  await snap(page, 'day-09-delete-draft')
  await page.getByRole('button', { name: 'Delete draft' }).last().click()
  await expect(page.getByText('Draft deleted')).toBeVisible()
  await expect(page).toHaveURL(/\/datasets$/)
})

test('a lead chemist records a pure boiling point and thermometer checks, and marks literature data as the lab’s own', async ({
  page,
}) => {
  await signIn(page, DEMO.lead)
  await page
    .getByRole('complementary', { name: 'Main navigation' })
    .getByRole('link', { name: 'Components and systems' })
    .click()
  await page.getByTestId('component-search').fill('ethanol')
  await page
    .getByTestId('components-table')
    .getByRole('row', { name: /^ethanol/ })
    .click()
  await page.getByTestId('add-pure').click()
  await page.getByRole('spinbutton', { name: /^T \// }).fill('78.45')
  await page.getByRole('spinbutton', { name: /^P \// }).fill('101.325')
  await page.getByLabel('Thermometer').fill('Pt100 T-3')
  await page.getByLabel('Still').fill('Still B')
  await page.getByTestId('pure-save').click()
  // SVNA 7th ed. Table B.2's ethanol set gives 78.20 °C at 101.325 kPa; ΔT shown = measured − correlation.
  await expect(page.getByTestId('pure-dT').first()).toHaveText('+0.25')
  await snap(page, 'day-10-pure-boiling-point')

  await page
    .getByRole('complementary', { name: 'Main navigation' })
    .getByRole('link', { name: 'Instrument checks' })
    .click()
  for (const [i, t] of ['99.98', '100.01', '99.97', '100.02', '100.45'].entries()) {
    await page.getByTestId('check-instrument').fill('T-3')
    if (i === 0) {
      await page.getByLabel('Reference liquid').fill('water')
      await page.getByRole('option', { name: /^water/ }).click()
    }
    await page.getByLabel(/^Boiling T/).fill(t)
    await page.getByLabel(/^Barometer \//).fill('101.325')
    await page.getByTestId('check-at').fill(`2026-11-0${i + 1}T08:00`)
    await page.getByTestId('check-save').click()
    await expect(page.getByTestId('check-series-T-3').getByText(`${i + 1} checks`)).toBeVisible()
  }
  // the thermometer's own chart (the page also charts the demo's GC check standards below it)
  await expect(page.getByTestId('check-series-T-3').getByTestId('control-limits')).toContainText(
    'limits from the first 5 results',
  )
  await snap(page, 'day-11-control-chart')

  await page.goto('/datasets')
  await page.getByLabel('Search').fill(`Literature acetone/methanol ${run}`)
  await page.getByRole('link', { name: `Literature acetone/methanol ${run}` }).click()
  await page.getByTestId('mark-own').click()
  await page.getByTestId('own-reason').fill('The lab measured and published these points itself in 1987.')
  await page.getByTestId('own-save').click()
  await expect(page.getByTestId('fact-origin')).toContainText('counts as the lab’s own measurement')
  await snap(page, 'day-12-own-measurement')
})

async function snap(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0))
  await page.waitForTimeout(200)
  await shot(page, name)
}
