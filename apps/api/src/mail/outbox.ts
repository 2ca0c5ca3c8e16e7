import type { Db } from '../db/index.js'

export interface MailMessage {
  to: string
  subject: string
  text: string
}

/** Queue a message inside the caller's transaction; the mailer delivers it later and retries until it succeeds. */
export async function enqueueMail(db: Db, m: MailMessage): Promise<void> {
  await db.insertInto('mail_outbox').values({ to_address: m.to, subject: m.subject, body_text: m.text }).execute()
}

/** Queue a message only when the user wants mail (their notification preference). */
export async function notifyUser(db: Db, userId: string, m: Omit<MailMessage, 'to'>): Promise<void> {
  const u = await db
    .selectFrom('app_user')
    .select(['email', 'notify_mail', 'active'])
    .where('id', '=', userId)
    .executeTakeFirst()
  if (u && u.active && u.notify_mail) await enqueueMail(db, { ...m, to: u.email })
}
