// The only file that imports lucia: upstream no longer maintains it, so everything else goes through auth/index.ts.
import { NodePostgresAdapter } from '@lucia-auth/adapter-postgresql'
import { Lucia, TimeSpan } from 'lucia'
import type pg from 'pg'
import type { Config } from '../config.js'

export function createLucia(pool: pg.Pool, config: Config) {
  const secure = config.cookieSecure === 'auto' ? config.publicUrl.startsWith('https:') : config.cookieSecure === 'true'
  return new Lucia(new NodePostgresAdapter(pool, { user: 'app_user', session: 'user_session' }), {
    // Lucia extends a session used past half its lifetime, so this is the idle timeout.
    sessionExpiresIn: new TimeSpan(config.sessionIdleHours * 60, 'm'),
    sessionCookie: { name: 'ebullio_session', attributes: { secure, sameSite: 'lax' } },
    getSessionAttributes: (a) => ({ createdAt: new Date(a.created_at) }),
    getUserAttributes: (a) => ({ email: a.email, displayName: a.display_name, active: a.active }),
  })
}

export type AuthEngine = ReturnType<typeof createLucia>

declare module 'lucia' {
  interface Register {
    Lucia: AuthEngine
    DatabaseSessionAttributes: { created_at: Date | string }
    DatabaseUserAttributes: { email: string; display_name: string; active: boolean }
  }
}
