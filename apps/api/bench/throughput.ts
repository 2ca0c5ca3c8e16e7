/**
 * Throughput at 50 concurrent connections (autocannon), one API process, numbers for bench/README.md (never a
 * test): GET /api/health (the floor of the same stack), GET /api/auth/me (session + user + roles), and the
 * engineer's GET /api/data-sets/:id/curve of an approved data set. Targets (issue 12): curve ≥ 50 % of health's
 * requests per second with p95 < 40 ms; auth/me ≥ 70 %.
 * The API runs in its own process (bench/throughput-server.ts), so autocannon does not share its event loop.
 * Needs a throw-away PostgreSQL like upload-10k.ts: DATABASE_URL naming a "bench"/"test" database (wiped), or none.
 * BENCH_SECONDS sets the duration of each run (default 10); BENCH_ROUNDS how often the three are run in turn (1);
 * BENCH_ONLY keeps the endpoints whose name holds it (for profiling); BENCH_PROFILE=<folder> writes a CPU profile of the API process per endpoint
 * (the load only) there; BENCH_NODE_ARGS adds Node options to the API process.
 */
import { fork } from 'node:child_process'
import { loadavg } from 'node:os'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import autocannon from 'autocannon'

const here = path.dirname(fileURLToPath(import.meta.url))

interface Ready {
  base: string
  cookie: string
  dataSetId: string
}

async function main(): Promise<void> {
  const child = fork(path.join(here, 'throughput-server.ts'), [], {
    execArgv: ['--import', 'tsx', ...(process.env.BENCH_NODE_ARGS?.split(' ').filter(Boolean) ?? [])],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  })
  const ready = await new Promise<Ready>((resolve, reject) => {
    child.once('message', (m) => resolve(m as Ready))
    child.once('exit', (code) => reject(new Error(`the API process ended (${code}) before it was ready`)))
  })
  const { base, cookie, dataSetId } = ready
  try {
    const seconds = Number(process.env.BENCH_SECONDS ?? 10)
    const rounds = Number(process.env.BENCH_ROUNDS ?? 1)
    // autocannon reports p90 and p97.5 but not p95: the latencies are also collected here, from every response.
    const profileDir = process.env.BENCH_PROFILE
    const ask = <T>(message: object) =>
      new Promise<T>((resolve) => {
        child.once('message', (m) => resolve(m as T))
        child.send(message)
      })
    const run = async (p: string, name: string) => {
      await ask({ start: true, profile: !!profileDir })
      const times: number[] = []
      const r = await new Promise<autocannon.Result>((resolve, reject) => {
        const instance = autocannon(
          { url: base + p, connections: 50, duration: seconds, headers: { cookie } },
          (err, result) => (err ? reject(err) : resolve(result)),
        )
        instance.on('response', (_client, _status, _bytes, ms) => void times.push(ms))
      })
      const { cpuMs } = await ask<{ cpuMs: number }>({
        stop: profileDir ? path.join(profileDir, `${name.replace(/\W+/g, '-')}.cpuprofile`) : null,
      })
      times.sort((a, b) => a - b)
      const at = (q: number) => Math.round(times[Math.min(times.length - 1, Math.floor(q * times.length))] * 10) / 10
      return {
        rps: Math.round(r.requests.average),
        p50: at(0.5),
        p95: at(0.95),
        p99: at(0.99),
        non2xx: r.non2xx,
        // CPU time of the API process per answered request: what the endpoint costs, whatever else the machine runs
        cpuUs: Math.round((1000 * cpuMs) / Math.max(1, r.requests.total)),
      }
    }
    const targets = [
      ['GET /api/health', '/api/health'],
      ['GET /api/auth/me', '/api/auth/me'],
      ['GET /api/data-sets/:id/curve', `/api/data-sets/${dataSetId}/curve?pressure=101.325&unit=kPa`],
    ].filter(([name]) => name.includes(process.env.BENCH_ONLY ?? ''))
    for (const [name, p] of targets) {
      const probe = await fetch(base + p, { headers: { cookie } })
      if (probe.status !== 200) throw new Error(`${name}: ${probe.status} ${await probe.text()}`)
      await autocannon({ url: base + p, connections: 10, amount: 500, headers: { cookie } }) // warm-up
    }
    for (let round = 1; round <= rounds; round++) {
      const before = loadavg()[0]
      const rows: {
        name: string
        rps: number
        p50: number
        p95: number
        p99: number
        non2xx: number
        cpuUs: number
      }[] = []
      for (const [name, p] of targets) {
        rows.push({ name, ...(await run(p, name)) })
      }
      const health = rows[0].rps
      console.log(
        `\nround ${round}: ${seconds} s per endpoint, load average ${before.toFixed(2)} before, ${loadavg()[0].toFixed(2)} after`,
      )
      console.log('| endpoint | req/s | % of health | p50 ms | p95 ms | p99 ms | non-2xx | API CPU µs/request |')
      console.log('|---|---|---|---|---|---|---|---|')
      for (const r of rows)
        console.log(
          `| ${r.name} | ${r.rps} | ${Math.round((100 * r.rps) / health)} % | ${r.p50} | ${r.p95} | ${r.p99} | ${r.non2xx} | ${r.cpuUs} |`,
        )
    }
  } finally {
    child.disconnect()
  }
}

main().catch((e) => {
  console.error(e)
  process.exit(1)
})
