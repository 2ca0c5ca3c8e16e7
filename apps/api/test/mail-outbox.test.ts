import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { Mailer } from '../src/mail/mailer.js'
import { enqueueMail } from '../src/mail/outbox.js'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t.close())
beforeEach(() => resetDatabase(t.db))

describe('mail outbox', () => {
  it('keeps a message through a mail-server outage and delivers it when the server is back', async () => {
    await enqueueMail(t.db, { to: 'ana@lab.test', subject: 'Data set returned', text: 'Please check point 4.' })
    // Port 9 (discard) on loopback: nothing listens there, so the connection is refused.
    const down = new Mailer(t.db, 'smtp://127.0.0.1:9', t.config.mailFrom)
    expect(await down.deliverPending()).toBe(0)
    await down.stop()
    const row = await t.db.selectFrom('mail_outbox').selectAll().executeTakeFirstOrThrow()
    expect(row.sent_at).toBeNull()
    expect(row.attempts).toBe(1)
    expect(row.last_error).toBeTruthy()
    expect(row.next_attempt_at.getTime()).toBeGreaterThan(Date.now())

    // Not due yet: the working server does not get it before its retry time…
    expect((await t.mail()).length).toBe(0)
    // …and does once the retry is due.
    await t.db
      .updateTable('mail_outbox')
      .set({ next_attempt_at: new Date(Date.now() - 1000) })
      .execute()
    const mails = await t.mail()
    expect(mails.map((m) => m.subject)).toEqual(['Data set returned'])
    const sent = await t.db.selectFrom('mail_outbox').selectAll().executeTakeFirstOrThrow()
    expect(sent.sent_at).not.toBeNull()
    expect(sent.attempts).toBe(2)
  })

  it('loses no message when the transaction that queued it rolls back — and sends none either', async () => {
    await expect(
      t.db.transaction().execute(async (tx) => {
        await enqueueMail(tx, { to: 'ana@lab.test', subject: 'never', text: 'x' })
        throw new Error('the change failed')
      }),
    ).rejects.toThrow('the change failed')
    expect(await t.db.selectFrom('mail_outbox').selectAll().execute()).toHaveLength(0)
  })
})
