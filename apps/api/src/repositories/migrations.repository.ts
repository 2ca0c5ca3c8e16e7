import { sql } from 'kysely'
import type { Db } from '../db/index.js'

/** Names of the migrations the database has applied (Kysely's own bookkeeping table). */
export async function appliedMigrationNames(db: Db): Promise<string[]> {
  const { rows } = await sql<{ name: string }>`select name from kysely_migration`.execute(db)
  return rows.map((r) => r.name)
}
