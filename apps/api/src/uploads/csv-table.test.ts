import { describe, expect, it } from 'vitest'
import { detectDelimiter, mapColumns, parseNumber, readCsvTable } from './csv-table.js'

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
    expect(readCsvTable(Buffer.from([0x50, 0x4b, 0x03, 0x00, 0x01])).problems[0].message).toBe(
      'The file is not a text CSV file.',
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
