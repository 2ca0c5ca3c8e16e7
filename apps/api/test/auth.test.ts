import { sha256 } from '@oslojs/crypto/sha2'
import { encodeHexLowerCase } from '@oslojs/encoding'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { generateSessionToken, sessionIdOf } from '../src/auth/index.js'
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

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t.close())
beforeEach(async () => {
  await resetDatabase(t.db)
  await createUser(t.db, { email: 'ada@lab.test', roles: ['admin'], displayName: 'Ada Admin' })
  await createUser(t.db, { email: 'ana@lab.test', roles: ['analyst'], displayName: 'Ana Analyst' })
})

const BAD_SIGN_IN = 'The e-mail address or password is not correct, or the account is not active.'

describe('sign-in', () => {
  it('signs in, reports the user and roles, and signs out server-side', async () => {
    const a = await signedInAgent(t.app, 'ana@lab.test')
    const me = await a.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.user).toMatchObject({ email: 'ana@lab.test', roles: ['analyst'] })
    const cookie = (await agent(t.app).post('/api/auth/sign-in').send({ email: 'ana@lab.test', password: PASSWORD }))
      .headers['set-cookie']
    expect(String(cookie)).toMatch(/HttpOnly/)
    expect(String(cookie)).toMatch(/SameSite=Lax/)
    expect(String(cookie)).not.toMatch(/Secure/)
    await a.post('/api/auth/sign-out').expect(200)
    expect((await a.get('/api/auth/me')).status).toBe(401)
    expect(
      await t.db.selectFrom('user_session').selectAll().where('user_id', '=', me.body.user.id).execute(),
    ).toHaveLength(1)
  })

  it('ends sessions after the idle timeout and after the absolute lifetime', async () => {
    const idle = await signedInAgent(t.app, 'ana@lab.test')
    await t.db
      .updateTable('user_session')
      .set({ expires_at: new Date(Date.now() - 1000) })
      .execute()
    expect((await idle.get('/api/auth/me')).status).toBe(401)

    const old = await signedInAgent(t.app, 'ana@lab.test')
    const hours = t.config.sessionAbsoluteHours + 1
    await t.db
      .updateTable('user_session')
      .set({ created_at: new Date(Date.now() - hours * 3.6e6) })
      .execute()
    expect((await old.get('/api/auth/me')).status).toBe(401)
    expect(await t.db.selectFrom('user_session').selectAll().execute()).toHaveLength(0)
  })

  it('marks the cookie Secure when the app is served over https', async () => {
    const https = await createTestContext({ PUBLIC_URL: 'https://vle.lab.example' })
    try {
      const r = await agent(https.app, 'https://vle.lab.example')
        .post('/api/auth/sign-in')
        .send({ email: 'ana@lab.test', password: PASSWORD })
      expect(r.status).toBe(200)
      expect(String(r.headers['set-cookie'])).toMatch(/Secure/)
    } finally {
      await https.close()
    }
  })

  it('gives the same answer for a wrong password and an unknown e-mail', async () => {
    const wrong = await agent(t.app).post('/api/auth/sign-in').send({ email: 'ana@lab.test', password: 'nope' })
    const unknown = await agent(t.app).post('/api/auth/sign-in').send({ email: 'nobody@lab.test', password: 'nope' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.error).toEqual({ code: 'invalid_credentials', message: BAD_SIGN_IN, details: null })
    expect(unknown.body.error).toEqual(wrong.body.error)
    // Every error answer names its request (as in the X-Request-Id header and the log line).
    expect(wrong.body.requestId).toBe(wrong.headers['x-request-id'])
    expect(unknown.body.requestId).not.toBe(wrong.body.requestId)
  })

  it("ends a deactivated user's sessions at once", async () => {
    const ana = await signedInAgent(t.app, 'ana@lab.test')
    const admin = await signedInAgent(t.app, 'ada@lab.test')
    const users = (await admin.get('/api/admin/users')).body.items
    const id = users.find((u: { email: string }) => u.email === 'ana@lab.test').id
    await admin.post(`/api/admin/users/${id}/deactivate`).expect(200)
    expect((await ana.get('/api/auth/me')).status).toBe(401)
    const again = await agent(t.app).post('/api/auth/sign-in').send({ email: 'ana@lab.test', password: PASSWORD })
    expect(again.body.error.message).toBe(BAD_SIGN_IN)
  })

  it('rate-limits failed attempts per account', async () => {
    const strict = await createTestContext({ RATE_LIMIT_SIGNIN_PER_ACCOUNT: '3' })
    try {
      for (let i = 0; i < 3; i++)
        await agent(strict.app).post('/api/auth/sign-in').send({ email: 'ana@lab.test', password: 'x' }).expect(401)
      const r = await agent(strict.app).post('/api/auth/sign-in').send({ email: 'ana@lab.test', password: PASSWORD })
      expect(r.status).toBe(429)
      expect(r.body.error.message).toBe(
        'Too many failed sign-in attempts for this account. Wait 15 minutes and try again.',
      )
    } finally {
      await strict.close()
    }
  })

  it('rate-limits attempts per IP address', async () => {
    const strict = await createTestContext({ RATE_LIMIT_SIGNIN_PER_IP: '2' })
    try {
      await agent(strict.app).post('/api/auth/sign-in').send({ email: 'a@lab.test', password: 'x' })
      await agent(strict.app).post('/api/auth/sign-in').send({ email: 'b@lab.test', password: 'x' })
      const r = await agent(strict.app).post('/api/auth/sign-in').send({ email: 'c@lab.test', password: 'x' })
      expect(r.status).toBe(429)
    } finally {
      await strict.close()
    }
  })
})

describe('invites and password resets', () => {
  it('invites a user by mail; the link sets a password once', async () => {
    const admin = await signedInAgent(t.app, 'ada@lab.test')
    await admin
      .post('/api/admin/users')
      .send({ email: 'rui@lab.test', displayName: 'Rui Reviewer', roles: ['reviewer'] })
      .expect(201)
    const [mail] = await t.mail()
    expect(mail.envelope_to).toBe('rui@lab.test')
    expect(mail.subject).toBe('You are invited to Ebullio')
    const token = linkIn(mail.body_text, '/welcome/').split('/welcome/')[1]
    expect((await agent(t.app).get(`/api/auth/invites/${token}`)).body).toEqual({
      email: 'rui@lab.test',
      displayName: 'Rui Reviewer',
    })
    const rui = agent(t.app)
    await rui.post('/api/auth/accept-invite').send({ token, password: 'a-new-long-password' }).expect(200)
    expect((await rui.get('/api/auth/me')).body.user.roles).toEqual(['reviewer'])
    const reuse = await agent(t.app).post('/api/auth/accept-invite').send({ token, password: 'another-long-password' })
    expect(reuse.status).toBe(400)
    expect(reuse.body.error.code).toBe('invalid_link')
  })

  it('resets a password with a single-use link and refuses it when reused or expired', async () => {
    await agent(t.app).post('/api/auth/forgot-password').send({ email: 'ana@lab.test' }).expect(200)
    const unknown = await agent(t.app).post('/api/auth/forgot-password').send({ email: 'ghost@lab.test' })
    expect(unknown.status).toBe(200)
    const mails = await t.mail()
    expect(mails).toHaveLength(1)
    const token = linkIn(mails[0].body_text, '/reset-password/').split('/reset-password/')[1]
    await agent(t.app).post('/api/auth/reset-password').send({ token, password: 'brand-new-password' }).expect(200)
    await signedInAgent(t.app, 'ana@lab.test', 'brand-new-password')
    const reused = await agent(t.app).post('/api/auth/reset-password').send({ token, password: 'brand-new-password-2' })
    expect(reused.body.error).toMatchObject({
      code: 'invalid_link',
      message: 'This link is not valid any more. It may have been used already or have expired; ask for a new one.',
    })

    await agent(t.app).post('/api/auth/forgot-password').send({ email: 'ana@lab.test' }).expect(200)
    const second = linkIn((await t.mail())[0].body_text, '/reset-password/').split('/reset-password/')[1]
    await t.db
      .updateTable('password_reset')
      .set({ expires_at: new Date(Date.now() - 1000) })
      .where('used_at', 'is', null)
      .execute()
    const expired = await agent(t.app)
      .post('/api/auth/reset-password')
      .send({ token: second, password: 'brand-new-password-3' })
    expect(expired.body.error.code).toBe('invalid_link')
  })

  it('saves the notification preference and audits the change', async () => {
    const a = await signedInAgent(t.app, 'ana@lab.test')
    await a.patch('/api/auth/me/preferences').send({ notifyMail: false }).expect(200)
    expect((await a.get('/api/auth/me')).body.user.notifyMail).toBe(false)
    const rows = await t.db
      .selectFrom('audit_log')
      .selectAll()
      .where('action', '=', 'change notification preference')
      .execute()
    expect(rows).toHaveLength(1)
    const bad = await a.patch('/api/auth/me/preferences').send({ notifyMail: 'sometimes' })
    expect(bad.status).toBe(422)
  })

  it('changes a password after checking the current one', async () => {
    const a = await signedInAgent(t.app, 'ana@lab.test')
    const bad = await a
      .post('/api/auth/change-password')
      .send({ currentPassword: 'wrong', newPassword: 'long-enough-password' })
    expect(bad.body.error.message).toBe('Your current password is not correct.')
    await a
      .post('/api/auth/change-password')
      .send({ currentPassword: PASSWORD, newPassword: 'long-enough-password' })
      .expect(200)
    await signedInAgent(t.app, 'ana@lab.test', 'long-enough-password')
  })
})

describe('errors and request hygiene', () => {
  it('refuses a state-changing request without or with a forged Origin', async () => {
    const a = await signedInAgent(t.app, 'ana@lab.test')
    const forged = await a.post('/api/auth/sign-out').set('Origin', 'http://evil.example')
    expect(forged.status).toBe(403)
    expect(forged.body.error.code).toBe('cross_site_request')
    const { default: request } = await import('supertest')
    const none = await request(t.app).post('/api/auth/sign-in').send({ email: 'ana@lab.test', password: PASSWORD })
    expect(none.status).toBe(403)
    // the sender controls Host: an Origin that matches the request's own Host but not PUBLIC_URL is still foreign
    const sameAsHost = await a
      .post('/api/auth/sign-out')
      .set('Host', 'evil.example')
      .set('X-Forwarded-Host', 'evil.example')
      .set('Origin', 'http://evil.example')
    expect(sameAsHost.status).toBe(403)
    expect(sameAsHost.body.error.code).toBe('cross_site_request')
    expect((await a.get('/api/auth/me')).status).toBe(200) // still signed in: the sign-out was refused
  })

  it('answers malformed and oversize JSON with the error shape', async () => {
    const bad = await agent(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":')
    expect(bad.status).toBe(400)
    expect(bad.body).toEqual({
      error: { code: 'malformed_json', message: 'The request body is not valid JSON.', details: null },
      requestId: bad.headers['x-request-id'],
    })
    const big = await agent(t.app)
      .post('/api/auth/sign-in')
      .send({ email: 'a@b.test', password: 'x'.repeat(2_000_000) })
    expect(big.status).toBe(413)
    expect(big.body.error.code).toBe('payload_too_large')
  })

  it('lists every bad field of a validation failure', async () => {
    const admin = await signedInAgent(t.app, 'ada@lab.test')
    const r = await admin.post('/api/admin/users').send({ email: 'not-an-email', displayName: '', roles: [] })
    expect(r.status).toBe(422)
    expect(r.body.error.code).toBe('validation_failed')
    expect(r.body.error.details.map((d: { path: string }) => d.path)).toEqual(['email', 'displayName', 'roles'])
  })

  it('answers unknown API routes with 404 and sets security headers', async () => {
    const r = await agent(t.app).get('/api/nothing-here')
    expect(r.status).toBe(404)
    expect(r.headers['x-content-type-options']).toBe('nosniff')
    expect(r.headers['content-security-policy']).toContain("default-src 'self'")
  })
})

describe('the stored session id', () => {
  it('is the hex SHA-256 of the token (FIPS 180-2 test vectors), the same digest @oslojs/crypto gives', () => {
    // FIPS 180-2, appendix B.1 and B.2 (one-block and two-block messages)
    expect(sessionIdOf('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad')
    expect(sessionIdOf('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    )
    const token = generateSessionToken()
    expect(sessionIdOf(token)).toBe(encodeHexLowerCase(sha256(new TextEncoder().encode(token))))
  })
})
