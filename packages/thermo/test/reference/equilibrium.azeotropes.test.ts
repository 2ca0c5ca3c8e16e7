import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  findAzeotrope,
  relativeVolatility,
  saturationTemperature,
  vaporPressure,
  type BinarySystem,
} from '../../src/index.js'
import { b2, CAL, EX_10_1, TABLE_12_5 } from './helpers/constants.js'

const K = 273.15
const pw = TABLE_12_5.propanolWater
const mw = TABLE_12_5.methanolWater

describe('azeotropes at 101.325 kPa against the CRC Handbook (“Azeotropic Data for Binary Mixtures”)', () => {
  // Model: SVNA 7th ed. Table 12.5 NRTL for 1-propanol/water (S) with Table B.2 Antoine constants.
  // Handbook: 87.7 °C, 71.7 wt % 1-propanol, x ≈ 0.43, minimum-boiling (reference-values.md §5, S).
  // Tolerances 0.5 K and 0.03 in x1: the model is a fit to other data, and the boiling curve is flat there.
  it('1-propanol/water (NRTL, Table 12.5): 87.7 °C, x1 ≈ 0.43, minimum-boiling', () => {
    const system: BinarySystem = {
      vaporPressure: [b2('1-propanol'), b2('water')],
      activity: { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha },
    }
    const az = findAzeotrope(system, { P: 101325 })
    expect(az).not.toBeNull()
    expect(az!.kind).toBe('minimum-boiling')
    expect(Math.abs(az!.T - K - 87.7)).toBeLessThan(0.5)
    expect(Math.abs(az!.x1 - 0.43)).toBeLessThan(0.03)
    const b = bubbleTemperature(system, { P: 101325, x1: az!.x1 })
    expect(Math.abs(b.y1 - az!.x1)).toBeLessThan(1e-9)
    expect(Math.abs(b.T - az!.T)).toBeLessThan(1e-6)
  })
  it('1-propanol/water (Wilson, Table 12.5, from memory): same azeotrope within the same tolerances', () => {
    const system: BinarySystem = {
      vaporPressure: [b2('1-propanol'), b2('water')],
      activity: { kind: 'wilson', a12: pw.a12 * CAL, a21: pw.a21 * CAL, V1: pw.V1, V2: pw.V2 },
    }
    const az = findAzeotrope(system, { P: 101325 })!
    expect(Math.abs(az.T - K - 87.7)).toBeLessThan(0.5)
    expect(Math.abs(az.x1 - 0.43)).toBeLessThan(0.03)
  })
  // Handbook: methanol–water has no azeotrope (S). Table 12.5 methanol/water NRTL (M).
  it('methanol/water (NRTL, Table 12.5, from memory): no azeotrope', () => {
    const system: BinarySystem = {
      vaporPressure: [b2('methanol'), b2('water')],
      activity: { kind: 'nrtl', b12: mw.b12 * CAL, b21: mw.b21 * CAL, alpha: mw.alpha },
    }
    expect(findAzeotrope(system, { P: 101325 })).toBeNull()
  })
  it('an isothermal search finds the same composition family (maximum pressure = minimum boiling)', () => {
    const system: BinarySystem = {
      vaporPressure: [b2('1-propanol'), b2('water')],
      activity: { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha },
    }
    const az = findAzeotrope(system, { T: 87.5 + K })!
    expect(az.kind).toBe('minimum-boiling')
    expect(Math.abs(az.P / 101325 - 1)).toBeLessThan(0.01)
  })
})

describe('azeotropes near the ends, and a curve that only touches the diagonal', () => {
  // Constructed cases (no source needed: they follow from the definitions). Nitromethane (1) is the heavier
  // component, acetonitrile (2) the lighter (SVNA Ex. 10.1 constants). Symmetric Margules with
  // A = ln(P / P1sat(T2sat)) makes α12 = 1 exactly at x1 = 0: the x–y curve touches the diagonal there.
  const P = 70000
  const T2 = saturationTemperature(EX_10_1.acetonitrile, P)
  const A = Math.log(P / vaporPressure(EX_10_1.nitromethane, T2))
  const system = (A12: number): BinarySystem => ({
    vaporPressure: [EX_10_1.nitromethane, EX_10_1.acetonitrile],
    activity: { kind: 'margules', A12, A21: A12 },
  })
  it('touching the diagonal at a pure component is not an azeotrope', () => {
    expect(Math.abs(relativeVolatility(system(A), { P, x1: 0 }).alpha - 1)).toBeLessThan(1e-12)
    expect(findAzeotrope(system(A), { P })).toBeNull()
  })
  it('a slightly stronger deviation gives a real azeotrope close to x1 = 0, and it is found', () => {
    const az = findAzeotrope(system(A + 0.01), { P })!
    expect(az).not.toBeNull()
    expect(az.x1).toBeGreaterThan(0)
    expect(az.x1).toBeLessThan(0.02)
    expect(az.kind).toBe('minimum-boiling')
    const b = bubbleTemperature(system(A + 0.01), { P, x1: az.x1 })
    expect(Math.abs(b.y1 - az.x1)).toBeLessThan(1e-10)
  })
  it('negative deviation gives a maximum-boiling azeotrope', () => {
    const s: BinarySystem = {
      vaporPressure: [b2('benzene'), b2('cyclohexane')],
      activity: { kind: 'margules', A12: -0.6, A21: -0.6 },
    }
    const az = findAzeotrope(s, { P: 101325 })!
    expect(az.kind).toBe('maximum-boiling')
    expect(az.T).toBeGreaterThan(saturationTemperature(b2('cyclohexane'), 101325))
  })
})
