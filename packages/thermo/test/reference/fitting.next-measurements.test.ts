import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  fitBinary,
  planNextMeasurements,
  type BinaryPoint,
  type BinarySystem,
  type SuggestionCriterion,
} from '../../src/index.js'
import { b2, CAL, TABLE_12_5 } from './helpers/constants.js'
import { seededRandom as prng } from '../../src/random.js'

// Where to measure next with the lab's limits: data generated from known NRTL parameters (SVNA 7th ed.
// Table 12.5, 1-propanol/water) with σT = 0.1 K and σy = 0.005 Gaussian noise, as in fitting.prediction.test.ts.
const pw = TABLE_12_5.propanolWater
const truth: BinarySystem = {
  vaporPressure: [b2('1-propanol'), b2('water')],
  activity: { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha },
}
function generate(xs: number[], seed: number): BinaryPoint[] {
  const rng = prng(seed)
  return xs.map((x1) => {
    const b = bubbleTemperature(truth, { P: 101325, x1 })
    return { T: b.T + 0.1 * rng.gaussian(), P: 101325, x1, y1: b.y1 + 0.005 * rng.gaussian() }
  })
}
const spread = (n: number, lo: number, hi: number) =>
  Array.from({ length: n }, (_, i) => Math.round((lo + ((hi - lo) * i) / (n - 1)) * 1e4) / 1e4)
const measured = spread(12, 0.03, 0.97)
const fit = fitBinary({
  points: generate(measured, 11),
  vaporPressure: truth.vaporPressure,
  model: 'nrtl',
  alpha: pw.alpha,
})
const P = 101325

describe('planNextMeasurements: exclusion distance', () => {
  it('without the measured points D-optimal would repeat a measured x1; with them no pick is within the distance', () => {
    const blind = planNextMeasurements(fit, { P, count: 5, criterion: 'd-optimal' })
    // The blind plan lands within 0.02 of a point already measured (so the option matters for this data)
    expect(blind.items.some((s) => measured.some((m) => Math.abs(m - s.x1) < 0.02))).toBe(true)
    const plan = planNextMeasurements(fit, { P, count: 5, criterion: 'd-optimal', measured, exclusion: 0.03 })
    expect(plan.items).toHaveLength(5)
    expect(plan.exclusion).toBe(0.03)
    for (const s of plan.items) for (const m of measured) expect(Math.abs(s.x1 - m)).toBeGreaterThanOrEqual(0.03 - 1e-9)
  })
  it('says so when nothing is left to suggest', () => {
    const plan = planNextMeasurements(fit, { P, count: 3, range: [0.4, 0.45], measured: [0.42], exclusion: 0.05 })
    expect(plan.items).toEqual([])
    expect(plan.notes).toEqual([
      'No composition in x1 = 0.40–0.45 is at least 0.05 from every measured point; widen the range or shorten the distance.',
    ])
  })
  it('says how many fit when fewer than asked do', () => {
    const plan = planNextMeasurements(fit, { P, count: 5, range: [0.4, 0.5], exclusion: 0.04 })
    expect(plan.items.length).toBe(3) // 0.40, 0.44, 0.48 or similar: 0.1 wide, 0.05 apart at least
    expect(plan.notes[0]).toBe(
      'Only 3 of the 5 compositions asked for fit in x1 = 0.40–0.50 at least 0.04 from the measured points and 0.05 from each other.',
    )
  })
})

describe('planNextMeasurements: composition range and the dilute ends', () => {
  it('keeps every pick inside the chosen range, including a dilute end the whole-range plan leaves out', () => {
    const whole = planNextMeasurements(fit, { P, count: 5, criterion: 'd-optimal', measured })
    expect(whole.items.some((s) => s.x1 > 0.92)).toBe(false)
    const end = planNextMeasurements(fit, { P, count: 2, criterion: 'd-optimal', measured, range: [0.92, 1] })
    expect(end.items).toHaveLength(2)
    for (const s of end.items) {
      expect(s.x1).toBeGreaterThanOrEqual(0.92)
      expect(s.x1).toBeLessThanOrEqual(0.999)
      // the bubble point given with each pick is the fitted model's at that x1
      const b = bubbleTemperature({ vaporPressure: truth.vaporPressure, activity: fit.activity }, { P, x1: s.x1 })
      expect(s.T).toBeCloseTo(b.T, 6)
      expect(s.y1).toBeCloseTo(b.y1, 8)
    }
  })
  it('D-optimal reaches a dilute end on this fit, and then adds no note', () => {
    const plan = planNextMeasurements(fit, { P, count: 5, criterion: 'd-optimal', measured })
    expect(plan.items.some((s) => s.x1 < 0.15 || s.x1 > 0.85)).toBe(true)
    expect(plan.notes).toEqual([])
  })
  it('says honestly when D-optimal picks none at a dilute end because the measured points cover them', () => {
    const dense = [...spread(15, 0.01, 0.15), ...spread(15, 0.85, 0.99)]
    const plan = planNextMeasurements(fit, { P, count: 3, criterion: 'd-optimal', measured: dense, exclusion: 0.02 })
    expect(plan.items).toHaveLength(3)
    expect(plan.items.every((s) => s.x1 >= 0.15 && s.x1 <= 0.85)).toBe(true)
    expect(plan.notes).toEqual([
      'Every composition at a dilute end (x1 below 0.15 or above 0.85) in the range is within 0.02 of a measured point, so none is suggested there.',
    ])
  })
  it('refuses a bad range or distance with an exact message', () => {
    expect(() => planNextMeasurements(fit, { P, count: 2, range: [0.5, 0.4] })).toThrow(
      'The composition range must lie within 0–1 and be at least 0.01 wide; got 0.5–0.4.',
    )
    expect(() => planNextMeasurements(fit, { P, count: 2, range: [-0.1, 0.4] })).toThrow(
      'The composition range must lie within 0–1 and be at least 0.01 wide; got -0.1–0.4.',
    )
    expect(() => planNextMeasurements(fit, { P, count: 2, exclusion: 0.6 })).toThrow(
      'The least distance from measured points must be from 0 to 0.5 in x1; got 0.6.',
    )
    expect(() => planNextMeasurements(fit, { P, count: 2, measured: [1.2] })).toThrow(
      'Every measured x1 must be a number from 0 to 1.',
    )
  })
})

describe('planNextMeasurements: properties (fast-check)', { timeout: 120_000 }, () => {
  it('every pick is in the range, keeps its distances, and the plan is reproducible', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 0.9, noNaN: true }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 0.1, noNaN: true }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 8 }),
        fc.integer({ min: 1, max: 6 }),
        fc.constantFrom<SuggestionCriterion>('sigma-y', 'd-optimal'),
        (from, width, exclusion, pts, count, criterion) => {
          const to = Math.min(1, from + width)
          fc.pre(to - from >= 0.01)
          const o = { P, count, criterion, range: [from, to] as [number, number], measured: pts, exclusion }
          const plan = planNextMeasurements(fit, o)
          const spacing = Math.max(exclusion, Math.min(0.05, 0.5 / count))
          expect(plan.items.length).toBeLessThanOrEqual(count)
          if (plan.items.length < count) expect(plan.notes.length).toBeGreaterThan(0)
          plan.items.forEach((s, i) => {
            expect(s.x1).toBeGreaterThanOrEqual(from - 1e-9)
            expect(s.x1).toBeLessThanOrEqual(to + 1e-9)
            expect(s.x1 > 0 && s.x1 < 1).toBe(true)
            for (const m of pts) expect(Math.abs(s.x1 - m)).toBeGreaterThanOrEqual(exclusion - 1e-9)
            for (let j = 0; j < i; j++) expect(Math.abs(s.x1 - plan.items[j].x1)).toBeGreaterThanOrEqual(spacing - 1e-9)
          })
          expect(planNextMeasurements(fit, o)).toEqual(plan)
        },
      ),
      { numRuns: 30, seed: 11 },
    )
  })
})
