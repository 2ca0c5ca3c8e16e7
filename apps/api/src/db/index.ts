import { Kysely, PostgresDialect, type Transaction } from 'kysely'
import pg from 'pg'
import type { Database } from './database.js'

export type { Database } from './database.js'
export type Db = Kysely<Database> | Transaction<Database>

// Return NUMERIC and BIGINT as JS numbers/strings consistently: bigint ids stay strings, numeric becomes number.
pg.types.setTypeParser(1700, (v) => Number(v))

export function createPool(url: string): pg.Pool {
  return new pg.Pool({ connectionString: url, max: 10 })
}

export function createDb(url: string, pool: pg.Pool = createPool(url)): Kysely<Database> {
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) })
}
