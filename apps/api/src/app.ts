import { existsSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import express from 'express'
import helmet from 'helmet'
import type { Logger } from 'pino'
import type pg from 'pg'
import type { AppServices } from './context.js'
import { notFound } from './errors/index.js'
import { errorHandler } from './errors/handler.js'
import { authorize } from './middleware/authorize.js'
import { rejectInvalidText } from './middleware/invalid-text.js'
import { sameOrigin } from './middleware/same-origin.js'
import { sessionContext } from './middleware/session.js'
import { createLimits } from './ops/limits.js'
import { createMetrics } from './ops/metrics.js'
import { requestLog } from './ops/request-log.js'
import type { RouteDef } from './routes/define.js'
import { allRoutes } from './routes/index.js'

const webDist = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../web/dist')

/**
 * The routes, one router per first path segment after /api (`data-sets`, `auth`, …): a request is matched only
 * against the routes of its own segment instead of walking the whole table (about a hundred patterns). Within a
 * segment the routes keep their order. Every route path starts with a literal `/api/<segment>`.
 */
function mount(routes: RouteDef[]): express.RequestHandler {
  const bySegment = new Map<string, express.Router>()
  for (const r of routes) {
    const segment = firstSegment(r.path)
    if (!segment || segment.includes(':') || segment.includes('*'))
      throw new Error(`route ${r.path}: its path must start with /api/<literal segment>`)
    let router = bySegment.get(segment)
    if (!router) bySegment.set(segment, (router = express.Router()))
    const handlers = Array.isArray(r.handler) ? r.handler : [r.handler]
    router[r.method](r.path, authorize(r.access), rejectInvalidText, ...handlers)
  }
  return (req, res, next) => {
    const router = bySegment.get(firstSegment(req.url))
    if (router) router(req, res, next)
    else next()
  }
}

/** `data-sets` of `/api/data-sets/…?…`, lower-cased as Express matches paths without regard to case. */
function firstSegment(url: string): string {
  if (url.slice(0, 5).toLowerCase() !== '/api/') return ''
  const end = url.slice(5).search(/[/?#]/)
  return (end === -1 ? url.slice(5) : url.slice(5, 5 + end)).toLowerCase()
}

export interface AppOptions {
  /** The pool behind services.db, for the pool gauges of /metrics. */
  pool?: pg.Pool
  /** Set by server.ts when it is shutting down: answers then ask the client to close the connection. */
  lifecycle?: { stopping: boolean }
  /** Include Node's process metrics (one app per process only). */
  processMetrics?: boolean
}

/** Paths that never need the session: liveness, readiness. */
const NO_SESSION = new Set(['/api/health', '/api/ready'])

function isLoopback(req: express.Request): boolean {
  const a = req.socket.remoteAddress ?? ''
  return !req.get('x-forwarded-for') && (a === '127.0.0.1' || a === '::1' || a === '::ffff:127.0.0.1')
}

/** Build the Express application (no listening here: see server.ts). */
export function createApp(
  services: AppServices,
  logger: Logger,
  routes: RouteDef[] = allRoutes,
  options: AppOptions = {},
): express.Express {
  const { config } = services
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', 'loopback')
  const lifecycle = options.lifecycle
  if (lifecycle)
    // While stopping, every answer (also of a request that arrived before the signal) closes its connection.
    app.use((_req, res, next) => {
      const writeHead = res.writeHead
      res.writeHead = function (this: express.Response, ...args: unknown[]) {
        if (lifecycle.stopping && !this.headersSent) this.setHeader('Connection', 'close')
        return (writeHead as (...a: unknown[]) => express.Response).apply(this, args)
      } as typeof res.writeHead
      next()
    })
  const changes = services.changes
  if (changes)
    // A request that may have written to the database empties this process's caches before its answer leaves: the
    // client's next request never meets what it just changed, even before the database's notification arrives.
    app.use((req, res, next) => {
      if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return next()
      const writeHead = res.writeHead
      res.writeHead = function (this: express.Response, ...args: unknown[]) {
        changes.flush()
        return (writeHead as (...a: unknown[]) => express.Response).apply(this, args)
      } as typeof res.writeHead
      next()
    })
  const metrics = createMetrics(services.db, options.pool, options.processMetrics, changes)
  app.use(metrics.middleware)
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'upgrade-insecure-requests': config.publicUrl.startsWith('https:') ? [] : null,
        },
      },
      strictTransportSecurity: config.publicUrl.startsWith('https:'),
    }),
  )
  app.use(requestLog(logger))
  // Prometheus scrape: with METRICS_TOKEN as a bearer token, or from this machine without a proxy in between.
  app.get('/metrics', async (req, res, next) => {
    const token = config.metricsToken
    const allowed = token ? req.get('authorization') === `Bearer ${token}` : isLoopback(req)
    if (!allowed) return next()
    res.set('Content-Type', metrics.registry.contentType).send(await metrics.registry.metrics())
  })
  app.use('/api', express.json({ limit: config.jsonLimit }))
  app.use('/api', sameOrigin(config.publicUrl))
  const session = sessionContext(services)
  app.use('/api', (req, res, next) => {
    if (!NO_SESSION.has(req.originalUrl.split('?')[0])) return session(req, res, next)
    req.ctx = { ...services, user: null }
    next()
  })
  const limits = createLimits(services)
  app.use('/api/auth', limits.sweep)
  app.use('/api/auth/sign-in', ...limits.signIn)
  app.use('/api/auth/forgot-password', ...limits.forgotPassword)
  app.use('/api/auth/change-password', ...limits.changePassword)

  app.use(mount(routes))
  app.use('/api', (_req, _res, next) => next(notFound('There is no such API route.')))

  if (config.serveWeb && existsSync(webDist)) {
    app.use(express.static(webDist, { index: false, maxAge: '1h' }))
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(webDist, 'index.html')))
  }
  app.use(errorHandler)
  return app
}
