import type { ErrorRequestHandler } from 'express'
import { AppError } from './app-error.js'
import { fromPostgres } from './postgres.js'
import { databaseUnavailable, isDatabaseUnavailable } from './unavailable.js'

type Res = Parameters<ErrorRequestHandler>[2]

/** Every error answer: `{ error: { code, message, details }, requestId }` (requestId also in the X-Request-Id header). */
function send(res: Res, status: number, code: string, message: string, details: unknown = null): void {
  const requestId = (res.req as { id?: unknown }).id
  res.status(status).json({ error: { code, message, details: details ?? null }, requestId: requestId ?? null })
}

/** Turns every error into `{ error: { code, message, details }, requestId }`; unknown errors are logged and answered generically. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof AppError) {
    if (err.status === 503) res.set('Retry-After', '5')
    send(res, err.status, err.code, err.message, err.details)
    return
  }
  if (isDatabaseUnavailable(err)) {
    req.log?.warn(
      { err: { message: (err as Error).message, code: (err as { code?: unknown }).code } },
      'database unavailable',
    )
    const e = databaseUnavailable()
    res.set('Retry-After', '5')
    send(res, e.status, e.code, e.message)
    return
  }
  // body-parser and multer errors carry a status or a code of their own
  const e = err as { type?: string; status?: number; code?: string; message?: string }
  if (e.type === 'entity.too.large') {
    send(res, 413, 'payload_too_large', 'The request body is too large.')
    return
  }
  if (e.type === 'entity.parse.failed') {
    send(res, 400, 'malformed_json', 'The request body is not valid JSON.')
    return
  }
  if (e.code === 'LIMIT_FILE_SIZE') {
    send(res, 413, 'file_too_large', 'The file is larger than the upload limit.')
    return
  }
  if (e.code === 'LIMIT_UNEXPECTED_FILE') {
    send(res, 400, 'unexpected_file', 'Send one file in the form field "file".')
    return
  }
  const pgError = fromPostgres(err)
  if (pgError) {
    req.log?.warn({ err }, 'database refused a write')
    send(res, pgError.status, pgError.code, pgError.message, pgError.details)
    return
  }
  req.log?.error({ err }, 'unhandled error')
  send(res, 500, 'internal', 'Something went wrong on the server. The error has been logged.')
}
