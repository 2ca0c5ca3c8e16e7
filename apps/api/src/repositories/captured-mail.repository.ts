import type { Db } from '../db/index.js'

/** Mail the development SMTP capture received (dev and test only). */
export async function insertCapturedMail(
  db: Db,
  m: { envelopeFrom: string; envelopeTo: string; subject: string; bodyText: string },
): Promise<void> {
  await db
    .insertInto('captured_mail')
    .values({ envelope_from: m.envelopeFrom, envelope_to: m.envelopeTo, subject: m.subject, body_text: m.bodyText })
    .execute()
}

/** The 200 newest captured messages. */
export async function listCapturedMailRows(db: Db) {
  return db.selectFrom('captured_mail').selectAll().orderBy('id', 'desc').limit(200).execute()
}
