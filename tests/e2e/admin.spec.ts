import { expect, test, type Locator, type Page } from '@playwright/test'
import { DEMO, nav, shot, signIn } from './support/helpers'

/** Full-page screenshot from the top (the frame's sticky bars would otherwise be drawn mid-page). */
async function snapTop(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0))
  await shot(page, name)
}

/**
 * Type a number into a PrimeVue InputNumber as a person does (key by key), leave the field, and wait until it shows
 * the number: the component takes its value on blur, so saving before that could send an empty field.
 */
async function typeNumber(input: Locator, value: string) {
  await input.click()
  await input.press('ControlOrMeta+a')
  await input.pressSequentially(value)
  await input.press('Tab')
  await expect.poll(async () => Number((await input.inputValue()).replace(/,/g, ''))).toBe(Number(value))
}

async function choose(page: Page, inputId: string, option: string) {
  await page.locator(`#${inputId}`).click()
  await page.getByRole('option', { name: option, exact: true }).click()
}

test('an admin reads a component’s vapour-pressure sources, adds a component with an Antoine set, and manages GC calibrations', async ({
  page,
}) => {
  await signIn(page, DEMO.admin)
  await nav(page).getByRole('link', { name: 'Components' }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Components' })).toBeVisible()
  const table = page.getByTestId('components-table')
  await expect(table).toContainText('methanol')

  // Search by CAS number and read acetone's set as published (SVNA 7th ed. Table B.2: A 14.3145, B 2756.22, C 228.060).
  await page.getByTestId('component-search').fill('67-64-1')
  await expect(table.locator('tbody tr')).toHaveCount(1)
  await table.getByText('acetone', { exact: true }).click()
  const detail = page.getByTestId('component-detail')
  await expect(detail.getByTestId('vp-sets')).toContainText('ln(P/kPa) = 14.3145 − 2756.22 / (t/°C + 228.06)')
  await expect(detail.getByTestId('vp-sets')).toContainText('Table B.2')
  await expect(detail.getByTestId('vp-sets')).toContainText('Used for calculations')
  await snapTop(page, 'admin-01-components')

  // A new component: the CAS check digit is checked in the form with the shared schema.
  await page.getByTestId('component-new').click()
  const form = page.getByTestId('component-form')
  await form.getByLabel('Name').fill('2-propanol')
  await form.getByLabel('CAS number').fill('67-63-1')
  await form.getByLabel('Formula').fill('C3H8O')
  await typeNumber(form.locator('#cmp-mm'), '60.096')
  await page.getByTestId('component-save').click()
  await expect(form.getByText('The CAS number is not valid (its check digit does not match).')).toBeVisible()
  await form.getByLabel('CAS number').fill('67-63-0')
  await page.getByTestId('component-save').click()
  await expect(form).toBeHidden()
  await expect(detail.getByRole('heading', { name: '2-propanol' })).toBeVisible()
  await expect(table.locator('tr.p-datatable-row-selected, tr[aria-selected="true"]')).toContainText('2-propanol')
  await expect(detail).toContainText('No vapour-pressure set yet')

  // Its Antoine set as SVNA 7th ed. Table B.2 prints it: A 16.6796, B 3640.20, C 219.610, 8 to 100 °C.
  await detail.getByTestId('add-antoine').click()
  const ant = page.getByTestId('antoine-form')
  await choose(page, 'ant-log', 'ln')
  await choose(page, 'ant-p', 'kPa')
  for (const [id, v] of [
    ['ant-A', '16.6796'],
    ['ant-B', '3640.20'],
    ['ant-C', '219.610'],
    ['ant-rmin', '8'],
    ['ant-rmax', '100'],
  ]) {
    await typeNumber(ant.locator(`#${id}`), v)
  }
  await ant.getByRole('button', { name: 'Add set' }).click()
  await expect(ant.getByText('Name the source (book, edition, table) of the constants')).toBeVisible()
  await ant
    .getByLabel('Source')
    .fill('Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, 7th ed., Table B.2')
  await expect(ant).toContainText('ln(P/kPa) = 16.6796 − 3640.2 / (t/°C + 219.61)')
  await ant.getByRole('button', { name: 'Add set' }).click()
  await expect(ant).toBeHidden()
  await expect(detail.getByTestId('vp-sets')).toContainText('ln(P/kPa) = 16.6796 − 3640.2 / (t/°C + 219.61)')
  await expect(detail.getByTestId('vp-sets')).toContainText('8 to 100 °C')
  await snapTop(page, 'admin-02-new-component')

  // GC methods: the calibrations of the FID method, one opened, one retired.
  await nav(page).getByRole('link', { name: 'GC methods' }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'GC methods' })).toBeVisible()
  await page.getByTestId('gc-method').filter({ hasText: 'FID-A' }).click()
  const cals = page.getByTestId('calibrations-table')
  await expect(cals).toContainText('acetone / methanol')
  await expect(cals).toContainText('n-hexane / n-heptane')
  await cals.getByRole('button', { name: 'View calibration for acetone / methanol' }).click()
  const calDialog = page.getByRole('dialog', { name: 'Calibration · acetone / methanol' })
  await expect(calDialog.getByText('Standards')).toBeVisible()
  await expect(calDialog.locator('table').nth(1).locator('tbody tr').first()).toBeVisible()
  await page.waitForTimeout(400) // let the dialog finish fading in before the screenshot
  await snapTop(page, 'admin-03-calibration')
  await page.keyboard.press('Escape')
  await expect(calDialog).toBeHidden()

  await cals.locator('tr').filter({ hasText: 'n-hexane / n-heptane' }).getByTestId('calibration-retire').click()
  await page.getByRole('alertdialog').getByRole('button', { name: 'Retire' }).click()
  await expect(cals).not.toContainText('n-hexane / n-heptane')
  await page.getByRole('button', { name: 'All' }).click()
  await expect(cals.locator('tr').filter({ hasText: 'n-hexane / n-heptane' })).toContainText('Retired')
  await snapTop(page, 'admin-04-gc-methods')

  // A new method.
  await page.getByTestId('gc-new').click()
  const gm = page.getByTestId('gc-method-form')
  await gm.getByRole('button', { name: 'Add method' }).click()
  await expect(gm.getByText('Enter a name')).toBeVisible()
  await gm.getByLabel('Name').fill('TCD-C, molecular sieve')
  await gm
    .getByRole('radio', { name: 'TCD' })
    .or(gm.getByRole('button', { name: 'TCD' }))
    .first()
    .click()
  await gm.getByLabel('Column').fill('molecular sieve 5A packed, 2 m')
  await gm.getByRole('button', { name: 'Add method' }).click()
  await expect(gm).toBeHidden()
  await expect(page.getByTestId('gc-method').filter({ hasText: 'TCD-C, molecular sieve' })).toContainText('TCD')

  // Retiring a method asks first, then marks it and explains what that means for its calibrations.
  await page.getByTestId('gc-method').filter({ hasText: 'TCD-C, molecular sieve' }).click()
  await page.getByTestId('gc-method-retire').click()
  const ask = page.getByRole('alertdialog')
  await expect(ask).toContainText('Retire TCD-C, molecular sieve? It has no active calibration.')
  await ask.getByRole('button', { name: 'Keep in use' }).click()
  await expect(page.getByTestId('gc-method-retire')).toBeVisible()
  await page.getByTestId('gc-method-retire').click()
  await page.getByRole('alertdialog').getByRole('button', { name: 'Retire method' }).click()
  await expect(page.getByTestId('gc-retired-note')).toContainText('cannot be made active or used for new uploads')
  await expect(page.getByTestId('gc-method-retire')).toHaveCount(0)
  await expect(
    page.getByTestId('gc-method').filter({ hasText: 'TCD-C, molecular sieve' }).getByTestId('gc-method-retired'),
  ).toContainText('Retired')
  await page.waitForTimeout(400) // let the note finish its entrance before the screenshot
  await snapTop(page, 'admin-05-gc-method-retired')
})
