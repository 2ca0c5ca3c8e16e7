import type { RequestHandler } from 'express'
import type { Kysely } from 'kysely'
import type pg from 'pg'
import { Counter, Gauge, Histogram, Registry, collectDefaultMetrics } from 'prom-client'
import type { Database } from '../db/index.js'
import { outboxStats } from '../repositories/mail-outbox.repository.js'
import type { ChangeFeed } from './change-feed.js'

/** Prometheus metrics of one app: requests, latency per route, errors, outbox depth and age, pool usage. */
export function createMetrics(db: Kysely<Database>, pool?: pg.Pool, withProcessMetrics = false, changes?: ChangeFeed) {
  const registry = new Registry()
  if (withProcessMetrics) collectDefaultMetrics({ register: registry })
  const requests = new Counter({
    name: 'ebullio_http_requests_total',
    help: 'HTTP requests answered, by method, route pattern and status',
    labelNames: ['method', 'route', 'status'] as const,
    registers: [registry],
  })
  const errors = new Counter({
    name: 'ebullio_http_errors_total',
    help: 'HTTP answers with status 500 or above, by route pattern and status',
    labelNames: ['route', 'status'] as const,
    registers: [registry],
  })
  const latency = new Histogram({
    name: 'ebullio_http_request_duration_seconds',
    help: 'Time from request to response, by method and route pattern',
    labelNames: ['method', 'route'] as const,
    buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
    registers: [registry],
  })
  new Gauge({
    name: 'ebullio_outbox_pending',
    help: 'Mail messages waiting to be delivered',
    registers: [registry],
    async collect() {
      this.set(await outbox().then((o) => o.pending))
    },
  })
  new Gauge({
    name: 'ebullio_outbox_oldest_pending_seconds',
    help: 'Age of the oldest undelivered mail message (0 when none waits)',
    registers: [registry],
    async collect() {
      this.set(await outbox().then((o) => o.oldestSeconds))
    },
  })
  new Gauge({
    name: 'ebullio_outbox_failed',
    help: 'Mail messages given up (refused for good or too many tries)',
    registers: [registry],
    async collect() {
      this.set(await outbox().then((o) => o.failed))
    },
  })
  if (pool) {
    const poolGauge = (name: string, help: string, read: () => number) =>
      new Gauge({
        name,
        help,
        registers: [registry],
        collect() {
          this.set(read())
        },
      })
    poolGauge('ebullio_db_pool_connections', 'Open database connections of this process', () => pool.totalCount)
    poolGauge('ebullio_db_pool_idle', 'Idle database connections of this process', () => pool.idleCount)
    poolGauge('ebullio_db_pool_waiting', 'Queries waiting for a database connection', () => pool.waitingCount)
  }
  if (changes) {
    new Gauge({
      name: 'ebullio_change_feed_listening',
      help: '1 while the change feed listens (the caches are in use), 0 while they are bypassed',
      registers: [registry],
      collect() {
        this.set(changes.live ? 1 : 0)
      },
    })
    new Gauge({
      name: 'ebullio_change_feed_reconnects',
      help: 'Times the change feed lost its database connection since the process started',
      registers: [registry],
      collect() {
        this.set(changes.stats.disconnects)
      },
    })
    const perCache = (name: string, help: string, read: (c: { size: number; hits: number }) => number) =>
      new Gauge({
        name,
        help,
        labelNames: ['cache'],
        registers: [registry],
        collect() {
          for (const [cache, c] of Object.entries(changes.cacheStats())) this.set({ cache }, read(c))
        },
      })
    perCache('ebullio_cache_entries', 'Entries in an in-process cache (sessions, curve-sources)', (c) => c.size)
    perCache('ebullio_cache_hits', 'Answers served from an in-process cache since the process started', (c) => c.hits)
  }

  // One outbox query per scrape, shared by the three gauges.
  let cached: Promise<{ pending: number; oldestSeconds: number; failed: number }> | null = null
  function outbox() {
    cached ??= outboxStats(db)
      .catch(() => ({ pending: Number.NaN, oldestSeconds: Number.NaN, failed: Number.NaN }))
      .finally(() => setTimeout(() => (cached = null), 0))
    return cached
  }

  /** Counts and times every request under /api, labelled with the matched route pattern (not the raw path). */
  const middleware: RequestHandler = (req, res, next) => {
    if (!req.path.startsWith('/api')) return next()
    const start = process.hrtime.bigint()
    res.on('finish', () => {
      const route = req.route?.path ? String(req.route.path) : 'unmatched'
      const seconds = Number(process.hrtime.bigint() - start) / 1e9
      requests.inc({ method: req.method, route, status: String(res.statusCode) })
      latency.observe({ method: req.method, route }, seconds)
      if (res.statusCode >= 500) errors.inc({ route, status: String(res.statusCode) })
    })
    next()
  }

  return { registry, middleware }
}
