import { describe, expect, it } from 'vitest'
import {
  activityCoefficients,
  excessGibbsOverRT,
  phaseDiagram,
  R,
  type ActivityModel,
  type BinarySystem,
} from '../../src/index.js'
import { CAL, EX_10_1, TABLE_12_5 } from './helpers/constants.js'

// Closed forms at infinite dilution, SVNA 7th ed. §12.1–12.2 (from memory):
//   Margules, Van Laar: ln γ1∞ = A12, ln γ2∞ = A21 (the definition of the constants);
//   Wilson: ln γ1∞ = −ln Λ12 + 1 − Λ21, ln γ2∞ = −ln Λ21 + 1 − Λ12;
//   NRTL: ln γ1∞ = τ21 + τ12·exp(−α τ12), ln γ2∞ = τ12 + τ21·exp(−α τ21).
// Parameter values: SVNA Table 12.5, 1-propanol/water (NRTL S, Wilson M).
const pw = TABLE_12_5.propanolWater
const T = 360

describe('activity models against their infinite-dilution closed forms', () => {
  it('Margules and Van Laar: ln γ∞ are the constants themselves', () => {
    for (const kind of ['margules', 'van-laar'] as const) {
      const m: ActivityModel = { kind, A12: 1.3, A21: 0.7 }
      expect(Math.log(activityCoefficients(m, { x1: 0, T })[0])).toBeCloseTo(1.3, 12)
      expect(Math.log(activityCoefficients(m, { x1: 1, T })[1])).toBeCloseTo(0.7, 12)
    }
  })
  it('Wilson', () => {
    const m: ActivityModel = { kind: 'wilson', a12: pw.a12 * CAL, a21: pw.a21 * CAL, V1: pw.V1, V2: pw.V2 }
    const L12 = (pw.V2 / pw.V1) * Math.exp(-(pw.a12 * CAL) / (R * T))
    const L21 = (pw.V1 / pw.V2) * Math.exp(-(pw.a21 * CAL) / (R * T))
    expect(Math.log(activityCoefficients(m, { x1: 0, T })[0])).toBeCloseTo(-Math.log(L12) + 1 - L21, 12)
    expect(Math.log(activityCoefficients(m, { x1: 1, T })[1])).toBeCloseTo(-Math.log(L21) + 1 - L12, 12)
  })
  it('NRTL', () => {
    const m: ActivityModel = { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha }
    const t12 = (pw.b12 * CAL) / (R * T)
    const t21 = (pw.b21 * CAL) / (R * T)
    expect(Math.log(activityCoefficients(m, { x1: 0, T })[0])).toBeCloseTo(t21 + t12 * Math.exp(-pw.alpha * t12), 12)
    expect(Math.log(activityCoefficients(m, { x1: 1, T })[1])).toBeCloseTo(t12 + t21 * Math.exp(-pw.alpha * t21), 12)
  })
  it('gE/RT: Margules x1·x2·(A21·x1 + A12·x2), Van Laar A12·A21·x1·x2/(A12·x1 + A21·x2), zero for pure liquids', () => {
    const x1 = 0.3
    const x2 = 0.7
    expect(excessGibbsOverRT({ kind: 'margules', A12: 1.3, A21: 0.7 }, { x1, T })).toBeCloseTo(
      x1 * x2 * (0.7 * x1 + 1.3 * x2),
      12,
    )
    expect(excessGibbsOverRT({ kind: 'van-laar', A12: 1.3, A21: 0.7 }, { x1, T })).toBeCloseTo(
      (1.3 * 0.7 * x1 * x2) / (1.3 * x1 + 0.7 * x2),
      12,
    )
    const uniquac: ActivityModel = { kind: 'uniquac', a12: 400, a21: 900, r1: 2.78, r2: 0.92, q1: 2.51, q2: 1.4 }
    expect(excessGibbsOverRT(uniquac, { x1: 0, T })).toBeCloseTo(0, 12)
    expect(excessGibbsOverRT(uniquac, { x1: 1, T })).toBeCloseTo(0, 12)
  })
  it('UNIQUAC with identical molecules and no interaction is ideal', () => {
    const m: ActivityModel = { kind: 'uniquac', a12: 0, a21: 0, r1: 2, r2: 2, q1: 1.8, q2: 1.8 }
    const [g1, g2] = activityCoefficients(m, { x1: 0.4, T })
    expect(g1).toBeCloseTo(1, 12)
    expect(g2).toBeCloseTo(1, 12)
  })
})

describe('isothermal P–x–y diagram', () => {
  // SVNA 7th ed. Example 10.1 at 75 °C (Raoult's law): the P–x line runs from P2sat = 41.98 kPa to
  // P1sat = 83.21 kPa and is straight (reference-values.md §3, M+C).
  it('is straight from P2sat to P1sat for Raoult’s law', () => {
    const system: BinarySystem = {
      vaporPressure: [EX_10_1.acetonitrile, EX_10_1.nitromethane],
      activity: { kind: 'ideal' },
    }
    const d = phaseDiagram(system, { T: 348.15 }, { points: 21 })
    if (d.kind !== 'isothermal') throw new Error('expected isothermal')
    expect(Math.abs(d.P[0] / 1000 - 41.98)).toBeLessThan(0.005)
    expect(Math.abs(d.P[20] / 1000 - 83.21)).toBeLessThan(0.005)
    d.x1.forEach((x, i) => expect(d.P[i]).toBeCloseTo(d.P[0] + (d.P[20] - d.P[0]) * x, 6))
  })
})
