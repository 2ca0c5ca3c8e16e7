import { sql } from 'kysely'
import type { OutboxMail } from '../db/auth-tables.js'
import type { Db } from '../db/index.js'

/** A message the outbox could not deliver: given up (`failedAt` set) or still being retried. */
export interface UndeliveredMail {
  id: number | string
  to: string
  subject: string
  createdAt: Date
  attempts: number
  lastError: string | null
  nextAttemptAt: Date | null
  failedAt: Date | null
}

/** The 200 newest undelivered messages: 'failed' (given up for good) or 'retrying' (failed at least once). */
export async function listUndeliveredMail(db: Db, status: 'failed' | 'retrying'): Promise<UndeliveredMail[]> {
  let q = db
    .selectFrom('mail_outbox')
    .select(['id', 'to_address', 'subject', 'created_at', 'attempts', 'last_error', 'next_attempt_at', 'failed_at'])
    .where('sent_at', 'is', null)
  q =
    status === 'failed'
      ? q.where('failed_at', 'is not', null)
      : q.where('failed_at', 'is', null).where('attempts', '>', 0)
  const rows = await q.orderBy('id', 'desc').limit(200).execute()
  return rows.map((r) => ({
    id: r.id,
    to: r.to_address,
    subject: r.subject,
    createdAt: r.created_at,
    attempts: r.attempts,
    lastError: r.last_error,
    nextAttemptAt: r.failed_at ? null : r.next_attempt_at,
    failedAt: r.failed_at,
  }))
}

export async function insertOutboxMail(db: Db, m: { to: string; subject: string; text: string }): Promise<void> {
  await db.insertInto('mail_outbox').values({ to_address: m.to, subject: m.subject, body_text: m.text }).execute()
}

/**
 * Claim the next due message for one worker for `leaseMs` and count the attempt; null when none is due or every
 * due one is held by another worker (`for update skip locked`: several replicas may deliver side by side).
 */
export async function claimDueMail(db: Db, leaseMs: number): Promise<OutboxMail | null> {
  const { rows } = await sql<OutboxMail>`
    update mail_outbox
       set claimed_until = now() + ${leaseMs} * interval '1 millisecond', attempts = attempts + 1
     where id = (select id from mail_outbox
                  where sent_at is null and failed_at is null and next_attempt_at <= now()
                    and (claimed_until is null or claimed_until < now())
                  order by next_attempt_at, id
                  limit 1
                  for update skip locked)
    returning *`.execute(db)
  return rows[0] ?? null
}

export async function markMailSent(db: Db, id: OutboxMail['id']): Promise<void> {
  await db
    .updateTable('mail_outbox')
    .set({ sent_at: new Date(), claimed_until: null, last_error: null })
    .where('id', '=', id)
    .execute()
}

/** A failed attempt: the error, when to try again, and `failedAt` when the outbox gives up for good. */
export async function markMailFailed(
  db: Db,
  id: OutboxMail['id'],
  f: { lastError: string; nextAttemptAt: Date; failedAt: Date | null },
): Promise<void> {
  await db
    .updateTable('mail_outbox')
    .set({ claimed_until: null, last_error: f.lastError, next_attempt_at: f.nextAttemptAt, failed_at: f.failedAt })
    .where('id', '=', id)
    .execute()
}

/** The outbox at a glance: messages waiting, the age of the oldest waiting one (s, 0 when none), messages given up. */
export async function outboxStats(db: Db): Promise<{ pending: number; oldestSeconds: number; failed: number }> {
  const { rows } = await sql<{ pending: number; oldest: number | null; failed: number }>`
    select count(*) filter (where sent_at is null and failed_at is null)::int as pending,
           extract(epoch from now() - min(created_at) filter (where sent_at is null and failed_at is null))::float8 as oldest,
           count(*) filter (where failed_at is not null)::int as failed
      from mail_outbox`.execute(db)
  return { pending: rows[0].pending, oldestSeconds: rows[0].oldest ?? 0, failed: rows[0].failed }
}

/** One outbox row, locked for the rest of the transaction. */
export async function lockMail(db: Db, id: string) {
  return db
    .selectFrom('mail_outbox')
    .select(['id', 'to_address', 'subject', 'attempts', 'last_error', 'failed_at', 'sent_at', 'claimed_until'])
    .where('id', '=', id)
    .forUpdate()
    .executeTakeFirst()
}

/** Make a message due now and no longer given up (its try count stays). */
export async function releaseMail(db: Db, id: string): Promise<void> {
  await db
    .updateTable('mail_outbox')
    .set({ failed_at: null, next_attempt_at: new Date() })
    .where('id', '=', id)
    .execute()
}
