import { AppError } from './app-error.js'

const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND'])
const MESSAGES = [
  'Connection terminated',
  'timeout exceeded when trying to connect',
  'Client has encountered a connection error',
  'Connection ended unexpectedly',
  'the database system is',
]

/**
 * True when an error means "the database cannot be reached right now" (restarting, shut down, connection dropped),
 * as opposed to a query the database refused. Such requests answer 503 and change nothing (every write runs in a
 * transaction that PostgreSQL rolls back when its connection goes).
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: unknown; message?: unknown } | null
  if (!e || typeof e !== 'object') return false
  const code = typeof e.code === 'string' ? e.code : ''
  // 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now, class 08 connection exceptions
  if (code === '57P01' || code === '57P02' || code === '57P03' || /^08[0-9A-Z]{3}$/.test(code)) return true
  if (NETWORK_CODES.has(code)) return true
  const message = typeof e.message === 'string' ? e.message : ''
  if (MESSAGES.some((m) => message.includes(m))) return true
  const inner = (err as { errors?: unknown[]; cause?: unknown }).errors ?? []
  return (
    inner.some(isDatabaseUnavailable) ||
    (!!(err as { cause?: unknown }).cause && isDatabaseUnavailable((err as { cause?: unknown }).cause))
  )
}

export function databaseUnavailable(): AppError {
  return new AppError(
    503,
    'database_unavailable',
    'The database cannot be reached right now. Nothing was changed; try again in a few seconds.',
  )
}
