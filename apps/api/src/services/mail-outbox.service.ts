/** The admins' view of the outbox: mail that could not be delivered, and a manual "try again now". */
import type { Db } from '../db/index.js'
import { conflict, notFound } from '../errors/index.js'
import { appendAudit } from '../repositories/audit.repository.js'
import { lockMail, releaseMail } from '../repositories/mail-outbox.repository.js'

export { listUndeliveredMail } from '../repositories/mail-outbox.repository.js'

/**
 * Try an undelivered message again within the mail worker's next round: a given-up one is released, a waiting one
 * skips the rest of its wait. Its try count is kept, so a message already at its bound gets exactly one more try
 * (and is given up again if that fails). Audited. Refused for a delivered message and for one being sent now.
 */
export async function retryMail(db: Db, actorId: string, id: string): Promise<{ id: string; status: 'queued' }> {
  return db.transaction().execute(async (tx) => {
    const m = await lockMail(tx, id)
    if (!m) throw notFound('There is no such message in the outbox.')
    if (m.sent_at) throw conflict('This message was delivered; there is nothing to try again.')
    if (m.claimed_until && m.claimed_until.getTime() > Date.now())
      throw conflict('This message is being sent right now; look again in a minute.')
    await releaseMail(tx, id)
    await appendAudit(tx, {
      actorId,
      entity: 'mail_outbox',
      entityId: String(m.id),
      action: 'retry',
      before: { to: m.to_address, attempts: m.attempts, lastError: m.last_error, failedAt: m.failed_at },
    })
    return { id: String(m.id), status: 'queued' as const }
  })
}
