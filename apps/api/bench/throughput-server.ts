/**
 * The API process that bench/throughput.ts loads: a throw-away database with an approved acetone/methanol data set
 * (invented data) and its Wilson fit, the engineer signed in. It logs every request at `info` as the real server
 * does (to /dev/null, so the terminal is not the bottleneck) and tells its parent, over IPC, where it listens.
 */
import { writeFileSync } from 'node:fs'
import { Session } from 'node:inspector/promises'
import type { AddressInfo } from 'node:net'
import { pino } from 'pino'
import { createTestContext, PASSWORD } from '../test/helpers.js'
import { buildLab, draftWithPoints } from '../test/lab-fixture.js'
import { prepareDatabase } from './prepare-db.js'

async function main(): Promise<void> {
  process.env.DATABASE_URL = await prepareDatabase()
  const logger = pino({ level: process.env.BENCH_LOG ?? 'info' }, pino.destination('/dev/null'))
  const t = await createTestContext({}, logger)
  const lab = await buildLab(t)
  const ds = await draftWithPoints(t, lab)
  const fits = await lab.analyst.post(`/api/data-sets/${ds.id}/fits`).send({ models: ['wilson'] })
  await lab.analyst.post(`/api/data-sets/${ds.id}/submit`).send({ rowVersion: fits.body.rowVersion })
  const rec = await lab.lead.post(`/api/data-sets/${ds.id}/recommended-fit`).send({ fitId: fits.body.fits[0].id })
  const ok = await lab.lead
    .post(`/api/data-sets/${ds.id}/approve`)
    .send({ password: PASSWORD, reason: 'benchmark', rowVersion: rec.body.rowVersion })
  if (ok.status !== 200) throw new Error(`approve: ${JSON.stringify(ok.body)}`)
  const server = t.app.listen(0, '127.0.0.1')
  await new Promise((r) => server.once('listening', r))
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { Origin: t.config.publicUrl, 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'engineer@lab.test', password: PASSWORD }),
  })
  const cookie = signIn.headers.get('set-cookie')!.split(';')[0]
  process.send!({ base, cookie, dataSetId: ds.id })
  // Around each loaded endpoint the parent asks for this process's CPU time (user + system) and, with
  // BENCH_PROFILE, a CPU profile of the load only (not of the start-up).
  const inspector = new Session()
  inspector.connect()
  let cpu = process.cpuUsage()
  process.on('message', async (m: { start?: boolean; profile?: boolean; stop?: string | null }) => {
    if (m.start) {
      if (m.profile) {
        await inspector.post('Profiler.enable')
        await inspector.post('Profiler.start')
      }
      cpu = process.cpuUsage()
      return process.send!({ started: true })
    }
    const used = process.cpuUsage(cpu)
    if (m.stop) {
      const { profile } = await inspector.post('Profiler.stop')
      writeFileSync(m.stop, JSON.stringify(profile))
    }
    process.send!({ cpuMs: (used.user + used.system) / 1000 })
  })
  process.on('disconnect', () => {
    server.close()
    void t.close().then(() => process.exit(0))
  })
}

main().catch((e) => {
  console.error(e)
  process.exit(1)
})
