import type { Role } from '@ebullio/schemas'
import type { Config } from '../config.js'
import type { Db } from '../db/index.js'
import type { AuthEngine } from './lucia.js'

export { createLucia, type AuthEngine } from './lucia.js'
export { hashPassword, verifyPassword, dummyHash } from './password.js'

export interface SessionUser {
  id: string
  email: string
  displayName: string
  roles: Role[]
}

/** Sessions: create, validate (idle and absolute lifetime, active account), end. */
export class Sessions {
  constructor(
    private readonly engine: AuthEngine,
    private readonly config: Config,
  ) {}

  get cookieName(): string {
    return this.engine.sessionCookieName
  }

  async create(userId: string): Promise<string> {
    const session = await this.engine.createSession(userId, {} as never)
    return this.engine.createSessionCookie(session.id).serialize()
  }

  blankCookie(): string {
    return this.engine.createBlankSessionCookie().serialize()
  }

  /** The user behind a cookie header, and a cookie to send back when the session was extended or ended. */
  async validate(db: Db, cookieHeader: string | undefined): Promise<{ user: SessionUser | null; setCookie?: string }> {
    const id = this.engine.readSessionCookie(cookieHeader ?? '')
    if (!id) return { user: null }
    const { session, user } = await this.engine.validateSession(id)
    if (!session || !user) return { user: null, setCookie: this.blankCookie() }
    const ageHours = (Date.now() - session.createdAt.getTime()) / 3.6e6
    if (!user.active || ageHours > this.config.sessionAbsoluteHours) {
      await this.engine.invalidateSession(session.id)
      return { user: null, setCookie: this.blankCookie() }
    }
    const roles = await db.selectFrom('user_role').select('role').where('user_id', '=', user.id).execute()
    return {
      user: { id: user.id, email: user.email, displayName: user.displayName, roles: roles.map((r) => r.role as Role) },
      setCookie: session.fresh ? this.engine.createSessionCookie(session.id).serialize() : undefined,
    }
  }

  async end(cookieHeader: string | undefined): Promise<void> {
    const id = this.engine.readSessionCookie(cookieHeader ?? '')
    if (id) await this.engine.invalidateSession(id)
  }

  async endAllFor(userId: string): Promise<void> {
    await this.engine.invalidateUserSessions(userId)
  }
}
