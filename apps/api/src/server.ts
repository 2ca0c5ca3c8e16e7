import { pino } from 'pino'
import { createLucia, Sessions } from './auth/index.js'
import { loadConfig } from './config.js'
import { createDb, createPool } from './db/index.js'
import { startFakeSmtp } from './mail/fake-smtp.js'
import { Mailer } from './mail/mailer.js'
import { createApp } from './app.js'

const config = loadConfig()
const logger = pino({ level: config.logLevel })
const pool = createPool(config.databaseUrl)
const db = createDb(config.databaseUrl, pool)

const smtp = config.fakeSmtp ? await startFakeSmtp(db, config.fakeSmtpPort) : null
const smtpUrl = smtp ? `smtp://127.0.0.1:${smtp.port}` : config.smtpUrl
const mailer = new Mailer(db, smtpUrl, config.mailFrom, logger)
mailer.start()
const sessions = new Sessions(createLucia(pool, config), config)
const app = createApp({ db, config, sessions, mailer }, logger)

const server = app.listen(config.port, config.host, () => {
  logger.info(`Ebullio is serving on ${config.publicUrl}${smtp ? ` (mail capture on 127.0.0.1:${smtp.port})` : ''}`)
})

let stopping = false
async function shutdown(signal: string) {
  if (stopping) return
  stopping = true
  logger.info(`${signal}: stopping`)
  server.close()
  await mailer.stop()
  await smtp?.close()
  await db.destroy()
  process.exit(0)
}
process.on('SIGINT', () => void shutdown('SIGINT'))
process.on('SIGTERM', () => void shutdown('SIGTERM'))
