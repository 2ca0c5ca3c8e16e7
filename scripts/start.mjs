#!/usr/bin/env node
// `npm start`: prepare this machine, start PostgreSQL and the app, load the demo scenario, serve on loopback.
// Settings besides the app's own (.env, environment): DATABASE_URL's port is the cluster's port; EBULLIO_PG_DIR puts
// the cluster's files elsewhere than .data/pg; EBULLIO_SKIP_WEB_BUILD=1 serves the web app as last built (or none);
// EBULLIO_SKIP_INSTALL=1 skips `pnpm install` when node_modules exists; DEMO_DATA=false loads no demo scenario.
import { spawn } from 'node:child_process'
import path from 'node:path'
import { loadDotEnv, portOf } from './lib/env.mjs'
import { dataDirFor, startCluster } from './lib/postgres.mjs'
import { ensureDependencies, ensurePnpm, log, root, run } from './lib/system.mjs'

const started = Date.now()
ensurePnpm()
ensureDependencies()

const env = { ...loadDotEnv(root), ...process.env }
const dbUrl = env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54320/ebullio'
const pg = startCluster({
  dataDir: env.EBULLIO_PG_DIR ? path.resolve(env.EBULLIO_PG_DIR) : dataDirFor(root, 'pg'),
  port: portOf(dbUrl, 54320),
  database: new URL(dbUrl).pathname.slice(1) || 'ebullio',
})
const appEnv = {
  ...env,
  DATABASE_URL: pg.url,
  NODE_ENV: env.NODE_ENV ?? 'development',
  SERVE_WEB: 'true',
  // the demo scenario's invented lab (db/seeds/lab.ts), unless LAB_NAME says otherwise
  LAB_NAME: env.LAB_NAME ?? 'Halvorsen Fine Chemicals, Solvent Recovery Laboratory',
}
const tsx = path.join(root, 'node_modules', '.bin', 'tsx')

try {
  log('applying database migrations')
  run(tsx, ['db/migrate.ts'], { env: appEnv })
  if ((appEnv.DEMO_DATA ?? (appEnv.NODE_ENV === 'production' ? 'false' : 'true')) !== 'false') {
    log('loading the demo scenario (invented data; idempotent)')
    run(tsx, ['db/seeds/index.ts'], { env: appEnv })
  }
  if (env.EBULLIO_SKIP_WEB_BUILD !== '1') {
    log('building the web app')
    run('pnpm', ['--filter', '@ebullio/web', 'build', '--logLevel', 'warn'])
  }
} catch (e) {
  pg.stop()
  console.error(e instanceof Error ? e.message : e)
  process.exit(1)
}

// node --import tsx: the app is our direct child (no wrapper process in between to orphan).
const server = spawn(process.execPath, ['--import', 'tsx', 'apps/api/src/server.ts'], {
  cwd: root,
  env: appEnv,
  stdio: ['ignore', 'inherit', 'inherit'],
})
const url = appEnv.PUBLIC_URL ?? `http://127.0.0.1:${appEnv.PORT ?? 3000}`
const healthUrl = `http://127.0.0.1:${appEnv.PORT ?? 3000}/api/health`

/** "ready" only once the app answers its liveness check (not after a fixed delay). */
async function announceWhenReady() {
  while (!stopping && server.exitCode === null) {
    try {
      const r = await fetch(healthUrl, { signal: AbortSignal.timeout(2000) })
      if (r.ok) break
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 200))
  }
  if (stopping || server.exitCode !== null) return
  const secs = Math.round((Date.now() - started) / 1000)
  console.log(`
  Ebullio is ready at ${url}   (started in ${secs} s; Ctrl-C stops it and its PostgreSQL, the data stays in .data/)

  Demo sign-ins (DEMO ONLY, invented lab; password for all: ebullio-demo-2026)
    analyst       analyst@demo.ebullio.test
    lead chemist  lead@demo.ebullio.test
    2nd lead      lead2@demo.ebullio.test
    reviewer      reviewer@demo.ebullio.test
    engineer      engineer@demo.ebullio.test
    admin         admin@demo.ebullio.test
  Mail sent by the app is captured locally: sign in as admin → Captured mail.
`)
}

// SIGINT (Ctrl-C) and SIGTERM alike: the app stops gracefully, then its PostgreSQL; a second signal hurries the app.
let stopping = false
function stop(signal) {
  if (stopping) {
    server.kill('SIGKILL')
    return
  }
  stopping = true
  log(`${signal}: stopping the app and PostgreSQL`)
  server.kill('SIGTERM')
}
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(signal, () => stop(signal))
server.on('exit', (code, signal) => {
  pg.stop()
  log('stopped')
  process.exit(stopping ? 0 : (code ?? (signal ? 1 : 0)))
})
void announceWhenReady()
