/**
 * Ebullio's CSV exports, one module for the API and the web app (docs/csv-formats.md): the same columns, decimals,
 * number format and file names whichever side writes the file. Every file is written by csv-stringify; a text
 * cell that a spreadsheet would run as a formula (starting with = + - @ tab or CR) gets a leading apostrophe,
 * while numbers stay numbers.
 */
// the browser build (its own Buffer shim) runs in Node and in the web app alike
import { stringify } from 'csv-stringify/browser/esm/sync'

/** A number already formatted for the file (fixed decimals or exponent): written as is, never neutralised. */
export class CsvNumber {
  constructor(readonly text: string) {}
}

/** `n` with `digits` decimals; empty for null or a non-finite value. */
export const fixed = (n: number | null | undefined, digits: number): CsvNumber | null =>
  n === null || n === undefined || !Number.isFinite(n) ? null : new CsvNumber(n.toFixed(digits))

/** `n` in exponent form with `digits` decimals (uncertainties of a few 1e-4). */
export const exponent = (n: number | null | undefined, digits: number): CsvNumber | null =>
  n === null || n === undefined || !Number.isFinite(n) ? null : new CsvNumber(n.toExponential(digits))

export type CsvCell = string | number | boolean | CsvNumber | null | undefined

const FORMULA_START = /^[=+\-@\t\r]/

/** A text cell a spreadsheet would evaluate gets a leading apostrophe (OWASP's advice for CSV injection). */
export function neutraliseFormula(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text
}

function cellText(c: CsvCell): string {
  if (c === null || c === undefined) return ''
  if (c instanceof CsvNumber) return c.text
  if (typeof c === 'number') return Number.isFinite(c) ? String(c) : ''
  if (typeof c === 'boolean') return c ? 'true' : 'false'
  return neutraliseFormula(c)
}

/**
 * A whole CSV file: optional `# ` comment lines (each one cell, quoted when it holds a delimiter, so no part of it
 * lands in a cell of its own), the header, then the rows; `\n` line ends, RFC 4180 quoting where a cell needs it.
 */
export function csvDocument(
  header: readonly string[],
  rows: readonly (readonly CsvCell[])[],
  comments: readonly string[] = [],
): string {
  const options = { record_delimiter: '\n', escape_formulas: false } as const
  const head =
    comments.length > 0
      ? stringify(
          comments.map((c) => [`# ${c}`]),
          options,
        )
      : ''
  return head + stringify([header.map(neutraliseFormula), ...rows.map((r) => r.map(cellText))], options)
}

/**
 * A file-name stem from any title: letters of every script kept (Éthanol stays éthanol), lower-cased, every run of
 * other characters one hyphen, at most 60 characters. `fallback` when nothing is left.
 */
export function slugify(title: string, fallback = 'export'): string {
  const s = title
    .normalize('NFC')
    .toLocaleLowerCase('en')
    .replace(/[^\p{L}\p{M}\p{N}]+/gu, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '')
  return s || fallback
}

/** The name of a data set's export, e.g. `éthanol-water-at-1-atm-v2-points.csv`. */
export function dataSetFileName(d: { title: string; version: number }, what: string, extension: string): string {
  return `${slugify(d.title, 'data-set')}-v${d.version}-${what}.${extension}`
}

/** One point as the points export needs it (K, Pa, mole fractions). */
export interface ExportPoint {
  seq: number
  sampleLabel: string
  temperatureK: number
  pressurePa: number
  x1: number
  x1Uncertainty: number
  /** null without vapour composition (T–x, P–x) */
  y1: number | null
  y1Uncertainty: number | null
  /** σP, Pa, when the point gives one */
  pressureUncertaintyPa?: number | null
  excluded: boolean
  exclusionReason: string | null
  /** The liquid split into two layers: x1 is the overall composition; the layers (when analysed) follow. */
  heterogeneous?: boolean
  liquidPhases?: readonly [{ x1: number; uncertainty: number }, { x1: number; uncertainty: number }] | null
}

export const POINTS_CSV_HEADER = [
  'seq',
  'sample',
  't_k',
  'p_kpa',
  'x1',
  'u_x1',
  'y1',
  'u_y1',
  'excluded',
  'exclusion_reason',
  'liquid_layers',
  'x1_layer_i',
  'u_x1_layer_i',
  'x1_layer_ii',
  'u_x1_layer_ii',
  'u_p_kpa',
] as const

/**
 * The points export: K and kPa whatever the display units; 3 decimals for T, 4 for P, 5 for x and y. A two-layer
 * point has liquid_layers 2, its overall x1, and both layers' x1 (layer I poorer in component 1) when analysed.
 * y1 and u_y1 are empty for data without vapour composition; u_p_kpa (σP, kPa) is empty unless the point gives it.
 */
export function pointsCsv(points: readonly ExportPoint[]): string {
  return csvDocument(
    POINTS_CSV_HEADER,
    points.map((p) => [
      p.seq,
      p.sampleLabel,
      fixed(p.temperatureK, 3),
      fixed(p.pressurePa / 1000, 4),
      fixed(p.x1, 5),
      exponent(p.x1Uncertainty, 3),
      fixed(p.y1, 5),
      exponent(p.y1Uncertainty, 3),
      p.excluded,
      p.exclusionReason,
      p.heterogeneous ? 2 : 1,
      p.liquidPhases ? fixed(p.liquidPhases[0].x1, 5) : null,
      p.liquidPhases ? exponent(p.liquidPhases[0].uncertainty, 3) : null,
      p.liquidPhases ? fixed(p.liquidPhases[1].x1, 5) : null,
      p.liquidPhases ? exponent(p.liquidPhases[1].uncertainty, 3) : null,
      p.pressureUncertaintyPa ? exponent(p.pressureUncertaintyPa / 1000, 3) : null,
    ]),
  )
}
