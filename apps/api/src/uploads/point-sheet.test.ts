import { readFileSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { parsePointSheet } from './point-sheet.js'

const example = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '../../../../docs/examples/points-acetone-methanol-literature.csv',
)

describe('parsePointSheet', () => {
  it('reads the documented example: eleven points, °C → K (+273.15), kPa → Pa', () => {
    const r = parsePointSheet(readFileSync(example), 'txy')
    expect(r.problems).toEqual([])
    expect(r.points).toHaveLength(11)
    expect(r.points[0]).toMatchObject({ row: 2, sampleLabel: 'T2-01', x1: 0.05, y1: 0.107, x1Uncertainty: 0.003 })
    expect(r.points[0].temperatureK).toBeCloseTo(63.09 + 273.15, 10)
    expect(r.points[0].pressurePa).toBeCloseTo(101325, 8)
  })

  it('names a missing column, a repeated sample and a y1 in a T–x sheet', () => {
    expect(parsePointSheet('sample,t,t_unit,p,p_unit\nA,1,C,1,kPa\n', 'txy').problems.map((p) => p.message)).toEqual([
      'Required column "x1" is missing.',
    ])
    const dup = parsePointSheet(
      'sample,t,t_unit,p,p_unit,x1,y1\nA,60,C,101,kPa,0.1,0.2\nA,61,C,101,kPa,0.2,0.3\n',
      'txy',
    )
    expect(dup.problems).toEqual([
      expect.objectContaining({ row: 3, column: 'sample', message: 'Sample "A" appears again (first on line 2).' }),
    ])
    const tx = parsePointSheet('sample,t,t_unit,p,p_unit,x1,y1\nA,60,C,101,kPa,0.1,0.2\n', 'tx')
    expect(tx.problems[0].message).toBe('A T–x sheet has no vapour composition; leave y1 empty.')
  })

  it('reads σP in the row’s pressure unit (1 mmHg = 133.322387415 Pa, as packages/thermo/src/units.ts defines it) and a P–x sheet without y1', () => {
    const r = parsePointSheet('sample,t,t_unit,p,p_unit,x1,u_p\nA,50,C,600,mmHg,0.3,0.75\nB,50,C,61.2,kPa,0.5,\n', 'px')
    expect(r.problems).toEqual([])
    expect(r.points[0].pressureUncertaintyPa).toBeCloseTo(0.75 * 133.322387415, 9)
    expect(r.points[1].pressureUncertaintyPa).toBeNull()
    expect(r.points.map((p) => p.y1)).toEqual([null, null])
    const bad = parsePointSheet('sample,t,t_unit,p,p_unit,x1,y1,u_p\nA,50,C,60,kPa,0.3,0.4,-1\n', 'px')
    expect(bad.problems.map((p) => [p.row, p.column, p.message])).toEqual([
      [2, 'y1', 'A P–x sheet has no vapour composition; leave y1 empty.'],
      [2, 'u_p', 'u_p must be positive (in the row’s pressure unit).'],
    ])
  })
})
