import { sql } from 'kysely'
import type { Db } from '../db/index.js'

/** Rate-limit windows (table `rate_limit_hit`): hits per key in a fixed window that ends at `reset_at`. */
export async function findCurrentHits(db: Db, key: string) {
  return db
    .selectFrom('rate_limit_hit')
    .select(['hits', 'reset_at'])
    .where('key', '=', key)
    .where('reset_at', '>', sql<Date>`now()`)
    .executeTakeFirst()
}

/** Count one hit in one statement; a window that has passed starts again at 1. */
export async function countHit(db: Db, key: string, windowMs: number): Promise<{ hits: number; reset_at: Date }> {
  const window = sql`${windowMs} * interval '1 millisecond'`
  const { rows } = await sql<{ hits: number; reset_at: Date }>`
    insert into rate_limit_hit as r (key, hits, reset_at) values (${key}, 1, now() + ${window})
    on conflict (key) do update set
      hits = case when r.reset_at <= now() then 1 else r.hits + 1 end,
      reset_at = case when r.reset_at <= now() then now() + ${window} else r.reset_at end
    returning hits, reset_at`.execute(db)
  return rows[0]
}

export async function uncountHit(db: Db, key: string): Promise<void> {
  await db
    .updateTable('rate_limit_hit')
    .set({ hits: sql`greatest(hits - 1, 0)` })
    .where('key', '=', key)
    .execute()
}

export async function deleteHits(db: Db, key: string): Promise<void> {
  await db.deleteFrom('rate_limit_hit').where('key', '=', key).execute()
}

/** Windows that ended more than an hour ago. */
export async function deleteExpiredHits(db: Db): Promise<void> {
  await db
    .deleteFrom('rate_limit_hit')
    .where('reset_at', '<', sql<Date>`now() - interval '1 hour'`)
    .execute()
}
