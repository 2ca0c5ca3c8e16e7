/**
 * Every link in every mail opens a page of the web app (matched against the router's own path table), and the
 * captured-mail viewer never shows another person's single-use link.
 */
import { WEB_PATHS } from '@ebullio/schemas'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { MASKED_TOKEN } from '../src/services/captured-mail.service.js'
import {
  agent,
  createTestContext,
  createUser,
  PASSWORD,
  resetDatabase,
  signedInAgent,
  type TestContext,
} from './helpers.js'
import { buildLab, draftWithPoints, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let id: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await draftWithPoints(t, lab, 'Mailed links')
  id = d.id
  const fit = await lab.analyst
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['wilson'] })
    .expect(201)
  const sub = await lab.analyst
    .post(`/api/data-sets/${id}/submit`)
    .send({ rowVersion: fit.body.rowVersion })
    .expect(200)
  await lab.lead
    .post(`/api/data-sets/${id}/return`)
    .send({ password: PASSWORD, reason: 'More points near the azeotrope.', rowVersion: sub.body.rowVersion })
    .expect(200)
  const thread = await lab.reviewer.post(`/api/data-sets/${id}/comments`).send({ body: 'Check sample 3.' }).expect(201)
  await lab.analyst
    .post(`/api/data-sets/${id}/comments`)
    .send({ body: 'Checked.', parentId: thread.body.id })
    .expect(201)
  await lab.admin
    .post('/api/admin/users')
    .send({ email: 'new.chemist@lab.test', displayName: 'New Chemist', roles: ['analyst'] })
    .expect(201)
  await agent(t.app).post('/api/auth/forgot-password').send({ email: 'lead@lab.test' }).expect(200)
})
afterAll(() => t.close())

/** A path of the table as a regular expression: `:id` → one path segment. */
const pattern = (p: string) => new RegExp(`^${p.replace(/:\w+/g, '[^/]+')}$`)

describe('mailed links', () => {
  it('every link of every mail opens a page of the web app; data-set links open that data set', async () => {
    const mails = await t.mail()
    const subjects = mails.map((m) => m.subject)
    expect(subjects.some((s) => /submitted/i.test(s))).toBe(true)
    expect(subjects.some((s) => /returned/i.test(s))).toBe(true)
    expect(subjects.some((s) => /replied/i.test(s))).toBe(true)
    expect(subjects).toContain('You are invited to Ebullio')
    expect(subjects).toContain('Reset your Ebullio password')
    const links = mails.flatMap((m) => m.body_text.match(/https?:\/\/\S+/g) ?? [])
    expect(links.length).toBeGreaterThanOrEqual(5)
    const pages = Object.values(WEB_PATHS).filter((p) => p !== '/')
    for (const link of links) {
      const url = new URL(link)
      expect(url.origin).toBe(t.config.publicUrl)
      expect(
        pages.some((p) => pattern(p).test(url.pathname)),
        `${link} is no page of the web app`,
      ).toBe(true)
      if (url.pathname.startsWith('/datasets/')) expect(url.pathname).toBe(`/datasets/${id}`)
    }
  })
})

describe('captured-mail viewer', () => {
  it("shows an administrator another person's reset and invitation links with the token masked", async () => {
    const stored = await t.mail()
    const reset = stored.find((m) => m.subject === 'Reset your Ebullio password')!
    const token = reset.body_text.match(/\/reset-password\/(\S+)/)![1]
    const seen = await lab.admin.get('/api/dev/mail').expect(200)
    const text = JSON.stringify(seen.body)
    expect(text).not.toContain(token)
    const invite = stored.find((m) => m.subject === 'You are invited to Ebullio')!
    expect(text).not.toContain(invite.body_text.match(/\/welcome\/(\S+)/)![1])
    const shown = seen.body.items.find((m: { subject: string }) => m.subject === 'Reset your Ebullio password')
    expect(shown.body_text).toContain(`/reset-password/${MASKED_TOKEN}`)
    expect(shown.masked).toBe(true)
    // the masked link is no use: the real one still works for its addressee only
    await agent(t.app)
      .post('/api/auth/reset-password')
      .send({ token: MASKED_TOKEN, password: 'another-long-passphrase-9' })
      .expect((r) => expect(r.status).toBeGreaterThanOrEqual(400))
  })

  it('shows an administrator their own reset link whole', async () => {
    await createUser(t.db, { email: 'admin2@lab.test', roles: ['admin'] })
    const admin2 = await signedInAgent(t.app, 'admin2@lab.test')
    await agent(t.app).post('/api/auth/forgot-password').send({ email: 'admin2@lab.test' }).expect(200)
    const own = (await t.mail()).find((m) => m.envelope_to === 'admin2@lab.test')!
    const token = own.body_text.match(/\/reset-password\/(\S+)/)![1]
    const seen = await admin2.get('/api/dev/mail').expect(200)
    const mine = seen.body.items.find((m: { envelope_to: string }) => m.envelope_to === 'admin2@lab.test')
    expect(mine.body_text).toContain(`/reset-password/${token}`)
    expect(mine.masked).toBe(false)
    expect(JSON.stringify((await lab.admin.get('/api/dev/mail').expect(200)).body)).not.toContain(token)
  })
})
