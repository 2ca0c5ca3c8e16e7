import { LRUCache } from 'lru-cache'
import pg from 'pg'
import type { Logger } from 'pino'

/** The channel the database triggers notify on (migration 20261204_perf_change_feed). */
export const CHANGE_CHANNEL = 'ebullio_change'

/** What changed: a session, everything about a user, anything a curve's access check reads, or everything. */
export type Change = { topic: 'session' | 'user' | 'sync'; key: string } | { topic: 'curve' | 'all'; key: null }

export function parseChange(payload: string | undefined): Change {
  const colon = payload?.indexOf(':') ?? -1
  const topic = colon > 0 ? payload!.slice(0, colon) : payload
  if ((topic === 'session' || topic === 'user' || topic === 'sync') && colon > 0 && colon < payload!.length - 1)
    return { topic, key: payload!.slice(colon + 1) }
  if (topic === 'curve') return { topic, key: null }
  // Unknown or 'all': the safe answer is to forget everything.
  return { topic: 'all', key: null }
}

export interface ChangeFeedOptions {
  logger?: Logger
  /** First wait before reconnecting after the listening connection broke; doubled up to maxReconnectMs. */
  reconnectMs?: number
  maxReconnectMs?: number
  /** How long a cached answer may be used at most, whatever the feed says (a backstop). 0 turns caching off. */
  ttlMs?: number
}

/**
 * One dedicated PostgreSQL connection per process that LISTENs to the triggers' change notifications and tells the
 * caches built on it (`cache()`) what to forget. While that connection is not established (at start, after the
 * database restarted or dropped it) every cache is empty and bypassed: nothing is served that a missed notification
 * could have made stale. It reconnects by itself and empties the caches again once it listens (what changed in
 * between was not heard).
 */
export class ChangeFeed {
  private client: pg.Client | null = null
  private listening = false
  private closed = false
  private timer: NodeJS.Timeout | null = null
  private wait: number
  private readonly caches = new Map<string, FeedCache<unknown>>()
  private readonly waiters = new Set<() => void>()
  /** Moves on every change heard and every flush: a read that started before it must not be cached. */
  generation = 0
  /** Notifications heard and reconnections (for tests and the operator's eye). */
  readonly stats = { notifications: 0, connects: 0, disconnects: 0 }
  readonly ttlMs: number

  constructor(
    private readonly url: string,
    private readonly o: ChangeFeedOptions = {},
  ) {
    this.wait = o.reconnectMs ?? 250
    this.ttlMs = o.ttlMs ?? 5000
  }

  /** Whether the caches may be used: the listening connection is up and caching is on. */
  get live(): boolean {
    return this.listening && this.ttlMs > 0
  }

  start(): this {
    if (this.ttlMs > 0) void this.connect()
    return this
  }

  /** Resolves once the feed listens, or at once with caching off (tests; start-up need not wait: until then the caches are bypassed). */
  ready(timeoutMs = 10_000): Promise<void> {
    if (this.listening || this.ttlMs <= 0) return Promise.resolve()
    return new Promise((resolve, reject) => {
      const t = setTimeout(() => {
        this.waiters.delete(done)
        reject(new Error('the change feed did not connect in time'))
      }, timeoutMs)
      const done = () => {
        clearTimeout(t)
        resolve()
      }
      this.waiters.add(done)
    })
  }

  /** A cache kept by this feed (one per name), emptied and bypassed with it. */
  cache<V>(name: string, o: { max: number; forget?: (change: Change, cache: LRUCache<string, V & {}>) => void }) {
    let c = this.caches.get(name) as FeedCache<V> | undefined
    if (!c) {
      c = new FeedCache<V>(this, o.max, o.forget)
      this.caches.set(name, c as FeedCache<unknown>)
    }
    return c
  }

  /** Size and hits of every cache, by name. */
  cacheStats(): Record<string, { size: number; hits: number }> {
    return Object.fromEntries([...this.caches].map(([name, c]) => [name, { size: c.size, hits: c.hits }]))
  }

  /** Forget everything now (this process), e.g. after this process wrote to the database. */
  flush(): void {
    this.generation++
    for (const c of this.caches.values()) c.clear()
  }

  /**
   * Resolves once this feed has heard every change committed before the call: it notifies a marker of its own and
   * waits for it (PostgreSQL delivers notifications in commit order). At once when the feed is not listening (the
   * caches are bypassed then).
   */
  async sync(timeoutMs = 10_000): Promise<void> {
    const client = this.client
    if (!this.listening || !client) return
    const marker = `${process.pid}.${++this.syncs}`
    const heard = new Promise<void>((resolve, reject) => {
      const t = setTimeout(() => {
        this.syncWaiters.delete(marker)
        reject(new Error('the change feed did not hear its own marker in time'))
      }, timeoutMs)
      this.syncWaiters.set(marker, () => {
        clearTimeout(t)
        resolve()
      })
    })
    await client.query('select pg_notify($1, $2)', [CHANGE_CHANNEL, `sync:${marker}`])
    await heard
  }

  private syncs = 0
  private readonly syncWaiters = new Map<string, () => void>()

  private dispatch(change: Change): void {
    if (change.topic === 'sync') {
      this.syncWaiters.get(change.key)?.()
      this.syncWaiters.delete(change.key)
      return
    }
    this.generation++
    this.stats.notifications++
    if (change.topic === 'all') return this.flush()
    for (const c of this.caches.values()) c.forget(change)
  }

  private async connect(): Promise<void> {
    if (this.closed) return
    const client = new pg.Client({ connectionString: this.url, application_name: 'ebullio-change-feed' })
    this.client = client
    const lost = (err?: Error) => {
      if (this.client !== client) return
      this.client = null
      const was = this.listening
      this.listening = false
      this.flush()
      // the caches are bypassed now: nobody needs to wait for a marker
      for (const w of this.syncWaiters.values()) w()
      this.syncWaiters.clear()
      if (this.closed) return
      if (was) {
        this.stats.disconnects++
        this.o.logger?.warn(
          { error: err?.message },
          'change feed lost its database connection: caches bypassed until it is back',
        )
      }
      client.removeAllListeners('notification')
      void client.end().catch(() => {})
      this.timer = setTimeout(() => void this.connect(), this.wait)
      this.timer.unref()
      this.wait = Math.min(this.wait * 2, this.o.maxReconnectMs ?? 5000)
    }
    client.on('error', (err) => lost(err))
    client.on('end', () => lost())
    client.on('notification', (n) => {
      if (n.channel === CHANGE_CHANNEL) this.dispatch(parseChange(n.payload))
    })
    try {
      await client.connect()
      await client.query(`LISTEN ${CHANGE_CHANNEL}`)
    } catch (err) {
      return lost(err as Error)
    }
    if (this.client !== client || this.closed) return
    // Whatever changed while nobody listened was not heard.
    this.flush()
    this.listening = true
    this.wait = this.o.reconnectMs ?? 250
    this.stats.connects++
    if (this.stats.connects > 1) this.o.logger?.info('change feed listening again: caches in use')
    for (const w of this.waiters) w()
    this.waiters.clear()
  }

  /** The server process id of the listening connection (tests: to cut it), null while not connected. */
  get backendPid(): number | null {
    return this.listening ? ((this.client as unknown as { processID?: number } | null)?.processID ?? null) : null
  }

  async close(): Promise<void> {
    this.closed = true
    this.listening = false
    if (this.timer) clearTimeout(this.timer)
    const c = this.client
    this.client = null
    this.flush()
    await c?.end().catch(() => {})
  }
}

/**
 * An LRU cache whose entries live at most the feed's TTL and only while the feed listens. `begin()` before reading
 * the database and `set(key, value, token)` after: the value is kept only if nothing was heard in between.
 */
export class FeedCache<V> {
  private readonly lru: LRUCache<string, V & {}>

  constructor(
    private readonly feed: ChangeFeed,
    max: number,
    private readonly forgetFn?: (change: Change, cache: LRUCache<string, V & {}>) => void,
  ) {
    this.lru = new LRUCache<string, V & {}>({ max, ttl: Math.max(1, feed.ttlMs), ttlAutopurge: false })
  }

  /** Answers served from this cache (tests, and the operator's eye). */
  hits = 0

  get(key: string): V | undefined {
    const v = this.feed.live ? this.lru.get(key) : undefined
    if (v !== undefined) this.hits++
    return v
  }

  begin(): number {
    return this.feed.generation
  }

  set(key: string, value: V & {}, token: number): void {
    if (this.feed.live && this.feed.generation === token) this.lru.set(key, value)
  }

  delete(key: string): void {
    this.lru.delete(key)
  }

  clear(): void {
    this.lru.clear()
  }

  get size(): number {
    return this.lru.size
  }

  forget(change: Change): void {
    if (this.forgetFn) this.forgetFn(change, this.lru)
    else this.lru.clear()
  }
}
