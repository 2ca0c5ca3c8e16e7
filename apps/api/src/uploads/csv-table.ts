/**
 * Reads an instrument CSV export into header + rows, tolerating what real exports contain:
 * a byte-order mark (UTF-8, or UTF-16 which is decoded), `;` or `,` (or tab) delimiters, decimal commas when `;`
 * is the delimiter, blank or delimiter-only trailing lines, and header names in any case.
 */
import { parse as parseStream } from 'csv-parse'
import { parse as parseSync } from 'csv-parse/sync'
import { uploadError, type UploadProblem } from './problems.js'
import { decodeUpload } from './text-decoding.js'

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
  /** at most one problem: the file could not be read at all (then header and rows are empty) */
  problems: UploadProblem[]
}

/** Limits on what one file may hold; the row cap is the UPLOAD_MAX_ROWS setting. */
export interface ReadLimits {
  /** data rows (the header not counted) */
  maxRows: number
  /** characters in one record: a 5 MB single-line file is refused without splitting it into a million cells */
  maxRecordChars: number
}
export const DEFAULT_READ_LIMITS: ReadLimits = { maxRows: 20_000, maxRecordChars: 64 * 1024 }

/** Pick the delimiter that occurs most in the first non-blank line (the header). */
export function detectDelimiter(text: string): CsvFormat['delimiter'] {
  const first =
    text
      .slice(0, 64 * 1024)
      .split(/\r?\n/)
      .find((l) => l.trim() !== '') ?? ''
  const count = (ch: string) => first.split(ch).length - 1
  const candidates: CsvFormat['delimiter'][] = [';', ',', '\t']
  let best: CsvFormat['delimiter'] = ','
  for (const c of candidates) if (count(c) > count(best)) best = c
  return best
}

type CsvRecord = { info: { lines: number }; record: string[] }

const parseOptions = (delimiter: string, limits: ReadLimits) => ({
  delimiter,
  info: true,
  relax_column_count: true,
  skip_empty_lines: true,
  skip_records_with_empty_values: true,
  trim: true,
  max_record_size: limits.maxRecordChars,
})

const fail = (format: CsvFormat, problem: UploadProblem): CsvTable => ({
  format,
  header: [],
  rows: [],
  problems: [problem],
})

/** The line whose quote is still open at the end of the text (a doubled quote "" toggles twice). */
function unclosedQuoteLine(text: string): number | null {
  let line = 1
  let open: number | null = null
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i)
    if (c === 10) line++
    else if (c === 34) open = open === null ? line : null
  }
  return open
}

/** csv-parse's refusal as one message an analyst can act on. */
function csvFailure(text: string, err: unknown, limits: ReadLimits): UploadProblem {
  const e = err as { code?: string; lines?: number; message?: string }
  const line = e.lines ?? null
  if (e.code === 'CSV_QUOTE_NOT_CLOSED') {
    const opened = unclosedQuoteLine(text) ?? line ?? 1
    return uploadError(
      opened,
      null,
      null,
      `Line ${opened} opens a quoted cell (") that is never closed, so the file cannot be read from there on. Close or remove the quote.`,
    )
  }
  if (e.code === 'CSV_MAX_RECORD_SIZE')
    return uploadError(
      line,
      null,
      null,
      `Line ${line} is longer than ${limits.maxRecordChars.toLocaleString('en')} characters; a run sheet has one short line per injection. Check that the file has line breaks.`,
    )
  return uploadError(
    line,
    null,
    null,
    `The file could not be read as CSV (line ${line ?? '?'}): ${e.message ?? String(err)}`,
  )
}

const tooManyRows = (limits: ReadLimits) =>
  uploadError(
    null,
    null,
    null,
    `The file has more than ${limits.maxRows.toLocaleString('en')} data rows, the most one upload may hold on this server (setting UPLOAD_MAX_ROWS). Split it into several files.`,
  )

function finish(format: CsvFormat, records: CsvRecord[], limits: ReadLimits): CsvTable {
  if (records.length === 0) return fail(format, uploadError(null, null, null, 'The file is empty.'))
  if (records.length - 1 > limits.maxRows) return fail(format, tooManyRows(limits))
  const [head, ...body] = records
  return {
    format,
    header: head.record,
    rows: body.map((r) => ({ line: r.info.lines, cells: r.record })),
    problems: [],
  }
}

function prepare(content: Buffer | string): { text: string; format: CsvFormat } | { failed: CsvTable } {
  const decoded = decodeUpload(content)
  const unknownFormat: CsvFormat = { delimiter: ',', decimalComma: false, byteOrderMark: false }
  if (!decoded.ok) return { failed: fail(unknownFormat, decoded.problem) }
  const delimiter = detectDelimiter(decoded.text)
  return {
    text: decoded.text,
    format: { delimiter, decimalComma: delimiter === ';', byteOrderMark: decoded.byteOrderMark },
  }
}

/**
 * Decode and split a CSV upload. Never throws for bad content: it reports problems instead. A file that cannot be
 * read at all (empty, binary, not UTF-8, an unclosed quote, too many rows) gives exactly one problem.
 */
export function readCsvTable(content: Buffer | string, limits: ReadLimits = DEFAULT_READ_LIMITS): CsvTable {
  const prepared = prepare(content)
  if ('failed' in prepared) return prepared.failed
  const { text, format } = prepared
  try {
    return finish(format, parseSync(text, parseOptions(format.delimiter, limits)) as unknown as CsvRecord[], limits)
  } catch (err) {
    return fail(format, csvFailure(text, err, limits))
  }
}

/** Characters fed to the parser between two turns of the event loop. */
const CHUNK_CHARS = 32 * 1024
const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve))

/**
 * The same as `readCsvTable`, fed to csv-parse's stream in slices with a turn of the event loop between them,
 * so a large file never holds the server for long, and stopped as soon as the row cap is passed.
 */
export async function readCsvTableAsync(
  content: Buffer | string,
  limits: ReadLimits = DEFAULT_READ_LIMITS,
): Promise<CsvTable> {
  const prepared = prepare(content)
  if ('failed' in prepared) return prepared.failed
  const { text, format } = prepared
  const parser = parseStream(parseOptions(format.delimiter, limits))
  const records: CsvRecord[] = []
  let error: unknown = null
  parser.on('readable', () => {
    let r: CsvRecord | null
    while ((r = parser.read() as CsvRecord | null) !== null) records.push(r)
  })
  const ended = new Promise<void>((resolve) => {
    parser.on('end', resolve)
    parser.on('error', (err) => {
      error = err
      resolve()
    })
  })
  for (let i = 0; i < text.length && error === null; i += CHUNK_CHARS) {
    parser.write(text.slice(i, i + CHUNK_CHARS))
    await nextTurn()
    if (records.length - 1 > limits.maxRows) {
      parser.destroy()
      return fail(format, tooManyRows(limits))
    }
  }
  if (error === null) parser.end()
  await ended
  if (error !== null) return fail(format, csvFailure(text, error, limits))
  return finish(format, records, limits)
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

/** The read limits of this server (UPLOAD_MAX_ROWS). */
export function readLimits(config: { uploadMaxRows: number }): ReadLimits {
  return { ...DEFAULT_READ_LIMITS, maxRows: config.uploadMaxRows }
}
