/**
 * Benchmarks of the lab workflow (numbers go in bench/README.md, never in tests):
 *  - a 10,000-row run file (2,500 samples × 2 phases × 2 injections, invented data) through preview and commit over HTTP;
 *  - fitting all four models to 100 points in one request (the "answer within a couple of seconds" target).
 * Needs a throw-away PostgreSQL: DATABASE_URL whose database name contains "bench" or "test" (it is wiped),
 * or none, in which case the test cluster of scripts/test-db.mjs is started and `ebullio_bench_test` used.
 */
import { createTestContext } from '../test/helpers.js'
import { buildLab, csv, generatedRun } from '../test/lab-fixture.js'
import { prepareDatabase } from './prepare-db.js'

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]

async function time<T>(fn: () => Promise<T>): Promise<[number, T]> {
  const t0 = performance.now()
  const r = await fn()
  return [performance.now() - t0, r]
}

async function main(): Promise<void> {
  process.env.DATABASE_URL = await prepareDatabase()
  const t = await createTestContext({ UPLOAD_MAX_BYTES: String(50 * 1024 * 1024) })
  try {
    const lab = await buildLab(t)
    const file = Buffer.from(generatedRun(2500, 9001))
    const rows = file.toString().trim().split('\n').length - 1
    const previews: number[] = []
    const commits: number[] = []
    for (let i = 0; i < 3; i++) {
      const d = await lab.analyst
        .post('/api/data-sets')
        .send({ systemId: lab.systemId, title: `bench ${i}`, nominalPressurePa: 101325 })
      const [tp, p] = await time(() => csv(lab.analyst.post(`/api/data-sets/${d.body.id}/uploads/preview`), file))
      if (p.status !== 200 || p.body.samples.length !== 2500) throw new Error(`preview failed: ${p.status}`)
      previews.push(tp)
      const [tc, c] = await time(() =>
        csv(lab.analyst.post(`/api/data-sets/${d.body.id}/uploads`), file)
          .field('rowVersion', String(d.body.rowVersion))
          .field('acceptWarnings', 'true'),
      )
      if (c.status !== 201 || c.body.pointCount !== 2500)
        throw new Error(`commit failed: ${c.status} ${JSON.stringify(c.body).slice(0, 300)}`)
      commits.push(tc)
    }
    console.log(`run file: ${rows} rows, ${(file.length / 1024).toFixed(0)} KiB, 2500 samples`)
    console.log(
      `  preview (parse + 5000 compositions, HTTP): median ${median(previews).toFixed(0)} ms  [${previews.map((x) => x.toFixed(0)).join(', ')}]`,
    )
    console.log(
      `  commit  (re-check + store 2500 points, 10000 injections): median ${median(commits).toFixed(0)} ms  [${commits.map((x) => x.toFixed(0)).join(', ')}]`,
    )

    const d = await lab.analyst
      .post('/api/data-sets')
      .send({ systemId: lab.systemId, title: 'bench fits', nominalPressurePa: 101325 })
    await csv(lab.analyst.post(`/api/data-sets/${d.body.id}/uploads`), generatedRun(100, 9002))
      .field('rowVersion', String(d.body.rowVersion))
      .field('acceptWarnings', 'true')
    const fits: number[] = []
    for (let i = 0; i < 3; i++) {
      const [tf, r] = await time(() =>
        lab.analyst
          .post(`/api/data-sets/${d.body.id}/fits`)
          .send({ models: ['margules', 'van-laar', 'wilson', 'nrtl'] }),
      )
      if (r.status !== 201) throw new Error(`fit failed: ${r.status} ${JSON.stringify(r.body)}`)
      fits.push(tf)
    }
    console.log(
      `fits: 4 models (multi-start, bubble-point objective) on 100 points in one request: median ${median(fits).toFixed(0)} ms  [${fits.map((x) => x.toFixed(0)).join(', ')}]`,
    )
  } finally {
    await t.close()
  }
}

main().catch((e) => {
  console.error(e)
  process.exit(1)
})
