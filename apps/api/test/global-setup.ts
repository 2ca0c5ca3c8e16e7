import { execFileSync } from 'node:child_process'
import { createRequire } from 'node:module'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { Kysely, PostgresDialect, sql } from 'kysely'
import pg from 'pg'

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..')

/** A fresh schema for every run: drop everything, then apply all migrations (in a child process, as `pnpm migrate` does). */
export default async function setup(): Promise<void> {
  const url = process.env.DATABASE_URL
  if (!url)
    throw new Error(
      'DATABASE_URL is not set: run the suite with `npm test`, or start a test database with `node scripts/test-db.mjs start`',
    )
  if (!/test/.test(new URL(url).pathname))
    throw new Error(`Refusing to wipe ${url}: the test database name must contain "test"`)
  const db = new Kysely<Record<string, never>>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 1 }) }),
  })
  await sql`drop schema public cascade; create schema public`.execute(db)
  await db.destroy()
  const tsx = createRequire(import.meta.url).resolve('tsx/cli')
  execFileSync(process.execPath, [tsx, path.join(root, 'db/migrate.ts')], {
    env: { ...process.env, DATABASE_URL: url },
    stdio: 'pipe',
  })
}
