import { expect, test } from '@playwright/test'
import { DEMO, signIn } from './support/helpers'
import { OPEN_DRAFT, openDataSet, snap } from './support/lab'

test('excluding a point marks every older fit and consistency result stale on every screen, and submit is refused until they are re-run', async ({
  page,
}) => {
  test.setTimeout(180_000)
  await signIn(page, DEMO.analyst)
  await openDataSet(page, OPEN_DRAFT)

  // Fresh results on the current points.
  await page.getByTestId('run-fits').click()
  const nrtl = page.getByTestId('fit-nrtl')
  await expect(nrtl).toBeVisible({ timeout: 30_000 })
  await expect(nrtl).toHaveAttribute('data-stale', 'false')
  await page.getByRole('tab', { name: 'Consistency' }).click()
  await page.getByTestId('run-consistency').click()
  const results = page.getByTestId('consistency-result')
  await expect(results.first()).toHaveAttribute('data-stale', 'false', { timeout: 30_000 })
  await page.getByRole('tab', { name: 'Diagrams and fits' }).click()

  // Exclude one point: every result above was computed on other points now.
  const first = page.getByTestId('points-table').locator('tbody tr').first()
  await first.getByTestId('exclude-point').click()
  await page.getByRole('dialog').getByLabel('Reason').fill('Vapour sample lost (check of stale marking)')
  await page.getByRole('dialog').getByRole('button', { name: 'Exclude point', exact: true }).click()
  await expect(first).toContainText('Excluded: Vapour sample lost')

  await expect(nrtl).toHaveAttribute('data-stale', 'true')
  await expect(nrtl.getByTestId('fit-stale')).toContainText(/^Stale: computed on \d+ points on /)
  await expect(page.getByTestId('uncertainty-stale')).toContainText('re-run the fit first')
  await snap(page, 'stale-01-fits-marked-after-exclusion')
  await page.getByRole('tab', { name: 'Consistency' }).click()
  await expect(results.first()).toHaveAttribute('data-stale', 'true')
  await expect(page.getByTestId('consistency-stale').first()).toContainText('Stale: computed on')
  await snap(page, 'stale-02-consistency-marked')

  // Submitting with a stale recommended or shown result is refused by the server, and says what is stale.
  await page.getByTestId('submit').click()
  await page.getByRole('button', { name: 'Submit', exact: true }).click()
  await expect(page.getByText(/Cannot submit.*results computed on other points/)).toBeVisible({ timeout: 20_000 })
  await expect(page.getByTestId('dataset-state')).toContainText(/draft/i)

  // The record tab says the same.
  await page.getByRole('tab', { name: 'Record' }).click()
  const record = page.getByTestId('record-results')
  await expect(record.locator('[data-stale="true"]').first()).toContainText('Stale: computed on')
  await snap(page, 'stale-03-record-tab')
  await page.getByRole('tab', { name: 'Diagrams and fits' }).click()

  // Including the point again restores the point set the results were computed on: nothing is stale.
  await page.getByRole('button', { name: /Include point 1 .* again/ }).click()
  await expect(first).not.toContainText('Excluded')
  await expect(nrtl).toHaveAttribute('data-stale', 'false')
  await expect(page.getByTestId('uncertainty-stale')).toHaveCount(0)
})
