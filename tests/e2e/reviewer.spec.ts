import { expect, test } from '@playwright/test'
import { DEMO, signIn } from './support/helpers'
import { SUBMITTED_FOR_REVIEW, clickLiquidPoint, openDataSet, snap } from './support/lab'

// Journey 2 works on a submitted data set of its own in the demo scenario (the lead chemist approves another one), so it depends on no other journey.
test('a reviewer comments on one point, chosen on the T–x–y plot', async ({ page }) => {
  await signIn(page, DEMO.reviewer)
  await expect(page.getByRole('button', { name: 'New data set' })).toHaveCount(0)
  await openDataSet(page, SUBMITTED_FOR_REVIEW)
  await expect(page.getByTestId('open-upload')).toHaveCount(0)
  await expect(page.getByTestId('open-approve')).toHaveCount(0)
  await expect(page.getByTestId('threads-panel')).toContainText('Which TCD calibration was used for water?')

  // The third point, read from the table, then found and clicked on the plot.
  const row = page.getByTestId('points-table').locator('tbody tr').nth(2)
  const label = (await row.locator('td').nth(1).innerText()).trim()
  const x1 = Number((await row.locator('td').nth(4).innerText()).split('±')[0])
  await clickLiquidPoint(page, page.getByTestId('txy-plot'), label, x1)
  const details = page.getByTestId('point-details')
  await expect(details).toContainText(label)
  await expect(page.getByText(`New thread on Point 3 (${label})`)).toBeVisible()

  const text = `The liquid sample of ${label} sits above the bubble line of both fits; please check the thermometer reading.`
  await page.getByLabel(/New thread on/).fill(text)
  await snap(page, 'lab-10-reviewer-comment-on-point')
  await page.getByTestId('post-comment').click()
  await expect(page.getByTestId('threads-panel')).toContainText(text)
  await expect(page.getByTestId('threads-panel').locator('article').filter({ hasText: text })).toContainText(
    `Point 3 (${label})`,
  )
  await expect(page.getByLabel(/New thread on/)).toHaveValue('')

  await page.getByRole('link', { name: 'My open threads' }).click()
  await expect(page.getByTestId('my-threads')).toContainText(text)
  await snap(page, 'lab-11-my-open-threads')
  // The thread opens beside its point.
  await page.getByTestId('my-threads').getByText(text).click()
  await expect(page.getByTestId('point-details')).toContainText(label)
})
