/**
 * Pure-component samples of the run sheet: a boiling point of one component alone. The absent component's peak
 * area is 0 or empty on every row of the sample; the sample then gives x1 = y1 = 1 (only component 1) or 0 (only
 * component 2) exactly, without the calibration. Its vapour rows may be left out (a pure liquid boils to the
 * same vapour). A zero or empty area in a sample with both peaks elsewhere is an error, not a pure sample.
 */
import type { ParsedInjection } from './calibration-file.js'
import { numberCell } from './calibration-file.js'
import { uploadError, type UploadProblem } from './problems.js'
import type { Cells, Draft } from './run-file.js'

/** A peak area of the run sheet: a number ≥ 0, or empty (= 0, the component gave no peak). Null when unreadable. */
export function runAreaCell(
  cell: Cells,
  name: string,
  line: number,
  decimalComma: boolean,
  problems: UploadProblem[],
): number | null {
  if (cell(name) === '') return 0
  const n = numberCell(cell, name, line, decimalComma, problems)
  if (n !== null && n < 0) {
    problems.push(uploadError(line, name, cell(name), 'Peak area cannot be negative.'))
    return null
  }
  return n
}

/** Which components a row shows: 1 or 2 alone, or both. */
type Shows = 1 | 2 | 'both'
const showsOf = (i: ParsedInjection): Shows => (i.area2 === 0 ? 1 : i.area1 === 0 ? 2 : 'both')
const SHOWS_WORDS: Record<string, string> = { 1: 'only component 1', 2: 'only component 2', both: 'both components' }

/** Both areas of one row zero or empty: nothing was injected or detected. An error at area_1. */
export function bothAreasMissing(line: number, raw: string, problems: UploadProblem[]): void {
  problems.push(
    uploadError(line, 'area_1', raw, 'Both peak areas are zero or empty; a sample holds at least one component.'),
  )
}

/**
 * The pure component a sample is of (1 or 2), `null` for a mixture, or `false` after an error (rows disagree,
 * or a pure sample marked as two-layered). Every injection of every phase must show the same component(s).
 */
export function pureComponentOf(s: Draft, problems: UploadProblem[]): 1 | 2 | null | false {
  const all = [...s.liquid, ...s.vapour, ...s.upper, ...s.lower].sort((a, b) => a.row - b.row)
  if (all.length === 0) return null
  const first = all[0]
  const firstShows = showsOf(first)
  const other = all.find((i) => showsOf(i) !== firstShows)
  if (other) {
    const [a, b] = firstShows === 'both' ? [other, first] : [first, other]
    problems.push(
      uploadError(
        a.row,
        a.area1 === 0 ? 'area_1' : 'area_2',
        '0',
        `Sample ${s.label}: line ${a.row} shows ${SHOWS_WORDS[showsOf(a)]} but line ${b.row} shows ${SHOWS_WORDS[showsOf(b)]}; a pure-component sample has the absent component's area 0 or empty on every row.`,
      ),
    )
    return false
  }
  if (firstShows === 'both') return null
  if (s.layers?.value === 2) {
    problems.push(
      uploadError(
        s.layers.line,
        'layers',
        s.layers.raw,
        `Sample ${s.label} is pure component ${firstShows}; it cannot have two liquid layers.`,
      ),
    )
    return false
  }
  return firstShows
}
