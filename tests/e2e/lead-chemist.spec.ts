import { expect, test } from '@playwright/test'
import { DEMO, DEMO_PASSWORD, signIn } from './support/helpers'
import { SUBMITTED_WITH_THREADS, snap } from './support/lab'

// Journey 3 works on the demo scenario's submitted data set (an analyst's, so the four-eyes rule allows it).
test('a lead chemist resolves the thread, marks the recommended fit and approves with a password', async ({ page }) => {
  await signIn(page, DEMO.lead)
  await page.getByRole('link', { name: 'Awaiting signature' }).first().click()
  const queue = page.getByTestId('approvals-table')
  await expect(queue).toContainText(SUBMITTED_WITH_THREADS)
  await expect(queue.locator('tr').filter({ hasText: SUBMITTED_WITH_THREADS })).toContainText('unresolved')
  await expect(page.locator('.p-datatable-mask')).toHaveCount(0)
  await snap(page, 'lab-20-approvals-queue')
  await queue.getByRole('link', { name: SUBMITTED_WITH_THREADS }).click()
  await expect(page.getByRole('heading', { level: 1, name: SUBMITTED_WITH_THREADS })).toBeVisible()

  // Resolve the thread pinned to a point (the one the analyst answered).
  const panel = page.getByTestId('threads-panel')
  const thread = panel.locator('article').filter({ hasText: 'condensate well mixed' })
  await expect(thread).toContainText('I will re-inject the retained sample')
  await thread.getByTestId('resolve').click()
  await expect(panel.locator('article').filter({ hasText: 'condensate well mixed' })).toHaveCount(0)
  await panel
    .getByRole('radio', { name: 'All' })
    .or(panel.getByRole('button', { name: 'All' }))
    .first()
    .click()
  await expect(panel.locator('article').filter({ hasText: 'condensate well mixed' })).toContainText('Resolved')

  // Wilson has the lowest AIC on this data set; the lead chemist recommends it.
  await expect(page.getByTestId('fit-wilson')).toContainText('lowest')
  await page.getByTestId('recommend-wilson').click()
  await expect(page.getByTestId('fit-wilson').getByTestId('recommended')).toBeVisible()
  await snap(page, 'lab-21-lead-workspace')

  await page.getByTestId('open-approve').click()
  const dialog = page.getByTestId('signature-dialog')
  await expect(dialog.getByTestId('sign-title')).toHaveText(SUBMITTED_WITH_THREADS)
  await expect(dialog.getByTestId('sign-version')).toHaveText('1')
  await expect(dialog.getByTestId('sign-points')).toContainText('12 measured')
  await expect(dialog.getByTestId('sign-fit')).toContainText('Wilson')
  await expect(dialog.getByTestId('sign-fit')).toContainText(/a12 = \S+ ± \S+ J\/mol/)
  await expect(dialog.getByTestId('sign-calibrations')).toContainText('Relative response factor, k = ')
  await expect(dialog.getByTestId('sign-outliers')).toContainText('against Wilson (recommended)')
  await dialog.getByTestId('sign').click()
  await expect(dialog.getByText('Re-enter your password to sign')).toBeVisible()
  await expect(dialog.getByText('Give the reason for your signature')).toBeVisible()

  await dialog
    .getByLabel('Reason')
    .fill('Points consistent with the plant samples; Wilson recommended for the mother-liquor column.')
  const override = dialog.getByLabel(/still open: why approve anyway/)
  if (await override.count())
    await override.fill('The remaining thread asks for a note in the apparatus record; it does not affect the data.')
  await dialog.getByLabel('Your password').fill('not-my-password')
  await dialog.getByTestId('sign').click()
  await expect(dialog.locator('.p-message-error, small.eb-error')).toBeVisible()
  await snap(page, 'lab-22-signature-dialog')

  await dialog.getByLabel('Your password').fill(DEMO_PASSWORD)
  await dialog.getByTestId('sign').click()
  await expect(dialog).toBeHidden()
  await expect(page.getByTestId('dataset-state')).toHaveText('Approved')
  const record = page.getByTestId('approval-record')
  await expect(record).toContainText('Approved')
  await expect(record).toContainText('Dr. Tobias Lindqvist')
  await expect(record).toContainText('Wilson recommended for the mother-liquor column')
  await expect(record).toContainText(/SHA-256 [0-9a-f]{64}/)
  await expect(record.getByTestId('approval-outliers')).toContainText(
    'Outliers as signed, against Wilson (recommended)',
  )
  await expect(record.getByTestId('approval-parameters')).toContainText('J/mol')
  await expect(page.getByTestId('open-approve')).toHaveCount(0)
  await snap(page, 'lab-23-approved-record')

  // The record tab tells the story: the files as received and the audit trail ending in the signature.
  await page.getByRole('tab', { name: 'Record' }).click()
  await expect(page.getByTestId('dataset-record')).toContainText('Files as received')
  await expect(page.getByTestId('audit-trail').locator('li').last()).toContainText('Dr. Tobias Lindqvist approve')
  await expect(page.getByTestId('audit-trail')).toContainText('Mira Okonkwo submit')
  await snap(page, 'lab-24-record-and-audit')
})
