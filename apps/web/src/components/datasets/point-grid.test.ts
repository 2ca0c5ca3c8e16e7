import { describe, expect, it } from 'vitest'
import { gridToPoints, rowsFromPaste } from './point-grid'

const o = { tUnit: 'C' as const, pUnit: 'kPa' as const, defaultU: 0.005, withY: true }

describe('gridToPoints', () => {
  it('converts °C and kPa to K and Pa and fills empty uncertainties', () => {
    const r = gridToPoints([{ sample: 'A', t: '78,3', p: '101.325', x1: '0.5', y1: '0.6', ux1: '0.002', uy1: '' }], o)
    expect(r.problems).toEqual([])
    expect(r.points[0].temperatureK).toBeCloseTo(351.45, 10) // 78.3 °C + 273.15
    expect(r.points[0].pressurePa).toBeCloseTo(101325, 9)
    expect(r.points[0]).toMatchObject({ x1Uncertainty: 0.002, y1Uncertainty: 0.005 })
  })

  it('names every bad cell by row and column and keeps no point of a bad row', () => {
    const r = gridToPoints(
      [
        { sample: 'A', t: '78', p: '101', x1: '0.5', y1: '0.6', ux1: '', uy1: '' },
        { sample: 'B', t: 'x', p: '101', x1: '1.4', y1: '', ux1: '', uy1: '' },
      ],
      o,
    )
    expect(r.problems).toEqual([
      { row: 2, column: 't', message: '"x" is not a number.' },
      { row: 2, column: 'y1', message: 'y1 is missing.' },
    ])
    expect(r.points).toHaveLength(1)
    const range = gridToPoints([{ sample: 'C', t: '78', p: '101', x1: '1.4', y1: '0.5', ux1: '', uy1: '' }], o)
    expect(range.problems).toEqual([{ row: 1, column: 'x1', message: 'x1 must be between 0 and 1' }])
  })

  it('reads rows pasted from a spreadsheet', () => {
    expect(rowsFromPaste('A\t78.1\t101.3\t0.1\t0.4\n\nB;79;101.3;0.2;0.5\n')).toHaveLength(2)
  })
})
