/**
 * Text PostgreSQL cannot store (a NUL character) or that is not Unicode (a lone surrogate) is refused at the door
 * with 400 `invalid_text` naming the field, instead of reaching a query and ending as a 500.
 */
import type { RequestHandler } from 'express'
import { AppError } from '../errors/index.js'

export interface InvalidText {
  path: string
  message: string
}

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/

function problemOf(s: string): string | null {
  if (s.includes('\u0000')) return 'holds a NUL character (byte 0), which text may not contain'
  if (LONE_SURROGATE.test(s)) return 'holds a lone surrogate, which is not valid Unicode text'
  return null
}

/** Every string (and object key) in `value` that cannot be stored as text, by its path (`body.points.3.label`). */
export function findInvalidText(value: unknown, path: string, out: InvalidText[] = [], depth = 0): InvalidText[] {
  if (out.length >= 20 || depth > 32) return out
  if (typeof value === 'string') {
    const p = problemOf(value)
    if (p) out.push({ path, message: `${path} ${p}.` })
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => findInvalidText(v, `${path}.${i}`, out, depth + 1))
  } else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const kp = problemOf(k)
      if (kp) out.push({ path: `${path} (a field name)`, message: `A field name in ${path} ${kp}.` })
      else findInvalidText(v, `${path}.${k}`, out, depth + 1)
    }
  }
  return out
}

/** The 400 for what `findInvalidText` found. */
export function invalidTextError(found: InvalidText[]): AppError {
  const fields = found.map((f) => f.path)
  return new AppError(
    400,
    'invalid_text',
    `Not valid text: ${fields.join(', ')}. ${found[0].message.replace(/^\S+ /, 'It ')}`,
    found,
  )
}

/** Checks the route's path parameters (by name), query string and JSON body. */
export const rejectInvalidText: RequestHandler = (req, _res, next) => {
  const found = [
    ...findInvalidText(req.params, 'path'),
    ...findInvalidText(req.query, 'query'),
    ...findInvalidText(req.body, 'body'),
  ]
  next(found.length > 0 ? invalidTextError(found) : undefined)
}
