/**
 * Reads an instrument CSV export into header + rows, tolerating what real exports contain:
 * a UTF-8 byte-order mark, `;` or `,` (or tab) delimiters, decimal commas when `;` is the
 * delimiter, blank or delimiter-only trailing lines, and header names in any case.
 */
import { parse } from 'csv-parse/sync'
import { uploadError, type UploadProblem } from './problems.js'

/** How the file was read, reported back in the preview. */
export interface CsvFormat {
  delimiter: ',' | ';' | '\t'
  decimalComma: boolean
  byteOrderMark: boolean
}

/** One data row: its line number in the file and its cells, trimmed. */
export interface CsvRow {
  line: number
  cells: string[]
}

export interface CsvTable {
  format: CsvFormat
  /** header cells as written in the file (trimmed) */
  header: string[]
  rows: CsvRow[]
  problems: UploadProblem[]
}

const BOM = '\uFEFF'

/** Pick the delimiter that occurs most in the first non-blank line (the header). */
export function detectDelimiter(text: string): CsvFormat['delimiter'] {
  const first = text.split(/\r?\n/).find((l) => l.trim() !== '') ?? ''
  const count = (ch: string) => first.split(ch).length - 1
  const candidates: CsvFormat['delimiter'][] = [';', ',', '\t']
  let best: CsvFormat['delimiter'] = ','
  for (const c of candidates) if (count(c) > count(best)) best = c
  return best
}

/** Decode and split a CSV upload. Never throws for bad content: it reports problems instead. */
export function readCsvTable(content: Buffer | string): CsvTable {
  let text = typeof content === 'string' ? content : content.toString('utf8')
  const byteOrderMark = text.startsWith(BOM)
  if (byteOrderMark) text = text.slice(1)
  const delimiter = detectDelimiter(text)
  const format: CsvFormat = { delimiter, decimalComma: delimiter === ';', byteOrderMark }
  if (text.includes('\u0000')) {
    return {
      format,
      header: [],
      rows: [],
      problems: [uploadError(null, null, null, 'The file is not a text CSV file.')],
    }
  }
  let records: { info: { lines: number }; record: string[] }[]
  try {
    records = parse(text, {
      delimiter,
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      skip_records_with_empty_values: true,
      trim: true,
    }) as unknown as typeof records
  } catch (err) {
    const line = (err as { lines?: number }).lines ?? null
    return {
      format,
      header: [],
      rows: [],
      problems: [uploadError(line, null, null, `The file could not be read as CSV: ${(err as Error).message}`)],
    }
  }
  if (records.length === 0) {
    return { format, header: [], rows: [], problems: [uploadError(null, null, null, 'The file is empty.')] }
  }
  const [head, ...body] = records
  return {
    format,
    header: head.record,
    rows: body.map((r) => ({ line: r.info.lines, cells: r.record })),
    problems: [],
  }
}

/** Where each expected column sits in the header, matched case-insensitively. */
export interface ColumnMapping {
  /** canonical name → { index, header as written } */
  columns: Record<string, { index: number; header: string }>
  /** headers not used by Ebullio (ignored, listed in the preview) */
  extraColumns: string[]
  problems: UploadProblem[]
}

/** Match `required` and `optional` canonical names against the header, case- and space-insensitively. */
export function mapColumns(
  header: string[],
  required: readonly string[],
  optional: readonly string[] = [],
): ColumnMapping {
  const norm = (h: string) => h.trim().toLowerCase().replace(/\s+/g, '_')
  const known = new Set([...required, ...optional])
  const columns: ColumnMapping['columns'] = {}
  const extraColumns: string[] = []
  const problems: UploadProblem[] = []
  header.forEach((h, index) => {
    const key = norm(h)
    if (!known.has(key)) {
      extraColumns.push(h)
    } else if (columns[key]) {
      problems.push(uploadError(1, h, h, `Column "${key}" appears more than once.`))
    } else {
      columns[key] = { index, header: h }
    }
  })
  for (const name of required) {
    if (!columns[name]) problems.push(uploadError(1, name, null, `Required column "${name}" is missing.`))
  }
  return { columns, extraColumns, problems }
}

/** Parse one numeric cell; a decimal comma is accepted only when the file uses `;` delimiters. */
export function parseNumber(cell: string, decimalComma: boolean): number | null {
  let s = cell.trim()
  if (decimalComma) s = s.replace(',', '.')
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s)) return null
  const n = Number(s)
  return Number.isFinite(n) ? n : null
}
