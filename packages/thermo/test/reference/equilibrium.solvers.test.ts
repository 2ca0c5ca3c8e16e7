import { describe, expect, it } from 'vitest'
import {
  bubblePressure,
  bubbleTemperature,
  dewPressure,
  dewTemperature,
  phaseDiagram,
  type ActivityModel,
  type BinarySystem,
} from '../../src/index.js'
import { b2, CAL, TABLE_12_5 } from './helpers/constants.js'

// Solver behaviour, checked against the defining equations rather than a book: the bubble temperature
// must satisfy Σ xi·γi·Pi_sat(T) = P (checked through bubblePressure, which has no iteration) to
// better than 1e-6 K, at every composition including the pure ends, for every model.
// Parameters: SVNA 7th ed. Table 12.5 (1-propanol/water NRTL S, Wilson M) and Table B.2 constants;
// the Margules, Van Laar and UNIQUAC values are illustrative (no source needed for a self-consistency check).
const pw = TABLE_12_5.propanolWater
const models: ActivityModel[] = [
  { kind: 'ideal' },
  { kind: 'margules', A12: 1.2, A21: 0.8 },
  { kind: 'van-laar', A12: 2.2, A21: 1.1 },
  { kind: 'wilson', a12: pw.a12 * CAL, a21: pw.a21 * CAL, V1: pw.V1, V2: pw.V2 },
  { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha },
  { kind: 'uniquac', a12: 500, a21: 1200, r1: 2.78, r2: 0.92, q1: 2.51, q2: 1.4 },
]
const xs = [0, 1e-12, 1e-6, 0.001, 0.05, 0.25, 0.5, 0.75, 0.95, 0.999, 1 - 1e-9, 1]

describe('bubble and dew solvers converge everywhere', () => {
  for (const activity of models) {
    const system: BinarySystem = { vaporPressure: [b2('1-propanol'), b2('water')], activity }
    it(`${activity.kind}: bubble T at 1 atm satisfies the equilibrium equation to 1e-6 K for 0 ≤ x1 ≤ 1`, () => {
      for (const x1 of xs) {
        const r = bubbleTemperature(system, { P: 101325, x1 })
        const back = bubblePressure(system, { T: r.T, x1 })
        // d ln P/dT ≈ 0.03 /K here, so a relative pressure error of 1e-9 is about 3e-8 K.
        expect(Math.abs(back.P / 101325 - 1)).toBeLessThan(1e-9)
        expect(Math.abs(back.y1 - r.y1)).toBeLessThan(1e-8)
      }
    })
    it(`${activity.kind}: dew T inverts bubble T and dew P inverts bubble P`, () => {
      for (const x1 of [0, 0.1, 0.4, 0.8, 1]) {
        const b = bubbleTemperature(system, { P: 50000, x1 })
        const d = dewTemperature(system, { P: 50000, y1: b.y1 })
        expect(Math.abs(d.T - b.T)).toBeLessThan(1e-6)
        expect(Math.abs(d.x1 - x1)).toBeLessThan(1e-7)
        const bp = bubblePressure(system, { T: 350, x1 })
        const dp = dewPressure(system, { T: 350, y1: bp.y1 })
        expect(Math.abs(dp.P / bp.P - 1)).toBeLessThan(1e-9)
        expect(Math.abs(dp.x1 - x1)).toBeLessThan(1e-7)
      }
    })
  }
  it('pure ends give the pure-component boiling points exactly and y1 = x1', () => {
    const system: BinarySystem = { vaporPressure: [b2('1-propanol'), b2('water')], activity: models[4] }
    const water = bubbleTemperature(system, { P: 101325, x1: 0 })
    const propanol = bubbleTemperature(system, { P: 101325, x1: 1 })
    expect(water.y1).toBe(0)
    expect(propanol.y1).toBe(1)
    expect(Math.abs(water.T - 273.15 - 100.0)).toBeLessThan(0.01) // Table B.2 tn (S)
    expect(Math.abs(propanol.T - 273.15 - 97.2)).toBeLessThan(0.01) // Table B.2 tn (S)
  })
  it('works from a deep vacuum (1 kPa) to 5 bar', () => {
    const system: BinarySystem = { vaporPressure: [b2('1-propanol'), b2('water')], activity: models[4] }
    for (const P of [1000, 10000, 500000]) {
      const r = bubbleTemperature(system, { P, x1: 0.3 })
      expect(Math.abs(bubblePressure(system, { T: r.T, x1: 0.3 }).P / P - 1)).toBeLessThan(1e-9)
    }
  })
})

describe('dew point where plain substitution stalls', () => {
  // Found by a randomised search (illustrative parameters): cyclohexane (1) / 1-propanol (2), NRTL
  // b12 = 5135, b21 = 1997 J/mol, α = 0.231, y1 = 0.7018 at 1 atm. The substitution on x1 does not settle,
  // so the bracketed search on x1 must finish the job, and the answer must be a bubble point of its own x1.
  it('falls back to the bracketed search and still inverts the bubble point', () => {
    const system: BinarySystem = {
      vaporPressure: [b2('cyclohexane'), b2('1-propanol')],
      activity: { kind: 'nrtl', b12: 5134.952511172742, b21: 1996.7137286439538, alpha: 0.23102350528351964 },
    }
    const d = dewTemperature(system, { P: 101325, y1: 0.701814528554678 })
    const b = bubbleTemperature(system, { P: 101325, x1: d.x1 })
    expect(Math.abs(b.T - d.T)).toBeLessThan(1e-6)
    expect(Math.abs(b.y1 - 0.701814528554678)).toBeLessThan(1e-9)
  })
})

describe('no solution is reported, not looped on', () => {
  // Symmetric Margules with A > 2 splits into two liquids (SVNA 7th ed., §14.4, stability criterion; from memory).
  const split: BinarySystem = {
    vaporPressure: [b2('benzene'), b2('toluene')],
    activity: { kind: 'margules', A12: 3, A21: 3 },
  }
  // Binodal of symmetric Margules: ln(x/(1 − x)) = A·(2x − 1), solved here by bisection (closed form).
  const binodal = (A: number) => {
    let lo = 1e-12
    let hi = 0.5 - 1e-9
    for (let i = 0; i < 200; i++) {
      const m = 0.5 * (lo + hi)
      if (Math.log(m / (1 - m)) - A * (2 * m - 1) > 0) hi = m
      else lo = m
    }
    return 0.5 * (lo + hi)
  }
  it('a liquid that the model splits in two boils as two layers: the three-phase bubble point', () => {
    const b = bubbleTemperature(split, { P: 101325, x1: 0.5 })
    expect(b.gamma).toBeUndefined()
    expect(b.liquidPhases![0]).toBeCloseTo(binodal(3), 9)
    expect(b.liquidPhases![1]).toBeCloseTo(1 - binodal(3), 9)
    // Both layers have the bubble pressure of the vapour found, at the three-phase temperature.
    for (const x of b.liquidPhases!) {
      const p = bubblePressure(split, { T: b.T, x1: x })
      expect(Math.abs(p.P / 101325 - 1)).toBeLessThan(1e-8)
      expect(Math.abs(p.y1 - b.y1)).toBeLessThan(1e-8)
    }
  })
  it('the diagram has no single-liquid point inside the binodal and carries the three-phase line', () => {
    const d = phaseDiagram(split, { P: 101325 }, { points: 41 })
    if (d.kind !== 'isobaric') throw new Error('isobaric expected')
    const xI = binodal(3)
    expect(d.threePhase!.x1I).toBeCloseTo(xI, 9)
    expect(d.threePhase!.x1II).toBeCloseTo(1 - xI, 9)
    expect(d.x1.every((x) => x <= xI + 1e-9 || x >= 1 - xI - 1e-9)).toBe(true)
    expect(d.x1).toContain(d.threePhase!.x1I)
    expect(d.x1.length).toBeGreaterThan(10)
  })
  it('the still-dilute ends of a splitting system are solved', () => {
    expect(bubbleTemperature(split, { P: 101325, x1: 0.02 }).converged).toBe(true)
  })
})
