import type { Role } from '@ebullio/schemas'
import type { Kysely } from 'kysely'
import type { Config } from '../config.js'
import type { Database, Db } from '../db/index.js'
import type { ChangeFeed, FeedCache } from '../ops/change-feed.js'
import * as sessions from '../repositories/sessions.repository.js'
import { generateSessionToken, sessionIdOf } from './session-token.js'

export { hashPassword, verifyPassword, dummyHash } from './password.js'
export { generateSessionToken, sessionIdOf } from './session-token.js'

export interface SessionUser {
  id: string
  email: string
  displayName: string
  roles: Role[]
  /** Whether the user wants mail notifications; read with the session (absent where a user is built otherwise). */
  notifyMail?: boolean
}

const COOKIE = 'ebullio_session'

/** The value of one cookie in a Cookie header. */
function readCookie(header: string | undefined, name: string): string | null {
  if (!header) return null
  for (const part of header.split(';')) {
    const eq = part.indexOf('=')
    if (eq > 0 && part.slice(0, eq).trim() === name) {
      const v = part.slice(eq + 1).trim()
      return /^[a-z2-7]{1,64}$/.test(v) ? v : null
    }
  }
  return null
}

type SessionRow = NonNullable<Awaited<ReturnType<typeof sessions.findSessionWithUser>>>

/**
 * Sessions: a random token in an HttpOnly cookie, its SHA-256 as the row id in `user_session` (the approach the
 * lucia authors now recommend, on @oslojs/crypto). Idle timeout (sliding, extended past half its life) and absolute
 * lifetime; one query reads session, user and roles. With a change feed the row is kept in this process for a few
 * seconds at most and dropped as soon as the database says the session or its user changed (on any replica); while
 * the feed is not listening every request reads the database.
 */
export class Sessions {
  readonly cookieName = COOKIE
  private readonly secure: boolean
  private readonly idleMs: number
  private readonly cache: FeedCache<SessionRow> | null

  constructor(
    private readonly db: Kysely<Database>,
    private readonly config: Config,
    changes?: ChangeFeed,
  ) {
    this.cache =
      changes?.cache<SessionRow>('sessions', {
        max: 10_000,
        forget: (change, lru) => {
          if (change.topic === 'session') lru.delete(change.key)
          else if (change.topic === 'user') {
            for (const [k, row] of lru.entries()) if (row.id === change.key) lru.delete(k)
          } else if (change.topic === 'all') lru.clear()
        },
      }) ?? null
    this.secure =
      config.cookieSecure === 'auto'
        ? config.nodeEnv === 'production' || config.publicUrl.startsWith('https:')
        : config.cookieSecure === 'true'
    this.idleMs = config.sessionIdleHours * 3.6e6
  }

  private cookie(token: string, maxAgeSeconds: number): string {
    return `${COOKIE}=${token}; Path=/; Max-Age=${maxAgeSeconds}; HttpOnly; SameSite=Lax${this.secure ? '; Secure' : ''}`
  }

  /** Start a session; returns the Set-Cookie value. */
  async create(userId: string, db: Db = this.db): Promise<string> {
    const token = generateSessionToken()
    await sessions.insertSession(db, {
      id: sessionIdOf(token),
      userId,
      expiresAt: new Date(Date.now() + this.idleMs),
    })
    return this.cookie(token, Math.floor(this.idleMs / 1000))
  }

  blankCookie(): string {
    return this.cookie('', 0)
  }

  /** The user behind a cookie header, and a cookie to send back when the session was extended or ended. */
  async validate(db: Db, cookieHeader: string | undefined): Promise<{ user: SessionUser | null; setCookie?: string }> {
    const token = readCookie(cookieHeader, COOKIE)
    if (!token) return { user: null }
    const id = sessionIdOf(token)
    let row = this.cache?.get(id)
    if (!row) {
      const since = this.cache?.begin() ?? 0
      row = await sessions.findSessionWithUser(db, id)
      if (!row) return { user: null, setCookie: this.blankCookie() }
      this.cache?.set(id, row, since)
    }
    const now = Date.now()
    const ageHours = (now - row.created_at.getTime()) / 3.6e6
    if (!row.active || row.expires_at.getTime() <= now || ageHours > this.config.sessionAbsoluteHours) {
      this.cache?.delete(id)
      await sessions.deleteSession(db, id)
      return { user: null, setCookie: this.blankCookie() }
    }
    let setCookie: string | undefined
    if (row.expires_at.getTime() - now < this.idleMs / 2) {
      this.cache?.delete(id)
      await sessions.extendSession(db, id, new Date(now + this.idleMs))
      setCookie = this.cookie(token, Math.floor(this.idleMs / 1000))
    }
    return {
      user: {
        id: row.id,
        email: row.email,
        displayName: row.display_name,
        roles: row.roles,
        notifyMail: row.notify_mail,
      },
      setCookie,
    }
  }

  /** The stored id of the session a cookie header carries (null without one). */
  idFromCookie(cookieHeader: string | undefined): string | null {
    const token = readCookie(cookieHeader, COOKIE)
    return token ? sessionIdOf(token) : null
  }

  async end(cookieHeader: string | undefined): Promise<void> {
    const id = this.idFromCookie(cookieHeader)
    if (id) {
      this.cache?.delete(id)
      await sessions.deleteSession(this.db, id)
    }
  }

  /** End every session of a user, except (optionally) the one this cookie header carries. */
  async endAllFor(userId: string, exceptCookieHeader?: string, db: Db = this.db): Promise<void> {
    const keep = exceptCookieHeader ? this.idFromCookie(exceptCookieHeader) : null
    await sessions.deleteSessionsOf(db, userId, keep)
  }
}
