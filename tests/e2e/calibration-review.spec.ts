import path from 'node:path'
import { expect, test } from '@playwright/test'
import pg from 'pg'
import { DEMO, nav, shot, signIn } from './support/helpers'

// Calibration review: the record (admin) and the upload preview (analyst) show the calibration plot, each
// standard's residual and replicate RSD against the lab's limit, the calibrated range and a typical sample's budget.
const dbUrl = process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/ebullio_e2e_test'
const examples = path.join(process.cwd(), 'docs/examples')
const exp = (v: number) => v.toExponential(2).replace(/-/g, '−')

test('an admin reviews the stored acetone/methanol calibration: residuals and RSDs are the engine’s', async ({
  page,
}) => {
  test.setTimeout(120_000)
  await signIn(page, DEMO.admin)
  await nav(page).getByRole('link', { name: 'GC methods' }).click()
  await page.getByTestId('gc-method').filter({ hasText: 'FID-A' }).click()
  const respP = page.waitForResponse((r) => /\/api\/calibrations\/[0-9a-f-]{36}$/.test(r.url()) && r.ok())
  await page
    .getByTestId('calibrations-table')
    .getByRole('button', { name: 'View calibration for acetone / methanol' })
    .click()
  const stored = await (await respP).json()
  const dialog = page.getByRole('dialog', { name: 'Calibration · acetone / methanol' })
  const review = dialog.getByTestId('calibration-review')
  await expect(review).toBeVisible()
  await expect(review.getByTestId('plot-calibration')).toBeVisible()
  await expect(review.getByTestId('plot-calibration-residuals')).toBeVisible()

  // one row per standard, with the residual and RSD thermo stored and the verdict against the lab's limit
  const rows = review.getByTestId('calibration-standards').locator('tbody tr')
  const residuals = stored.result.residuals as { label: string; residual: number; replicateRsd: number | null }[]
  await expect(rows).toHaveCount(residuals.length)
  for (const [i, r] of residuals.entries()) {
    await expect(rows.nth(i)).toContainText(r.label)
    await expect(rows.nth(i)).toContainText(exp(r.residual))
    if (r.replicateRsd !== null) {
      await expect(rows.nth(i)).toContainText(`${(r.replicateRsd * 100).toFixed(2)} %`)
      const within = r.replicateRsd <= stored.replicateRsdLimit
      await expect(rows.nth(i)).toContainText(
        `${within ? 'within' : 'above'} ${(stored.replicateRsdLimit * 100).toFixed(1)} %`,
      )
    }
  }
  const [lo, hi] = stored.result.calibratedRange.x1 as [number, number]
  await expect(review.getByTestId('calibrated-range')).toContainText(`${lo.toFixed(3)} to ${hi.toFixed(3)}`)
  await expect(review.getByTestId('typical-u')).toHaveText(/^\d\.\d\de−\d$/)
  await page.waitForTimeout(400) // the dialog's fade-in
  await review.scrollIntoViewIfNeeded()
  await shot(page, 'calibration-01-record-review')
})

test('an analyst sees the review in the calibration preview before committing anything', async ({ page }) => {
  test.setTimeout(120_000)
  const client = new pg.Client({ connectionString: dbUrl })
  await client.connect()
  const ds = (await client.query("select id from data_set where title like 'SR-24 acetone/chloroform cut%'")).rows[0]
  const before = (await client.query('select count(*)::int as n from calibration')).rows[0].n
  await signIn(page, DEMO.analyst)
  await page.goto(`/datasets/${ds.id}`)
  await page.getByTestId('open-upload').click({ timeout: 30_000 })
  const dialog = page.getByTestId('upload-dialog')
  await dialog.getByRole('button', { name: 'Calibration file' }).click()
  await dialog.getByTestId('file-input').setInputFiles(path.join(examples, 'calibration-acetone-methanol.csv'))
  await expect(dialog.getByTestId('preview-summary')).toBeVisible()
  const review = dialog.getByTestId('calibration-review')
  await expect(review).toBeVisible()
  await expect(review.getByTestId('calibration-standards').locator('tbody tr').first()).toBeVisible()
  await expect(review.getByTestId('typical-budget')).toContainText('combined u(x₁)')
  await review.scrollIntoViewIfNeeded()
  await shot(page, 'calibration-02-preview-review')
  await page.keyboard.press('Escape')
  await expect(dialog).toBeHidden()
  // the preview stored nothing
  expect((await client.query('select count(*)::int as n from calibration')).rows[0].n).toBe(before)
  await client.end()
})
