/** Who may see and change lab data: the rules shared by every lab service. */
import type { SessionUser } from '../auth/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import type { DataSetState } from '../db/lab-tables.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'

/** Roles that read every data set whatever its state; engineers read approved (and superseded) versions only. */
const FULL_READERS = ['analyst', 'lead_chemist', 'reviewer', 'admin'] as const

export const PUBLISHED_STATES: readonly DataSetState[] = ['approved', 'superseded']
/** States in which points, uploads and metadata may still change. */
export const EDITABLE_STATES: readonly DataSetState[] = ['draft', 'returned']
/** States in which fits and consistency tests may be run and a recommended fit chosen. */
export const FITTABLE_STATES: readonly DataSetState[] = ['draft', 'returned', 'submitted']

export function readsEverything(user: SessionUser): boolean {
  return user.roles.some((r) => (FULL_READERS as readonly string[]).includes(r))
}

/** The data set, or 404 when it does not exist or the user may not know it exists (engineers, unapproved). */
export function visibleOrNotFound<T extends DataSetRecord>(user: SessionUser, d: T | undefined): T {
  if (!d || (!readsEverything(user) && !PUBLISHED_STATES.includes(d.state)))
    throw notFound('There is no such data set.')
  return d
}

/** Refuse a change unless the data set is in one of the states. */
export function requireState(d: DataSetRecord, states: readonly DataSetState[], action: string): void {
  if (!states.includes(d.state)) {
    throw conflict(`This data set is ${d.state}; ${action} is possible only when it is ${states.join(' or ')}.`, {
      state: d.state,
    })
  }
}

/** The optimistic-concurrency refusal: someone else saved first. */
export function staleWrite(expected: number, current: number): AppError {
  return new AppError(
    409,
    'stale_write',
    `This data set was changed by someone else since you loaded it (you had version ${expected}, it is now ${current}). Reload it and apply your change again.`,
    { expectedRowVersion: expected, currentRowVersion: current },
  )
}

/** Convert a PostgreSQL constraint violation into a user-facing error, or rethrow. */
export function translateDbError(err: unknown, messages: Record<string, string>): never {
  const e = err as { code?: string; constraint?: string }
  if (e.code === '23505' || e.code === '23514' || e.code === '23503') {
    const message = (e.constraint && messages[e.constraint]) ?? messages[e.code] ?? null
    if (message) throw conflict(message, { constraint: e.constraint ?? null })
  }
  if (e.code === 'P0002') throw conflict('Approved data cannot be changed; revise it to create a new version.')
  throw err
}

/** Limit/offset from page and pageSize. */
export function pageWindow(page: number, pageSize: number): { limit: number; offset: number } {
  return { limit: pageSize, offset: (page - 1) * pageSize }
}

/** Run an engine call; a ThermoError (bad input, no solution) becomes a 422 with the engine's own words. */
export function thermo<T>(what: string, fn: () => T): T {
  try {
    return fn()
  } catch (err) {
    const e = err as { name?: string; code?: string; message?: string }
    if (e.name === 'ThermoError')
      throw new AppError(422, 'computation_refused', `${what}: ${e.message}`, { thermoCode: e.code ?? null })
    throw err
  }
}
