import type { Kysely } from 'kysely'
import type { Database } from '../db/index.js'
import { insertCapturedMail } from '../repositories/captured-mail.repository.js'

/**
 * A local SMTP server for development and tests: it accepts every message on loopback and stores it in
 * `captured_mail`, where admins can read it in the app and tests can follow its links. Like a real server for a
 * domain that does not exist, it refuses for good (550) any recipient under `.invalid`, the top-level domain that
 * RFC 2606 reserves as never resolvable: that is how a permanently failing mail is made on purpose. Its two
 * packages are development dependencies, loaded only when the capture starts (a production install does without them).
 */
export async function startFakeSmtp(
  db: Kysely<Database>,
  port: number,
  host = '127.0.0.1',
): Promise<{ port: number; close: () => Promise<void> }> {
  const [{ SMTPServer }, { simpleParser }] = await Promise.all([import('smtp-server'), import('mailparser')]).catch(
    (e: Error) => {
      throw new Error(
        `The mail capture (FAKE_SMTP) needs the development packages smtp-server and mailparser: ${e.message}`,
      )
    },
  )
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Ebullio mail capture',
    logger: false,
    onRcptTo(address, _session, callback) {
      if (/\.invalid$/i.test(address.address)) {
        const err = new Error(`5.1.2 ${address.address}: this domain does not receive mail`) as Error & {
          responseCode: number
        }
        err.responseCode = 550
        return callback(err)
      }
      callback()
    },
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          await insertCapturedMail(db, {
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            envelopeTo: session.envelope.rcptTo.map((r) => r.address).join(', '),
            subject: mail.subject ?? '',
            bodyText: mail.text ?? '',
          })
          callback()
        })
        .catch((err: Error) => callback(err))
    },
  })
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(port, host, () => resolve())
  })
  const address = server.server.address()
  const actual = typeof address === 'object' && address ? address.port : port
  return { port: actual, close: () => new Promise((r) => server.close(() => r())) }
}
