import type { BinarySystem } from '@ebullio/thermo'
import { describe, expect, it } from 'vitest'
import {
  DESIGN_PRESSURE_PA,
  extrapolationItems,
  isRangeWarning,
  outOfRangeLines,
  pressureVerdict,
  RANGE_MARGIN_K,
  volatilityNote,
} from './design-limits'

// Antoine constants, ln(P/kPa) = A − B/(t/°C + C), with their stated ranges: Smith, Van Ness & Abbott,
// Introduction to Chemical Engineering Thermodynamics, 7th ed., Table B.2 (acetone −26 to 77 °C, methanol −11 to 83 °C).
// Wilson a12, a21 (cal/mol → J/mol) and molar volumes: SVNA 7th ed., Table 12.5.
const CAL = 4.184
const acetoneMethanol: BinarySystem = {
  vaporPressure: [
    {
      kind: 'antoine',
      A: 14.3145,
      B: 2756.22,
      C: 228.06,
      log: 'ln',
      pressureUnit: 'kPa',
      temperatureUnit: 'C',
      range: [-26, 77],
    },
    {
      kind: 'antoine',
      A: 16.5785,
      B: 3638.27,
      C: 239.5,
      log: 'ln',
      pressureUnit: 'kPa',
      temperatureUnit: 'C',
      range: [-11, 83],
    },
  ],
  activity: { kind: 'wilson', a12: -161.88 * CAL, a21: 583.11 * CAL, V1: 74.05, V2: 40.73 },
  names: ['acetone', 'methanol'],
}
const names: [string, string] = ['acetone', 'methanol']
const celsius = {
  fmtT: (T: number, d = 2) => `${(T - 273.15).toFixed(d)} °C`,
  tFromK: (T: number) => T - 273.15,
  dT: (d: number) => d,
  dTLabel: () => 'K',
}

describe('pressureVerdict (acetone / methanol, SVNA 7th ed. Tables B.2 and 12.5)', () => {
  it('at 1 atm: both normal boiling points inside their ranges (56.2 and 64.7 °C, Table B.2), acetone the lighter, designs open', () => {
    const v = pressureVerdict(acetoneMethanol, 101325, names)
    expect(Math.abs(v.pure[0].T - 273.15 - 56.2)).toBeLessThan(0.1)
    expect(Math.abs(v.pure[1].T - 273.15 - 64.7)).toBeLessThan(0.1)
    expect(v.lighter).toBe(0)
    expect(v.designBlocked).toBe(false)
    expect(outOfRangeLines(v, celsius)).toEqual([])
  })

  it('at 60 bar: the Antoine lines cross, so methanol boils lower and is the lighter; both far above range, designs blocked', () => {
    const v = pressureVerdict(acetoneMethanol, 60e5, names)
    expect(v.pure[0].T).toBeGreaterThan(v.pure[1].T)
    expect(v.lighter).toBe(1)
    expect(v.designBlocked).toBe(true)
    expect(v.pure[0].side).toBe('above')
    expect(outOfRangeLines(v, celsius)[0]).toBe(
      `acetone boils at ${(v.pure[0].T - 273.15).toFixed(2)} °C, ${(v.pure[0].T - 350.15).toFixed(1)} K above its vapour-pressure equation's range (-26 to 77 °C)`,
    )
  })

  it('at 1 kPa: acetone boils below −26 °C, but by less than the margin; designs stay open and the banner says so', () => {
    const v = pressureVerdict(acetoneMethanol, 1000, names)
    expect(v.pure[0].side).toBe('below')
    expect(v.pure[0].beyondK).toBeLessThan(RANGE_MARGIN_K)
    expect(v.designBlocked).toBe(false)
    // acetone and methanol below their ranges, and the activity model far from the measured pressure
    expect(extrapolationItems(acetoneMethanol, v, null, '101.33 kPa', celsius)).toHaveLength(3)
  })

  it("at the field's limits: 0.5 kPa stays within the margin (acetone ≈ −44 °C), 5 MPa is blocked (acetone ≈ 247 °C)", () => {
    const low = pressureVerdict(acetoneMethanol, DESIGN_PRESSURE_PA.min, names)
    expect(low.pure[0].beyondK).toBeGreaterThan(15)
    expect(low.designBlocked).toBe(false)
    expect(pressureVerdict(acetoneMethanol, DESIGN_PRESSURE_PA.max, names).designBlocked).toBe(true)
  })

  it('names a component whose vapour pressure leaves its range only inside the diagram, once, with the limit crossed', () => {
    const v = pressureVerdict(acetoneMethanol, 101325, names)
    // Tmax 90 °C lies above acetone's 77 °C and methanol's 83 °C although both boiling points are inside.
    const items = extrapolationItems(acetoneMethanol, v, { Tmin: 329.35, Tmax: 363.15 }, null, celsius)
    expect(items).toEqual([
      "acetone's vapour pressure above 77 °C in part of the diagram (its equation covers -26 to 77 °C)",
      "methanol's vapour pressure above 83 °C in part of the diagram (its equation covers -11 to 83 °C)",
    ])
  })
})

describe('volatilityNote', () => {
  it('says "reverses" only when the α range straddles 1', () => {
    expect(volatilityNote(0.9, 2.1, names)).toBe(
      'Crosses 1: the order of volatility reverses across composition (an azeotrope).',
    )
    expect(volatilityNote(0.39, 0.93, names)).toBe(
      'Below 1 across the whole range: methanol is the more volatile throughout.',
    )
    expect(volatilityNote(1.3, 2.5, names)).toBe(
      'Above 1 across the whole range: acetone is the more volatile throughout.',
    )
  })
})

describe('isRangeWarning', () => {
  it('recognises both range warnings of the engine and nothing else', () => {
    expect(
      isRangeWarning(
        'acetone: 350.00 K (76.85 °C) is outside the range of its vapour-pressure correlation (-26 to 77 °C); the value is extrapolated.',
      ),
    ).toBe(true)
    expect(
      isRangeWarning(
        'n-hexane: temperatures from 68.70 to 98.40 °C reach outside the range of its vapour-pressure correlation (-19 to 92 °C); values there are extrapolated.',
      ),
    ).toBe(true)
    expect(
      isRangeWarning(
        'xD is at or below the vapour in equilibrium with the feed: any reflux ratio reaches it (Rmin = 0).',
      ),
    ).toBe(false)
  })
})
