import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  fitBinary,
  predictionBand,
  suggestNextCompositions,
  type BinaryPoint,
  type BinarySystem,
} from '../../src/index.js'
import { b2, CAL, TABLE_12_5 } from './helpers/constants.js'
import { seededRandom as prng } from '../../src/random.js'

// Uncertainty of the fitted curve, checked against data generated from known parameters
// (SVNA 7th ed. Table 12.5 1-propanol/water NRTL, S) with σT = 0.1 K and σy = 0.005 Gaussian noise.
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
const spread = (n: number, lo = 0.03, hi = 0.97) => Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1))
const fitOf = (points: BinaryPoint[]) =>
  fitBinary({ points, vaporPressure: truth.vaporPressure, model: 'nrtl', alpha: pw.alpha })

describe('predictionBand', () => {
  const fit = fitOf(generate(spread(20), 11))
  const band = predictionBand(fit, { P: 101325 })
  it('is pinned at the pure ends and widens in between', () => {
    expect(band.x1[0]).toBe(0)
    expect(band.x1[50]).toBe(1)
    expect(band.sigmaY[0]).toBeLessThan(1e-9)
    expect(band.sigmaY[50]).toBeLessThan(1e-9)
    expect(band.sigmaT[0]).toBeLessThan(1e-9)
    expect(Math.max(...band.sigmaT)).toBeGreaterThan(0.01)
  })
  it('holds the true curve over most of the composition range (±2σ)', () => {
    let inside = 0
    band.x1.forEach((x1, i) => {
      const T = bubbleTemperature(truth, { P: 101325, x1 }).T
      if (T >= band.Tlow[i] - 1e-9 && T <= band.Thigh[i] + 1e-9) inside++
    })
    expect(inside / band.x1.length).toBeGreaterThan(0.8)
  })
  it('narrows about as 1/√n: four times the points, about half the width', () => {
    const big = predictionBand(fitOf(generate(spread(80), 12)), { P: 101325 })
    const ratio = Math.max(...big.sigmaY) / Math.max(...band.sigmaY)
    expect(ratio).toBeGreaterThan(0.35)
    expect(ratio).toBeLessThan(0.7)
  })
})

describe('suggestNextCompositions', () => {
  // Data only on the water-rich side. With two parameters the model is constrained globally, and its
  // least sure y can be where y1 rises steeply with x1 (dilute end) as much as on the unmeasured side.
  const points = generate(spread(10, 0.03, 0.35), 21)
  const fit = fitOf(points)
  it('starts where the predicted σy is largest, and keeps the picks apart', () => {
    const s = suggestNextCompositions(fit, { P: 101325, count: 4 })
    expect(s.length).toBe(4)
    const band = predictionBand(fit, { P: 101325, points: 201 })
    const inner = band.sigmaY.filter((_, i) => band.x1[i] >= 0.01 && band.x1[i] <= 0.99)
    expect(s[0].sigmaY).toBeGreaterThan(0.95 * Math.max(...inner))
    for (let i = 0; i < s.length; i++)
      for (let j = 0; j < i; j++) expect(Math.abs(s[i].x1 - s[j].x1)).toBeGreaterThanOrEqual(0.05 - 1e-12)
    expect(s[0].sigmaY).toBeGreaterThanOrEqual(s[1].sigmaY * 0.999)
  })
  it('a measurement where it says cuts the worst σy more than one inside the measured range', () => {
    const [first] = suggestNextCompositions(fit, { P: 101325, count: 1 })
    const worst = (pts: BinaryPoint[]) => Math.max(...predictionBand(fitOf(pts), { P: 101325 }).sigmaY)
    const there = worst([...points, ...generate([first.x1], 99)])
    const inside = worst([...points, ...generate([0.2], 99)])
    expect(there).toBeLessThan(inside)
  })
  it('is deterministic: the same fit gives the same list, for both criteria', () => {
    for (const criterion of ['sigma-y', 'd-optimal'] as const) {
      const a = suggestNextCompositions(fit, { P: 101325, count: 5, criterion })
      const b = suggestNextCompositions(fitOf(generate(spread(10, 0.03, 0.35), 21)), { P: 101325, count: 5, criterion })
      expect(b).toEqual(a)
    }
  })
  it('D-optimal on a two-parameter NRTL fit over the whole range reaches a dilute end (x1 < 0.15 or > 0.85)', () => {
    // 20 points evenly over 0.03–0.97: the middle is well covered; the determinant of the covariance of
    // b12, b21 falls most where γ∞ is pinned.
    const even = fitOf(generate(spread(20), 11))
    const s = suggestNextCompositions(even, { P: 101325, count: 5, criterion: 'd-optimal' })
    expect(s.length).toBe(5)
    expect(s.some((p) => p.x1 < 0.15 || p.x1 > 0.85)).toBe(true)
    for (let i = 0; i < s.length; i++)
      for (let j = 0; j < i; j++) expect(Math.abs(s[i].x1 - s[j].x1)).toBeGreaterThanOrEqual(0.05 - 1e-12)
  })
  it('refuses an unknown criterion with an exact message', () => {
    expect(() => suggestNextCompositions(fit, { P: 101325, count: 2, criterion: 'widest' as 'sigma-y' })).toThrow(
      "The suggestion criterion must be 'sigma-y' or 'd-optimal'; got widest.",
    )
  })
  it('refuses a bad count with an exact message', () => {
    expect(() => suggestNextCompositions(fit, { P: 101325, count: 0 })).toThrow(
      'The number of suggestions must be a whole number from 1 to 20; got 0.',
    )
    expect(() => predictionBand(fit, { P: -1 })).toThrow('Pressure must be a positive number of pascals; got -1.')
  })
})
