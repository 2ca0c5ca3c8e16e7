import { randomUUID } from 'node:crypto'
import { existsSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import express from 'express'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
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
import type { RouteDef } from './routes/define.js'
import { allRoutes } from './routes/index.js'

const webDist = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../web/dist')

function mount(router: express.Router, routes: RouteDef[]) {
  for (const r of routes) {
    const handlers = Array.isArray(r.handler) ? r.handler : [r.handler]
    router[r.method](r.path, authorize(r.access), rejectInvalidText, ...handlers)
  }
}

export interface AppOptions {
  /** The pool behind services.db, for the pool gauges of /metrics. */
  pool?: pg.Pool
  /** Set by server.ts when it is shutting down: answers then ask the client to close the connection. */
  lifecycle?: { stopping: boolean }
  /** Include Node's process metrics (one app per process only). */
  processMetrics?: boolean
}

const REQUEST_ID = /^[A-Za-z0-9._:-]{1,100}$/
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
  app.use(
    pinoHttp({
      logger,
      // Every request has an id: the caller's X-Request-Id when it is sane (a proxy's), else a new one. It is in
      // every log line of the request (reqId), in the X-Request-Id answer header and in every error answer.
      genReqId: (req, res) => {
        const given = req.headers['x-request-id']
        const id = typeof given === 'string' && REQUEST_ID.test(given) ? given : randomUUID()
        res.setHeader('X-Request-Id', id)
        return id
      },
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
      // Method, path and status only: no headers (cookies), no bodies (passwords), no query strings (tokens).
      serializers: {
        req: (req: { id: unknown; method: string; url: string }) => ({
          id: req.id,
          method: req.method,
          path: req.url.split('?')[0],
        }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  )
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

  const api = express.Router()
  mount(api, routes)
  app.use(api)
  app.use('/api', (_req, _res, next) => next(notFound('There is no such API route.')))

  if (config.serveWeb && existsSync(webDist)) {
    app.use(express.static(webDist, { index: false, maxAge: '1h' }))
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(webDist, 'index.html')))
  }
  app.use(errorHandler)
  return app
}
