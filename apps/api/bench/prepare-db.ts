/** A throw-away, freshly migrated database for a benchmark (see upload-10k.ts). */
import { execFileSync } from 'node:child_process'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { Kysely, PostgresDialect, sql } from 'kysely'
import pg from 'pg'
import { migrateToLatest } from '../../../db/migrate.js'

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..')

export async function prepareDatabase(): Promise<string> {
  let url = process.env.DATABASE_URL
  if (!url) {
    const out = execFileSync('node', [path.join(root, 'scripts/test-db.mjs'), 'start'], { encoding: 'utf8' })
    const base = out.match(/DATABASE_URL=(\S+)/)![1]
    const admin = new pg.Client({ connectionString: base })
    await admin.connect()
    const exists = await admin.query("select 1 from pg_database where datname = 'ebullio_bench_test'")
    if (exists.rowCount === 0) await admin.query('create database ebullio_bench_test')
    await admin.end()
    url = base.replace(/\/[^/]+$/, '/ebullio_bench_test')
  }
  if (!/bench|test/.test(new URL(url).pathname))
    throw new Error(`Refusing to wipe ${url}: use a database whose name contains "bench" or "test"`)
  const db = new Kysely<Record<string, never>>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 1 }) }),
  })
  await sql`drop schema public cascade; create schema public`.execute(db)
  await db.destroy()
  await migrateToLatest(url)
  return url
}
