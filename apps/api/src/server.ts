import { pino } from 'pino'
import { Sessions } from './auth/index.js'
import { loadConfig, loadEnvFile } from './config.js'
import { createDb, createPool } from './db/index.js'
import { startFakeSmtp } from './mail/fake-smtp.js'
import { Mailer } from './mail/mailer.js'
import { ChangeFeed } from './ops/change-feed.js'
import { createApp } from './app.js'

loadEnvFile()
const config = loadConfig()
const logger = pino({ level: config.logLevel })
// A broken idle connection (PostgreSQL restarted or dropped it) is logged, never fatal: the pool opens a new one.
const pool = createPool(config.databaseUrl, {
  onError: (err) => logger.warn({ error: err.message }, 'database connection lost; it will be reopened when needed'),
})
const db = createDb(config.databaseUrl, pool)

const smtp = config.fakeSmtp ? await startFakeSmtp(db, config.fakeSmtpPort) : null
const smtpUrl = smtp ? `smtp://127.0.0.1:${smtp.port}` : config.smtpUrl
const mailer = new Mailer(db, smtpUrl, config.mailFrom, logger, {
  timeoutMs: config.smtpTimeoutMs,
  maxAttempts: config.mailMaxAttempts,
  maxRefusedAttempts: config.mailMaxRefusedAttempts,
})
mailer.start(config.mailPollMs)
// The database's change notifications, for the in-process caches (sessions, curve sources): see docs/operations.md.
const changes = new ChangeFeed(config.databaseUrl, { logger, ttlMs: config.cacheTtlMs }).start()
const sessions = new Sessions(db, config, changes)
const lifecycle = { stopping: false }
const app = createApp({ db, config, sessions, mailer, changes }, logger, undefined, {
  pool,
  lifecycle,
  processMetrics: true,
})

const server = app.listen(config.port, config.host, () => {
  logger.info(`Ebullio is serving on ${config.publicUrl}${smtp ? ` (mail capture on 127.0.0.1:${smtp.port})` : ''}`)
})
server.on('error', (err) => {
  logger.fatal({ error: err.message }, 'cannot listen')
  process.exit(1)
})

/**
 * Graceful stop: accept no new connections, let requests in flight finish (at most SHUTDOWN_TIMEOUT_MS, then
 * their connections are cut), let the mail worker finish the message it is sending, close the pool.
 */
async function shutdown(signal: string) {
  if (lifecycle.stopping) return
  lifecycle.stopping = true
  logger.info(`${signal}: stopping (in-flight requests get up to ${config.shutdownTimeoutMs} ms)`)
  const closed = new Promise<void>((resolve) => server.close(() => resolve()))
  server.closeIdleConnections()
  const cut = setTimeout(() => {
    logger.warn('requests still running at the shutdown deadline: closing their connections')
    server.closeAllConnections()
  }, config.shutdownTimeoutMs)
  cut.unref()
  await Promise.all([closed, mailer.stop()])
  clearTimeout(cut)
  await smtp?.close()
  await changes.close()
  await db.destroy()
  logger.info('stopped')
  process.exit(0)
}
process.on('SIGINT', () => void shutdown('SIGINT'))
process.on('SIGTERM', () => void shutdown('SIGTERM'))
