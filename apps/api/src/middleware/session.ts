import type { RequestHandler } from 'express'
import type { AppServices } from '../context.js'

/** Puts the services and the signed-in user (or null) on every request. */
export function sessionContext(services: AppServices): RequestHandler {
  return async (req, res, next) => {
    const { user, setCookie } = await services.sessions.validate(services.db, req.headers.cookie)
    if (setCookie) res.append('Set-Cookie', setCookie)
    req.ctx = { ...services, user }
    next()
  }
}
