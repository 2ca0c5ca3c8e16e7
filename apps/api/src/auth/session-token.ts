import { sha256 } from '@oslojs/crypto/sha2'
import { encodeBase32LowerCaseNoPadding, encodeHexLowerCase } from '@oslojs/encoding'
import { randomBytes } from 'node:crypto'

/** A new session token: 20 random bytes (160 bits), base32. It lives only in the user's cookie. */
export function generateSessionToken(): string {
  return encodeBase32LowerCaseNoPadding(randomBytes(20))
}

/** The session id stored in the database: hex SHA-256 of the token, so a copy of the database holds no live session. */
export function sessionIdOf(token: string): string {
  return encodeHexLowerCase(sha256(new TextEncoder().encode(token)))
}
