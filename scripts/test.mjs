#!/usr/bin/env node
// `npm test`: the whole suite on this machine. Starts its own PostgreSQL (port 54329, throw-away databases,
// never the demo data), installs Debian's chromium when missing, runs the linter and the format check, vitest, the type
// checks, then Playwright, and prints one count line. A lint or format finding fails the run like a failing test.
import { spawnSync } from 'node:child_process'
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs'
import path from 'node:path'
import { dataDirFor, startCluster } from './lib/postgres.mjs'
import { ensureChromium, ensureDependencies, ensureHaproxy, ensurePnpm, log, root } from './lib/system.mjs'

const started = Date.now()
const only = process.argv[2] // optional: "unit" or "e2e"
ensurePnpm()
ensureDependencies()
const chromium = only === 'unit' ? null : ensureChromium()
if (only !== 'e2e') ensureHaproxy() // the reverse proxy of the replica test (apps/api/test/replicas.test.ts)

// TEST_PG_PORT lets two checkouts on one machine test side by side.
const pgPort = Number(process.env.TEST_PG_PORT ?? 54329)
const dataDir = dataDirFor(root, 'pg-test')
const unitDb = startCluster({ dataDir, port: pgPort, database: 'ebullio_test', fresh: true })
const e2eDb = startCluster({ dataDir, port: pgPort, database: 'ebullio_e2e_test' })
const bin = (name) => path.join(root, 'node_modules', '.bin', name)
const reportDir = path.join(root, '.data')
mkdirSync(reportDir, { recursive: true })

const sh = (cmd, args, env = {}) =>
  spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } }).status ?? 1
const counts = {
  unit: { passed: 0, failed: 0, skipped: 0 },
  e2e: { passed: 0, failed: 0, skipped: 0 },
  types: 'not run',
  lint: 'not run',
  format: 'not run',
}
let failure = false

try {
  if (!only) {
    log('lint (ESLint) and format check (Prettier)')
    const lintOk = sh(bin('eslint'), ['--max-warnings', '0', '.']) === 0
    counts.lint = lintOk ? 'passed' : 'FAILED'
    const formatOk = sh(bin('prettier'), ['--check', '--log-level', 'warn', '.']) === 0
    counts.format = formatOk ? 'passed' : 'FAILED (run `pnpm format`)'
    if (!lintOk || !formatOk) failure = true
  }

  if (only !== 'e2e') {
    log('unit and integration tests (vitest)')
    const vitestJson = path.join(reportDir, 'vitest-report.json')
    rmSync(vitestJson, { force: true })
    const code = sh(
      bin('vitest'),
      ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${vitestJson}`],
      {
        DATABASE_URL: unitDb.url,
        NODE_ENV: 'test',
      },
    )
    if (existsSync(vitestJson)) {
      const r = JSON.parse(readFileSync(vitestJson, 'utf8'))
      counts.unit = {
        passed: r.numPassedTests,
        failed: r.numFailedTests,
        skipped: r.numPendingTests + (r.numTodoTests ?? 0),
      }
    }
    if (code !== 0) failure = true
    if (code !== 0 && counts.unit.failed === 0) counts.unit.failed = 1 // a crash outside any test still fails the run
  }

  if (!only) {
    log('type checks of every package (tsc, vue-tsc)')
    const ok = sh('pnpm', ['-r', '--if-present', '--reporter-hide-prefix', 'typecheck']) === 0
    counts.types = ok ? 'passed' : 'FAILED'
    if (!ok) failure = true
  }

  if (only !== 'unit') {
    log('preparing the browser-test database (migrations + demo scenario)')
    if (sh(process.execPath, ['scripts/lib/reset-db.mjs', e2eDb.url]) !== 0)
      throw new Error('could not reset the e2e database')
    if (sh(bin('tsx'), ['db/migrate.ts'], { DATABASE_URL: e2eDb.url }) !== 0)
      throw new Error('migrations failed on the e2e database')
    if (sh(bin('tsx'), ['db/seeds/index.ts'], { DATABASE_URL: e2eDb.url }) !== 0)
      throw new Error('the demo scenario did not load on the e2e database')
    log('building the web app')
    if (sh('pnpm', ['--filter', '@ebullio/web', 'build', '--logLevel', 'warn']) !== 0)
      throw new Error('web build failed')
    log('browser tests (Playwright in Debian chromium)')
    mkdirSync(path.join(root, 'tests/artifacts/screens'), { recursive: true })
    const pwJson = path.join(reportDir, 'playwright-report.json')
    rmSync(pwJson, { force: true })
    const code = sh(bin('playwright'), ['test'], { CHROMIUM_PATH: chromium, E2E_DATABASE_URL: e2eDb.url })
    if (existsSync(pwJson)) {
      const s = JSON.parse(readFileSync(pwJson, 'utf8')).stats
      counts.e2e = { passed: s.expected, failed: s.unexpected + (s.flaky ?? 0), skipped: s.skipped }
    }
    if (code !== 0) failure = true
    if (code !== 0 && counts.e2e.failed === 0) counts.e2e.failed = 1
  }
} catch (e) {
  failure = true
  console.error(e instanceof Error ? e.message : e)
} finally {
  unitDb.stop()
}

const total = {
  passed: counts.unit.passed + counts.e2e.passed,
  failed: counts.unit.failed + counts.e2e.failed,
  skipped: counts.unit.skipped + counts.e2e.skipped,
}
const secs = Math.round((Date.now() - started) / 1000)
console.log(
  `\nEbullio test suite: ${failure ? 'FAILED' : 'PASSED'} — ${total.passed} passed, ${total.failed} failed, ${total.skipped} skipped ` +
    `(vitest ${counts.unit.passed}/${counts.unit.passed + counts.unit.failed}, browser ${counts.e2e.passed}/${counts.e2e.passed + counts.e2e.failed}; ` +
    `lint ${counts.lint}, format ${counts.format}, type checks ${counts.types}) in ${secs} s`,
)
process.exit(failure ? 1 : 0)
