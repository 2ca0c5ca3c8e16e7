import { describe, expect, it } from 'vitest'
import {
  bubblePressure,
  bubbleTemperature,
  fitBinary,
  predictionBand,
  predictionBandIsothermal,
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

describe('predictionBandIsothermal (P–x–y band of a fit on pressures)', () => {
  // Isothermal data at 60 °C generated from the same published model (SVNA 7th ed. Table 12.5 1-propanol/water
  // NRTL) with σP = 100 Pa and σy = 0.005 Gaussian noise, fitted on bubble pressures.
  const T = 333.15
  const points = spread(20).map((x1, i) => {
    const b = bubblePressure(truth, { T, x1 })
    const rng = prng(500 + i)
    return { T, P: b.P + 100 * rng.gaussian(), x1, y1: b.y1 + 0.005 * rng.gaussian() }
  })
  const fit = fitBinary({
    points,
    vaporPressure: truth.vaporPressure,
    model: 'nrtl',
    alpha: pw.alpha,
    objective: 'bubble-pressure',
  })
  const band = predictionBandIsothermal(fit, { T, points: 21 })
  it("follows the fitted model's bubble pressures and is pinned at the pure ends", () => {
    band.x1.forEach((x1, i) => {
      const b = bubblePressure(fit.system, { T, x1 })
      expect(band.P[i]).toBeCloseTo(b.P, 3)
      expect(band.y1[i]).toBeCloseTo(b.y1, 8)
    })
    expect(band.sigmaP[0]).toBeLessThan(1e-6)
    expect(band.sigmaP[20]).toBeLessThan(1e-6)
    expect(Math.max(...band.sigmaP)).toBeGreaterThan(5)
  })
  it('equals σ² = gᵀCg with g by central differences of the public bubblePressure (an independent path)', () => {
    const names = fit.parameters.map((p) => p.name)
    for (const i of [5, 10, 15]) {
      const x1 = band.x1[i]
      const g = names.map((name) => {
        const h = 1e-3 * Math.max(1, Math.abs(fit.parameters.find((p) => p.name === name)!.value))
        const at = (d: number) =>
          bubblePressure(
            { ...fit.system, activity: { ...fit.activity, [name]: (fit.activity as never)[name] + d } as never },
            { T, x1 },
          )
        const [up, down] = [at(h), at(-h)]
        return { P: (up.P - down.P) / (2 * h), y: (up.y1 - down.y1) / (2 * h) }
      })
      const quad = (v: number[]) =>
        v.reduce((s, a, j) => s + v.reduce((t, b, k) => t + a * fit.covariance[j][k] * b, 0), 0)
      expect(band.sigmaP[i]).toBeCloseTo(Math.sqrt(quad(g.map((q) => q.P))), 2)
      expect(band.sigmaY[i]).toBeCloseTo(Math.sqrt(quad(g.map((q) => q.y))), 6)
    }
  })
  it('holds the true curve over most of the composition range (±2σ)', () => {
    let inside = 0
    band.x1.forEach((x1, i) => {
      const P = bubblePressure(truth, { T, x1 }).P
      if (P >= band.Plow[i] - 1e-6 && P <= band.Phigh[i] + 1e-6) inside++
    })
    expect(inside / band.x1.length).toBeGreaterThan(0.8)
  })
  it('refuses a temperature that is not one, naming it', () => {
    expect(() => predictionBandIsothermal(fit, { T: -3 })).toThrow(
      'Temperature must be a positive number of kelvins; got -3.',
    )
  })
})
