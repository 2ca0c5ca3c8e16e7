import { createHash } from 'node:crypto'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import {
  agent,
  createTestContext,
  createUser,
  linkIn,
  PASSWORD,
  resetDatabase,
  signedInAgent,
  type TestContext,
} from './helpers.js'

// Small limits so the rules show within a few requests (defaults: .env.example).
let t: TestContext
beforeAll(async () => {
  t = await createTestContext({
    RATE_LIMIT_SIGNIN_PER_IP: '12',
    RATE_LIMIT_SIGNIN_PER_ACCOUNT: '3',
    RATE_LIMIT_FORGOT_PER_ADDRESS: '2',
    RATE_LIMIT_FORGOT_PER_IP: '4',
    RATE_LIMIT_PASSWORD_CHANGE: '2',
  })
})
afterAll(() => t.close())
beforeEach(async () => {
  await resetDatabase(t.db)
  await createUser(t.db, { email: 'ana@lab.test', roles: ['analyst'] })
  await createUser(t.db, { email: 'leo@lab.test', roles: ['lead_chemist'] })
})

const tokenOf = (setCookie: unknown) => String(setCookie).match(/ebullio_session=([a-z2-7]+)/)![1]

describe('sessions', () => {
  it('stores only the SHA-256 of the session token: the database holds no live session', async () => {
    const r = await agent(t.app).post('/api/auth/sign-in').send({ email: 'ana@lab.test', password: PASSWORD })
    const token = tokenOf(r.headers['set-cookie'])
    expect(token.length).toBeGreaterThanOrEqual(32) // 160 random bits in base32
    const rows = await t.db.selectFrom('user_session').select('id').execute()
    expect(rows.map((x) => x.id)).toEqual([createHash('sha256').update(token).digest('hex')])
    // Presenting the stored id as a cookie is no session.
    const stolen = await agent(t.app).get('/api/auth/me').set('Cookie', `ebullio_session=${rows[0].id}`)
    expect(stolen.status).toBe(401)
    const real = await agent(t.app).get('/api/auth/me').set('Cookie', `ebullio_session=${token}`)
    expect(real.body.user.email).toBe('ana@lab.test')
  })

  it('compares Origin with the public URL only, never with the request’s own Host', async () => {
    const a = await signedInAgent(t.app, 'ana@lab.test')
    const spoofed = await a.post('/api/auth/sign-out').set('Host', 'evil.example').set('Origin', 'http://evil.example')
    expect(spoofed.status).toBe(403)
    expect(spoofed.body.error.code).toBe('cross_site_request')
    const otherPort = await a.post('/api/auth/sign-out').set('Origin', 'http://127.0.0.1:3001')
    expect(otherPort.status).toBe(403)
    expect((await a.get('/api/auth/me')).status).toBe(200)
  })
})

describe('passwords', () => {
  it('changing the password ends the user’s other sessions and keeps this one', async () => {
    const here = await signedInAgent(t.app, 'ana@lab.test')
    const laptop = await signedInAgent(t.app, 'ana@lab.test')
    const leo = await signedInAgent(t.app, 'leo@lab.test')
    await here
      .post('/api/auth/change-password')
      .send({ currentPassword: PASSWORD, newPassword: 'brand-new-password' })
      .expect(200)
    expect((await here.get('/api/auth/me')).status).toBe(200)
    expect((await laptop.get('/api/auth/me')).status).toBe(401)
    expect((await leo.get('/api/auth/me')).status).toBe(200) // other users are not touched
  })

  it('using a reset link ends every session and makes older links of that user useless', async () => {
    const open = await signedInAgent(t.app, 'ana@lab.test')
    await agent(t.app).post('/api/auth/forgot-password').send({ email: 'ana@lab.test' }).expect(200)
    await agent(t.app).post('/api/auth/forgot-password').send({ email: 'ana@lab.test' }).expect(200)
    const mails = await t.mail() // newest first
    expect(mails).toHaveLength(2)
    const [newer, older] = mails.map((m) => linkIn(m.body_text, '/reset-password/').split('/reset-password/')[1])
    await agent(t.app)
      .post('/api/auth/reset-password')
      .send({ token: newer, password: 'brand-new-password' })
      .expect(200)
    expect((await open.get('/api/auth/me')).status).toBe(401)
    const old = await agent(t.app)
      .post('/api/auth/reset-password')
      .send({ token: older, password: 'another-long-password' })
    expect(old.status).toBe(400)
    expect(old.body.error.code).toBe('invalid_link')
    await signedInAgent(t.app, 'ana@lab.test', 'brand-new-password')
  })

  it('refuses trivially weak new passwords with the reason, and changes nothing', async () => {
    const a = await signedInAgent(t.app, 'ana@lab.test')
    const cases: [string, string][] = [
      [' '.repeat(10), 'A password of only spaces is too easy to guess'],
      ['1234567890', 'A run of keys or letters (like 1234567890 or qwertyuiop) is too easy to guess'],
      ['zzzzzzzzzzzz', 'Use more different characters: a repeated character or pattern is too easy to guess'],
    ]
    for (const [newPassword, message] of cases) {
      const r = await a.post('/api/auth/change-password').send({ currentPassword: PASSWORD, newPassword })
      expect(r.status).toBe(422)
      expect(r.body.error.details).toEqual([{ path: 'newPassword', message }])
    }
    await signedInAgent(t.app, 'ana@lab.test', PASSWORD)
  })
})

describe('rate limits', () => {
  it('counts failed sign-ins, not successful ones: thirty role switches from one network lock nobody out', async () => {
    for (let i = 0; i < 30; i++) {
      const email = i % 2 ? 'ana@lab.test' : 'leo@lab.test'
      const r = await agent(t.app).post('/api/auth/sign-in').send({ email, password: PASSWORD })
      expect(r.status, `sign-in ${i + 1}`).toBe(200)
    }
  })

  it('a success resets the account’s failure count; repeated failures lock the account', async () => {
    const attempt = (password: string) =>
      agent(t.app).post('/api/auth/sign-in').send({ email: 'ana@lab.test', password })
    for (let round = 0; round < 3; round++) {
      expect((await attempt('typo-1')).status).toBe(401)
      expect((await attempt('typo-2')).status).toBe(401)
      expect((await attempt(PASSWORD)).status).toBe(200) // clears the count: 2 failures + 2 more never reach 3
    }
    for (let i = 0; i < 3; i++) expect((await attempt('guess-' + i)).status).toBe(401)
    const locked = await attempt(PASSWORD)
    expect(locked.status).toBe(429)
    expect(locked.body.error.message).toBe(
      'Too many failed sign-in attempts for this account. Wait 15 minutes and try again.',
    )
    // The count is in the database (shared by replicas), keyed by the account.
    const row = await t.db
      .selectFrom('rate_limit_hit')
      .selectAll()
      .where('key', '=', 'signin-account:ana@lab.test')
      .executeTakeFirstOrThrow()
    expect(row.hits).toBeGreaterThanOrEqual(3)
  })

  it('limits forgotten-password requests per address and failed password changes per user', async () => {
    const forgot = () => agent(t.app).post('/api/auth/forgot-password').send({ email: 'ana@lab.test' })
    expect((await forgot()).status).toBe(200)
    expect((await forgot()).status).toBe(200)
    const third = await forgot()
    expect(third.status).toBe(429)
    expect(third.body.error.code).toBe('too_many_attempts')
    expect(await t.mail()).toHaveLength(2)

    const a = await signedInAgent(t.app, 'leo@lab.test')
    const change = (currentPassword: string) =>
      a.post('/api/auth/change-password').send({ currentPassword, newPassword: 'brand-new-password' })
    expect((await change('wrong-1')).status).toBe(400)
    expect((await change('wrong-2')).status).toBe(400)
    expect((await change(PASSWORD)).status).toBe(429)
    await signedInAgent(t.app, 'leo@lab.test', PASSWORD) // unchanged
  })
})
