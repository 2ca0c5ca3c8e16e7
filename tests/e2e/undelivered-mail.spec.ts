import { expect, test, type Page } from '@playwright/test'
import pg from 'pg'
import { DEMO, nav, shot, signIn } from './support/helpers'

/**
 * A mail that cannot be delivered, seen by the admin: the local mail server (apps/api/src/mail/fake-smtp.ts) refuses
 * every recipient under `.invalid` (RFC 2606) with 550, as a real one refuses a domain that does not exist.
 */
const dbUrl = process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/ebullio_e2e_test'
const HOSTILE = '<img src=x onerror="window.__outboxPwned=1"> "Kestrel" & <b>feed</b> approved'

async function enqueue(to: string, subject: string) {
  const client = new pg.Client({ connectionString: dbUrl })
  await client.connect()
  try {
    await client.query('insert into mail_outbox (to_address, subject, body_text) values ($1, $2, $3)', [
      to,
      subject,
      'A notification.',
    ])
  } finally {
    await client.end()
  }
}

/** The row of a recipient, after refreshing until it shows `tries` tries (the mail worker polls every 2 s). */
async function rowWithTries(page: Page, to: string, tries: number) {
  const row = page.getByTestId('outbox-table').locator('tbody tr').filter({ hasText: to })
  await expect(async () => {
    await page.getByTestId('outbox-refresh').click()
    await expect(row.locator('td').nth(2)).toHaveText(String(tries), { timeout: 1000 })
  }).toPass({ timeout: 30_000 })
  await expect(page.getByTestId('outbox-table').locator('.p-datatable-mask')).toHaveCount(0)
  return row
}

test('an admin sees a refused invitation with the server’s error and tries it again until it is given up', async ({
  page,
}) => {
  const stamp = Date.now()
  const email = `ilse.${stamp}@lab.invalid`
  const hostileTo = `lead.${stamp}@kestrel.invalid`
  await enqueue(hostileTo, HOSTILE)

  await signIn(page, DEMO.admin)
  await nav(page).getByRole('link', { name: 'People and roles' }).click()
  await page.getByTestId('invite-open').click()
  const dialog = page.getByRole('dialog', { name: 'Invite a colleague' })
  await dialog.getByLabel('Name').fill('Ilse Brandt')
  await dialog.getByLabel('E-mail address').fill(email)
  await dialog.getByTestId('invite-roles').click()
  await page.getByRole('option', { name: 'Reviewer' }).click()
  await page.keyboard.press('Escape')
  await dialog.getByRole('button', { name: 'Send invitation' }).click()
  await expect(dialog).toBeHidden()

  await nav(page).getByRole('link', { name: 'Undelivered mail' }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Undelivered mail' })).toBeVisible()
  // refused once: still being tried (a refused recipient is given up after 3 tries)
  await page
    .getByTestId('outbox-filter')
    .getByText(/Still trying/)
    .click()
  const row = await rowWithTries(page, email, 1)
  await expect(row).toContainText('You are invited to Ebullio')
  await expect(row.getByTestId('outbox-error')).toContainText(`550 5.1.2 ${email}: this domain does not receive mail`)
  await expect(row.locator('td').nth(4)).toHaveText(/under a minute|\d+ min/)

  // hostile text in a subject stays text
  const hostile = await rowWithTries(page, hostileTo, 1)
  await expect(hostile.locator('td').nth(1)).toHaveText(HOSTILE)
  await expect(page.getByTestId('outbox-table').locator('img, b')).toHaveCount(0)
  expect(await page.evaluate(() => (window as { __outboxPwned?: number }).__outboxPwned)).toBeUndefined()
  await page.evaluate(() => window.scrollTo(0, 0))
  await shot(page, 'admin-undelivered-mail')

  // "Try now" skips the wait: tries 2, then 3, and then it is given up
  await row.getByTestId('outbox-retry').click()
  await expect(page.getByText(`The message to ${email} is tried again within a few seconds.`)).toBeVisible()
  await rowWithTries(page, email, 2)
  await row.getByTestId('outbox-retry').click()
  await page
    .getByTestId('outbox-filter')
    .getByText(/Given up/)
    .click()
  const given = await rowWithTries(page, email, 3)
  await expect(given.getByTestId('outbox-error')).toContainText('550')
  await expect(given.getByTestId('outbox-retry')).toHaveText('Try again')
  await shot(page, 'admin-undelivered-mail-given-up')

  // a given-up message gets one more try after a confirmation, and is given up again when refused again
  await given.getByTestId('outbox-retry').click()
  await page.getByTestId('outbox-retry-confirm').click()
  await rowWithTries(page, email, 4)
  await expect(page.getByTestId('outbox-filter')).toContainText(/Given up \(\d+\)/)
})
