import { expect, test } from '@playwright/test'
import { DEMO, signIn } from './support/helpers'
import { openDataSet, snap } from './support/lab'

/** The demo scenario's approved acetone/methanol series (db/seeds/lab-scenario.ts, INVENTED points), fitted with Wilson, NRTL and Van Laar. */
const APPROVED = 'Kestrel acetone recycle: acetone/methanol at 1 atm'

// °F is a scale of its own for differences too: 1 K = 1.8 °F (NIST SP 811, 2008 ed., from memory).
test('in °F every temperature difference on the lab screens is in °F, and the workspace fits a 768 px screen', async ({
  page,
}) => {
  await signIn(page, DEMO.analyst)
  await openDataSet(page, APPROVED)
  await page.getByTestId('units-picker').click()
  const units = page.getByRole('dialog', { name: 'Display units' })
  await units.getByText('°F', { exact: true }).click()
  await units.getByText('psi', { exact: true }).click()
  await page.keyboard.press('Escape')
  await expect(page.getByTestId('fit-panel')).toContainText('RMS ΔT / °F')
  await expect(page.getByTestId('fit-panel')).not.toContainText('alpha')

  await page.getByRole('tab', { name: 'Consistency' }).click()
  // the tolerance of 0.3 K (common practice, no source) is 0.54 °F
  await expect(page.getByTestId('pure-check')).toContainText('|ΔT| ≤ 0.54 °F')
  await page.getByRole('tab', { name: 'Record' }).click()
  await expect(page.getByTestId('audit-trail')).toContainText(/run fit: Wilson, \d+ points/)

  await page.getByRole('tab', { name: 'Diagrams and fits' }).click()
  await page.setViewportSize({ width: 768, height: 1024 })
  await expect(page.getByTestId('fit-panel')).toBeVisible()
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(768)
  await snap(page, 'lab-40-approved-fahrenheit-768')
})
