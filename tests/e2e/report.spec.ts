import { readFileSync, writeFileSync } from 'node:fs'
import { expect, test, type Page } from '@playwright/test'
import pg from 'pg'
import { DEMO, shot, signIn } from './support/helpers'

// The printed report and its verify page: an engineer prints the approved acetone/methanol system; an analyst prints
// the returned acetone/chloroform version, changes it, and the verify page says the record no longer matches.
const dbUrl = process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/ebullio_e2e_test'

async function one<T>(text: string, params: unknown[]): Promise<T> {
  const client = new pg.Client({ connectionString: dbUrl })
  await client.connect()
  try {
    return (await client.query(text, params)).rows[0] as T
  } finally {
    await client.end()
  }
}

/** Click a download link; the file's name and first bytes, and the id the server registered for it. */
async function downloadReport(page: Page, dataSetId: string) {
  const [dl] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-report').click()])
  const bytes = readFileSync((await dl.path())!)
  const row = await one<{ id: string; number: string }>(
    'select id, number from lab_report where data_set_id = $1 order by number desc limit 1',
    [dataSetId],
  )
  return { name: dl.suggestedFilename(), head: bytes.subarray(0, 5).toString('latin1'), ...row }
}

test('an engineer downloads the signed report of an approved system and checks it on the verify page', async ({
  page,
}) => {
  test.setTimeout(150_000)
  const ds = await one<{ id: string }>("select id from data_set where title like 'Kestrel acetone recycle%'", [])
  await signIn(page, DEMO.engineer)
  await page.getByRole('link', { name: 'Approved systems' }).first().click()
  await page.getByTestId('catalogue-table').getByRole('link', { name: 'acetone / methanol' }).click()
  // the 1 atm version (the system also has the newer 55 °C static-cell version)
  await page.locator('#sys-version').click()
  await page.getByRole('option', { name: /Kestrel acetone recycle/ }).click()
  await expect(page.getByTestId('measured-at')).toHaveText('101.33 kPa')
  await expect(page.getByTestId('download-report')).toBeVisible()
  const r = await downloadReport(page, ds.id)
  expect(r.head).toBe('%PDF-')
  expect(r.name).toMatch(/^kestrel-acetone-recycle-.*-v1-report-\d+\.pdf$/)

  await page.goto(`/verify/${r.id}`)
  await expect(page.getByTestId('verify-verdict')).toContainText('The stored record matches this report.')
  await expect(page.getByTestId('verify-verdict')).toContainText(`R-${r.number.padStart(6, '0')}`)
  const printed = (await page.getByTestId('digest-printed').textContent())!.trim()
  await expect(page.getByTestId('digest-now')).toHaveText(printed)
  // the signed digest of the approval is the digest the report printed
  const signed = await one<{ digest: string }>(
    "select digest from approval where data_set_id = $1 and meaning = 'approved'",
    [ds.id],
  )
  expect(printed.replace(/\s/g, '')).toBe(signed.digest)
  await expect(page.getByTestId('verify-signatures')).toContainText('Dr. Tobias Lindqvist')
  await expect(page.getByTestId('verify-signatures')).toContainText('equal')
  // a copy's digest typed by hand, in capitals and groups
  await page.getByTestId('typed-digest').fill(printed.toUpperCase())
  await expect(page.getByTestId('typed-result')).toHaveText('Your copy carries the digest registered for this report.')
  await shot(page, 'report-01-verify-matches')
  await page.getByTestId('typed-digest').fill(printed.replace(/.$/, printed.endsWith('0') ? '1' : '0'))
  await expect(page.getByTestId('typed-result')).toContainText('it is not this report as Ebullio printed it')
  // engineers have no data set page to go to
  await expect(page.getByTestId('verify-open-dataset')).toHaveCount(0)
})

test('an analyst prints a returned version; after a point is excluded the verify page says the record changed', async ({
  page,
}) => {
  test.setTimeout(150_000)
  const ds = await one<{ id: string }>("select id from data_set where title like 'SR-24 acetone/chloroform cut%'", [])
  await signIn(page, DEMO.analyst)
  await page.goto(`/datasets/${ds.id}`)
  await expect(page.getByTestId('dataset-state')).toContainText(/returned/i, { timeout: 30_000 })
  const r = await downloadReport(page, ds.id)
  expect(r.head).toBe('%PDF-')
  await shot(page, 'report-02-workspace-with-report-link')

  // exclude the first point with a reason: the record's content (and digest) changes
  const first = page.getByTestId('points-table').locator('tbody tr').first()
  await first.getByTestId('exclude-point').click()
  await page.getByRole('dialog').getByLabel('Reason').fill('Check the report verification')
  await page.getByRole('dialog').getByRole('button', { name: 'Exclude point', exact: true }).click()
  await expect(first).toContainText('Excluded: Check the report verification')

  await page.goto(`/verify/${r.id}`)
  const verdict = page.getByTestId('verify-verdict')
  await expect(verdict).toContainText('The stored record has changed since this report was printed.')
  await expect(verdict).toContainText('It was not an approved record when printed.')
  const printed = (await page.getByTestId('digest-printed').textContent())!.trim()
  await expect(page.getByTestId('digest-now')).not.toHaveText(printed)
  await shot(page, 'report-03-verify-changed')

  // included again, the content is as printed and the digest matches again
  await page.getByTestId('verify-open-dataset').click()
  await page.getByRole('button', { name: /Include point 1 .* again/ }).click()
  await expect(first).not.toContainText('Excluded')
  await page.goto(`/verify/${r.id}`)
  await expect(page.getByTestId('verify-verdict')).toContainText('The stored record matches this report.')
})

test('an exported plot carries its title block and only the curves drawn on screen', async ({ page }) => {
  test.setTimeout(150_000)
  const ds = await one<{ id: string }>("select id from data_set where title like 'Kestrel acetone recycle%'", [])
  await signIn(page, DEMO.reviewer)
  await page.goto(`/datasets/${ds.id}`)
  const txy = page.getByRole('group', { name: /T–x–y diagram/ })
  await expect(txy).toBeVisible({ timeout: 30_000 })
  await expect(page.getByTestId('curves-drawn')).toContainText('NRTL', { timeout: 30_000 })
  // NRTL switched off in the fit table: it is not drawn, so it is not exported either
  await page.getByRole('checkbox', { name: 'Draw NRTL' }).uncheck()
  await expect(page.getByTestId('curves-drawn')).not.toContainText('NRTL')

  const [svgDl] = await Promise.all([page.waitForEvent('download'), txy.getByTestId('export-svg').click()])
  const svg = readFileSync((await svgDl.path())!, 'utf8')
  expect(svg).toContain('acetone / methanol · T–x–y diagram at 101.33 kPa')
  expect(svg).toContain('version 1 · approved, signed by Dr. Tobias Lindqvist on ')
  expect(svg).toMatch(/Exported from Ebullio \d{4}-\d\d-\d\d \d\d:\d\d UTC/)
  expect(svg).toContain('Wilson')
  expect(svg).not.toContain('NRTL')

  const [pngDl] = await Promise.all([page.waitForEvent('download'), txy.getByTestId('export-png').click()])
  const png = readFileSync((await pngDl.path())!)
  expect(png.subarray(1, 4).toString('latin1')).toBe('PNG')
  // kept beside the screenshots so the exported picture can be looked at
  writeFileSync('tests/artifacts/screens/report-04-exported-txy.png', png)
})
