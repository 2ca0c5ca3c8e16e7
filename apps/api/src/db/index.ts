import { Kysely, PostgresDialect, type Transaction } from 'kysely'
import pg from 'pg'
import type { Database } from './database.js'

export type { Database } from './database.js'
export type Db = Kysely<Database> | Transaction<Database>

// Return NUMERIC and BIGINT as JS numbers/strings consistently: bigint ids stay strings, numeric becomes number.
pg.types.setTypeParser(1700, (v) => Number(v))

export interface PoolOptions {
  max?: number
  /** Called when an idle connection breaks (PostgreSQL restarted, a proxy dropped it). Without a listener pg would crash the process. */
  onError?: (err: Error) => void
}

export function createPool(url: string, o: PoolOptions = {}): pg.Pool {
  const pool = new pg.Pool({
    connectionString: url,
    max: o.max ?? 10,
    // While the database is away a request waits at most this long for a connection, then answers 503.
    connectionTimeoutMillis: 5000,
  })
  // A broken idle client is removed from the pool by pg itself; the next query opens a new connection.
  pool.on('error', (err) => o.onError?.(err))
  return pool
}

export function createDb(url: string, pool: pg.Pool = createPool(url)): Kysely<Database> {
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) })
}
