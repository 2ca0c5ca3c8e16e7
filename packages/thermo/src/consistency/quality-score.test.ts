import { describe, expect, it } from 'vitest'
import { bubbleTemperature } from '../equilibrium/index.js'
import type { BinarySystem } from '../types.js'
import { dataQualityScore } from './quality-score.js'

// 1-propanol (1) / water (2): NRTL and Antoine constants from Smith, Van Ness & Abbott, 7th ed., Tables 12.5
// and B.2 (cal/mol × 4.184 = J/mol). Data below are generated from this model (no noise): they are consistent.
const system: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha: 0.5081 },
}
const xs = [0.03, 0.06, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95]
const generated = () =>
  xs.map((x1) => {
    const b = bubbleTemperature(system, { P: 101325, x1 })
    return { T: b.T, P: 101325, x1, y1: b.y1 }
  })
const options = { vaporPressure: system.vaporPressure, model: 'nrtl' as const, alpha: 0.5081 }

describe('data-quality score', () => {
  it('consistent data generated from a model score (nearly) 1, every test passing', () => {
    const r = dataQualityScore(generated(), options)
    expect(r.tests.map((t) => t.test)).toEqual(['area', 'point', 'infinite-dilution', 'end-point'])
    for (const t of r.tests.filter((t) => t.test !== 'end-point')) expect(t.passed, t.detail).toBe(true)
    expect(r.tests[3].applicable).toBe(false)
    expect(r.quality).toBeCloseTo(1, 6)
    expect(r.tests.every((t) => t.source.length > 10)).toBe(true)
  })

  it('a point whose vapour is 0.06 too rich has the lowest point figure (0.01/0.06) and comes first', () => {
    const pts = generated()
    pts[6] = { ...pts[6], y1: pts[6].y1 + 0.06 }
    const r = dataQualityScore(pts, options)
    expect(r.points[0].index).toBe(6)
    expect(r.points[0].dy).toBeGreaterThan(0.04)
    expect(r.points[0].quality).toBeCloseTo(0.01 / r.points[0].dy, 12)
    expect(r.points.slice(1).every((p) => p.quality > r.points[0].quality)).toBe(true)
  })

  it('three such points fail the point test: the figure drops and leaving the worst out raises it', () => {
    const pts = generated()
    for (const i of [4, 6, 8]) pts[i] = { ...pts[i], y1: pts[i].y1 + 0.06 }
    const r = dataQualityScore(pts, options)
    expect(r.quality).toBeLessThan(0.95)
    expect([4, 6, 8]).toContain(r.points[0].index)
    expect(r.points[0].gainIfExcluded).toBeGreaterThan(0)
  })

  it('a systematic bias in y fails the point test and lowers its score as limit/value', () => {
    const pts = generated().map((p) => ({ ...p, y1: Math.min(0.999, p.y1 + 0.03) }))
    const r = dataQualityScore(pts, options)
    const point = r.tests.find((t) => t.test === 'point')!
    expect(point.passed).toBe(false)
    expect(point.score).toBeCloseTo(0.25 * (0.01 / point.value), 12)
  })

  it('measured pure boiling points 0.5 K off fail the end-point test (0.3 K)', () => {
    const pts = [
      ...generated(),
      { T: bubbleTemperature(system, { P: 101325, x1: 0 }).T + 0.5, P: 101325, x1: 0, y1: 0 },
      { T: bubbleTemperature(system, { P: 101325, x1: 1 }).T, P: 101325, x1: 1, y1: 1 },
    ]
    const end = dataQualityScore(pts, options).tests.find((t) => t.test === 'end-point')!
    expect(end.value).toBeCloseTo(0.5, 6)
    expect(end.passed).toBe(false)
    expect(end.score).toBeCloseTo(0.25 * (0.3 / 0.5), 6)
  })
})
