import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { sql, type Kysely } from 'kysely'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ensureHaproxy } from '../../../scripts/lib/system.mjs'
import { loadConfig } from '../src/config.js'
import { createDb, type Database } from '../src/db/index.js'
import { startFakeSmtp } from '../src/mail/fake-smtp.js'
import { buildLab, draftWithPoints } from './lab-fixture.js'
import { createUser, PASSWORD, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import { freePort, startApi, waitFor, type ApiProcess } from './processes.js'

/**
 * The scale-out picture: a real reverse proxy (Debian's haproxy, round robin) in front of two API processes on one
 * database. Everything below goes through the proxy; the replica that answered is in the X-Replica header.
 */
const PUBLIC_URL = 'http://127.0.0.1:3000' // what the agents send as Origin; the replicas' configured public URL
let db: Kysely<Database>
let smtp: { port: number; close: () => Promise<void> }
const replicas: ApiProcess[] = []
let proxy: ChildProcess
let proxyUrl: string
let dir: string

beforeAll(async () => {
  const url = process.env.DATABASE_URL!
  db = createDb(url)
  await resetDatabase(db)
  smtp = await startFakeSmtp(db, 0) // one mail server for both replicas, storing what it receives
  const env = {
    DATABASE_URL: url,
    PUBLIC_URL,
    FAKE_SMTP: 'false',
    SMTP_URL: `smtp://127.0.0.1:${smtp.port}`,
    MAIL_POLL_MS: '50', // both workers poll hard, so they race for every message
    RATE_LIMIT_SIGNIN_PER_ACCOUNT: '4',
    RATE_LIMIT_SIGNIN_PER_IP: '1000',
    CACHE_TTL_MS: '60000', // only the change notifications can end a cached session within this test
  }
  replicas.push(await startApi(env))
  replicas.push(await startApi(env))
  const port = await freePort()
  proxyUrl = `http://127.0.0.1:${port}`
  dir = mkdtempSync(path.join(tmpdir(), 'ebullio-proxy-'))
  const cfg = path.join(dir, 'haproxy.cfg')
  writeFileSync(
    cfg,
    [
      'global',
      '  maxconn 256',
      'defaults',
      '  mode http',
      '  timeout connect 5s',
      '  timeout client 60s',
      '  timeout server 60s',
      '  option forwardfor',
      'frontend web',
      `  bind 127.0.0.1:${port}`,
      '  default_backend api',
      'backend api',
      '  balance roundrobin',
      '  option httpchk GET /api/ready',
      '  http-response set-header X-Replica %s',
      ...replicas.map((r, i) => `  server api${i + 1} 127.0.0.1:${r.port} check inter 2s`),
    ].join('\n') + '\n',
  )
  proxy = spawn(ensureHaproxy(), ['-f', cfg, '-db'], { stdio: ['ignore', 'ignore', 'pipe'] })
  await waitFor(`${proxyUrl}/api/health`, (s) => s === 200, 30_000)
}, 180_000)

afterAll(async () => {
  proxy?.kill('SIGTERM')
  await Promise.all(replicas.map((r) => r.stop()))
  await smtp?.close()
  await db?.destroy()
  if (dir) rmSync(dir, { recursive: true, force: true })
})

/** A TestContext whose "app" is the proxy's address: supertest sends real HTTP through haproxy. */
function throughProxy(): TestContext {
  const config = loadConfig({ ...process.env, NODE_ENV: 'test' })
  return {
    app: proxyUrl as never,
    db,
    config,
    mailer: null as never,
    mail: null as never,
    changes: null as never,
    close: async () => {},
  }
}

async function allMailSent(expected: number) {
  const until = Date.now() + 60_000
  for (;;) {
    const { rows } = await sql<{ sent: number; open: number }>`
      select count(*) filter (where sent_at is not null)::int as sent,
             count(*) filter (where sent_at is null)::int as open from mail_outbox`.execute(db)
    if (rows[0].sent >= expected && rows[0].open === 0) return
    if (Date.now() > until) throw new Error(`outbox: ${JSON.stringify(rows[0])}, expected ${expected} sent`)
    await new Promise((r) => setTimeout(r, 200))
  }
}

describe('two API replicas behind haproxy on one database', () => {
  it('keeps sessions valid on both replicas', async () => {
    await createUser(db, { email: 'ada@lab.test', roles: ['admin'] })
    const admin = await signedInAgent(proxyUrl as never, 'ada@lab.test')
    const seen = new Set<string>()
    for (let i = 0; i < 6; i++) {
      const r = await admin.get('/api/auth/me')
      expect(r.status).toBe(200)
      expect(r.body.user.email).toBe('ada@lab.test')
      seen.add(String(r.headers['x-replica']))
    }
    expect([...seen].sort()).toEqual(['api1', 'api2'])
  })

  it('ends a session on both replicas when it is signed out on one (the other had it cached)', async () => {
    const signIn = await fetch(`${replicas[0].url}/api/auth/sign-in`, {
      method: 'POST',
      headers: { Origin: PUBLIC_URL, 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'ada@lab.test', password: PASSWORD }),
    })
    expect(signIn.status).toBe(200)
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0]
    const me = (r: ApiProcess) => fetch(`${r.url}/api/auth/me`, { headers: { Cookie: cookie } }).then((x) => x.status)
    for (const r of replicas) expect([await me(r), await me(r)]).toEqual([200, 200]) // now in both caches
    const out = await fetch(`${replicas[0].url}/api/auth/sign-out`, {
      method: 'POST',
      headers: { Origin: PUBLIC_URL, Cookie: cookie },
    })
    expect(out.status).toBe(200)
    expect(await me(replicas[0])).toBe(401) // the replica that ended it: before it answered
    // The other replica: as soon as PostgreSQL's notification reaches it (normally before this request does; the
    // loop only keeps a loaded machine from failing the test), and long before its cache's minute is over.
    const until = Date.now() + 5000
    let status = await me(replicas[1])
    while (status !== 401 && Date.now() < until) {
      await new Promise((r) => setTimeout(r, 20))
      status = await me(replicas[1])
    }
    expect(status).toBe(401)
  })

  it('delivers every mail exactly once although both replicas run a mail worker', async () => {
    const admin = await signedInAgent(proxyUrl as never, 'ada@lab.test')
    const invites = Array.from({ length: 40 }, (_, i) => `person${i}@lab.test`)
    const answered = new Set<string>()
    // Ten at a time: both replicas take requests and both workers wake up for each.
    for (let i = 0; i < invites.length; i += 10) {
      const rs = await Promise.all(
        invites
          .slice(i, i + 10)
          .map((email) =>
            admin.post('/api/admin/users').send({ email, displayName: email.split('@')[0], roles: ['analyst'] }),
          ),
      )
      for (const r of rs) {
        expect(r.status, JSON.stringify(r.body)).toBe(201)
        answered.add(String(r.headers['x-replica']))
      }
    }
    expect([...answered].sort()).toEqual(['api1', 'api2'])
    await allMailSent(40)
    await new Promise((r) => setTimeout(r, 500)) // time for a duplicate to show up, if any
    const captured = await db.selectFrom('captured_mail').select(['envelope_to', 'subject']).execute()
    const invitesCaptured = captured.filter((m) => m.subject === 'You are invited to Ebullio')
    expect(invitesCaptured).toHaveLength(40)
    expect(new Set(invitesCaptured.map((m) => m.envelope_to)).size).toBe(40)
    const outbox = await db.selectFrom('mail_outbox').select(['attempts']).execute()
    expect(outbox.every((m) => m.attempts === 1)).toBe(true)
    // The audit log has every invitation.
    const audited = await db.selectFrom('audit_log').select('entity_id').where('action', '=', 'invite user').execute()
    expect(audited).toHaveLength(40)
  })

  it('shares the sign-in limit: failures on either replica count against one account', async () => {
    await createUser(db, { email: 'max@lab.test', roles: ['analyst'] })
    const attempt = (password: string) =>
      request(proxyUrl).post('/api/auth/sign-in').set('Origin', PUBLIC_URL).send({ email: 'max@lab.test', password })
    const hitBy = new Set<string>()
    for (let i = 0; i < 4; i++) {
      const r = await attempt(`guess-${i}`)
      expect(r.status).toBe(401)
      hitBy.add(String(r.headers['x-replica']))
    }
    expect(hitBy.size).toBe(2) // each replica saw only two of the four failures…
    for (let i = 0; i < 2; i++) {
      const r = await attempt(PASSWORD) // …yet both now refuse, even the right password
      expect(r.status).toBe(429)
      expect(r.body.error.code).toBe('too_many_attempts')
    }
  })

  it('runs the lab workflow across both replicas: uploads, fits, approval, audit complete', async () => {
    const t = throughProxy()
    const lab = await buildLab(t)
    const ds = await draftWithPoints(t, lab)
    const fits = await lab.analyst.post(`/api/data-sets/${ds.id}/fits`).send({ models: ['wilson'] })
    expect(fits.status, JSON.stringify(fits.body)).toBe(201)
    await lab.analyst.post(`/api/data-sets/${ds.id}/submit`).send({ rowVersion: fits.body.rowVersion }).expect(200)
    const rec = await lab.lead
      .post(`/api/data-sets/${ds.id}/recommended-fit`)
      .send({ fitId: fits.body.fits[0].id })
      .expect(200)
    const approved = await lab.lead
      .post(`/api/data-sets/${ds.id}/approve`)
      .send({ password: PASSWORD, reason: 'Checked on two replicas.', rowVersion: rec.body.rowVersion })
    expect(approved.status, JSON.stringify(approved.body)).toBe(200)
    expect(approved.body.dataSet.state).toBe('approved')
    // Both replicas verify the signature the same way.
    for (let i = 0; i < 2; i++) {
      const v = await lab.engineer.get(`/api/data-sets/${ds.id}/signatures/verify`)
      expect(v.status).toBe(200)
      expect(JSON.stringify(v.body)).not.toMatch(/"valid":false|"matches":false/)
    }
    // The audit log holds each step once, whichever replica did it.
    const actions = await db
      .selectFrom('audit_log')
      .select(['action'])
      .where('entity_id', '=', ds.id)
      .orderBy('id')
      .execute()
    const names = actions.map((a) => a.action)
    for (const step of ['create data set', 'submit', 'approve'])
      expect(
        names.filter((n) => n.includes(step.split(' ')[0])).length,
        `${step} in ${names.join(', ')}`,
      ).toBeGreaterThan(0)
    expect(new Set(names.filter((n) => /approve/.test(n))).size).toBe(names.filter((n) => /approve/.test(n)).length)
    // Every mail these steps queued went out once.
    await allMailSent(0)
    const { rows } = await sql<{ n: number }>`
      select count(*)::int as n from (select envelope_to, subject, body_text from captured_mail
       group by 1, 2, 3 having count(*) > 1) d`.execute(db)
    expect(rows[0].n).toBe(0)
  })
})
