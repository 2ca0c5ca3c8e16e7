import { execFileSync, spawnSync } from 'node:child_process'
import { createRequire } from 'node:module'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loadConfig } from '../src/config.js'
import { createDb } from '../src/db/index.js'
import { startFakeSmtp } from '../src/mail/fake-smtp.js'
import { createUser, PASSWORD, resetDatabase } from './helpers.js'
import { freePort, repoRoot, startApi, type ApiProcess } from './processes.js'

describe('production settings', () => {
  const base = { NODE_ENV: 'production', DATABASE_URL: 'postgres://x@127.0.0.1:5432/ebullio' }
  it('requires the public URL and refuses demo data', () => {
    expect(() => loadConfig(base)).toThrow(/PUBLIC_URL: required in production/)
    expect(() => loadConfig({ ...base, PUBLIC_URL: 'https://e.lab.example', DEMO_DATA: 'true' })).toThrow(
      /DEMO_DATA: the invented demo scenario is refused in production/,
    )
  })
  it('defaults to no mail capture, no captured-mail viewer, no demo data', () => {
    const c = loadConfig({ ...base, PUBLIC_URL: 'https://e.lab.example' })
    expect({ fakeSmtp: c.fakeSmtp, mailViewer: c.mailViewer, demoData: c.demoData }).toEqual({
      fakeSmtp: false,
      mailViewer: false,
      demoData: false,
    })
    const dev = loadConfig({ NODE_ENV: 'development' })
    expect({ fakeSmtp: dev.fakeSmtp, mailViewer: dev.mailViewer, demoData: dev.demoData }).toEqual({
      fakeSmtp: true,
      mailViewer: true,
      demoData: true,
    })
    // explicitly enabled, the capture may run in production (a staging copy)
    expect(loadConfig({ ...base, PUBLIC_URL: 'https://e.lab.example', FAKE_SMTP: 'true' }).fakeSmtp).toBe(true)
  })
  it('refuses to load the demo scenario into a production database', () => {
    const tsx = createRequire(import.meta.url).resolve('tsx/cli')
    const r = spawnSync(process.execPath, [tsx, path.join(repoRoot, 'db/seeds/index.ts')], {
      env: { ...process.env, NODE_ENV: 'production', DATABASE_URL: process.env.DATABASE_URL },
      encoding: 'utf8',
    })
    expect(r.status).toBe(1)
    expect(r.stderr).toContain('The demo scenario (invented data) is refused with NODE_ENV=production.')
  })
})

describe('the production build, started with plain node', () => {
  let api: ApiProcess
  let smtp: { port: number; close: () => Promise<void> }
  const db = createDb(process.env.DATABASE_URL!)
  beforeAll(async () => {
    execFileSync(process.execPath, [path.join(repoRoot, 'apps/api/build.mjs')], { stdio: 'pipe' })
    await resetDatabase(db)
    await createUser(db, { email: 'ada@lab.test', roles: ['admin'] })
    smtp = await startFakeSmtp(db, 0) // stands for the lab's real mail server
    const port = await freePort()
    api = await startApi(
      {
        NODE_ENV: 'production',
        PORT: String(port),
        PUBLIC_URL: `http://127.0.0.1:${port}`,
        DATABASE_URL: process.env.DATABASE_URL!,
        SMTP_URL: `smtp://127.0.0.1:${smtp.port}`,
        FAKE_SMTP: '',
      },
      { built: true },
    )
  }, 180_000)
  afterAll(async () => {
    await api?.stop()
    await smtp?.close()
    await db.destroy()
  })

  it('serves with Secure cookies, no captured-mail viewer, request ids and Prometheus metrics', async () => {
    expect((await fetch(`${api.url}/api/ready`)).status).toBe(200)
    const signIn = await fetch(`${api.url}/api/auth/sign-in`, {
      method: 'POST',
      headers: { Origin: api.url, 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'ada@lab.test', password: PASSWORD }),
    })
    expect(signIn.status).toBe(200)
    const setCookie = signIn.headers.get('set-cookie')!
    expect(setCookie).toMatch(/; Secure/)
    const cookie = setCookie.split(';')[0]
    const me = await (await fetch(`${api.url}/api/auth/me`, { headers: { Cookie: cookie } })).json()
    expect(me.devMode).toBe(false)
    const viewer = await fetch(`${api.url}/api/dev/mail`, { headers: { Cookie: cookie } })
    expect(viewer.status).toBe(404)
    const body = await viewer.json()
    expect(body.requestId).toBe(viewer.headers.get('x-request-id'))
    expect(body.requestId).toMatch(/^[0-9a-f-]{36}$/)

    const metrics = await (await fetch(`${api.url}/metrics`)).text()
    expect(metrics).toMatch(/ebullio_http_requests_total\{method="GET",route="\/api\/ready",status="200"\} 1/)
    expect(metrics).toMatch(
      /ebullio_http_request_duration_seconds_bucket\{le="[0-9.]+",method="POST",route="\/api\/auth\/sign-in"\}/,
    )
    expect(metrics).toMatch(/ebullio_outbox_pending \d+/)
    expect(metrics).toMatch(/ebullio_outbox_oldest_pending_seconds [0-9.]+/)
    expect(metrics).toMatch(/ebullio_db_pool_connections \d+/)
    expect(metrics).toMatch(/process_cpu_user_seconds_total/)
    // through a proxy (X-Forwarded-For) and without the token, /metrics is not there
    expect((await fetch(`${api.url}/metrics`, { headers: { 'X-Forwarded-For': '203.0.113.9' } })).status).toBe(404)
  })
})
