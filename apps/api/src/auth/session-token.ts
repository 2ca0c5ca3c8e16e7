import { encodeBase32LowerCaseNoPadding } from '@oslojs/encoding'
import { createHash, randomBytes } from 'node:crypto'

/** A new session token: 20 random bytes (160 bits), base32. It lives only in the user's cookie. */
export function generateSessionToken(): string {
  return encodeBase32LowerCaseNoPadding(randomBytes(20))
}

/**
 * The session id stored in the database: hex SHA-256 of the token, so a copy of the database holds no live session.
 * Node's native SHA-256 (it runs on every signed-in request; the same digest as @oslojs/crypto's, see auth.test.ts).
 */
export function sessionIdOf(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex')
}
