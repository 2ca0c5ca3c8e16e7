/**
 * One thing wrong with an uploaded file, located so the analyst can find it in the spreadsheet:
 * `row` is the line number in the file (the header is line 1), `column` the header as written.
 * Errors block a commit; warnings must be acknowledged before committing.
 */
export interface UploadProblem {
  row: number | null
  column: string | null
  value: string | null
  message: string
  severity: 'error' | 'warning'
}

/** Shorthand for an error-level problem. */
export function uploadError(
  row: number | null,
  column: string | null,
  value: string | null,
  message: string,
): UploadProblem {
  return { row, column, value, message, severity: 'error' }
}

/** Shorthand for a warning-level problem. */
export function uploadWarning(
  row: number | null,
  column: string | null,
  value: string | null,
  message: string,
): UploadProblem {
  return { row, column, value, message, severity: 'warning' }
}

/** True when any problem is an error (a commit would be refused). */
export function hasErrors(problems: readonly UploadProblem[]): boolean {
  return problems.some((p) => p.severity === 'error')
}
