import { describe, expect, it } from 'vitest'
import { saturationTemperature, vaporPressure, vaporPressureRangeWarnings } from '../../src/index.js'
import { b2 } from './helpers/constants.js'

const water = b2('water') // SVNA Table B.2 (S)

describe('water vapour pressure against independent references', () => {
  // Saturation pressures in Pa from psychrolib 1.1.1 (npm) `GetSatVapPres(t/°C)` in SI units, which implements the
  // ASHRAE Handbook—Fundamentals 2017, ch. 1 (Hyland–Wexler) formula; computed once and frozen here.
  const ASHRAE: [tC: number, pa: number][] = [
    [5, 872.4867],
    [15, 1705.4478],
    [25, 3169.2165],
    [35, 5627.8194],
    [45, 9593.2199],
    [55, 15759.7069],
    [65, 25038.6993],
    [75, 38592.357],
    [85, 57864.5194],
    [95, 84607.7555],
  ]
  // SVNA's water row differs from IAPWS-IF97 by up to about 0.6 % over 0–200 °C (reference-values.md §1, C).
  for (const [tC, pa] of ASHRAE) {
    it(`Psat(${tC} °C) = ${pa} Pa (ASHRAE 2017 via psychrolib 1.1.1) within 0.6 %`, () => {
      expect(Math.abs(vaporPressure(water, tC + 273.15) / pa - 1)).toBeLessThan(0.006)
      expect(Math.abs(saturationTemperature(water, pa) - (tC + 273.15))).toBeLessThan(0.15)
    })
  }

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
