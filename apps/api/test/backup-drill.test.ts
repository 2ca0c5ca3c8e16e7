import { spawnSync } from 'node:child_process'
import { mkdtempSync, readdirSync, rmSync, utimesSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { buildLab, draftWithPoints } from './lab-fixture.js'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { repoRoot } from './processes.js'

let t: TestContext
let dir: string
const url = process.env.DATABASE_URL!
const node = (script: string, args: string[], env: Record<string, string> = {}) =>
  spawnSync(process.execPath, [path.join(repoRoot, script), ...args], {
    cwd: repoRoot,
    env: { ...process.env, ...env },
    encoding: 'utf8',
  })

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  dir = mkdtempSync(path.join(tmpdir(), 'ebullio-backups-'))
  // An approved, signed data set, made through the API.
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
    .send({ password: PASSWORD, reason: 'For the backup drill.', rowVersion: rec.body.rowVersion })
  expect(approved.status, JSON.stringify(approved.body)).toBe(200)
}, 120_000)

afterAll(async () => {
  await t.close()
  rmSync(dir, { recursive: true, force: true })
})

describe('backups', () => {
  it('writes a dump and keeps only what the retention allows', () => {
    // three old dumps (20, 19 and 1 days old) from earlier runs
    const old = (name: string, days: number) => {
      const f = path.join(dir, name)
      writeFileSync(f, 'old')
      const when = new Date(Date.now() - days * 86_400_000)
      utimesSync(f, when, when)
    }
    old('ebullio-20261113T000000Z.dump', 20)
    old('ebullio-20261114T000000Z.dump', 19)
    old('ebullio-20261202T000000Z.dump', 1)
    const r = node('scripts/backup.mjs', ['--url', url, '--dir', dir, '--keep-days', '14', '--min-keep', '2'])
    expect(r.status, r.stderr).toBe(0)
    expect(r.stdout).toMatch(/backup written: .*ebullio-\d{8}T\d{6}Z\.dump/)
    const left = readdirSync(dir).sort()
    expect(left).toHaveLength(2) // the new one and the 1-day-old one; both 14+ days old are gone
    expect(left).toContain('ebullio-20261202T000000Z.dump')
    expect(left.some((f) => f.endsWith('.partial'))).toBe(false)
  })

  it('the restore drill restores into a scratch database and finds every signature matching', () => {
    const r = node('scripts/restore-drill.mjs', ['--url', url, '--dir', dir])
    expect(r.status, r.stdout + r.stderr).toBe(0)
    expect(r.stdout).toContain('1 of 1 signatures match their data')
    expect(r.stdout).toContain('restore drill passed')
  })

  it('the drill fails, naming the data set, when restored content no longer matches its signature', async () => {
    const r = node('scripts/restore-drill.mjs', ['--url', url, '--dir', dir, '--keep'])
    expect(r.status, r.stdout + r.stderr).toBe(0)
    const scratch = r.stdout.match(/kept (postgres:\/\/\S+)/)![1]
    const c = new pg.Client({ connectionString: scratch })
    await c.connect()
    try {
      // Change one measured temperature behind the immutability trigger's back (triggers off for this session).
      await c.query('set session_replication_role = replica')
      await c.query(
        'update point set temperature_k = temperature_k + 1 where id = (select id from point order by data_set_id, seq limit 1)',
      )
    } finally {
      await c.end()
    }
    const v = node('apps/api/src/ops/verify-signatures-cli.ts', [], {
      DATABASE_URL: scratch,
      NODE_OPTIONS: '--import tsx',
    })
    const admin = new pg.Client({ connectionString: url })
    await admin.connect()
    await admin.query(`drop database "${new URL(scratch).pathname.slice(1)}" with (force)`)
    await admin.end()
    expect(v.status, v.stdout + v.stderr).toBe(1)
    expect(v.stdout).toMatch(/MISMATCH approval \S+ of data set \S+: signed [0-9a-f]{64}, now [0-9a-f]{64}/)
    expect(v.stdout).toContain('0 of 1 signatures match their data')
  })
})
