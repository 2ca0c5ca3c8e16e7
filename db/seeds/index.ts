/** Load the demo scenario (idempotent: a second run neither duplicates nor wipes). Reads DATABASE_URL. */
import { existsSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { Kysely, PostgresDialect } from 'kysely'
import pg from 'pg'
import type { Database } from '../../apps/api/src/db/index.js'
import { seedUsers } from './users.js'

const here = path.dirname(fileURLToPath(import.meta.url))

async function main() {
  const url = process.env.DATABASE_URL
  if (!url) throw new Error('DATABASE_URL is not set')
  if (process.env.NODE_ENV === 'production')
    throw new Error('The demo scenario (invented data) is refused with NODE_ENV=production.')
  const db = new Kysely<Database>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 2 }) }),
  })
  try {
    const ids = await seedUsers(db)
    if (existsSync(path.join(here, 'lab.ts'))) {
      const { seedLab } = await import('./lab.js')
      await seedLab(db, ids)
    }
  } finally {
    await db.destroy()
  }
}

main().catch((e) => {
  console.error('Loading the demo scenario failed:', e instanceof Error ? e.stack : e)
  process.exit(1)
})
