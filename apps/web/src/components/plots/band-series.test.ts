import { describe, expect, it } from 'vitest'
import { bandSeries, suggestionSeries } from './band-series'
import { txyOption } from './txy-option'

const band = {
  name: 'NRTL',
  x1: [0, 0.5, 1],
  T: [373.15, 360, 370],
  Tlow: [373, 359.5, 369.9],
  Thigh: [373.3, 360.5, 370.1],
  ylow: [0, 0.4, 0.99],
  yhigh: [0.01, 0.5, 1],
}
type Custom = { renderItem: (p: unknown, api: unknown) => { shape: { points: number[][] } }; data: number[][] }
const identity = { coord: (v: number[]) => v, value: () => 0 }

describe('bandSeries', () => {
  it('closes a polygon along the lower edge and back along the upper one, on both the bubble and the dew side (°C shown)', () => {
    const [bubble, dew] = bandSeries(band, 'C', '#2c5d9e') as unknown as Custom[]
    const pts = bubble.renderItem(null, identity).shape.points
    expect(pts).toHaveLength(6)
    expect(pts[0][0]).toBe(0)
    expect(pts[0][1]).toBeCloseTo(373 - 273.15, 10)
    expect(pts[5][1]).toBeCloseTo(373.3 - 273.15, 10)
    expect(dew.renderItem(null, identity).shape.points.map((p) => p[0])).toEqual([0, 0.4, 0.99, 1, 0.5, 0.01])
  })

  it('drops compositions where the band could not be computed, and draws nothing with fewer than two', () => {
    const gaps = { ...band, Tlow: [373, Number.NaN, 369.9] }
    const [bubble] = bandSeries(gaps, 'K', '#000') as unknown as Custom[]
    expect(bubble.renderItem(null, identity).shape.points).toHaveLength(4)
    expect(bandSeries({ ...band, Tlow: [Number.NaN, Number.NaN, 1] }, 'K', '#000')).toEqual([])
  })
})

describe('suggestionSeries and the T–x–y option', () => {
  it('numbers the suggested compositions best first and puts the band behind the curves', () => {
    const s = suggestionSeries(
      [
        { x1: 0.12, T: 365, sigmaY: 0.004 },
        { x1: 0.8, T: 362, sigmaY: 0.003 },
      ],
      'K',
      '#c98a12',
    ) as unknown as Custom
    // x, bubble T (shown unit, so the temperature axis keeps its range), rank
    expect(s.data.map((d) => [d[0], d[1], d[2]])).toEqual([
      [0.12, 365, 1],
      [0.8, 362, 2],
    ])
    const o = txyOption({
      title: 'T–x–y',
      names: ['a', 'b'],
      unit: 'C',
      k: 1,
      points: [],
      curves: [{ name: 'NRTL', x1: [0, 1], y1: [0, 1], T: [373, 370] }],
      band,
      suggested: [{ x1: 0.3, T: 360, sigmaY: 0.01 }],
    })
    const series = o.series as { type: string; name: string }[]
    expect(series.slice(0, 3).map((x) => [x.type, x.name])).toEqual([
      ['custom', 'NRTL'],
      ['custom', 'NRTL'],
      ['custom', 'Measure next'],
    ])
  })
})
