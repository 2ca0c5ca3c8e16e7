#!/usr/bin/env node
// Start (or stop) the throw-away PostgreSQL used by the test suite:
//   node scripts/test-db.mjs start   → prints DATABASE_URL=...
//   node scripts/test-db.mjs stop
import { startCluster, dataDirFor } from './lib/postgres.mjs'
import { root } from './lib/system.mjs'

export const TEST_DB = { port: Number(process.env.TEST_PG_PORT ?? 54329), database: 'ebullio_test' }

const cmd = process.argv[2] ?? 'start'
const dataDir = dataDirFor(root, 'pg-test')
if (cmd === 'start') {
  const c = startCluster({ dataDir, ...TEST_DB })
  console.log(`DATABASE_URL=${c.url}`)
} else if (cmd === 'stop') {
  startCluster({ dataDir, ...TEST_DB }).stop()
}
