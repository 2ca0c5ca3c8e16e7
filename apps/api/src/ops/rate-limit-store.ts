import type { Kysely } from 'kysely'
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit'
import type { Database } from '../db/index.js'
import * as limits from '../repositories/rate-limits.repository.js'

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
    const row = await limits.findCurrentHits(this.db, this.k(key))
    return row ? { totalHits: row.hits, resetTime: row.reset_at } : undefined
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const row = await limits.countHit(this.db, this.k(key), this.windowMs)
    return { totalHits: row.hits, resetTime: row.reset_at }
  }

  async decrement(key: string): Promise<void> {
    await limits.uncountHit(this.db, this.k(key))
  }

  async resetKey(key: string): Promise<void> {
    await limits.deleteHits(this.db, this.k(key))
  }

  /** Expired windows are deleted now and then (by whichever replica hits the limiter). */
  async sweep(): Promise<void> {
    await limits.deleteExpiredHits(this.db)
  }
}
