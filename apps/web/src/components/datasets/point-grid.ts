import { directPointSchema, type DirectPoint } from '@ebullio/schemas'
import { PA_PER, type PressureChoice } from '../../stores/preferences'

/** One row of the point grid as typed (text), before conversion to SI. */
export interface GridRow {
  sample: string
  t: string
  p: string
  x1: string
  y1: string
  ux1: string
  uy1: string
  /** σP in the grid's pressure unit (optional) */
  up?: string
}

export const emptyRow = (n: number): GridRow => ({
  sample: `P${n}`,
  t: '',
  p: '',
  x1: '',
  y1: '',
  ux1: '',
  uy1: '',
  up: '',
})

/** A problem in the grid: 1-based row and the column as headed on screen. */
export interface GridProblem {
  row: number
  column: string
  message: string
}

/** Accepts "1,5" as 1.5 too (a decimal comma typed by habit). */
function num(s: string): number | null {
  const t = s.trim().replace(',', '.')
  if (t === '') return null
  const n = Number(t)
  return Number.isFinite(n) ? n : NaN
}

/**
 * Rows → points in K and Pa, checked with the API's own schema; every bad cell named by row and column.
 * Blank rows are skipped. Uncertainties left empty take `defaultU`.
 */
export function gridToPoints(
  rows: GridRow[],
  o: { tUnit: 'C' | 'K'; pUnit: PressureChoice; defaultU: number; withY: boolean },
): { points: DirectPoint[]; problems: GridProblem[] } {
  const points: DirectPoint[] = []
  const problems: GridProblem[] = []
  rows.forEach((r, i) => {
    if (Object.entries(r).every(([k, v]) => k === 'sample' || (v ?? '').trim() === '')) return
    const row = i + 1
    const bad = (column: string, message: string) => problems.push({ row, column, message })
    const cells = {
      t: num(r.t),
      p: num(r.p),
      x1: num(r.x1),
      y1: num(r.y1),
      ux1: num(r.ux1),
      uy1: num(r.uy1),
      up: num(r.up ?? ''),
    }
    for (const [k, v] of Object.entries(cells))
      if (Number.isNaN(v)) bad(k, `"${r[k as keyof GridRow]}" is not a number.`)
    if (cells.t === null) bad('t', 'The temperature is missing.')
    if (cells.p === null) bad('p', 'The pressure is missing.')
    if (cells.x1 === null) bad('x1', 'x1 is missing.')
    if (o.withY && cells.y1 === null) bad('y1', 'y1 is missing.')
    if (problems.some((p) => p.row === row)) return
    const candidate = {
      sampleLabel: r.sample.trim(),
      temperatureK: o.tUnit === 'C' ? cells.t! + 273.15 : cells.t!,
      pressurePa: cells.p! * PA_PER[o.pUnit],
      x1: cells.x1!,
      y1: o.withY ? cells.y1 : null,
      x1Uncertainty: cells.ux1 ?? o.defaultU,
      y1Uncertainty: o.withY ? (cells.uy1 ?? o.defaultU) : null,
      pressureUncertaintyPa: cells.up === null ? null : cells.up * PA_PER[o.pUnit],
    }
    const parsed = directPointSchema.safeParse(candidate)
    if (!parsed.success) {
      const column: Record<string, string> = {
        sampleLabel: 'sample',
        temperatureK: 't',
        pressurePa: 'p',
        x1Uncertainty: 'ux1',
        y1Uncertainty: 'uy1',
        pressureUncertaintyPa: 'up',
      }
      for (const issue of parsed.error.issues) {
        const k = String(issue.path[0])
        bad(column[k] ?? k, issue.message)
      }
      return
    }
    points.push(parsed.data)
  })
  return { points, problems }
}

/** Rows pasted from a spreadsheet (tab- or semicolon-separated): sample, t, p, x1, y1, u(x1), u(y1), σP. */
export function rowsFromPaste(text: string): GridRow[] {
  return text
    .split(/\r?\n/)
    .filter((l) => l.trim())
    .map((l) => {
      const c = l.split(/\t|;/).map((s) => s.trim())
      return {
        sample: c[0] ?? '',
        t: c[1] ?? '',
        p: c[2] ?? '',
        x1: c[3] ?? '',
        y1: c[4] ?? '',
        ux1: c[5] ?? '',
        uy1: c[6] ?? '',
        up: c[7] ?? '',
      }
    })
}
