/**
 * The Ebullio calibration sheet (docs/csv-formats.md): one row per injection of a
 * gravimetric standard. Columns: standard, basis (mole | mass, optional, default mole),
 * fraction_1, injection, area_1, area_2.
 */
import {
  DEFAULT_READ_LIMITS,
  mapColumns,
  parseNumber,
  readCsvTable,
  readCsvTableAsync,
  type ColumnMapping,
  type CsvFormat,
  type CsvTable,
  type ReadLimits,
} from './csv-table.js'
import { uploadError, type UploadProblem } from './problems.js'

export const CALIBRATION_REQUIRED = ['standard', 'fraction_1', 'injection', 'area_1', 'area_2'] as const
export const CALIBRATION_OPTIONAL = ['basis'] as const

/** One replicate injection with its file line. */
export interface ParsedInjection {
  injection: number
  area1: number
  area2: number
  row: number
}

/** A calibration standard gathered from its rows. */
export interface ParsedStandard {
  label: string
  basis: 'mole' | 'mass'
  /** mole or mass fraction of component 1, as given */
  fraction1: number
  injections: ParsedInjection[]
  rows: number[]
}

export interface CalibrationFileParse {
  format: CsvFormat
  mapping: Record<string, string>
  extraColumns: string[]
  rows: { line: number; cells: string[] }[]
  header: string[]
  standards: ParsedStandard[]
  problems: UploadProblem[]
}

type Cells = (name: string) => string

/** Read the numeric cell `name`; report a problem and return null when it is not a number. */
export function numberCell(
  cell: Cells,
  name: string,
  line: number,
  decimalComma: boolean,
  problems: UploadProblem[],
): number | null {
  const raw = cell(name)
  if (raw === '') {
    problems.push(uploadError(line, name, raw, 'Value is missing.'))
    return null
  }
  const n = parseNumber(raw, decimalComma)
  if (n === null) problems.push(uploadError(line, name, raw, 'Not a number.'))
  return n
}

/** Read the peak area `name`, which must be a number above zero. */
export function areaCell(
  cell: Cells,
  name: string,
  line: number,
  decimalComma: boolean,
  problems: UploadProblem[],
): number | null {
  const n = numberCell(cell, name, line, decimalComma, problems)
  if (n !== null && n <= 0) {
    problems.push(uploadError(line, name, cell(name), 'Peak area must be greater than zero.'))
    return null
  }
  return n
}

/** Read the replicate number, a whole number ≥ 1. */
export function injectionCell(
  cell: Cells,
  line: number,
  decimalComma: boolean,
  problems: UploadProblem[],
): number | null {
  const n = numberCell(cell, 'injection', line, decimalComma, problems)
  if (n !== null && (!Number.isInteger(n) || n < 1)) {
    problems.push(
      uploadError(line, 'injection', cell('injection'), 'Injection number must be a whole number of at least 1.'),
    )
    return null
  }
  return n
}

/** Parse a calibration sheet. Pure: no database, no thermo; every problem is listed. */
export function parseCalibrationFile(
  content: Buffer | string,
  limits: ReadLimits = DEFAULT_READ_LIMITS,
): CalibrationFileParse {
  return parseCalibrationTable(readCsvTable(content, limits))
}

/** `parseCalibrationFile` for the server: the CSV is read in slices so a large file does not hold the event loop. */
export async function parseCalibrationFileAsync(
  content: Buffer | string,
  limits: ReadLimits = DEFAULT_READ_LIMITS,
): Promise<CalibrationFileParse> {
  return parseCalibrationTable(await readCsvTableAsync(content, limits))
}

/** The standards of a table already read; an unreadable file keeps its one problem and nothing else. */
export function parseCalibrationTable(table: CsvTable): CalibrationFileParse {
  const map: ColumnMapping =
    table.problems.length > 0
      ? { columns: {}, extraColumns: [], problems: [] }
      : mapColumns(table.header, CALIBRATION_REQUIRED, CALIBRATION_OPTIONAL)
  const problems = [...table.problems, ...map.problems]
  const base = {
    format: table.format,
    mapping: Object.fromEntries(Object.entries(map.columns).map(([k, v]) => [k, v.header])),
    extraColumns: map.extraColumns,
    rows: table.rows,
    header: table.header,
  }
  if (problems.length > 0) return { ...base, standards: [], problems }

  const byLabel = new Map<string, ParsedStandard>()
  const { decimalComma } = table.format
  for (const row of table.rows) {
    const cell: Cells = (name) => {
      const col = map.columns[name]
      return col ? (row.cells[col.index] ?? '').trim() : ''
    }
    const label = cell('standard')
    if (label === '') {
      problems.push(uploadError(row.line, 'standard', '', 'Standard id is missing.'))
      continue
    }
    const basisRaw = cell('basis').toLowerCase() || 'mole'
    if (basisRaw !== 'mole' && basisRaw !== 'mass') {
      problems.push(uploadError(row.line, 'basis', cell('basis'), 'Basis must be mole or mass.'))
    }
    const fraction = numberCell(cell, 'fraction_1', row.line, decimalComma, problems)
    if (fraction !== null && (fraction < 0 || fraction > 1)) {
      problems.push(uploadError(row.line, 'fraction_1', cell('fraction_1'), 'Fraction must be between 0 and 1.'))
    }
    const injection = injectionCell(cell, row.line, decimalComma, problems)
    const area1 = areaCell(cell, 'area_1', row.line, decimalComma, problems)
    const area2 = areaCell(cell, 'area_2', row.line, decimalComma, problems)
    const basis = basisRaw === 'mass' ? 'mass' : 'mole'
    let std = byLabel.get(label)
    if (!std) {
      std = { label, basis, fraction1: fraction ?? NaN, injections: [], rows: [] }
      byLabel.set(label, std)
    } else if (fraction !== null && (std.fraction1 !== fraction || std.basis !== basis)) {
      problems.push(
        uploadError(
          row.line,
          'fraction_1',
          cell('fraction_1'),
          `Standard ${label} has a different composition on line ${std.rows[0]}.`,
        ),
      )
    }
    std.rows.push(row.line)
    if (injection !== null && std.injections.some((i) => i.injection === injection)) {
      problems.push(
        uploadError(
          row.line,
          'injection',
          cell('injection'),
          `Injection ${injection} of standard ${label} appears twice.`,
        ),
      )
    } else if (injection !== null && area1 !== null && area2 !== null) {
      std.injections.push({ injection, area1, area2, row: row.line })
    }
  }
  if (table.rows.length === 0) problems.push(uploadError(null, null, null, 'The file has a header but no data rows.'))
  return { ...base, standards: [...byLabel.values()], problems }
}
