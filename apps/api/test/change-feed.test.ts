import { sql } from 'kysely'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { parseChange } from '../src/ops/change-feed.js'
import { createTestContext, createUser, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, draftWithPoints, type Lab } from './lab-fixture.js'

/**
 * Two app instances on one database, each with its own caches and change feed, as two replicas would be. Whatever
 * one of them changes (or psql changes behind both) is refused or answered anew by the other as soon as the
 * database's notification reaches it: `sync()` waits for exactly that (a marker notified after the change, heard
 * in commit order), so these tests do not race the notification. The instance that made a change honours it
 * before it answers, without waiting. The caches live a minute here, so only the notifications can make these
 * pass, never the time-to-live.
 */
const TTL = { CACHE_TTL_MS: '60000' }
let a: TestContext
let b: TestContext
let lab: Lab
let dataSetId: string
const CURVE = (id: string) => `/api/data-sets/${id}/curve?pressure=101.325&unit=kPa&points=21`

const sessionHits = (t: TestContext) => t.changes.cacheStats().sessions?.hits ?? 0
const sourceHits = (t: TestContext) => t.changes.cacheStats()['curve-sources']?.hits ?? 0

/** The cookie header of a fresh session of this user, started on instance `t`. */
async function cookieOf(t: TestContext, email: string): Promise<string> {
  const r = await request(t.app)
    .post('/api/auth/sign-in')
    .set('Origin', t.config.publicUrl)
    .send({ email, password: PASSWORD })
  expect(r.status).toBe(200)
  return String(r.headers['set-cookie'][0]).split(';')[0]
}

const get = (t: TestContext, path: string, cookie: string) => request(t.app).get(path).set('Cookie', cookie)

/** Asks instance `t` twice: the second answer must come from its session cache (so the test below means something). */
async function warm(t: TestContext, cookie: string, path = '/api/auth/me') {
  expect((await get(t, path, cookie)).status).toBe(200)
  const before = sessionHits(t)
  expect((await get(t, path, cookie)).status).toBe(200)
  expect(sessionHits(t)).toBe(before + 1)
}

beforeAll(async () => {
  a = await createTestContext(TTL)
  await resetDatabase(a.db)
  b = await createTestContext(TTL, undefined, { changes: { reconnectMs: 1500 } })
  lab = await buildLab(a)
  const ds = await draftWithPoints(a, lab)
  const fits = await lab.analyst.post(`/api/data-sets/${ds.id}/fits`).send({ models: ['wilson'] })
  await lab.analyst.post(`/api/data-sets/${ds.id}/submit`).send({ rowVersion: fits.body.rowVersion })
  const rec = await lab.lead.post(`/api/data-sets/${ds.id}/recommended-fit`).send({ fitId: fits.body.fits[0].id })
  const ok = await lab.lead
    .post(`/api/data-sets/${ds.id}/approve`)
    .send({ password: PASSWORD, reason: 'cache test', rowVersion: rec.body.rowVersion })
  expect(ok.status).toBe(200)
  dataSetId = ds.id
}, 120_000)

afterAll(async () => {
  await b?.close()
  await a?.close()
})

describe('the change notifications', () => {
  it('reads every payload the triggers send, and anything else as "forget everything"', () => {
    expect(parseChange('session:ab12')).toEqual({ topic: 'session', key: 'ab12' })
    expect(parseChange('user:9f0c')).toEqual({ topic: 'user', key: '9f0c' })
    expect(parseChange('curve')).toEqual({ topic: 'curve', key: null })
    expect(parseChange('all')).toEqual({ topic: 'all', key: null })
    expect(parseChange('sync:12.3')).toEqual({ topic: 'sync', key: '12.3' })
    expect(parseChange('session:')).toEqual({ topic: 'all', key: null })
    expect(parseChange('nonsense')).toEqual({ topic: 'all', key: null })
    expect(parseChange(undefined)).toEqual({ topic: 'all', key: null })
  })
})

describe('sessions cached on one instance, changed on another', () => {
  it('a sign-out on A is refused at once by B', async () => {
    const cookie = await cookieOf(a, 'engineer@lab.test')
    await warm(b, cookie)
    const out = await request(a.app).post('/api/auth/sign-out').set('Origin', a.config.publicUrl).set('Cookie', cookie)
    expect(out.status).toBe(200)
    await b.changes.sync()
    expect((await get(b, '/api/auth/me', cookie)).status).toBe(401)
    expect((await get(a, '/api/auth/me', cookie)).status).toBe(401)
  })

  it('a sign-out on A is refused at once by A itself (its cache is emptied before it answers)', async () => {
    const cookie = await cookieOf(a, 'engineer@lab.test')
    await warm(a, cookie)
    await request(a.app).post('/api/auth/sign-out').set('Origin', a.config.publicUrl).set('Cookie', cookie)
    expect((await get(a, '/api/auth/me', cookie)).status).toBe(401)
  })

  it('a session deleted in the database behind both instances is refused at once', async () => {
    const cookie = await cookieOf(a, 'reviewer@lab.test')
    await warm(a, cookie)
    await warm(b, cookie)
    await sql`delete from user_session where user_id = ${lab.ids.reviewer}`.execute(a.db)
    await Promise.all([a.changes.sync(), b.changes.sync()])
    expect((await get(b, '/api/auth/me', cookie)).status).toBe(401)
    expect((await get(a, '/api/auth/me', cookie)).status).toBe(401)
  })

  it('a user deactivated on A is refused at once by B, also for a cached curve', async () => {
    await createUser(a.db, { email: 'temp-eng@lab.test', roles: ['engineer'] })
    const cookie = await cookieOf(a, 'temp-eng@lab.test')
    await warm(b, cookie, CURVE(dataSetId))
    const id = await userId('temp-eng@lab.test')
    expect((await lab.admin.post(`/api/admin/users/${id}/deactivate`).send({})).status).toBe(200)
    await b.changes.sync()
    expect((await get(b, CURVE(dataSetId), cookie)).status).toBe(401)
    expect((await get(b, '/api/auth/me', cookie)).status).toBe(401)
  })

  it('a role removed on A is gone at once on B (and with it what the role may read)', async () => {
    await createUser(a.db, { email: 'temp-rev@lab.test', roles: ['reviewer', 'engineer'] })
    const cookie = await cookieOf(a, 'temp-rev@lab.test')
    // a draft: reviewers may read it, engineers may not
    const draft = await draftWithPoints(a, lab)
    await lab.analyst.post(`/api/data-sets/${draft.id}/fits`).send({ models: ['wilson'] })
    await warm(b, cookie)
    expect((await get(b, '/api/auth/me', cookie)).body.user.roles).toEqual(['engineer', 'reviewer'])
    expect((await get(b, `/api/data-sets/${draft.id}`, cookie)).status).toBe(200)

    const id = await userId('temp-rev@lab.test')
    const put = await lab.admin.put(`/api/admin/users/${id}/roles`).send({ roles: ['engineer'] })
    expect(put.status).toBe(200)
    await b.changes.sync()
    expect((await get(b, '/api/auth/me', cookie)).body.user.roles).toEqual(['engineer'])
    expect((await get(b, `/api/data-sets/${draft.id}`, cookie)).status).toBe(404)
  })
})

describe('the curve of a published version, cached on one instance, changed behind it', () => {
  it('serves a repeat from the cache, and a component renamed elsewhere at once under the new name', async () => {
    const cookie = await cookieOf(b, 'engineer@lab.test')
    const first = await get(b, CURVE(dataSetId), cookie)
    expect(first.status).toBe(200)
    const before = sourceHits(b)
    const again = await get(b, CURVE(dataSetId), cookie)
    expect(again.status).toBe(200)
    expect(again.headers.etag).toBe(first.headers.etag)
    expect(sourceHits(b)).toBe(before + 1)

    const name = first.body.components[0] as string
    await sql`update component set name = ${`${name} (renamed)`} where name = ${name}`.execute(a.db)
    await b.changes.sync()
    try {
      const renamed = await get(b, CURVE(dataSetId), cookie)
      expect(renamed.status).toBe(200)
      expect(renamed.body.components[0]).toBe(`${name} (renamed)`)
      expect(renamed.headers.etag).not.toBe(first.headers.etag)
    } finally {
      await sql`update component set name = ${name} where name = ${`${name} (renamed)`}`.execute(a.db)
    }
  })

  it('a version taken out of the published states behind both instances is refused at once to an engineer', async () => {
    const cookie = await cookieOf(b, 'engineer@lab.test')
    expect((await get(b, CURVE(dataSetId), cookie)).status).toBe(200)
    const before = sourceHits(b)
    expect((await get(b, CURVE(dataSetId), cookie)).status).toBe(200)
    expect(sourceHits(b)).toBe(before + 1)
    // No route un-publishes a version (the database forbids it); an operator's manual fix in psql can, and the
    // caches must follow it like any other change.
    await a.db.transaction().execute(async (trx) => {
      await sql`alter table data_set disable trigger data_set_immutable`.execute(trx)
      await sql`update data_set set state = 'submitted' where id = ${dataSetId}`.execute(trx)
      await sql`alter table data_set enable trigger data_set_immutable`.execute(trx)
    })
    await Promise.all([a.changes.sync(), b.changes.sync()])
    try {
      expect((await get(b, CURVE(dataSetId), cookie)).status).toBe(404)
      expect((await get(a, CURVE(dataSetId), cookie)).status).toBe(404)
    } finally {
      await a.db.transaction().execute(async (trx) => {
        await sql`alter table data_set disable trigger data_set_immutable`.execute(trx)
        await sql`update data_set set state = 'approved' where id = ${dataSetId}`.execute(trx)
        await sql`alter table data_set enable trigger data_set_immutable`.execute(trx)
      })
    }
    await b.changes.sync()
    expect((await get(b, CURVE(dataSetId), cookie)).status).toBe(200)
  })
})

describe('while the change feed is not listening', () => {
  it('bypasses the caches (nothing it may have missed is served) and uses them again once it listens', async () => {
    const cookie = await cookieOf(a, 'engineer@lab.test')
    await warm(b, cookie)
    // What a database restart does to the listening connection, for B only.
    const pid = b.changes.backendPid
    expect(pid).not.toBeNull()
    await sql`select pg_terminate_backend(${pid})`.execute(a.db)
    await until(() => !b.changes.live)
    expect(b.changes.cacheStats().sessions.size).toBe(0)

    // B is not listening (it waits 1.5 s before reconnecting): every request reads the database.
    const hits = sessionHits(b)
    expect((await get(b, '/api/auth/me', cookie)).status).toBe(200)
    expect((await get(b, '/api/auth/me', cookie)).status).toBe(200)
    expect(sessionHits(b)).toBe(hits)
    expect(b.changes.live).toBe(false)
    // A change B cannot hear about is honoured all the same.
    await sql`delete from user_session where user_id = ${lab.ids.engineer}`.execute(a.db)
    expect((await get(b, '/api/auth/me', cookie)).status).toBe(401)

    // It reconnects by itself; the caches work again and hear changes again.
    await b.changes.ready()
    const next = await cookieOf(b, 'engineer@lab.test')
    await warm(b, next)
    await sql`delete from user_session where user_id = ${lab.ids.engineer}`.execute(a.db)
    await b.changes.sync()
    expect((await get(b, '/api/auth/me', next)).status).toBe(401)
  })
})

async function userId(email: string): Promise<string> {
  const row = await a.db.selectFrom('app_user').select('id').where('email', '=', email).executeTakeFirstOrThrow()
  return row.id
}

async function until(ok: () => boolean, ms = 5000) {
  const end = Date.now() + ms
  while (!ok()) {
    if (Date.now() > end) throw new Error('condition not met in time')
    await new Promise((r) => setTimeout(r, 10))
  }
}
