/** Apply every pending migration in db/migrations (or `down` one step with `--down`). Reads DATABASE_URL. */
import { promises as fs } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { FileMigrationProvider, Kysely, Migrator, PostgresDialect } from 'kysely'
import pg from 'pg'

const here = path.dirname(fileURLToPath(import.meta.url))

export async function migrateToLatest(databaseUrl: string, direction: 'up' | 'down' = 'up'): Promise<void> {
  const db = new Kysely<Record<string, never>>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: databaseUrl, max: 1 }) }),
  })
  const migrator = new Migrator({
    db,
    provider: new FileMigrationProvider({ fs, path, migrationFolder: path.join(here, 'migrations') }),
  })
  try {
    const { error, results } = direction === 'up' ? await migrator.migrateToLatest() : await migrator.migrateDown()
    for (const r of results ?? []) {
      const mark = r.status === 'Success' ? 'ok' : r.status
      console.log(`  migration ${r.migrationName}: ${mark}`)
    }
    if (error) throw error
  } finally {
    await db.destroy()
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const url = process.env.DATABASE_URL
  if (!url) {
    console.error('DATABASE_URL is not set')
    process.exit(2)
  }
  migrateToLatest(url, process.argv.includes('--down') ? 'down' : 'up').catch((e) => {
    console.error('Migration failed:', e instanceof Error ? e.message : e)
    process.exit(1)
  })
}
