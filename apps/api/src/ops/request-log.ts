/**
 * The request id and the one log line per API request. Every request gets an id: the caller's X-Request-Id when it
 * is sane (a proxy's), else a new UUID; it is in the X-Request-Id answer header, in every log line of the request
 * (`req.id`) and in every error answer. Logged: method, path and status only — no headers (cookies), no bodies
 * (passwords), no query strings (tokens).
 *
 * This replaces pino-http, which built a child logger and serialised the request for every request although almost
 * every request logs one line: here the child logger (for the error handler's lines) is made only when asked for.
 */
import { randomUUID } from 'node:crypto'
import { performance } from 'node:perf_hooks'
import type { RequestHandler } from 'express'
import type { Logger } from 'pino'

const REQUEST_ID = /^[A-Za-z0-9._:-]{1,100}$/

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** The request id (see ops/request-log.ts). */
      id?: string
      /** A logger whose lines carry the request's id, method and path. */
      log?: Logger
    }
  }
}

/** The id for a request: the given X-Request-Id when it is sane, else a new one. */
export function requestIdOf(given: string | string[] | undefined): string {
  return typeof given === 'string' && REQUEST_ID.test(given) ? given : randomUUID()
}

export function requestLog(logger: Logger): RequestHandler {
  return (req, res, next) => {
    const id = requestIdOf(req.headers['x-request-id'])
    req.id = id
    res.setHeader('X-Request-Id', id)
    const url = req.url
    if (url.slice(0, 4).toLowerCase() !== '/api') return next()
    const q = url.indexOf('?')
    const line = { id, method: req.method, path: q === -1 ? url : url.slice(0, q) }
    let child: Logger | undefined
    Object.defineProperty(req, 'log', {
      configurable: true,
      enumerable: false,
      get: () => (child ??= logger.child({ req: line })),
    })
    const start = performance.now()
    res.once('close', () => {
      const responseTime = Math.round(performance.now() - start)
      const status = res.statusCode
      if (!res.writableFinished)
        logger.warn({ req: line, res: { status }, responseTime }, 'request aborted before its answer was sent')
      else if (status >= 500) logger.error({ req: line, res: { status }, responseTime }, 'request failed')
      else logger.info({ req: line, res: { status }, responseTime }, 'request completed')
    })
    next()
  }
}
