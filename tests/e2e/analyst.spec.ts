import { expect, test } from '@playwright/test'
import path from 'node:path'
import { DEMO, signIn } from './support/helpers'
import { snap } from './support/lab'

// Journey 1: the example files are the documented ones (docs/examples, invented data generated from published
// acetone/methanol Wilson parameters); the spoiled run sheet has its mistakes on known lines (docs/csv-formats.md).
const examples = path.resolve('docs/examples')

test('an analyst creates a data set, uploads a calibration and a run file, fixes the flagged file, fits NRTL and Wilson and submits', async ({
  page,
}) => {
  await signIn(page, DEMO.analyst)
  await page.getByRole('link', { name: 'Data sets' }).first().click()
  await expect(page.getByRole('heading', { name: 'Data sets' })).toBeVisible()
  await expect(page.getByTestId('datasets-table')).toContainText('Kestrel acetone recycle')
  await expect(page.locator('.p-datatable-mask')).toHaveCount(0)
  // Filtering is done by the server: only the returned data set is listed.
  await page.getByRole('combobox', { name: 'State' }).click()
  await page.getByRole('option', { name: 'Returned' }).click()
  await expect(page.getByTestId('datasets-table').locator('tbody tr')).toHaveCount(1)
  await expect(page.getByTestId('datasets-table')).toContainText('SR-24 acetone/chloroform cut')
  await page.getByRole('button', { name: 'Clear filters' }).click()
  await expect(page.getByTestId('datasets-table')).toContainText('Kestrel acetone recycle')
  await expect(page.locator('.p-datatable-mask')).toHaveCount(0)
  await snap(page, 'lab-01-datasets-list')

  await page.getByTestId('new-dataset').click()
  await page.getByRole('button', { name: 'Create and upload files' }).click()
  await expect(page.getByText('Enter a title')).toBeVisible()
  await expect(page.getByText('Choose the binary system that was measured.')).toBeVisible()
  const title = `Recycle acetone check ${Date.now().toString(36)}`
  await page.getByLabel('Title').fill(title)
  await page.getByLabel('Binary system').fill('methanol')
  await page.getByRole('option', { name: /acetone \/ methanol/ }).click()
  await page.getByLabel('Project or campaign reference (optional)').fill('KES-2026-03')
  await page
    .getByLabel('Apparatus and method notes (optional)')
    .fill('Recirculating still no. 2, Pt100 in the vapour space.')
  await snap(page, 'lab-02-new-dataset')
  await page.getByTestId('create-dataset').click()

  // The upload step opens on the calibration sheet.
  const dialog = page.getByTestId('upload-dialog')
  await expect(dialog).toBeVisible()
  await dialog.getByTestId('file-input').setInputFiles(path.join(examples, 'calibration-acetone-methanol.csv'))
  await expect(dialog.getByTestId('preview-summary')).toBeVisible()
  await expect(dialog.getByTestId('commit-blocked')).toHaveCount(0)
  await snap(page, 'lab-03-calibration-preview')
  const ack = dialog.getByTestId('ack-warnings')
  if (await ack.count()) await dialog.getByText(/I have checked the/).click()
  // The demo lab already has an active calibration on this GC method: replacing it must be acknowledged.
  await expect(dialog.getByTestId('replaces-calibration')).toContainText(
    /This replaces the active calibration of calibration-acetone-methanol\.csv .*k = .* ± .*, x₁ .*used by \d+ data sets?/,
  )
  await expect(dialog.getByTestId('commit-upload')).toBeDisabled()
  await dialog.getByText('Retire the active calibration and use this one from now on').click()
  await dialog.getByTestId('commit-upload').click()
  await expect(page.getByText('Calibration stored')).toBeVisible()

  // The spoiled run sheet: line 5 has no phase, line 10 a letter in an area, line 15 a negative area.
  await dialog.getByTestId('file-input').setInputFiles(path.join(examples, 'run-acetone-methanol-with-errors.csv'))
  await expect(dialog.getByTestId('problem-list')).toBeVisible()
  await expect(dialog.getByTestId('problem-list')).toContainText('line 5, column phase')
  await expect(dialog.locator('tr[data-line="5"] td[data-problem="error"]')).toHaveCount(1)
  await expect(dialog.locator('tr[data-line="10"] td[data-problem="error"]')).toContainText('130x365.0')
  await expect(dialog.getByTestId('commit-upload')).toBeDisabled()
  await expect(dialog.getByTestId('commit-blocked')).toBeVisible()
  // The run preview names the calibration it computes with, and greys the samples resting on part of their injections.
  await expect(dialog.getByTestId('run-calibration')).toContainText('calibration-acetone-methanol.csv')
  await expect(dialog.getByTestId('partial-sample')).toHaveCount(3)
  await expect(dialog.getByTestId('preview-samples')).toContainText('liquid: 1 of 2 injections used')
  await snap(page, 'lab-04-run-preview-with-errors')

  await dialog.getByTestId('another-file').click()
  await dialog.getByTestId('file-input').setInputFiles(path.join(examples, 'run-acetone-methanol.csv'))
  await expect(dialog.getByTestId('preview-samples')).toContainText('AM-12')
  await expect(dialog.locator('td[data-problem="error"]')).toHaveCount(0)
  if (await dialog.getByTestId('ack-warnings').count()) {
    await expect(dialog.getByTestId('commit-upload')).toBeDisabled()
    await dialog.getByText(/I have checked the/).click()
  }
  await snap(page, 'lab-05-run-preview-clean')
  await dialog.getByTestId('commit-upload').click()
  await expect(dialog).toBeHidden()
  await expect(page.getByTestId('points-table').locator('tbody tr')).toHaveCount(12)

  // A point is excluded only with a reason, which stays on the record.
  const third = page.getByTestId('points-table').locator('tbody tr').nth(2)
  await third.getByTestId('exclude-point').click()
  await page.getByRole('dialog').getByRole('button', { name: 'Exclude point', exact: true }).click()
  await expect(page.getByText('Give a reason for excluding this point')).toBeVisible()
  await page.getByRole('dialog').getByLabel('Reason').fill('Still not at steady state when sampled')
  await page.getByRole('dialog').getByRole('button', { name: 'Exclude point', exact: true }).click()
  await expect(third).toContainText('Excluded: Still not at steady state when sampled')

  // Wilson and NRTL are the preselected models.
  await expect(page.getByLabel('Wilson')).toBeChecked()
  await expect(page.getByLabel('NRTL')).toBeChecked()
  await page.getByTestId('run-fits').click()
  await expect(page.getByTestId('fit-wilson')).toContainText('converged')
  await expect(page.getByTestId('fit-nrtl')).toBeVisible()
  await expect(page.getByTestId('curves-drawn')).toContainText('Wilson')
  await expect(page.getByTestId('curves-drawn')).toContainText('NRTL')
  await expect(page.getByTestId('lab-azeotropes')).toContainText('azeotrope')
  await expect(page.getByTestId('txy-plot')).toContainText('2 computed curve pairs')
  await snap(page, 'lab-06-workspace-fitted')

  await page.getByRole('tab', { name: 'Consistency' }).click()
  await page.getByTestId('run-consistency').click()
  await expect(page.getByTestId('consistency-panel')).toContainText('Area test')
  await snap(page, 'lab-07-consistency')
  await page.getByRole('tab', { name: 'Diagrams and fits' }).click()

  // Display units are a personal preference; stored values stay in K and Pa.
  await page.getByTestId('units-picker').click()
  const units = page.getByRole('dialog', { name: 'Display units' })
  await units.getByText('K', { exact: true }).click()
  await units.getByText('mmHg', { exact: true }).click()
  await page.keyboard.press('Escape')
  await expect(page.getByTestId('points-table')).toContainText('T / K')
  await expect(page.getByTestId('points-table')).toContainText('P / mmHg')
  await expect(page.getByTestId('units-picker')).toHaveText(/K · mmHg/)
  await snap(page, 'lab-08a-units-kelvin-mmhg')
  await page.setViewportSize({ width: 768, height: 1024 })
  await snap(page, 'lab-08b-workspace-tablet')
  await page.setViewportSize({ width: 1280, height: 800 })

  await page.getByTestId('submit').click()
  await page.getByRole('button', { name: 'Submit', exact: true }).click()
  await expect(page.getByTestId('dataset-state')).toHaveText('Submitted')
  await expect(page.getByTestId('open-upload')).toHaveCount(0)
  await snap(page, 'lab-09-submitted')

  // The record names the calibration behind the points, and the audit trail has its commit and the replacement.
  await page.getByRole('tab', { name: 'Record' }).click()
  await expect(page.getByTestId('record-calibrations')).toContainText('calibration-acetone-methanol.csv')
  await expect(page.getByTestId('record-calibrations')).toContainText('Relative response factor')
  await expect(page.getByTestId('audit-trail')).toContainText('upload calibration file')
  await expect(page.getByTestId('audit-trail')).toContainText('retire')
  await snap(page, 'lab-09b-record-calibration')
})
