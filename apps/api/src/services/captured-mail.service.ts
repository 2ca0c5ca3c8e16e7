/**
 * The captured-mail viewer (development and test only): what the fake SMTP server stored. A mail's single-use
 * secrets (invitation and password-reset links) are shown only to its addressee; anyone else (an administrator
 * reading the capture) sees the link with its token masked, so reading the capture cannot take over an account.
 */
import { WEB_PATHS } from '@ebullio/schemas'
import type { Db } from '../db/index.js'
import { listCapturedMailRows } from '../repositories/captured-mail.repository.js'

export const MASKED_TOKEN = '[hidden: only the addressee sees this link]'

/** Path prefixes of the pages whose last segment is a secret (from the web app's own path table). */
const TOKEN_PREFIXES = Object.values(WEB_PATHS)
  .filter((p) => p.endsWith('/:token'))
  .map((p) => p.slice(0, -':token'.length))

const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
const TOKEN_LINK = new RegExp(`(${TOKEN_PREFIXES.map(escapeRe).join('|')})[^\\s<>"']+`, 'g')
/** 32 random bytes in base64url (auth/tokens.ts) anywhere else in the text */
const BARE_TOKEN = /\b[A-Za-z0-9_-]{43}\b/g

/** The body with every secret link masked. */
export function maskTokens(text: string): string {
  return text.replace(TOKEN_LINK, (_m, prefix: string) => `${prefix}${MASKED_TOKEN}`).replace(BARE_TOKEN, MASKED_TOKEN)
}

const addressees = (envelopeTo: string) =>
  envelopeTo
    .split(',')
    .map((a) => a.trim().toLowerCase())
    .filter(Boolean)

/** The latest captured mails; bodies masked unless the viewer is the (only) addressee. */
export async function listCapturedMail(db: Db, viewer: { email: string }) {
  const rows = await listCapturedMailRows(db)
  const me = viewer.email.toLowerCase()
  return rows.map((m) => {
    const to = addressees(m.envelope_to)
    const own = to.length === 1 && to[0] === me
    return { ...m, body_text: own ? m.body_text : maskTokens(m.body_text), masked: !own }
  })
}
