import type { Request } from 'express'
import type { Kysely } from 'kysely'
import type { Role } from '@ebullio/schemas'
import type { Sessions, SessionUser } from './auth/index.js'
import type { Config } from './config.js'
import type { Database } from './db/index.js'
import type { Mailer } from './mail/mailer.js'
import type { ChangeFeed } from './ops/change-feed.js'
import { unauthorized } from './errors/index.js'

/** What every request handler may use; built once per app, with the user filled per request. */
export interface AppServices {
  db: Kysely<Database>
  config: Config
  sessions: Sessions
  mailer: Mailer
  /** The database's change notifications and the caches built on them (absent: nothing is cached across requests). */
  changes?: ChangeFeed
}

export interface RequestContext extends AppServices {
  user: SessionUser | null
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      ctx: RequestContext
    }
  }
}

/** The request's context with a signed-in user (routes that are not public always have one). */
export function ctx(req: Request): AppServices & { user: SessionUser } {
  const c = req.ctx
  if (!c.user) throw unauthorized()
  return c as AppServices & { user: SessionUser }
}

export function hasRole(user: SessionUser | null, ...roles: Role[]): boolean {
  return !!user && roles.some((r) => user.roles.includes(r))
}
