import { AppError } from './app-error.js'

interface PgError {
  code?: string
  constraint?: string
  message?: string
}

/**
 * A rule the database enforces (constraint or trigger) that a service did not check first,
 * as a user-facing error instead of a generic 500. Trigger messages (RAISE EXCEPTION) are written for users.
 */
export function fromPostgres(err: unknown): AppError | null {
  const e = err as PgError
  if (!e || typeof e.code !== 'string' || !/^[0-9A-Z]{5}$/.test(e.code)) return null
  const where = e.constraint ? { constraint: e.constraint } : undefined
  switch (e.code) {
    case '23505':
      return new AppError(409, 'duplicate', 'This would duplicate an existing record.', where)
    case '23503':
      return new AppError(
        409,
        'reference_conflict',
        'This refers to a record that does not exist, or is still referred to by another record.',
        where,
      )
    case '23514':
    case '23502':
      return new AppError(
        422,
        'rule_violated',
        'A value breaks a rule of the database (missing, or out of its allowed range).',
        where,
      )
    case 'P0001':
      return new AppError(409, 'refused_by_database', e.message ?? 'The database refused this change.')
    case '22P02':
    case '22003':
      return new AppError(422, 'bad_value', 'A value has the wrong form or is out of range.')
    default:
      return null
  }
}
