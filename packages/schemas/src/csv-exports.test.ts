import { parse } from 'csv-parse/sync'
import { describe, expect, it } from 'vitest'
import { csvDocument, dataSetFileName, fixed, neutraliseFormula, pointsCsv, slugify } from './csv-exports.js'

// CSV injection: cells starting with = + - @ tab or CR are run by spreadsheets (OWASP "CSV Injection" page).
describe('formula cells', () => {
  it.each(['=1+2', '+cmd', '-2+3', '@SUM(A1)', '\tx', '\rx'])('%j is prefixed with an apostrophe', (s) => {
    expect(neutraliseFormula(s)).toBe(`'${s}`)
  })

  it('leaves numbers as numbers and text that is safe as it is', () => {
    const text = csvDocument(['a', 'b', 'c', 'd'], [[-0.25, fixed(-1.5, 3), 'S-01', '=HYPERLINK("x")']])
    expect(text).toBe('a,b,c,d\n-0.25,-1.500,S-01,"\'=HYPERLINK(""x"")"\n')
    const [[a, b, c, d]] = parse(text, { from_line: 2 }) as string[][]
    expect([Number(a), Number(b), c]).toEqual([-0.25, -1.5, 'S-01'])
    expect(d.startsWith("'=")).toBe(true)
  })
})

describe('slugify', () => {
  it.each([
    ['Éthanol / water at 1 atm', 'éthanol-water-at-1-atm'],
    ['  Series 14 (rerun)  ', 'series-14-rerun'],
    ['Wasser–Ethanol Größe', 'wasser-ethanol-größe'],
    ['エタノール', 'エタノール'],
    ['***', 'export'],
  ])('%j → %j', (title, slug) => expect(slugify(title)).toBe(slug))

  it('names a data set export with its version', () => {
    expect(dataSetFileName({ title: 'Éthanol/water', version: 2 }, 'points', 'csv')).toBe('éthanol-water-v2-points.csv')
  })
})

describe('points layout', () => {
  it('writes K, kPa and the fixed decimals, and neutralises a hostile label and reason', () => {
    const text = pointsCsv([
      {
        seq: 1,
        sampleLabel: '=cmd|"/c calc"!A1',
        temperatureK: 351.4449,
        pressurePa: 101325,
        x1: 0.123456,
        x1Uncertainty: 0.0012,
        y1: 0.5,
        y1Uncertainty: 0.00051,
        excluded: true,
        exclusionReason: '@leak',
      },
    ])
    const rows = parse(text) as string[][]
    expect(rows).toEqual([
      [
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
      ],
      [
        '1',
        '\'=cmd|"/c calc"!A1',
        '351.445',
        '101.3250',
        '0.12346',
        '1.200e-3',
        '0.50000',
        '5.100e-4',
        'true',
        "'@leak",
        '1',
        '',
        '',
        '',
        '',
        '',
      ],
    ])
  })

  it('a two-layer point carries both layers', () => {
    const rows = parse(
      pointsCsv([
        {
          seq: 2,
          sampleLabel: 'WB-07',
          temperatureK: 366.1,
          pressurePa: 101325,
          x1: 0.6,
          x1Uncertainty: 0.002,
          y1: 0.764,
          y1Uncertainty: 0.002,
          excluded: false,
          exclusionReason: null,
          heterogeneous: true,
          liquidPhases: [
            { x1: 0.48123456, uncertainty: 0.003 },
            { x1: 0.9812, uncertainty: 0.001 },
          ],
        },
      ]),
    ) as string[][]
    expect(rows[1].slice(10)).toEqual(['2', '0.48123', '3.000e-3', '0.98120', '1.000e-3', ''])
  })

  it('writes σP in kPa when a point gives it (isothermal data)', () => {
    const rows = parse(
      pointsCsv([
        {
          seq: 1,
          sampleLabel: 'P-01',
          temperatureK: 328.15,
          pressurePa: 68000,
          x1: 0.3,
          x1Uncertainty: 0.001,
          y1: 0.5,
          y1Uncertainty: 0.002,
          excluded: false,
          exclusionReason: null,
          pressureUncertaintyPa: 150,
        },
      ]),
    ) as string[][]
    expect(rows[1][15]).toBe('1.500e-1')
  })
})
