import { sql, type Kysely } from 'kysely'
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit'
import type { Database } from '../db/index.js'

/**
 * An express-rate-limit store in PostgreSQL (table `rate_limit_hit`), so every replica counts against the same
 * limit. One statement per hit: a fixed window per key that starts again once `reset_at` has passed.
 * (Written here rather than taken from a package: it lives in our migrations and uses the app's own pool.)
 */
export class PostgresRateLimitStore implements Store {
  localKeys = false
  private windowMs = 60_000

  constructor(
    private readonly db: Kysely<Database>,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs
  }

  private k(key: string): string {
    return `${this.prefix}:${key}`
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const row = await this.db
      .selectFrom('rate_limit_hit')
      .select(['hits', 'reset_at'])
      .where('key', '=', this.k(key))
      .where('reset_at', '>', sql<Date>`now()`)
      .executeTakeFirst()
    return row ? { totalHits: row.hits, resetTime: row.reset_at } : undefined
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const window = sql`${this.windowMs} * interval '1 millisecond'`
    const { rows } = await sql<{ hits: number; reset_at: Date }>`
      insert into rate_limit_hit as r (key, hits, reset_at) values (${this.k(key)}, 1, now() + ${window})
      on conflict (key) do update set
        hits = case when r.reset_at <= now() then 1 else r.hits + 1 end,
        reset_at = case when r.reset_at <= now() then now() + ${window} else r.reset_at end
      returning hits, reset_at`.execute(this.db)
    return { totalHits: rows[0].hits, resetTime: rows[0].reset_at }
  }

  async decrement(key: string): Promise<void> {
    await this.db
      .updateTable('rate_limit_hit')
      .set({ hits: sql`greatest(hits - 1, 0)` })
      .where('key', '=', this.k(key))
      .execute()
  }

  async resetKey(key: string): Promise<void> {
    await this.db.deleteFrom('rate_limit_hit').where('key', '=', this.k(key)).execute()
  }

  /** Expired windows are deleted now and then (by whichever replica hits the limiter). */
  async sweep(): Promise<void> {
    await this.db
      .deleteFrom('rate_limit_hit')
      .where('reset_at', '<', sql<Date>`now() - interval '1 hour'`)
      .execute()
  }
}
