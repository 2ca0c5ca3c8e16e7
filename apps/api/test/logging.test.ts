import { Writable } from 'node:stream'
import { pino } from 'pino'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { agent, createTestContext, createUser, PASSWORD, resetDatabase, type TestContext } from './helpers.js'

const lines: string[] = []
const sink = new Writable({
  write(chunk, _enc, done) {
    lines.push(String(chunk))
    done()
  },
})

let t: TestContext
beforeAll(async () => {
  t = await createTestContext({}, pino({ level: 'info' }, sink))
  await resetDatabase(t.db)
  await createUser(t.db, { email: 'logged@lab.test', roles: ['analyst'] })
})
afterAll(() => t.close())

describe('request logging', () => {
  it('logs requests without passwords, cookies or bodies', async () => {
    const a = agent(t.app)
    await a.post('/api/auth/sign-in').send({ email: 'logged@lab.test', password: PASSWORD }).expect(200)
    await a.get('/api/auth/me').expect(200)
    const log = lines.join('')
    expect(log).toContain('/api/auth/sign-in')
    expect(log).toContain('/api/auth/me')
    expect(log).not.toContain(PASSWORD)
    expect(log).not.toContain('ebullio_session=')
  })

  it('puts the request id in every log line of a request and in its X-Request-Id header', async () => {
    lines.length = 0
    const a = agent(t.app)
    const r = await a.get('/api/auth/me').set('X-Request-Id', 'proxy-id-42').expect(401)
    expect(r.headers['x-request-id']).toBe('proxy-id-42')
    expect(r.body.requestId).toBe('proxy-id-42')
    const fresh = await a.get('/api/auth/me').expect(401)
    expect(fresh.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/)
    const entries = lines.map((l) => JSON.parse(l) as { req?: { id?: string; path?: string } })
    const mine = entries.filter((e) => e.req?.path === '/api/auth/me')
    expect(mine.map((e) => e.req?.id)).toEqual(['proxy-id-42', fresh.headers['x-request-id']])
    // a header that is not a sane id is replaced, not logged
    const odd = await a.get('/api/auth/me').set('X-Request-Id', 'bad id {"x":1}').expect(401)
    expect(odd.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/)
    expect(lines.join('')).not.toContain('bad id')
  })

  it('logs each API request once with its status and time, and a route pattern matches whatever the case', async () => {
    lines.length = 0
    const r = await agent(t.app).get('/API/Health').expect(200)
    // the line is written when the server side of the answer closes, which may follow the client's read
    for (let i = 0; i < 50 && !lines.some((l) => l.includes(String(r.headers['x-request-id']))); i++)
      await new Promise((done) => setTimeout(done, 10))
    const entries = lines.map(
      (l) => JSON.parse(l) as { level: number; req?: { id?: string }; res?: { status?: number } },
    )
    const mine = entries.filter((e) => e.req?.id === r.headers['x-request-id'])
    expect(mine).toHaveLength(1)
    expect(mine[0]).toMatchObject({ level: 30, res: { status: 200 }, msg: 'request completed' })
    expect(typeof (mine[0] as { responseTime?: unknown }).responseTime).toBe('number')
    // an unknown first segment is the usual 404 answer, with the request id
    const missing = await agent(t.app).get('/api/no-such-segment/1').expect(404)
    expect(missing.body).toMatchObject({ error: { code: 'not_found' }, requestId: missing.headers['x-request-id'] })
  })
})

describe('route table', () => {
  it('refuses a route whose path does not start with /api/<literal segment>', async () => {
    const { createApp } = await import('../src/app.js')
    const handler = () => undefined
    expect(() =>
      createApp({ db: t.db, config: t.config, mailer: t.mailer } as never, pino({ level: 'silent' }), [
        { method: 'get', path: '/api/:anything', access: 'public', handler },
      ]),
    ).toThrow(/must start with \/api\/<literal segment>/)
  })
})

describe('a failing request', () => {
  it('logs the error and its "request failed" line at error level, both with the request id', async () => {
    const { createApp } = await import('../src/app.js')
    const out: string[] = []
    const sink2 = new Writable({
      write(chunk, _enc, done) {
        out.push(String(chunk))
        done()
      },
    })
    // /api/health needs no session, so a throwing stand-in there runs the real stack around it
    const handler = () => {
      throw new Error('boom')
    }
    const app = createApp({ db: t.db, config: t.config, mailer: t.mailer } as never, pino({ level: 'info' }, sink2), [
      { method: 'get', path: '/api/health', access: 'public', handler },
    ])
    const r = await agent(app).get('/api/health').set('X-Request-Id', 'fail-7').expect(500)
    expect(r.body.requestId).toBe('fail-7')
    for (let i = 0; i < 50 && !out.some((l) => l.includes('request failed')); i++)
      await new Promise((done) => setTimeout(done, 10))
    const mine = out
      .map((l) => JSON.parse(l) as { level: number; msg: string; req?: { id?: string } })
      .filter((e) => e.req?.id === 'fail-7')
    expect(mine.map((e) => [e.level, e.msg])).toEqual([
      [50, 'unhandled error'],
      [50, 'request failed'],
    ])
  })
})
