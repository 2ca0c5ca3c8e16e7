import { expect, test } from '@playwright/test'
import { DEMO, linkFrom, nav, shot, signIn, signOut, waitForMail } from './support/helpers'

test('an admin invites a colleague, who sets a password, signs in, sees their navigation and signs out', async ({
  page,
}) => {
  const email = `new.reviewer.${Date.now()}@lab.example`
  await signIn(page, DEMO.admin)
  // the app frame shows the configured LAB_NAME (playwright.config.ts), markup as text
  await expect(page.getByTestId('lab-name')).toHaveText('Halvorsen <b>Solvent</b> Recovery Lab')
  await expect(page.getByTestId('lab-name').locator('b')).toHaveCount(0)
  await shot(page, 'admin-home')
  await nav(page).getByRole('link', { name: 'People and roles' }).click()
  await expect(page.getByRole('heading', { name: 'People and roles' })).toBeVisible()
  await page.getByTestId('invite-open').click()
  const dialog = page.getByRole('dialog', { name: 'Invite a colleague' })
  await dialog.getByLabel('Name').fill('Noor Haddad')
  await dialog.getByLabel('E-mail address').fill(email)
  await dialog.getByTestId('invite-roles').click()
  await page.getByRole('option', { name: 'Reviewer' }).click()
  await page.keyboard.press('Escape')
  await shot(page, 'admin-invite-dialog')
  await dialog.getByRole('button', { name: 'Send invitation' }).click()
  await expect(page.getByRole('cell', { name: email })).toBeVisible()
  await expect(dialog).toBeHidden()
  await shot(page, 'admin-people')
  // The list is searched on the server: the new colleague alone, then an empty search result.
  await page.getByTestId('people-search').fill('noor haddad')
  await expect(page.getByTestId('people-table').locator('tbody tr')).toHaveCount(1)
  await expect(page.getByRole('cell', { name: email })).toBeVisible()
  await page.getByTestId('people-search').fill('nobody-by-this-name')
  await expect(page.getByTestId('people-table')).toContainText('Nobody matches this search.')
  await page.getByTestId('people-search').fill('')
  await expect(page.getByRole('cell', { name: email })).toBeVisible()

  const body = await waitForMail(email, /invited/)
  await nav(page).getByRole('link', { name: 'Captured mail' }).click()
  await expect(page.getByTestId('mail-body')).toContainText('You are invited to Ebullio')
  await shot(page, 'admin-mail-capture')
  await signOut(page)

  await page.goto(linkFrom(body, '/welcome/'))
  await expect(page.getByText('Noor Haddad, choose the password')).toBeVisible()
  await page.locator('#new-password').fill('a-fresh-long-password')
  await page.locator('#repeat-password').fill('a-fresh-long-password')
  await shot(page, 'accept-invite')
  await page.getByRole('button', { name: 'Set password and sign in' }).click()
  await expect(page.getByRole('heading', { name: /Good to see you, Noor Haddad/ })).toBeVisible()
  await expect(nav(page).getByRole('link', { name: 'My open threads' })).toBeVisible()
  await expect(nav(page).getByRole('link', { name: 'People and roles' })).toHaveCount(0)
  await expect(nav(page).getByRole('link', { name: 'Approved systems' })).toHaveCount(0)
  await shot(page, 'reviewer-home')
  await signOut(page)

  await signIn(page, email, 'a-fresh-long-password')
  await signOut(page)

  // Forgotten password, twice: the newest mailed link opens the reset page in the browser and sets the password;
  // the older link stopped working when the newer one was used.
  const forgot = async () => {
    await page.goto('/forgot-password')
    await page.getByLabel('E-mail address').fill(email)
    await page.getByRole('button', { name: 'Send the link' }).click()
    await expect(page.getByText('If this address belongs to an account')).toBeVisible()
  }
  await forgot()
  const older = linkFrom(await waitForMail(email, /Reset/), '/reset-password/')
  await forgot()
  await expect.poll(async () => linkFrom(await waitForMail(email, /Reset/), '/reset-password/')).not.toBe(older)
  const newer = linkFrom(await waitForMail(email, /Reset/), '/reset-password/')
  await page.goto(newer)
  await expect(page.getByRole('heading', { name: 'Choose a new password' })).toBeVisible()
  await page.locator('#new-password').fill('another-long-password-2')
  await page.locator('#repeat-password').fill('another-long-password-2')
  await page.getByRole('button', { name: 'Save the new password' }).click()
  await expect(page.getByText('Your password is changed.')).toBeVisible()
  await shot(page, 'reset-password-done')
  await page.getByRole('link', { name: 'Sign in' }).click()
  await expect(page).toHaveURL(/\/sign-in/)
  await page.getByLabel('E-mail address').fill(email)
  await page.locator('#password').fill('another-long-password-2')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByRole('heading', { name: /Good to see you, Noor Haddad/ })).toBeVisible()
  await signOut(page)
  await page.goto(older)
  await page.locator('#new-password').fill('a-third-long-password-3')
  await page.locator('#repeat-password').fill('a-third-long-password-3')
  await page.getByRole('button', { name: 'Save the new password' }).click()
  await expect(page.getByText('This link is not valid any more.')).toBeVisible()
  await signIn(page, email, 'another-long-password-2')
  await signOut(page)
})

test('a deep link without a session goes to sign-in and back; a forced URL without the role shows 403', async ({
  page,
}) => {
  await page.goto('/admin/people')
  await expect(page).toHaveURL(/\/sign-in\?next=(%2F|\/)admin(%2F|\/)people/)
  await shot(page, 'sign-in')
  await page.getByLabel('E-mail address').fill(DEMO.admin)
  await page.locator('#password').fill('ebullio-demo-2026')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByRole('heading', { name: 'People and roles' })).toBeVisible()
  await signOut(page)

  await signIn(page, DEMO.engineer)
  await expect(page.getByRole('link', { name: 'People and roles' })).toHaveCount(0)
  await expect(nav(page).getByRole('link', { name: 'Approved systems' })).toBeVisible()
  await page.goto('/admin/people')
  await expect(page.getByTestId('forbidden')).toContainText('Not allowed (403)')
  await shot(page, 'forbidden')
})

test('a wrong password gets a message that does not reveal whether the account exists; forgotten password sends a link', async ({
  page,
}) => {
  await page.goto('/sign-in')
  await page.getByLabel('E-mail address').fill('nobody@lab.example')
  await page.locator('#password').fill('whatever')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByTestId('form-error')).toHaveText(
    'The e-mail address or password is not correct, or the account is not active.',
  )
  await page.getByRole('link', { name: 'Forgotten your password?' }).click()
  await expect(page.getByRole('heading', { name: 'Forgotten password' })).toBeVisible()
  await page.getByLabel('E-mail address').fill(DEMO.reviewer)
  await page.getByRole('button', { name: 'Send the link' }).click()
  await expect(page.getByText('If this address belongs to an account')).toBeVisible()
  const body = await waitForMail(DEMO.reviewer, /Reset/)
  expect(linkFrom(body, '/reset-password/')).toMatch(/^\/reset-password\//)
  await page.goto('/no/such/page')
  await expect(page.getByRole('heading', { name: 'Nothing here' })).toBeVisible()
})
