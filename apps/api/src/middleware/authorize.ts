import type { RequestHandler } from 'express'
import { forbidden, unauthorized } from '../errors/index.js'
import type { Access } from '../routes/define.js'

export function authorize(access: Access): RequestHandler {
  return (req, _res, next) => {
    if (access === 'public') return next()
    const user = req.ctx.user
    if (!user) return next(unauthorized())
    if (access === 'authenticated' || access.some((r) => user.roles.includes(r))) return next()
    next(forbidden())
  }
}
