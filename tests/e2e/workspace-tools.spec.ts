import { expect, test } from '@playwright/test'
import { DEMO, signIn } from './support/helpers'
import { OPEN_DRAFT, openDataSet, snap } from './support/lab'

/** A local calendar day as the date inputs take it (YYYY-MM-DD), `days` from today. */
const day = (days: number) => {
  const d = new Date()
  d.setDate(d.getDate() + days)
  return d.toLocaleDateString('en-CA')
}

test('the data sets list filters by the day a data set was created or last changed', async ({ page }) => {
  await signIn(page, DEMO.analyst)
  await page.goto('/datasets')
  const table = page.getByTestId('datasets-table')
  await expect(table).toContainText(OPEN_DRAFT)
  await page.getByTestId('f-date-from').fill(day(1))
  await page.getByTestId('f-date-to').fill(day(0))
  await expect(page.getByTestId('f-date-error')).toHaveText('The last day comes before the first one.')
  await page.getByTestId('f-date-to').fill(day(2))
  await expect(page.getByTestId('f-date-error')).toHaveCount(0)
  await expect(table).toContainText('No data set matches these filters.')
  await page.getByTestId('f-date-kind').click()
  await page.getByRole('option', { name: 'Changed' }).click()
  await page.getByTestId('f-date-from').fill(day(-1))
  await page.getByTestId('f-date-to').fill(day(0))
  await expect(table).toContainText(OPEN_DRAFT)
  await snap(page, 'lab-40-list-date-filter')
})

test('on a draft: NRTL α held or fitted, the ±2σ band, where to measure next, the pure-component check and the details', async ({
  page,
}) => {
  await signIn(page, DEMO.analyst)
  await openDataSet(page, OPEN_DRAFT)

  // NRTL α is checked as it is typed, with the server's own message.
  const alpha = page.locator('#nrtl-alpha')
  await alpha.fill('1.5')
  await alpha.press('Tab')
  await expect(page.getByTestId('nrtl-alpha-error')).toHaveText('NRTL α must be above 0 and at most 1')
  await expect(page.getByTestId('run-fits')).toBeDisabled()
  await alpha.fill('0.3')
  await alpha.press('Tab')
  await expect(page.getByTestId('nrtl-alpha-error')).toHaveCount(0)
  await page.getByTestId('nrtl-fit-alpha').click()
  await expect(page.getByText('start α at')).toBeVisible()
  await page.getByTestId('run-fits').click()
  await expect(page.getByTestId('fit-nrtl')).toContainText('α =')
  await expect(page.getByTestId('fit-nrtl')).not.toContainText('alpha')
  // UNIQUAC is offered; the demo's components carry r and q (sums of UNIFAC groups), so it fits like the others
  // (the refusal without r and q is checked in apps/api/test/lab-uniquac.test.ts).
  await page.locator('#m-uniquac').click()
  await page.getByTestId('run-fits').click()
  await expect(page.getByTestId('fit-uniquac')).toContainText('a12 =')
  await expect(page.getByTestId('fit-run-error')).toHaveCount(0)
  await page.locator('#m-uniquac').click()
  await expect(page.getByTestId('fit-wilson')).toBeVisible()

  // The band of the chosen fit and the compositions to measure next.
  const unc = page.getByTestId('uncertainty-panel')
  await expect(unc.getByTestId('next-compositions').locator('li')).toHaveCount(5)
  await expect(unc).toContainText('would narrow')
  await expect(unc.getByTestId('uncertainty-heading')).toContainText('by “Sharpest curve”')
  await expect(unc).toContainText('Largest uncertainty of the predicted vapour composition.')
  await unc.getByTestId('criterion-d-optimal').click()
  await expect(unc.getByTestId('uncertainty-heading')).toContainText('by “Best-pinned parameters”')
  await expect(unc.getByTestId('next-compositions').locator('li')).toHaveCount(5)
  await unc.getByTestId('criterion-sigma-y').click()
  await expect(unc.getByTestId('uncertainty-heading')).toContainText('by “Sharpest curve”')
  await unc.getByTestId('band-toggle').click()
  await expect(unc.getByTestId('band-note')).toContainText('±2σ')
  await expect(page.getByTestId('curves-drawn')).toContainText('shaded: ±2σ band of')
  await expect(page.getByTestId('curves-drawn')).toContainText('where to measure next')
  await page.getByTestId('txy-plot').scrollIntoViewIfNeeded()
  await page.waitForTimeout(400)
  await page.getByTestId('txy-plot').screenshot({ path: 'tests/artifacts/screens/lab-41-band-and-next.png' })
  await snap(page, 'lab-42-uncertainty-panel')

  // This draft has no pure-component point and no measured boiling point: nothing to compare.
  await page.getByRole('tab', { name: 'Consistency' }).click()
  await expect(page.getByTestId('pure-check-empty')).toContainText('Nothing to compare')
  await snap(page, 'lab-43-pure-check-empty')
  await page.getByRole('tab', { name: 'Diagrams and fits' }).click()

  // Details: a field message from the shared schema, then a save.
  await page.getByTestId('open-metadata').click()
  const edit = page.getByTestId('metadata-dialog')
  await edit.getByLabel('Title').fill(' ')
  await edit.getByTestId('save-metadata').click()
  await expect(edit.getByText('Enter a title')).toBeVisible()
  await edit.getByLabel('Title').fill(OPEN_DRAFT)
  await edit.getByLabel('Project or campaign reference').fill('KES-2026-03/feed')
  await edit.getByTestId('save-metadata').click()
  await expect(edit).toBeHidden()
  await expect(page.getByTestId('fact-project')).toHaveText('KES-2026-03/feed')

  // Someone else saves in between: the stale write is refused and the dialog offers to reload.
  await page.getByTestId('open-metadata').click()
  await edit.getByLabel('Project or campaign reference').fill('mine, typed second')
  const id = page.url().split('/datasets/')[1].split(/[?#]/)[0]
  const current = await (await page.request.get(`/api/data-sets/${id}`)).json()
  const other = await page.request.patch(`/api/data-sets/${id}`, {
    headers: { Origin: new URL(page.url()).origin },
    data: { rowVersion: current.rowVersion, projectRef: 'saved by a colleague first' },
  })
  expect(other.status()).toBe(200)
  await edit.getByTestId('save-metadata').click()
  await expect(edit.getByTestId('stale-write')).toContainText('changed by someone else since you loaded it')
  await snap(page, 'lab-44-stale-write')
  await edit.getByTestId('stale-reload').click()
  await expect(edit.getByTestId('stale-write')).toHaveCount(0)
  await expect(edit.getByLabel('Project or campaign reference')).toHaveValue('saved by a colleague first')
  await edit.getByRole('button', { name: 'Cancel' }).click()
  await expect(page.getByTestId('fact-project')).toHaveText('saved by a colleague first')
})
