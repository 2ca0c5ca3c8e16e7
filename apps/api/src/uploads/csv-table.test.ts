import { describe, expect, it } from 'vitest'
import { detectDelimiter, mapColumns, parseNumber, readCsvTable, readCsvTableAsync } from './csv-table.js'

const SAVE_AS = 'Save it from your spreadsheet as CSV with UTF-8 encoding and upload it again.'

// Export quirks below are common practice of instrument and spreadsheet software (no source).
describe('readCsvTable', () => {
  it('strips a UTF-8 byte-order mark and reports it', () => {
    const t = readCsvTable(Buffer.from('\uFEFFsample,phase\nA,liquid\n', 'utf8'))
    expect(t.format.byteOrderMark).toBe(true)
    expect(t.header).toEqual(['sample', 'phase'])
  })

  it('detects ; and switches to decimal commas', () => {
    const t = readCsvTable('a;b;c\n1,5;2;3\n')
    expect(t.format).toEqual({ delimiter: ';', decimalComma: true, byteOrderMark: false })
    expect(t.rows[0].cells).toEqual(['1,5', '2', '3'])
  })

  it('skips blank and delimiter-only trailing lines and keeps file line numbers', () => {
    const t = readCsvTable('a,b\n1,2\n\n3,4\n,\n\n\r\n')
    expect(t.rows.map((r) => r.line)).toEqual([2, 4])
  })

  it('reports an empty file', () => {
    expect(readCsvTable('').problems[0].message).toBe('The file is empty.')
  })

  it('reports binary content', () => {
    expect(readCsvTable(Buffer.from([0x50, 0x4b, 0x03, 0x00, 0x01])).problems).toEqual([
      {
        row: null,
        column: null,
        value: null,
        severity: 'error',
        message:
          'The file is not a text CSV file: it holds binary data (a zero byte on line 1). Export the run sheet as CSV (not a workbook or a PDF). ' +
          SAVE_AS,
      },
    ])
  })

  it('reads UTF-16 with a byte-order mark (little and big endian)', () => {
    const text = 'sample,phase\nÉ-1,liquid\n'
    const le = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')])
    const be = Buffer.from(le.map((_, i) => le[i ^ 1]))
    for (const bytes of [le, be]) {
      const t = readCsvTable(bytes)
      expect(t.problems).toEqual([])
      expect(t.header).toEqual(['sample', 'phase'])
      expect(t.rows[0].cells).toEqual(['É-1', 'liquid'])
      expect(t.format.byteOrderMark).toBe(true)
    }
  })

  it('says once that UTF-16 without a byte-order mark must be saved as UTF-8', () => {
    const t = readCsvTable(Buffer.from('sample,phase\nA,liquid\n', 'utf16le'))
    expect(t.problems.map((p) => p.message)).toEqual([
      'The file looks like UTF-16 text without a byte-order mark, which cannot be read. ' + SAVE_AS,
    ])
  })

  it('names the line of bytes that are not UTF-8', () => {
    const latin1 = Buffer.from('sample,phase\nA,liquid\nÉthanol,liquid\n', 'latin1')
    expect(readCsvTable(latin1).problems).toEqual([
      {
        row: 3,
        column: null,
        value: null,
        severity: 'error',
        message:
          'Line 3 holds bytes that are not UTF-8 text (byte 0xC9); the file was probably saved in an older encoding. ' +
          SAVE_AS,
      },
    ])
  })

  it('reports an unclosed quote once, at the line that opens it', () => {
    const t = readCsvTable('sample,phase\nA,liquid\nB,"vapour\nC,liquid\n')
    expect(t.problems.map((p) => [p.row, p.message])).toEqual([
      [
        3,
        'Line 3 opens a quoted cell (") that is never closed, so the file cannot be read from there on. Close or remove the quote.',
      ],
    ])
  })

  it('refuses more rows than the limit, and a line longer than the record limit', () => {
    const rows = 'a,b\n' + '1,2\n'.repeat(11)
    expect(readCsvTable(rows, { maxRows: 10, maxRecordChars: 1000 }).problems[0].message).toBe(
      'The file has more than 10 data rows, the most one upload may hold on this server (setting UPLOAD_MAX_ROWS). Split it into several files.',
    )
    expect(readCsvTable(rows, { maxRows: 11, maxRecordChars: 1000 }).problems).toEqual([])
    const oneLine = 'a,b,' + '1,'.repeat(2000)
    expect(readCsvTable(oneLine, { maxRows: 10, maxRecordChars: 1000 }).problems[0].message).toBe(
      'Line 1 is longer than 1,000 characters; a run sheet has one short line per injection. Check that the file has line breaks.',
    )
  })
})

describe('readCsvTableAsync', () => {
  it('gives the same table as the synchronous reader', async () => {
    const text = 'sample;phase;t\n' + Array.from({ length: 3000 }, (_, i) => `S${i};liquid;78,${i % 10}`).join('\n')
    const sync = readCsvTable(text)
    const async_ = await readCsvTableAsync(text)
    expect(async_).toEqual(sync)
    expect(async_.rows).toHaveLength(3000)
    expect(async_.rows[2999]).toEqual({ line: 3001, cells: ['S2999', 'liquid', '78,9'] })
  })

  it('lets other work run while a large file is read (the event loop turns between slices)', async () => {
    const text = 'a,b\n' + '1.25,2.5\n'.repeat(19_000)
    let turns = 0
    let stop = false
    const tick = () => {
      if (stop) return
      turns++
      setImmediate(tick)
    }
    setImmediate(tick)
    const t = await readCsvTableAsync(text)
    stop = true
    expect(t.rows).toHaveLength(19_000)
    // a reader that held the thread for the whole file would leave the ticker at most one turn
    expect(turns).toBeGreaterThan(3)
  })

  it('reports errors and the row cap like the synchronous reader', async () => {
    expect((await readCsvTableAsync('a,b\n"x,1\n')).problems[0].row).toBe(2)
    const many = 'a,b\n' + '1,2\n'.repeat(50)
    expect((await readCsvTableAsync(many, { maxRows: 20, maxRecordChars: 100 })).problems[0].message).toMatch(
      /^The file has more than 20 data rows/,
    )
  })

  it('picks the delimiter from the header line', () => {
    expect(detectDelimiter('x\ty\tz\n')).toBe('\t')
    expect(detectDelimiter('\n\nx,y\n')).toBe(',')
  })
})

describe('mapColumns', () => {
  it('matches headers in any case, lists extra columns and missing ones', () => {
    const m = mapColumns(['Sample', 'PHASE', 'Operator', ' Area 1 '], ['sample', 'phase', 'area_1', 'area_2'])
    expect(m.columns.sample).toEqual({ index: 0, header: 'Sample' })
    expect(m.columns.area_1.index).toBe(3)
    expect(m.extraColumns).toEqual(['Operator'])
    expect(m.problems).toEqual([
      { row: 1, column: 'area_2', value: null, message: 'Required column "area_2" is missing.', severity: 'error' },
    ])
  })

  it('refuses a column given twice', () => {
    const m = mapColumns(['sample', 'Sample'], ['sample'])
    expect(m.problems[0].message).toBe('Column "sample" appears more than once.')
  })
})

describe('parseNumber', () => {
  it.each([
    ['12.5', false, 12.5],
    ['12,5', true, 12.5],
    ['12,5', false, null],
    ['1.5e3', false, 1500],
    ['-0.25', false, -0.25],
    ['abc', false, null],
    ['', false, null],
    ['1.234,5', true, null],
  ])('%s (decimal comma %s) → %s', (cell, dc, expected) => {
    expect(parseNumber(cell, dc)).toBe(expected)
  })
})
