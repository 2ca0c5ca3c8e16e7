/**
 * Keeps upload previews bounded whatever the file holds: one page of the parsed rows (and of the samples or
 * standards), the first problems with the full counts. The analyst pages through by sending the file again with
 * another `page`; counts and the commit decision always cover the whole file.
 */
import type { UploadProblem } from '../uploads/problems.js'

export const PREVIEW_PAGE_SIZE = 200
export const PREVIEW_PAGE_SIZE_MAX = 1000
/** problems listed in one answer; errorCount and warningCount still count all of them */
export const PREVIEW_PROBLEMS_MAX = 500

export interface PageRequest {
  /** 1-based */
  page: number
  pageSize: number
}

export const FIRST_PAGE: PageRequest = { page: 1, pageSize: PREVIEW_PAGE_SIZE }

export interface Paging extends PageRequest {
  pages: number
  rowCount: number
  problemCount: number
}

/** Items of the requested page. */
export function pageItems<T>(items: readonly T[], p: PageRequest): T[] {
  return items.slice((p.page - 1) * p.pageSize, p.page * p.pageSize)
}

/** Paging facts for a preview of `rowCount` rows and `itemCount` samples or standards. */
export function paging(p: PageRequest, rowCount: number, itemCount: number, problemCount: number): Paging {
  const pages = Math.max(1, Math.ceil(Math.max(rowCount, itemCount) / p.pageSize))
  return { ...p, pages, rowCount, problemCount }
}

/** The problems shown: errors first so a cap never hides what blocks the commit, then in file order. */
export function shownProblems(problems: readonly UploadProblem[]): UploadProblem[] {
  if (problems.length <= PREVIEW_PROBLEMS_MAX) return [...problems]
  const errors = problems.filter((p) => p.severity === 'error')
  const warnings = problems.filter((p) => p.severity !== 'error')
  return [...errors, ...warnings].slice(0, PREVIEW_PROBLEMS_MAX).sort((a, b) => (a.row ?? 0) - (b.row ?? 0))
}
