import type { Db } from '../db/index.js'
import { insertOutboxMail } from '../repositories/mail-outbox.repository.js'
import { mailPreferenceOf } from '../repositories/users.repository.js'

export interface MailMessage {
  to: string
  subject: string
  text: string
}

/** Queue a message inside the caller's transaction; the mailer delivers it later and retries until it succeeds. */
export async function enqueueMail(db: Db, m: MailMessage): Promise<void> {
  await insertOutboxMail(db, m)
}

/** Queue a message only when the user wants mail (their notification preference). */
export async function notifyUser(db: Db, userId: string, m: Omit<MailMessage, 'to'>): Promise<void> {
  const u = await mailPreferenceOf(db, userId)
  if (u && u.active && u.notify_mail) await enqueueMail(db, { ...m, to: u.email })
}
