import type { UploadProblemDto } from '@ebullio/schemas'

/** One thing wrong with an uploaded file, located by line and column (the shared wire type). */
export type UploadProblem = UploadProblemDto

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
