import type { RequestHandler } from 'express'
import type { Role } from '@ebullio/schemas'

/** Who may call a route: anyone, any signed-in user, or holders of at least one of the roles. */
export type Access = 'public' | 'authenticated' | readonly Role[]

export interface RouteDef {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete'
  /** Full path including /api, in Express 5 syntax. */
  path: string
  access: Access
  handler: RequestHandler | RequestHandler[]
}

export function defineRoutes(defs: RouteDef[]): RouteDef[] {
  return defs
}
