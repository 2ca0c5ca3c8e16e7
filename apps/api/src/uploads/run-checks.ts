/**
 * Check standards in the run sheet: injections of a mixture of known composition, run beside the samples to see
 * whether the GC method and its calibration still read true. They are rows with phase `check`; the standard's
 * known mole fraction of component 1 goes in the optional column `check_x1` on at least one of its rows (repeats
 * must agree). Temperature and pressure cells are not read on these rows. They give no point: the server computes
 * their x1 with the run's calibration and keeps the deviation for the GC method's control chart.
 */
import type { ParsedInjection } from './calibration-file.js'
import { injectionCell } from './calibration-file.js'
import { parseNumber } from './csv-table.js'
import { uploadError, type UploadProblem } from './problems.js'
import type { Cells } from './run-file.js'
import { runAreaCell } from './run-pure.js'

/** Phase words that mark a check-standard row. */
export const CHECK_PHASES = new Set(['check', 'check standard', 'check-standard'])

/** One check standard of the file: its known x1 and its injections. */
export interface RunCheck {
  label: string
  firstRow: number
  rows: number[]
  /** mole fraction of component 1 as prepared */
  knownX1: number
  injections: ParsedInjection[]
}

interface CheckDraft {
  label: string
  rows: number[]
  known?: { value: number; raw: string; line: number }
  injections: ParsedInjection[]
}

/** Read one check-standard row into its standard. */
export function readCheckRow(
  cell: Cells,
  line: number,
  dc: boolean,
  checks: Map<string, CheckDraft>,
  problems: UploadProblem[],
): void {
  const label = cell('sample')
  let c = checks.get(label)
  if (!c) {
    c = { label, rows: [], injections: [] }
    checks.set(label, c)
  }
  c.rows.push(line)
  const raw = cell('check_x1')
  if (raw !== '') {
    const v = parseNumber(raw, dc)
    if (v === null || !(v > 0 && v < 1)) {
      problems.push(
        uploadError(line, 'check_x1', raw, 'The check standard’s x1 must be a mole fraction between 0 and 1.'),
      )
    } else if (c.known && c.known.value !== v) {
      problems.push(
        uploadError(line, 'check_x1', raw, `Check standard ${label} has a different x1 on line ${c.known.line}.`),
      )
    } else if (!c.known) {
      c.known = { value: v, raw, line }
    }
  }
  const injection = injectionCell(cell, line, dc, problems)
  const area1 = runAreaCell(cell, 'area_1', line, dc, problems)
  const area2 = runAreaCell(cell, 'area_2', line, dc, problems)
  if (injection === null || area1 === null || area2 === null) return
  if (area1 === 0 || area2 === 0) {
    problems.push(
      uploadError(
        line,
        area1 === 0 ? 'area_1' : 'area_2',
        cell(area1 === 0 ? 'area_1' : 'area_2'),
        'A check standard is a mixture: both peak areas must be greater than zero.',
      ),
    )
    return
  }
  if (c.injections.some((i) => i.injection === injection)) {
    problems.push(
      uploadError(
        line,
        'injection',
        cell('injection'),
        `Injection ${injection} of check standard ${label} appears twice.`,
      ),
    )
    return
  }
  c.injections.push({ injection, area1, area2, row: line })
}

/** The finished check standards; one without a known x1 is an error at its first line. */
export function finishChecks(
  checks: Map<string, CheckDraft>,
  sampleLabels: Set<string>,
  problems: UploadProblem[],
): RunCheck[] {
  const out: RunCheck[] = []
  for (const c of checks.values()) {
    const first = c.rows[0]
    if (sampleLabels.has(c.label)) {
      problems.push(
        uploadError(
          first,
          'sample',
          c.label,
          `${c.label} is used both for a check standard and for an equilibrium sample; give each its own label.`,
        ),
      )
      continue
    }
    if (!c.known) {
      problems.push(uploadError(first, 'check_x1', null, `Check standard ${c.label} has no known x1 (check_x1).`))
      continue
    }
    if (c.injections.length === 0) continue
    out.push({ label: c.label, firstRow: first, rows: c.rows, knownX1: c.known.value, injections: c.injections })
  }
  return out
}
