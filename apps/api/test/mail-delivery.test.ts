import { createServer, type Server } from 'node:net'
import { SMTPServer } from 'smtp-server'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { startFakeSmtp } from '../src/mail/fake-smtp.js'
import { Mailer } from '../src/mail/mailer.js'
import { enqueueMail } from '../src/mail/outbox.js'
import { createTestContext, createUser, resetDatabase, signedInAgent, type TestContext } from './helpers.js'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t.close())
beforeEach(() => resetDatabase(t.db))

/** An SMTP server that refuses one recipient for good (550), as a real server does for an unknown mailbox. */
async function refusingServer(): Promise<{ port: number; close: () => Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onRcptTo(address, _session, callback) {
      if (address.address.startsWith('gone@')) {
        const err = new Error('5.1.1 mailbox unavailable') as Error & { responseCode: number }
        err.responseCode = 550
        return callback(err)
      }
      callback()
    },
    onData(stream, _session, callback) {
      stream.resume()
      stream.on('end', () => callback())
    },
  })
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()))
  const a = server.server.address()
  return { port: typeof a === 'object' && a ? a.port : 0, close: () => new Promise((r) => server.close(() => r())) }
}

const dueNow = () =>
  t.db
    .updateTable('mail_outbox')
    .set({ next_attempt_at: new Date(Date.now() - 1000) })
    .execute()

describe('mail delivery', () => {
  it('gives up on a permanently refused recipient after a bounded number of tries and shows it to admins', async () => {
    const smtp = await refusingServer()
    const mailer = new Mailer(t.db, `smtp://127.0.0.1:${smtp.port}`, t.config.mailFrom, undefined, {
      maxRefusedAttempts: 3,
    })
    try {
      await enqueueMail(t.db, { to: 'gone@lab.test', subject: 'Returned', text: 'x' })
      await enqueueMail(t.db, { to: 'here@lab.test', subject: 'Approved', text: 'y' })
      const first = await mailer.deliverPending()
      expect(first, JSON.stringify(await t.db.selectFrom('mail_outbox').selectAll().execute())).toBe(1)
      for (let i = 0; i < 5; i++) {
        await dueNow()
        await mailer.deliverPending()
      }
      const gone = await t.db
        .selectFrom('mail_outbox')
        .selectAll()
        .where('to_address', '=', 'gone@lab.test')
        .executeTakeFirstOrThrow()
      expect(gone.attempts).toBe(3) // not 6: it stopped
      expect(gone.failed_at).not.toBeNull()
      expect(gone.sent_at).toBeNull()
      expect(gone.last_error).toMatch(/550/)
    } finally {
      await mailer.stop()
      await smtp.close()
    }
    await createUser(t.db, { email: 'ada@lab.test', roles: ['admin'] })
    await createUser(t.db, { email: 'ana@lab.test', roles: ['analyst'] })
    const admin = await signedInAgent(t.app, 'ada@lab.test')
    const list = await admin.get('/api/admin/mail-outbox?status=failed').expect(200)
    expect(list.body.items).toHaveLength(1)
    expect(list.body.items[0]).toMatchObject({ to: 'gone@lab.test', subject: 'Returned', attempts: 3 })
    expect(list.body.items[0].failedAt).toBeTruthy()
    expect((await (await signedInAgent(t.app, 'ana@lab.test')).get('/api/admin/mail-outbox')).status).toBe(403)
  })

  it('a mail server that accepts the connection and never answers costs one bounded timeout', async () => {
    const sockets: import('node:net').Socket[] = []
    const silent: Server = createServer((s) => sockets.push(s)) // never sends the SMTP greeting
    await new Promise<void>((r) => silent.listen(0, '127.0.0.1', () => r()))
    const port = (silent.address() as { port: number }).port
    const mailer = new Mailer(t.db, `smtp://127.0.0.1:${port}`, t.config.mailFrom, undefined, { timeoutMs: 800 })
    try {
      await enqueueMail(t.db, { to: 'ana@lab.test', subject: 'Hello', text: 'x' })
      expect(await mailer.deliverPending()).toBe(0) // returns instead of hanging (the test timeout is 30 s)
      const row = await t.db.selectFrom('mail_outbox').selectAll().executeTakeFirstOrThrow()
      expect(row.attempts).toBe(1)
      expect(row.sent_at).toBeNull()
      expect(row.failed_at).toBeNull() // a timeout is temporary: it will be tried again
      expect(row.last_error).toMatch(/timeout|greeting/i)
    } finally {
      await mailer.stop()
      for (const s of sockets) s.destroy()
      await new Promise((r) => silent.close(r))
    }
  })

  it('two workers on one outbox send each message once', async () => {
    for (let i = 0; i < 30; i++) await enqueueMail(t.db, { to: `p${i}@lab.test`, subject: `m${i}`, text: 'x' })
    const smtp = await startFakeSmtp(t.db, 0)
    const workers = [0, 1].map(() => new Mailer(t.db, `smtp://127.0.0.1:${smtp.port}`, t.config.mailFrom))
    try {
      const sent = await Promise.all(workers.map((w) => w.deliverPending()))
      expect(sent[0] + sent[1]).toBe(30)
      expect(Math.min(...sent)).toBeGreaterThan(0) // both took a share
    } finally {
      await Promise.all(workers.map((w) => w.stop()))
      await smtp.close()
    }
    const captured = await t.db.selectFrom('captured_mail').select('subject').execute()
    expect(captured).toHaveLength(30)
    expect(new Set(captured.map((c) => c.subject)).size).toBe(30)
    const rows = await t.db.selectFrom('mail_outbox').select(['attempts', 'sent_at']).execute()
    expect(rows.every((r) => r.attempts === 1 && r.sent_at !== null)).toBe(true)
  })

  it('the fake SMTP refuses .invalid recipients for good; an admin tries one again, once, audited', async () => {
    const smtp = await startFakeSmtp(t.db, 0)
    const mailer = new Mailer(t.db, `smtp://127.0.0.1:${smtp.port}`, t.config.mailFrom, undefined, {
      maxRefusedAttempts: 2,
    })
    const hostile = '<img src=x onerror="alert(1)"> & "quotes"'
    try {
      await enqueueMail(t.db, { to: 'nobody@lab.invalid', subject: hostile, text: 'x' })
      await enqueueMail(t.db, { to: 'here@lab.test', subject: 'Delivered', text: 'y' })
      expect(await mailer.deliverPending()).toBe(1)
      await dueNow()
      await mailer.deliverPending()
      await createUser(t.db, { email: 'ada@lab.test', roles: ['admin'] })
      await createUser(t.db, { email: 'ana@lab.test', roles: ['analyst'] })
      const admin = await signedInAgent(t.app, 'ada@lab.test')
      const failed = (await admin.get('/api/admin/mail-outbox?status=failed').expect(200)).body.items
      expect(failed).toHaveLength(1)
      expect(failed[0]).toMatchObject({ to: 'nobody@lab.invalid', subject: hostile, attempts: 2, nextAttemptAt: null })
      expect(failed[0].lastError).toMatch(/550.*nobody@lab\.invalid: this domain does not receive mail/)
      const id = String(failed[0].id)

      const analyst = await signedInAgent(t.app, 'ana@lab.test')
      expect((await analyst.post(`/api/admin/mail-outbox/${id}/retry`)).status).toBe(403)
      const ok = await admin.post(`/api/admin/mail-outbox/${id}/retry`).expect(200)
      expect(ok.body).toEqual({ id, status: 'queued' })
      const audit = await t.db
        .selectFrom('audit_log')
        .selectAll()
        .where('entity', '=', 'mail_outbox')
        .executeTakeFirstOrThrow()
      expect(audit).toMatchObject({ entity_id: id, action: 'retry' })
      expect(audit.before).toMatchObject({ to: 'nobody@lab.invalid', attempts: 2 })
      expect((await admin.get('/api/admin/mail-outbox?status=failed')).body.items).toHaveLength(0)
      const waiting = (await admin.get('/api/admin/mail-outbox?status=retrying')).body.items
      expect(waiting.map((m: { id: string }) => String(m.id))).toEqual([id])

      // due at once (no wait), one more try (the bound was reached), then given up again
      expect(await mailer.deliverPending()).toBe(0)
      const again = (await admin.get('/api/admin/mail-outbox?status=failed')).body.items
      expect(again).toHaveLength(1)
      expect(again[0].attempts).toBe(3)

      const sent = await t.db
        .selectFrom('mail_outbox')
        .select('id')
        .where('to_address', '=', 'here@lab.test')
        .executeTakeFirstOrThrow()
      const done = await admin.post(`/api/admin/mail-outbox/${sent.id}/retry`)
      expect(done.status).toBe(409)
      expect(done.body.error.message).toBe('This message was delivered; there is nothing to try again.')
      expect((await admin.post('/api/admin/mail-outbox/999999/retry')).status).toBe(404)
      const bad = await admin.post('/api/admin/mail-outbox/abc/retry')
      expect(bad.status).toBe(422)
      expect(bad.body.error.message).toBe('Some fields are not valid: id.')
      expect(
        await t.db.selectFrom('audit_log').select('id').where('entity', '=', 'mail_outbox').execute(),
      ).toHaveLength(1)
    } finally {
      await mailer.stop()
      await smtp.close()
    }
  })
})
