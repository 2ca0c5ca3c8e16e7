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
