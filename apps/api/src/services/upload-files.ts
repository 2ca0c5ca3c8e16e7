/** What the upload services need of a received file, and the checks common to every upload. */
import { createHash } from 'node:crypto'
import { AppError } from '../errors/index.js'
import { hasErrors, type UploadProblem } from '../uploads/problems.js'

/** A file as received (multer's memory storage), before anything is stored. */
export interface UploadedFile {
  originalName: string
  contentType: string
  content: Buffer
}

export interface FileSummary {
  name: string
  sizeBytes: number
  sha256: string
}

export function summarizeFile(f: UploadedFile): FileSummary {
  return {
    name: f.originalName,
    sizeBytes: f.content.length,
    sha256: createHash('sha256').update(f.content).digest('hex'),
  }
}

export function countProblems(problems: UploadProblem[]): { errorCount: number; warningCount: number } {
  const errorCount = problems.filter((p) => p.severity === 'error').length
  return { errorCount, warningCount: problems.length - errorCount }
}

/** Refuse a commit with errors, or with warnings the analyst has not acknowledged. Nothing is stored then. */
export function assertCommittable(problems: UploadProblem[], acceptWarnings: boolean): void {
  if (hasErrors(problems)) {
    const { errorCount } = countProblems(problems)
    throw new AppError(
      422,
      'upload_rejected',
      `The file has ${errorCount} problem${errorCount === 1 ? '' : 's'}; nothing was stored. Fix the file and upload it again.`,
      problems,
    )
  }
  if (problems.length > 0 && !acceptWarnings) {
    throw new AppError(
      422,
      'warnings_not_accepted',
      `The file has ${problems.length} warning${problems.length === 1 ? '' : 's'}; confirm them (acceptWarnings) to store it.`,
      problems,
    )
  }
}
