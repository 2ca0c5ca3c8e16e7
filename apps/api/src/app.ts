import { existsSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import express from 'express'
import { rateLimit } from 'express-rate-limit'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
import type { Logger } from 'pino'
import type { AppServices } from './context.js'
import { AppError, notFound } from './errors/index.js'
import { errorHandler } from './errors/handler.js'
import { authorize } from './middleware/authorize.js'
import { rejectInvalidText } from './middleware/invalid-text.js'
import { sameOrigin } from './middleware/same-origin.js'
import { sessionContext } from './middleware/session.js'
import type { RouteDef } from './routes/define.js'
import { allRoutes } from './routes/index.js'

const webDist = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../web/dist')

function signInLimiters(services: AppServices) {
  const { config } = services
  const tooMany = (message: string) => (_req: express.Request, _res: express.Response, next: express.NextFunction) =>
    next(new AppError(429, 'too_many_attempts', message))
  const window = 15 * 60_000
  return [
    rateLimit({
      windowMs: window,
      limit: config.rateLimitSigninPerIp,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: tooMany('Too many sign-in attempts from this address. Wait 15 minutes and try again.'),
    }),
    rateLimit({
      windowMs: window,
      limit: config.rateLimitSigninPerAccount,
      skipSuccessfulRequests: true,
      standardHeaders: false,
      legacyHeaders: false,
      keyGenerator: (req) =>
        `account:${String(req.body?.email ?? '')
          .trim()
          .toLowerCase()}`,
      validate: { keyGeneratorIpFallback: false },
      handler: tooMany('Too many failed sign-in attempts for this account. Wait 15 minutes and try again.'),
    }),
  ]
}

function mount(router: express.Router, routes: RouteDef[]) {
  for (const r of routes) {
    const handlers = Array.isArray(r.handler) ? r.handler : [r.handler]
    router[r.method](r.path, authorize(r.access), rejectInvalidText, ...handlers)
  }
}

/** Build the Express application (no listening here: see server.ts). */
export function createApp(services: AppServices, logger: Logger, routes: RouteDef[] = allRoutes): express.Express {
  const { config } = services
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', 'loopback')
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
  app.use('/api', express.json({ limit: config.jsonLimit }))
  app.use('/api', sameOrigin(config.publicUrl))
  app.use('/api', sessionContext(services))
  app.use('/api/auth/sign-in', ...signInLimiters(services))

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
