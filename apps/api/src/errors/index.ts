import type { ZodError } from 'zod'
import { AppError } from './app-error.js'

export { AppError } from './app-error.js'

export const badRequest = (message: string, details?: unknown) => new AppError(400, 'bad_request', message, details)
export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthorized', message)
export const forbidden = (message = 'Your role does not allow this.') => new AppError(403, 'forbidden', message)
export const notFound = (message = 'Not found.') => new AppError(404, 'not_found', message)
export const conflict = (message: string, details?: unknown) => new AppError(409, 'conflict', message, details)

/** A zod failure as a 422 that lists every bad field. */
export function validationError(error: ZodError, where = 'request'): AppError {
  const details = error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))
  const fields = [...new Set(details.map((d) => d.path || where))]
  return new AppError(422, 'validation_failed', `Some fields are not valid: ${fields.join(', ')}.`, details)
}
