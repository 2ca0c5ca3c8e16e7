import type { RequestHandler } from 'express'
import { AppError } from '../errors/index.js'

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

/**
 * Cross-site request forgery guard: a state-changing request must come from our own origin, as told by Origin
 * (or Referer when a browser omits Origin), compared with the configured public URL only — never with the
 * request's own Host header, which the sender controls. Requests with neither header are refused.
 */
export function sameOrigin(publicUrl: string): RequestHandler {
  const allowed = new URL(publicUrl).origin
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next()
    const source = req.get('origin') ?? req.get('referer')
    let origin: string | null
    try {
      origin = source ? new URL(source).origin : null
    } catch {
      origin = null
    }
    if (origin && origin === allowed) return next()
    next(new AppError(403, 'cross_site_request', 'This request did not come from the Ebullio page and was refused.'))
  }
}
