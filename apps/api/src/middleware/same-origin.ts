import type { RequestHandler } from 'express'
import { AppError } from '../errors/index.js'

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

/**
 * Cross-site request forgery guard: a state-changing request must come from our own origin,
 * as told by Origin (or Referer when a browser omits Origin). Requests with neither are refused.
 */
export function sameOrigin(publicUrl: string): RequestHandler {
  const allowed = new URL(publicUrl).host
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next()
    const source = req.get('origin') ?? req.get('referer')
    let host: string | null
    try {
      host = source ? new URL(source).host : null
    } catch {
      host = null
    }
    if (host && (host === allowed || host === req.get('host'))) return next()
    next(new AppError(403, 'cross_site_request', 'This request did not come from the Ebullio page and was refused.'))
  }
}
