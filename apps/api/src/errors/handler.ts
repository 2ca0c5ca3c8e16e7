import type { ErrorRequestHandler } from 'express'
import { AppError } from './app-error.js'
import { fromPostgres } from './postgres.js'

/** Turns every error into `{ error: { code, message, details } }`; unknown errors are logged and answered generically. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, details: err.details ?? null } })
    return
  }
  // body-parser and multer errors carry a status or a code of their own
  const e = err as { type?: string; status?: number; code?: string; message?: string }
  if (e.type === 'entity.too.large') {
    res
      .status(413)
      .json({ error: { code: 'payload_too_large', message: 'The request body is too large.', details: null } })
    return
  }
  if (e.type === 'entity.parse.failed') {
    res
      .status(400)
      .json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON.', details: null } })
    return
  }
  if (e.code === 'LIMIT_FILE_SIZE') {
    res
      .status(413)
      .json({ error: { code: 'file_too_large', message: 'The file is larger than the upload limit.', details: null } })
    return
  }
  if (e.code === 'LIMIT_UNEXPECTED_FILE') {
    res
      .status(400)
      .json({ error: { code: 'unexpected_file', message: 'Send one file in the form field "file".', details: null } })
    return
  }
  const pgError = fromPostgres(err)
  if (pgError) {
    req.log?.warn({ err }, 'database refused a write')
    res
      .status(pgError.status)
      .json({ error: { code: pgError.code, message: pgError.message, details: pgError.details ?? null } })
    return
  }
  req.log?.error({ err }, 'unhandled error')
  res.status(500).json({
    error: {
      code: 'internal',
      message: 'Something went wrong on the server. The error has been logged.',
      details: null,
    },
  })
}
