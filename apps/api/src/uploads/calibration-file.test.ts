import { describe, expect, it } from 'vitest'
import { parseCalibrationFile } from './calibration-file.js'

const GOOD = [
  'standard,basis,fraction_1,injection,area_1,area_2',
  'CAL-A,mole,0.2,1,20500,80100',
  'CAL-A,mole,0.2,2,20610,80020',
  'CAL-B,mole,0.5,1,51020,49800',
  'CAL-B,mole,0.5,2,50880,49910',
].join('\n')

describe('parseCalibrationFile', () => {
  it('gathers replicate injections per standard', () => {
    const p = parseCalibrationFile(GOOD)
    expect(p.problems).toEqual([])
    expect(p.standards).toHaveLength(2)
    expect(p.standards[0]).toMatchObject({ label: 'CAL-A', basis: 'mole', fraction1: 0.2, rows: [2, 3] })
    expect(p.standards[0].injections[1]).toEqual({ injection: 2, area1: 20610, area2: 80020, row: 3 })
    expect(p.mapping).toEqual({
      standard: 'standard',
      basis: 'basis',
      fraction_1: 'fraction_1',
      injection: 'injection',
      area_1: 'area_1',
      area_2: 'area_2',
    })
  })

  it('reads a ;-delimited export with decimal commas, BOM and upper-case headers', () => {
    const text = '\uFEFFSTANDARD;Fraction_1;Injection;Area_1;Area_2;Vial\nCAL-A;0,2;1;20500,5;80100;7\n\n'
    const p = parseCalibrationFile(Buffer.from(text))
    expect(p.problems).toEqual([])
    expect(p.extraColumns).toEqual(['Vial'])
    expect(p.standards[0]).toMatchObject({ basis: 'mole', fraction1: 0.2 })
    expect(p.standards[0].injections[0].area1).toBe(20500.5)
  })

  it('lists every bad cell with row, column, value and what is wrong', () => {
    const text = [
      'standard,basis,fraction_1,injection,area_1,area_2',
      'CAL-A,volume,1.2,1,abc,0',
      ',mole,0.3,1,10,10',
      'CAL-B,mole,0.5,1.5,-3,10',
      'CAL-B,mole,0.5,2,10,10',
      'CAL-B,mole,0.5,2,10,10',
      'CAL-B,mole,0.6,3,10,10',
    ].join('\n')
    const p = parseCalibrationFile(text)
    expect(p.problems.map((x) => [x.row, x.column, x.value, x.message])).toEqual([
      [2, 'basis', 'volume', 'Basis must be mole or mass.'],
      [2, 'fraction_1', '1.2', 'Fraction must be between 0 and 1.'],
      [2, 'area_1', 'abc', 'Not a number.'],
      [2, 'area_2', '0', 'Peak area must be greater than zero.'],
      [3, 'standard', '', 'Standard id is missing.'],
      [4, 'injection', '1.5', 'Injection number must be a whole number of at least 1.'],
      [4, 'area_1', '-3', 'Peak area must be greater than zero.'],
      [6, 'injection', '2', 'Injection 2 of standard CAL-B appears twice.'],
      [7, 'fraction_1', '0.6', 'Standard CAL-B has a different composition on line 4.'],
    ])
  })

  it('stops at the header when a required column is missing', () => {
    const p = parseCalibrationFile('standard,fraction_1,area_1,area_2\nA,0.5,1,1\n')
    expect(p.problems).toEqual([
      {
        row: 1,
        column: 'injection',
        value: null,
        message: 'Required column "injection" is missing.',
        severity: 'error',
      },
    ])
    expect(p.standards).toEqual([])
  })

  it('reports a header without data', () => {
    expect(parseCalibrationFile('standard,fraction_1,injection,area_1,area_2\n').problems[0].message).toBe(
      'The file has a header but no data rows.',
    )
  })
})
