import { expect, type Page } from '@playwright/test'
import pg from 'pg'

export const DEMO_PASSWORD = 'ebullio-demo-2026'
export const DEMO = {
  analyst: 'analyst@demo.ebullio.test',
  lead: 'lead@demo.ebullio.test',
  lead2: 'lead2@demo.ebullio.test',
  reviewer: 'reviewer@demo.ebullio.test',
  engineer: 'engineer@demo.ebullio.test',
  admin: 'admin@demo.ebullio.test',
} as const

const dbUrl = process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/ebullio_e2e_test'

/** The newest captured message to an address, waiting for the outbox to deliver it. */
export async function waitForMail(to: string, subject: RegExp, timeoutMs = 20_000): Promise<string> {
  const client = new pg.Client({ connectionString: dbUrl })
  await client.connect()
  try {
    const until = Date.now() + timeoutMs
    while (Date.now() < until) {
      const r = await client.query(
        'select subject, body_text from captured_mail where envelope_to = $1 order by id desc limit 5',
        [to],
      )
      const hit = r.rows.find((m) => subject.test(m.subject))
      if (hit) return hit.body_text as string
      await new Promise((res) => setTimeout(res, 300))
    }
    throw new Error(`no mail to ${to} matching ${subject}`)
  } finally {
    await client.end()
  }
}

export function linkFrom(body: string, path: string): string {
  const m = body.match(new RegExp(`https?://\\S+${path}\\S+`))
  if (!m) throw new Error(`no ${path} link in:\n${body}`)
  return new URL(m[0]).pathname
}

/** The side navigation of the app frame. */
export const nav = (page: Page) => page.getByRole('complementary', { name: 'Main navigation' })

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in')
  await page.getByLabel('E-mail address').fill(email)
  await page.locator('#password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByTestId('user-menu')).toBeVisible()
}

export async function signOut(page: Page) {
  await page.getByTestId('user-menu').click()
  await page.getByRole('menuitem', { name: 'Sign out' }).click()
  await expect(page.getByRole('heading', { name: 'Sign in to Ebullio' })).toBeVisible()
}

export async function shot(page: Page, name: string) {
  await page.screenshot({ path: `tests/artifacts/screens/${name}.png`, fullPage: true })
}
