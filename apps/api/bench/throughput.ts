/**
 * Throughput at 50 concurrent connections (autocannon), one API process, numbers for bench/README.md (never a
 * test): GET /api/health (the floor of the same stack), GET /api/auth/me (session + user + roles), and the
 * engineer's GET /api/data-sets/:id/curve of an approved data set. Targets (issue 12): curve ≥ 50 % of health's
 * requests per second with p95 < 40 ms; auth/me ≥ 70 %.
 * Needs a throw-away PostgreSQL like upload-10k.ts: DATABASE_URL naming a "bench"/"test" database (wiped), or none.
 * BENCH_SECONDS sets the duration of each run (default 10).
 */
import type { AddressInfo } from 'node:net'
import autocannon from 'autocannon'
import { createTestContext, PASSWORD } from '../test/helpers.js'
import { buildLab, draftWithPoints } from '../test/lab-fixture.js'
import { prepareDatabase } from './prepare-db.js'

async function main(): Promise<void> {
  process.env.DATABASE_URL = await prepareDatabase()
  const t = await createTestContext()
  const server = t.app.listen(0, '127.0.0.1')
  await new Promise((r) => server.once('listening', r))
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  try {
    const lab = await buildLab(t)
    const ds = await draftWithPoints(t, lab)
    const fits = await lab.analyst.post(`/api/data-sets/${ds.id}/fits`).send({ models: ['wilson'] })
    await lab.analyst.post(`/api/data-sets/${ds.id}/submit`).send({ rowVersion: fits.body.rowVersion })
    const rec = await lab.lead.post(`/api/data-sets/${ds.id}/recommended-fit`).send({ fitId: fits.body.fits[0].id })
    const ok = await lab.lead
      .post(`/api/data-sets/${ds.id}/approve`)
      .send({ password: PASSWORD, reason: 'benchmark', rowVersion: rec.body.rowVersion })
    if (ok.status !== 200) throw new Error(`approve: ${JSON.stringify(ok.body)}`)
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { Origin: t.config.publicUrl, 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@lab.test', password: PASSWORD }),
    })
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0]
    const seconds = Number(process.env.BENCH_SECONDS ?? 10)
    const run = (path: string) =>
      autocannon({ url: base + path, connections: 50, duration: seconds, headers: { cookie } })
    const targets = [
      ['GET /api/health', '/api/health'],
      ['GET /api/auth/me', '/api/auth/me'],
      ['GET /api/data-sets/:id/curve', `/api/data-sets/${ds.id}/curve?pressure=101.325&unit=kPa`],
    ] as const
    const rows: { name: string; rps: number; p50: number; p97_5: number; p99: number; non2xx: number }[] = []
    for (const [name, path] of targets) {
      const probe = await fetch(base + path, { headers: { cookie } })
      if (probe.status !== 200) throw new Error(`${name}: ${probe.status} ${await probe.text()}`)
      const r = await run(path)
      rows.push({
        name,
        rps: Math.round(r.requests.average),
        p50: r.latency.p50,
        p97_5: r.latency.p97_5,
        p99: r.latency.p99,
        non2xx: r.non2xx,
      })
    }
    const health = rows[0].rps
    console.log('| endpoint | req/s | % of health | p50 ms | p97.5 ms | p99 ms | non-2xx |')
    console.log('|---|---|---|---|---|---|---|')
    for (const r of rows)
      console.log(
        `| ${r.name} | ${r.rps} | ${Math.round((100 * r.rps) / health)} % | ${r.p50} | ${r.p97_5} | ${r.p99} | ${r.non2xx} |`,
      )
  } finally {
    server.close()
    await t.close()
  }
}

main().catch((e) => {
  console.error(e)
  process.exit(1)
})
