/** multer for the lab uploads: one CSV file in the field "file", in memory, size limit from config. */
import type { RequestHandler } from 'express'
import multer from 'multer'
import { AppError, badRequest } from '../errors/index.js'
import type { UploadedFile } from '../services/upload-files.js'

// Browsers on Windows often label .csv as application/vnd.ms-excel (common practice, no source).
const CSV_TYPES = new Set(['text/csv', 'application/vnd.ms-excel'])

/** Accept a single `.csv` file sent as text/csv; anything else is refused before it is read. */
export const csvUpload: RequestHandler = (req, res, next) => {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: req.ctx.config.uploadMaxBytes, files: 1, fields: 20 },
    fileFilter: (_req, file, cb) => {
      if (!/\.csv$/i.test(file.originalname) || !CSV_TYPES.has(file.mimetype.toLowerCase())) {
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
  upload(req, res, next)
}

/** The received file, or a 400 when none was sent. */
export function receivedFile(req: Parameters<RequestHandler>[0]): UploadedFile {
  const f = req.file
  if (!f) throw badRequest('Send one .csv file in the form field "file".')
  return { originalName: f.originalname, contentType: f.mimetype, content: f.buffer }
}
