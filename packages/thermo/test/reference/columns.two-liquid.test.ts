import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  equilibriumCurve,
  fenske,
  findAzeotropes,
  mccabeThiele,
  minimumReflux,
  R,
  simpleBatchDistillation,
  ThermoError,
  type BinarySystem,
  type VaporPressureModel,
} from '../../src/index.js'

// Design on a partially miscible pair: water (1) – 1-butanol (2), ChemSep NRTL parameters as distributed in
// Python `thermo` 0.6.1 and Poling Antoine constants as distributed in `chemicals` 1.5.2 (see
// equilibrium.water-butanol.test.ts). The checks are against the engine's own equilibrium functions (the
// curve must be the stable one) and the trade rule that a heterogeneous azeotrope needs a decanter to be crossed
// (common practice, no source).
const antoine = (A: number, B: number, C: number): VaporPressureModel => ({
  kind: 'antoine',
  A,
  B,
  C,
  log: 'log10',
  pressureUnit: 'Pa',
  temperatureUnit: 'K',
})
const system: BinarySystem = {
  vaporPressure: [antoine(10.11564, 1687.537, -42.98), antoine(9.6493, 1395.14, -90.411)],
  activity: { kind: 'nrtl', b12: 1325.3268195999854 * R, b21: 253.64181754760426 * R, alpha: 0.4447 },
  names: ['water', '1-butanol'],
}
const P = 101325
const source = { system, P }
const tp = findAzeotropes(system, { P })[0]

describe('equilibrium curve of a partially miscible system', () => {
  const curve = equilibriumCurve(source)
  it('is flat at the three-phase vapour across the tie line, and reports it', () => {
    expect(curve.twoLiquid!.x1I).toBeCloseTo(tp.liquidPhases![0], 10)
    expect(curve.twoLiquid!.x1II).toBeCloseTo(tp.liquidPhases![1], 10)
    expect(curve.twoLiquid!.heterogeneousAzeotrope).toBe(true)
    for (const x of [0.6, 0.7, 0.8, 0.9, 0.98]) {
      expect(curve.y(x)).toBeCloseTo(tp.x1, 10)
      expect(curve.T(x)).toBeCloseTo(tp.T, 8)
    }
    expect(curve.azeotropes).toEqual([tp.x1])
    expect(curve.warnings[0]).toContain('separate into two layers')
  })
  it('agrees with the stable bubble points off the tie line to 2e-5 in y (interpolation)', () => {
    for (const x of [0.01, 0.1, 0.3, 0.5, 0.58, 0.985, 0.995]) {
      expect(Math.abs(curve.y(x) - bubbleTemperature(system, { P, x1: x }).y1)).toBeLessThan(2e-5)
    }
  })
})

describe('design functions', () => {
  it('refuse a separation across the heterogeneous azeotrope: a decanter is needed to cross it', () => {
    for (const run of [
      () => mccabeThiele(source, { xF: 0.5, q: 1, xD: 0.9, xB: 0.01, R: 3 }),
      () => fenske(source, { xD: 0.9, xB: 0.01 }),
      () => minimumReflux(source, { xF: 0.5, q: 1, xD: 0.9 }),
    ]) {
      expect(run).toThrow(ThermoError)
      expect(run).toThrow(/a decanter is needed to cross it/)
    }
  })
  it('stage on the stable curve on the butanol side, with a feed inside the two-liquid region', () => {
    const m = mccabeThiele(source, { xF: 0.65, q: 1, xD: 0.75, xB: 0.01, R: 1 })
    expect(m.stages).toBeGreaterThan(2)
    for (const s of m.steps) {
      const b = bubbleTemperature(system, { P, x1: s.x })
      expect(Math.abs(s.y - b.y1)).toBeLessThan(2e-5)
      expect(s.T!).toBeGreaterThanOrEqual(tp.T - 1e-6)
    }
    expect(m.warnings.some((w) => w.includes('two layers'))).toBe(true)
  })
  it('a batch still charged inside the two-liquid region first distils the three-phase vapour', () => {
    const run = simpleBatchDistillation(source, { charge: { moles: 100, x1: 0.7 }, until: { potX1: 0.3 } })
    expect(run.frames[0].instantaneousDistillateY1).toBeCloseTo(tp.x1, 8)
    expect(run.frames[0].potT!).toBeCloseTo(tp.T, 6)
  })
})
