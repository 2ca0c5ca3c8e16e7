/**
 * Column design on a BinarySystem through part 1's bubble-point solver.
 * - Benzene–toluene, ideal solution, Antoine constants of Smith, Van Ness & Abbott, Appendix B, Table B.2
 *   (benzene S, toluene M), against Geankoplis, Transport Processes and Separation Process Principles, 4th ed.,
 *   Example 11.4-1: about 7.6 steps including the reboiler, feed on step 5 (reference-values §6, M, graphical accuracy).
 * - 1-propanol–water, NRTL parameters of SVNA 7th ed. Table 12.5 (tag S) with Table B.2 Antoine constants:
 *   minimum-boiling azeotrope at 87.7 °C, x ≈ 0.43 (CRC Handbook azeotrope table, reference-values §5, S),
 *   so a distillate above it is unreachable.
 */
import { describe, expect, it } from 'vitest'
import { equilibriumCurve, fenske, mccabeThiele, minimumReflux } from '../../src/columns/index.js'
import { bubbleTemperature, relativeVolatility } from '../../src/equilibrium/index.js'
import type { BinarySystem, VaporPressureModel } from '../../src/types.js'

const P = 101325
const antoine = (A: number, B: number, C: number): VaporPressureModel => ({
  kind: 'antoine',
  A,
  B,
  C,
  log: 'ln',
  pressureUnit: 'kPa',
  temperatureUnit: 'C',
})
const CAL = 4.184 // J per thermochemical calorie
const benzeneToluene: BinarySystem = {
  vaporPressure: [antoine(13.7819, 2726.81, 217.572), antoine(13.932, 3056.96, 217.625)],
  activity: { kind: 'ideal' },
  names: ['benzene', 'toluene'],
}
const propanolWater: BinarySystem = {
  vaporPressure: [antoine(16.1154, 3483.67, 205.807), antoine(16.3872, 3885.7, 230.17)],
  activity: { kind: 'nrtl', b12: 500.4 * CAL, b21: 1636.57 * CAL, alpha: 0.5081 },
  names: ['1-propanol', 'water'],
}

describe('benzene–toluene (ideal) vs Geankoplis 4th ed. Example 11.4-1', () => {
  const r = mccabeThiele({ system: benzeneToluene, P }, { xF: 0.45, q: 1, xD: 0.95, xB: 0.1, R: 4 })
  it('about 7.6 steps including the reboiler (±0.3, graphical accuracy), feed on step 5', () => {
    expect(Math.abs(r.fractionalStages - 7.6)).toBeLessThan(0.3)
    expect(r.stages).toBe(8)
    expect(r.feedStage).toBe(5)
    expect(r.assumptions.at(-1)).toBe('equilibrium: benzene–toluene, ideal activity model at 101.325 kPa, ideal vapour')
  })
  it('the tabulated curve follows the bubble-point solver within 1e-5 in y', () => {
    const c = equilibriumCurve({ system: benzeneToluene, P })
    for (let x = 0.0005; x < 1; x += 0.0173)
      expect(Math.abs(c.y(x) - bubbleTemperature(benzeneToluene, { P, x1: x }).y1)).toBeLessThan(1e-5)
  })
  it('Fenske uses the geometric mean of the top and bottom α from the solver', () => {
    const f = fenske({ system: benzeneToluene, P }, { xD: 0.95, xB: 0.1 })
    const top = relativeVolatility(benzeneToluene, { P, x1: 0.95 }).alpha
    const bottom = relativeVolatility(benzeneToluene, { P, x1: 0.1 }).alpha
    expect(f.alpha).toBeCloseTo(Math.sqrt(top * bottom), 4)
    expect(f.alpha).toBeGreaterThan(2.3)
    expect(f.alpha).toBeLessThan(2.7)
  })
})

describe('1-propanol–water (NRTL, SVNA Table 12.5) has a minimum-boiling azeotrope', () => {
  const curve = equilibriumCurve({ system: propanolWater, P })
  it('near x = 0.43 and 87.7 °C (CRC Handbook; model vs handbook ±0.03 in x, ±1 K)', () => {
    expect(curve.azeotropes).toHaveLength(1)
    expect(Math.abs(curve.azeotropes[0] - 0.43)).toBeLessThan(0.03)
    expect(Math.abs(curve.T(curve.azeotropes[0])! - 273.15 - 87.7)).toBeLessThan(1)
  })
  it('a distillate above the azeotrope is unreachable: a clear error, never a loop', () => {
    expect(() => mccabeThiele({ system: propanolWater, P }, { xF: 0.1, q: 1, xD: 0.6, xB: 0.01, R: 5 })).toThrow(
      /^The azeotrope at x1 = 0\.44\d\d lies between xB = 0\.01 and xD = 0\.6: distillation at this pressure cannot cross it\.$/,
    )
    expect(() => minimumReflux({ system: propanolWater, P }, { xF: 0.1, q: 1, xD: 0.6 })).toThrow(/cannot cross it/)
  })
  it('below the azeotrope the column can be designed', () => {
    const r = mccabeThiele(
      { system: propanolWater, P },
      { xF: 0.05, q: 1, xD: 0.4, xB: 0.001, R: { timesMinimum: 1.3 } },
    )
    expect(r.stages).toBeGreaterThan(3)
    expect(r.steps.every((s) => s.T !== null && s.T > 360 && s.T < 373.5)).toBe(true)
  })
})
