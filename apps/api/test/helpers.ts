import type { Role } from '@ebullio/schemas'
import { sql, type Kysely } from 'kysely'
import { pino, type Logger } from 'pino'
import request from 'supertest'
import type { Express } from 'express'
import { createApp } from '../src/app.js'
import { Sessions } from '../src/auth/index.js'
import { loadConfig, type Config } from '../src/config.js'
import { createDb, createPool, type Database } from '../src/db/index.js'
import { startFakeSmtp } from '../src/mail/fake-smtp.js'
import { Mailer } from '../src/mail/mailer.js'
import { ChangeFeed, type ChangeFeedOptions } from '../src/ops/change-feed.js'
import { createUser as createUserService } from '../src/services/users.service.js'

export const PASSWORD = 'correct-horse-battery'

export interface TestContext {
  app: Express
  db: Kysely<Database>
  config: Config
  mailer: Mailer
  /** The app's change feed (its caches are bypassed until it listens: createTestContext waits for that). */
  changes: ChangeFeed
  /** Deliver the outbox now and return the captured messages, newest first. */
  mail: () => Promise<{ envelope_to: string; subject: string; body_text: string }[]>
  close: () => Promise<void>
}

/** An app wired to the test database, with its own fake SMTP on a free port. */
export async function createTestContext(
  env: Record<string, string> = {},
  logger: Logger = pino({ level: 'silent' }),
  o: { changes?: ChangeFeedOptions } = {},
): Promise<TestContext> {
  const config = loadConfig({
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    RATE_LIMIT_SIGNIN_PER_IP: '10000',
    RATE_LIMIT_SIGNIN_PER_ACCOUNT: '10000',
    RATE_LIMIT_FORGOT_PER_ADDRESS: '10000',
    RATE_LIMIT_FORGOT_PER_IP: '10000',
    RATE_LIMIT_PASSWORD_CHANGE: '10000',
    ...env,
  })
  const pool = createPool(config.databaseUrl)
  const db = createDb(config.databaseUrl, pool)
  const smtp = await startFakeSmtp(db, 0)
  const mailer = new Mailer(db, `smtp://127.0.0.1:${smtp.port}`, config.mailFrom)
  const changes = new ChangeFeed(config.databaseUrl, { logger, ttlMs: config.cacheTtlMs, ...o.changes }).start()
  await changes.ready()
  const sessions = new Sessions(db, config, changes)
  const app = createApp({ db, config, sessions, mailer, changes }, logger, undefined, { pool })
  return {
    app,
    db,
    config,
    mailer,
    changes,
    mail: async () => {
      await mailer.deliverPending()
      return db.selectFrom('captured_mail').selectAll().orderBy('id', 'desc').execute()
    },
    close: async () => {
      await mailer.stop()
      await smtp.close()
      await changes.close()
      await db.destroy()
    },
  }
}

/** Empty every table except the migration bookkeeping. */
export async function resetDatabase(db: Kysely<Database>): Promise<void> {
  const { rows } = await sql<{ tablename: string }>`
    select tablename from pg_tables where schemaname = 'public' and tablename not like 'kysely_%'`.execute(db)
  if (rows.length)
    await sql.raw(`truncate ${rows.map((r) => `"${r.tablename}"`).join(', ')} restart identity cascade`).execute(db)
}

export async function createUser(
  db: Kysely<Database>,
  o: { email: string; roles: Role[]; password?: string; displayName?: string },
): Promise<string> {
  return createUserService(db, {
    email: o.email,
    roles: o.roles,
    password: o.password ?? PASSWORD,
    displayName: o.displayName ?? o.email.split('@')[0],
  })
}

/** A supertest agent that keeps cookies and sends a same-origin Origin header, like the web app does. */
export function agent(app: Express, origin = 'http://127.0.0.1:3000') {
  const a = request.agent(app)
  a.set('Origin', origin)
  return a
}

export async function signedInAgent(app: Express, email: string, password = PASSWORD) {
  const a = agent(app)
  const r = await a.post('/api/auth/sign-in').send({ email, password })
  if (r.status !== 200) throw new Error(`sign-in as ${email} failed: ${r.status} ${JSON.stringify(r.body)}`)
  return a
}

/** The first link to this app found in a mail body. */
export function linkIn(body: string, pathPrefix: string): string {
  const m = body.match(new RegExp(`https?://[^\\s]+${pathPrefix}[^\\s]+`))
  if (!m) throw new Error(`no ${pathPrefix} link in mail:\n${body}`)
  return m[0]
}
