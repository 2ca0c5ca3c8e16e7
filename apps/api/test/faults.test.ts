import http from 'node:http'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Kysely } from 'kysely'
import { dataDirFor, startCluster, type Cluster } from '../../../scripts/lib/postgres.mjs'
import { createDb, type Database } from '../src/db/index.js'
import { createUser, PASSWORD } from './helpers.js'
import { freePort, migrate, repoRoot, startApi, waitFor, type ApiProcess } from './processes.js'

// A cluster of its own (not the suite's test database), stopped and started under a running API process.
let cluster: Cluster
let api: ApiProcess
let db: Kysely<Database>

beforeAll(async () => {
  const port = await freePort()
  cluster = startCluster({
    dataDir: dataDirFor(repoRoot, `pg-fault-${port}`),
    port,
    database: 'ebullio_fault_test',
    fresh: true,
  })
  await migrate(cluster.url)
  db = createDb(cluster.url)
  await createUser(db, { email: 'ana@lab.test', roles: ['analyst'] })
  await db.destroy()
  api = await startApi({ DATABASE_URL: cluster.url })
}, 120_000)

afterAll(async () => {
  await api?.stop('SIGKILL')
  cluster?.destroy()
})

async function call(method: string, p: string, o: { cookie?: string; body?: unknown } = {}) {
  const r = await fetch(api.url + p, {
    method,
    headers: {
      Origin: api.url,
      'Content-Type': 'application/json',
      ...(o.cookie ? { Cookie: o.cookie } : {}),
    },
    body: o.body ? JSON.stringify(o.body) : undefined,
  })
  const text = await r.text()
  return { status: r.status, headers: r.headers, body: text ? JSON.parse(text) : null }
}

/** A value of /metrics (this test talks to the API from the same machine, so the scrape is allowed). */
async function metric(name: string): Promise<number> {
  const text = await (await fetch(`${api.url}/metrics`)).text()
  const line = text.split('\n').find((l) => l.startsWith(`${name} `))
  return line ? Number(line.slice(name.length + 1)) : NaN
}

/** Waits (at most 10 s) until the condition holds. */
async function until(ok: () => Promise<boolean>) {
  const end = Date.now() + 10_000
  while (!(await ok())) {
    if (Date.now() > end) throw new Error('condition not met within 10 s')
    await new Promise((r) => setTimeout(r, 50))
  }
}

describe('the database goes away and comes back', () => {
  it('answers 503 in the usual error shape while PostgreSQL is down, and recovers without a restart', async () => {
    const signIn = await call('POST', '/api/auth/sign-in', { body: { email: 'ana@lab.test', password: PASSWORD } })
    expect(signIn.status).toBe(200)
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0]
    expect((await call('GET', '/api/auth/me', { cookie })).status).toBe(200)
    expect((await call('GET', '/api/ready')).body).toEqual({ ok: true, database: 'up', migrations: 'current' })

    cluster.stop() // pg_ctl stop -m fast: every connection of the pool is terminated

    // Liveness stays trivial; readiness and every database-backed route say 503, in the error shape.
    expect((await call('GET', '/api/health')).status).toBe(200)
    const ready = await call('GET', '/api/ready')
    expect(ready.status).toBe(503)
    expect(ready.headers.get('retry-after')).toBe('5')
    const me = await call('GET', '/api/auth/me', { cookie })
    expect(me.status).toBe(503)
    expect(me.body).toEqual({
      error: {
        code: 'database_unavailable',
        message: 'The database cannot be reached right now. Nothing was changed; try again in a few seconds.',
        details: null,
      },
      requestId: me.headers.get('x-request-id'),
    })
    const write = await call('POST', '/api/auth/sign-in', { body: { email: 'ana@lab.test', password: PASSWORD } })
    expect(write.status).toBe(503)
    expect(api.proc.exitCode).toBeNull() // still running

    cluster.start()
    await waitFor(`${api.url}/api/ready`, (s) => s === 200, 30_000)
    // The same process, the same session: it answers again by itself.
    const again = await call('GET', '/api/auth/me', { cookie })
    expect(again.status).toBe(200)
    expect(again.body.user.email).toBe('ana@lab.test')
    expect(api.proc.exitCode).toBeNull()
  })

  it('bypasses its caches while the database is away and uses them again, still honouring changes, once back', async () => {
    const signIn = await call('POST', '/api/auth/sign-in', { body: { email: 'ana@lab.test', password: PASSWORD } })
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0]
    await until(async () => (await metric('ebullio_change_feed_listening')) === 1)
    cluster.stop()
    // The listening connection broke with the others: the caches are emptied and bypassed, so the session is not
    // answered from memory while nothing can be heard.
    await until(async () => (await metric('ebullio_change_feed_listening')) === 0)
    expect(await metric('ebullio_cache_entries{cache="sessions"}')).toBe(0)
    expect((await call('GET', '/api/auth/me', { cookie })).status).toBe(503)
    cluster.start()
    await waitFor(`${api.url}/api/ready`, (s) => s === 200, 30_000)
    // It listens again by itself, and its session cache serves again…
    await until(async () => (await metric('ebullio_change_feed_listening')) === 1)
    expect((await call('GET', '/api/auth/me', { cookie })).status).toBe(200)
    const hits = await metric('ebullio_cache_hits{cache="sessions"}')
    expect((await call('GET', '/api/auth/me', { cookie })).status).toBe(200)
    expect(await metric('ebullio_cache_hits{cache="sessions"}')).toBe(hits + 1)
    // …and hears changes: a session deleted behind its back is refused (as soon as the notification arrives).
    const other = createDb(cluster.url)
    await other.deleteFrom('user_session').execute()
    await other.destroy()
    await until(async () => (await call('GET', '/api/auth/me', { cookie })).status === 401)
  })

  it('readiness names migrations the database lacks', async () => {
    const other = createDb(cluster.url)
    const [last] = await other
      .selectFrom('kysely_migration' as never)
      .select('name' as never)
      .orderBy('name' as never, 'desc')
      .limit(1)
      .execute()
    const name = (last as { name: string }).name
    await other
      .deleteFrom('kysely_migration' as never)
      .where('name' as never, '=', name as never)
      .execute()
    try {
      const r = await call('GET', '/api/ready')
      expect(r.status).toBe(503)
      expect(r.body.error.code).toBe('migrations_pending')
      expect(r.body.error.details).toEqual({ pending: [name] })
    } finally {
      await other
        .insertInto('kysely_migration' as never)
        .values({ name, timestamp: new Date().toISOString() } as never)
        .execute()
      await other.destroy()
    }
    expect((await call('GET', '/api/ready')).status).toBe(200)
  })
})

describe('graceful shutdown', () => {
  it('on SIGTERM refuses new connections, finishes the request in flight, then exits 0', async () => {
    // A sign-in whose body is still arriving when the signal comes.
    const body = JSON.stringify({ email: 'ana@lab.test', password: PASSWORD })
    const answer = new Promise<{ status: number; connection: string | undefined }>((resolve, reject) => {
      const req = http.request(
        `${api.url}/api/auth/sign-in`,
        {
          method: 'POST',
          headers: { Origin: api.url, 'Content-Type': 'application/json', 'Content-Length': Buffer.byteLength(body) },
        },
        (res) => {
          res.resume()
          res.on('end', () => resolve({ status: res.statusCode!, connection: res.headers.connection }))
        },
      )
      req.on('error', reject)
      req.write(body.slice(0, 10))
      setTimeout(() => {
        api.proc.kill('SIGTERM')
        setTimeout(async () => {
          // The listener is closed: a new connection is refused…
          await expect(fetch(`${api.url}/api/health`)).rejects.toThrow()
          // …while the request in flight completes.
          req.end(body.slice(10))
        }, 500)
      }, 300)
    })
    const r = await answer
    expect(r.status).toBe(200)
    expect(r.connection).toBe('close')
    expect(await api.exited).toBe(0)
    expect(api.output()).not.toMatch(/unhandled|uncaught/i)
  })
})
