/** multer for the lab uploads: one CSV file in the field "file", in memory, size limit from config. */
import type { RequestHandler } from 'express'
import multer from 'multer'
import { AppError, badRequest } from '../errors/index.js'
import { findInvalidText, invalidTextError } from '../middleware/invalid-text.js'
import type { UploadedFile } from '../services/upload-files.js'

// Browsers on Windows often label .csv as application/vnd.ms-excel (common practice, no source).
const CSV_TYPES = new Set(['text/csv', 'application/vnd.ms-excel'])

/** Accept a single `.csv` file sent as text/csv; anything else is refused before it is read. */
export const csvUpload: RequestHandler = (req, res, next) => {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: req.ctx.config.uploadMaxBytes,
      files: 1,
      fields: 20,
      parts: 21,
      fieldNameSize: 100,
      fieldSize: 1000,
    },
    fileFilter: (_req, file, cb) => {
      if (file.originalname.length > MAX_NAME) {
        cb(new AppError(400, 'bad_upload', `The file name is longer than ${MAX_NAME} characters; rename the file.`))
      } else if (findInvalidText(file.originalname, 'file name').length > 0) {
        cb(new AppError(400, 'invalid_text', 'The file name is not valid text; rename the file.'))
      } else if (!/\.csv$/i.test(file.originalname) || !CSV_TYPES.has(file.mimetype.toLowerCase())) {
        cb(
          new AppError(
            415,
            'unsupported_file',
            `Only .csv files sent as text/csv are accepted; got "${file.originalname}" (${file.mimetype}).`,
          ),
        )
      } else cb(null, true)
    },
  }).single('file')
  upload(req, res, (err: unknown) => {
    if (err) return next(uploadFailure(err))
    const found = findInvalidText(req.body, 'body')
    next(found.length > 0 ? invalidTextError(found) : undefined)
  })
}

const MAX_NAME = 255

/** What multer and busboy refuse, in words (a malformed form is the sender's fault: 400, never 500). */
const MULTER_MESSAGES: Record<string, [number, string, string]> = {
  LIMIT_FILE_SIZE: [413, 'file_too_large', 'The file is larger than the upload limit.'],
  LIMIT_FILE_COUNT: [400, 'too_many_files', 'Send exactly one file, in the form field "file".'],
  LIMIT_UNEXPECTED_FILE: [400, 'unexpected_file', 'Send one file in the form field "file".'],
  LIMIT_PART_COUNT: [400, 'too_many_fields', 'The form has too many parts; send one file and its few fields.'],
  LIMIT_FIELD_COUNT: [400, 'too_many_fields', 'The form has too many fields.'],
  LIMIT_FIELD_KEY: [400, 'bad_upload', 'A form field name is longer than 100 characters.'],
  LIMIT_FIELD_VALUE: [400, 'bad_upload', 'A form field value is longer than 1000 characters.'],
  MISSING_FIELD_NAME: [400, 'bad_upload', 'A form field has no name.'],
}

function uploadFailure(err: unknown): unknown {
  if (err instanceof AppError) return err
  const e = err as { code?: string; field?: string; message?: string }
  const known = e.code ? MULTER_MESSAGES[e.code] : undefined
  if (known) return new AppError(known[0], known[1], known[2], e.field ? { field: e.field } : undefined)
  return new AppError(400, 'bad_upload', `The upload could not be read as a form: ${e.message ?? 'malformed'}.`)
}

/** The received file, or a 400 when none was sent. */
export function receivedFile(req: Parameters<RequestHandler>[0]): UploadedFile {
  const f = req.file
  if (!f) throw badRequest('Send one .csv file in the form field "file".')
  return { originalName: f.originalname, contentType: f.mimetype, content: f.buffer }
}
