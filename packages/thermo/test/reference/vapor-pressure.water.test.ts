import psychrolib from 'psychrolib'
import { describe, expect, it } from 'vitest'
import { saturationTemperature, vaporPressure, vaporPressureRangeWarnings } from '../../src/index.js'
import { b2 } from './helpers/constants.js'

const water = b2('water') // SVNA Table B.2 (S)

describe('water vapour pressure against independent references', () => {
  // psychrolib (npm) implements the ASHRAE Handbook—Fundamentals 2017, ch. 1 (Hyland–Wexler) formula.
  // SVNA's water row differs from IAPWS-IF97 by up to about 0.6 % over 0–200 °C (reference-values.md §1, C).
  it('agrees with psychrolib GetSatVapPres within 0.6 % from 5 to 95 °C', () => {
    psychrolib.SetUnitSystem(psychrolib.SI)
    for (let t = 5; t <= 95; t += 5) {
      const ref = psychrolib.GetSatVapPres(t)
      expect(Math.abs(vaporPressure(water, t + 273.15) / ref - 1)).toBeLessThan(0.006)
    }
  })

  // psychrolib values at 25, 50, 100 °C recomputed here (reference-values.md §2, C), so the
  // comparison above is known to be against the right function.
  it('psychrolib itself gives the recorded values', () => {
    psychrolib.SetUnitSystem(psychrolib.SI)
    expect(psychrolib.GetSatVapPres(25)).toBeCloseTo(3169.2165, 3)
    expect(psychrolib.GetSatVapPres(100)).toBeCloseTo(101418.7168, 3)
  })

  // IAPWS-IF97 (IAPWS R7-97) check values (reference-values.md §2, M reproduced by an independent implementation).
  const if97 = [
    { what: 'Psat(300 K) = 3.53658941e-3 MPa', got: () => vaporPressure(water, 300) / 3.53658941e3 - 1, tol: 0.006 },
    {
      what: 'Psat(500 K) = 2.63889776 MPa (extrapolated beyond 200 °C)',
      got: () => vaporPressure(water, 500) / 2.63889776e6 - 1,
      tol: 0.01,
    },
  ]
  for (const c of if97) {
    it(`IF97 ${c.what}: relative difference < ${c.tol}`, () => {
      expect(Math.abs(c.got())).toBeLessThan(c.tol)
    })
  }
  it('IF97 Tsat(0.1 MPa) = 372.755919 K within 0.05 K', () => {
    expect(Math.abs(saturationTemperature(water, 1e5) - 372.755919)).toBeLessThan(0.05)
  })
  it('500 K lies outside the Table B.2 range and is reported', () => {
    expect(vaporPressureRangeWarnings(water, 500, 'Water')).toEqual([
      'Water: 500.00 K (226.85 °C) is outside the range of its vapour-pressure correlation (0 to 200 °C); the value is extrapolated.',
    ])
  })
})
