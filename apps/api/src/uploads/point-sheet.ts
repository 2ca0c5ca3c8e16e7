/**
 * The Ebullio point sheet (docs/csv-formats.md): one row per equilibrium state already reduced to
 * compositions — legacy spreadsheet series, another analytical method, literature tables. No peak areas.
 * Columns: sample, t, t_unit, p, p_unit, x1, y1, and optionally u_x1, u_y1 (standard uncertainties, k = 1) and
 * u_p (σP, in the row's p_unit). y1 is left empty in a T–x or P–x sheet and required otherwise. Every bad cell is reported by line and column.
 */
import { toKelvin, toPascal, type PressureUnitName, type TemperatureUnitName } from '@ebullio/thermo'
import { mapColumns, parseNumber, readCsvTable, type CsvFormat } from './csv-table.js'
import { uploadError, type UploadProblem } from './problems.js'
import { DEFAULT_BOUNDS } from './run-file.js'

export const POINT_SHEET_REQUIRED = ['sample', 't', 't_unit', 'p', 'p_unit', 'x1'] as const
export const POINT_SHEET_OPTIONAL = ['y1', 'u_x1', 'u_y1', 'u_p'] as const
/** Standard uncertainty given to x1 and y1 when the sheet has none (Ebullio's default; common practice, no source). */
export const DEFAULT_COMPOSITION_UNCERTAINTY = 0.005

const T_UNITS: Record<string, TemperatureUnitName> = { c: 'C', '°c': 'C', degc: 'C', k: 'K', f: 'F', '°f': 'F' }
const P_UNITS: Record<string, PressureUnitName> = Object.fromEntries(
  (['Pa', 'kPa', 'MPa', 'bar', 'mbar', 'atm', 'mmHg', 'torr', 'psi'] as PressureUnitName[]).map((u) => [
    u.toLowerCase(),
    u,
  ]),
)

/** One point read from the sheet, in SI, with its line in the file. */
export interface SheetPoint {
  row: number
  sampleLabel: string
  temperatureK: number
  pressurePa: number
  x1: number
  y1: number | null
  x1Uncertainty: number
  y1Uncertainty: number | null
  /** σP, Pa; null when the sheet gives none */
  pressureUncertaintyPa: number | null
}

export interface PointSheetParse {
  format: CsvFormat
  extraColumns: string[]
  points: SheetPoint[]
  problems: UploadProblem[]
}

/** Read a point sheet. Layouts 'tx' and 'px' expect no y1; 'txy' and 'pxy' need y1 on every row. */
export function parsePointSheet(content: Buffer | string, layout: 'txy' | 'tx' | 'pxy' | 'px'): PointSheetParse {
  const liquidOnly = layout === 'tx' || layout === 'px'
  const sheetName = layout === 'px' ? 'P–x' : 'T–x'
  const table = readCsvTable(content)
  const map = mapColumns(table.header, POINT_SHEET_REQUIRED, POINT_SHEET_OPTIONAL)
  const problems: UploadProblem[] = [...table.problems, ...map.problems]
  const points: SheetPoint[] = []
  if (problems.length) return { format: table.format, extraColumns: map.extraColumns, points, problems }
  if (!liquidOnly && !map.columns.y1)
    problems.push(
      uploadError(1, 'y1', null, 'Required column "y1" is missing (only a T–x or P–x sheet leaves it out).'),
    )
  const seen = new Map<string, number>()
  for (const r of table.rows) {
    const cell = (name: string) => {
      const c = map.columns[name]
      return c ? (r.cells[c.index] ?? '').trim() : ''
    }
    const header = (name: string) => map.columns[name]?.header ?? name
    const bad = (name: string, message: string) => problems.push(uploadError(r.line, header(name), cell(name), message))
    const num = (name: string): number | null => {
      const v = cell(name)
      if (v === '') return null
      const n = parseNumber(v, table.format.decimalComma)
      if (n === null) bad(name, `"${v}" is not a number.`)
      return n
    }
    const before = problems.length
    const label = cell('sample')
    if (!label) bad('sample', 'Give each point a sample label.')
    else if (seen.has(label)) bad('sample', `Sample "${label}" appears again (first on line ${seen.get(label)}).`)
    else seen.set(label, r.line)
    const tUnit = T_UNITS[cell('t_unit').toLowerCase()]
    if (!tUnit) bad('t_unit', `Unknown temperature unit "${cell('t_unit')}"; use C, K or F.`)
    const pUnit = P_UNITS[cell('p_unit').toLowerCase()]
    if (!pUnit)
      bad('p_unit', `Unknown pressure unit "${cell('p_unit')}"; use Pa, kPa, MPa, bar, mbar, atm, mmHg, torr or psi.`)
    const t = num('t')
    const p = num('p')
    if (cell('t') === '') bad('t', 'The temperature is missing.')
    if (cell('p') === '') bad('p', 'The pressure is missing.')
    const x1 = num('x1')
    if (cell('x1') === '') bad('x1', 'x1 is missing.')
    else if (x1 !== null && (x1 < 0 || x1 > 1)) bad('x1', 'x1 must be between 0 and 1.')
    const y1 = num('y1')
    if (liquidOnly && cell('y1') !== '') bad('y1', `A ${sheetName} sheet has no vapour composition; leave y1 empty.`)
    if (!liquidOnly && map.columns.y1 && cell('y1') === '') bad('y1', 'y1 is missing.')
    else if (y1 !== null && (y1 < 0 || y1 > 1)) bad('y1', 'y1 must be between 0 and 1.')
    const ux = num('u_x1')
    const uy = num('u_y1')
    const up = num('u_p')
    if (up !== null && up <= 0) bad('u_p', 'u_p must be positive (in the row’s pressure unit).')
    if (ux !== null && (ux < 0 || ux > 0.5)) bad('u_x1', 'u_x1 must be between 0 and 0.5.')
    if (uy !== null && (uy < 0 || uy > 0.5)) bad('u_y1', 'u_y1 must be between 0 and 0.5.')
    const T = t !== null && tUnit ? toKelvin(t, tUnit) : null
    const P = p !== null && pUnit ? toPascal(p, pUnit) : null
    const [tLo, tHi] = DEFAULT_BOUNDS.temperatureK
    const [pLo, pHi] = DEFAULT_BOUNDS.pressurePa
    if (T !== null && (T < tLo || T > tHi)) bad('t', `${cell('t')} ${tUnit} is outside ${tLo}–${tHi} K.`)
    if (P !== null && (P < pLo || P > pHi))
      bad('p', `${cell('p')} ${pUnit} is outside ${pLo / 1000}–${pHi / 1000} kPa.`)
    if (problems.length > before || T === null || P === null || x1 === null) continue
    const yValue = liquidOnly ? null : y1
    const sigmaP = up !== null && up > 0 && pUnit ? toPascal(up, pUnit) : null
    points.push({
      row: r.line,
      sampleLabel: label,
      temperatureK: T,
      pressurePa: P,
      x1,
      y1: yValue,
      x1Uncertainty: ux ?? DEFAULT_COMPOSITION_UNCERTAINTY,
      y1Uncertainty: yValue === null ? null : (uy ?? DEFAULT_COMPOSITION_UNCERTAINTY),
      pressureUncertaintyPa: sigmaP,
    })
  }
  if (!table.rows.length && !problems.length) problems.push(uploadError(null, null, null, 'The sheet has no points.'))
  return { format: table.format, extraColumns: map.extraColumns, points, problems }
}
