import psychrolib from 'psychrolib'
import { describe, expect, it } from 'vitest'
import { fitAntoine, fitClausiusClapeyron, saturationTemperature, vaporPressure } from '../../src/index.js'
import { b2 } from './helpers/constants.js'
import { seededRandom as prng } from '../../src/random.js'

// Round trips: points generated from SVNA Table B.2 constants (benzene, S) are fitted back.
const benzene = b2('benzene')
const temps = Array.from({ length: 12 }, (_, i) => 283.15 + 8 * i) // 10 to 98 °C, inside the table's range

describe('fitAntoine', () => {
  it('recovers the Table B.2 benzene constants from exact points', () => {
    const fit = fitAntoine(temps.map((T) => ({ T, P: vaporPressure(benzene, T) })))
    expect(fit.model.A).toBeCloseTo(13.7819, 6)
    expect(fit.model.B).toBeCloseTo(2726.81, 3)
    expect(fit.model.C).toBeCloseTo(217.572, 4)
    expect(fit.rmsRelative).toBeLessThan(1e-10)
    expect(fit.model.range).toEqual([10, 98].map((t) => expect.closeTo(t, 9)))
  })
  it('with 0.2 % noise on P, the true constants lie within 3 standard errors', () => {
    const rng = prng(20240601)
    const fit = fitAntoine(temps.map((T) => ({ T, P: vaporPressure(benzene, T) * (1 + 0.002 * rng.gaussian()) })))
    expect(Math.abs(fit.model.A - 13.7819)).toBeLessThan(3 * fit.standardErrors.A)
    expect(Math.abs(fit.model.B - 2726.81)).toBeLessThan(3 * fit.standardErrors.B)
    expect(Math.abs(fit.model.C - 217.572)).toBeLessThan(3 * fit.standardErrors.C)
    expect(fit.rmsRelative).toBeGreaterThan(0.001)
    expect(fit.rmsRelative).toBeLessThan(0.004)
    // A, B and C of Antoine are strongly correlated (common practice, no source).
    const rAB = fit.covariance[0][1] / Math.sqrt(fit.covariance[0][0] * fit.covariance[1][1])
    expect(rAB).toBeGreaterThan(0.9)
  })
  it('reports in log10 / mmHg / K when asked, describing the same curve', () => {
    const pts = temps.map((T) => ({ T, P: vaporPressure(benzene, T) }))
    const fit = fitAntoine(pts, { log: 'log10', pressureUnit: 'mmHg', temperatureUnit: 'K' })
    expect(fit.model.log).toBe('log10')
    expect(Math.abs(saturationTemperature(fit.model, 101325) - saturationTemperature(benzene, 101325))).toBeLessThan(
      1e-6,
    )
  })
  it('with exactly 3 points the fit is exact and says that standard errors need more', () => {
    const fit = fitAntoine([300, 330, 350].map((T) => ({ T, P: vaporPressure(benzene, T) })))
    expect(fit.model.B).toBeCloseTo(2726.81, 2)
    expect(Number.isNaN(fit.standardErrors.A)).toBe(true)
    expect(fit.warnings).toEqual([
      'With exactly 3 points the Antoine fit is exact; standard errors need at least 4 points.',
    ])
  })
  it('refuses too few, bad and non-monotonic points with exact messages', () => {
    expect(() =>
      fitAntoine([
        { T: 300, P: 1e4 },
        { T: 310, P: 2e4 },
      ]),
    ).toThrow('Fitting Antoine constants needs at least 3 points (T, P); got 2.')
    expect(() =>
      fitAntoine([
        { T: 300, P: 1e4 },
        { T: 310, P: -1 },
        { T: 320, P: 3e4 },
      ]),
    ).toThrow('Point 2: pressure must be a positive number of pascals; got -1.')
    expect(() =>
      fitAntoine([
        { T: 300, P: 1e4 },
        { T: NaN, P: 2e4 },
        { T: 320, P: 3e4 },
      ]),
    ).toThrow('Point 2: temperature must be a positive number of kelvins; got NaN.')
    expect(() =>
      fitAntoine([
        { T: 300, P: 1e4 },
        { T: 310, P: 2e4 },
        { T: 320, P: 1.5e4 },
      ]),
    ).toThrow(
      'Vapour pressure must rise with temperature, but the point at 320 K (15000 Pa) is not above the point at 310 K (20000 Pa).',
    )
  })
})

describe('fitAntoine on independent data: water from psychrolib (ASHRAE Handbook—Fundamentals 2017, ch. 1)', () => {
  psychrolib.SetUnitSystem(psychrolib.SI)
  const points = Array.from({ length: 19 }, (_, i) => ({ T: 283.15 + 5 * i, P: psychrolib.GetSatVapPres(10 + 5 * i) }))
  it('reproduces the IAPWS-IF97 boiling points within 0.05 K (IF97 check value Tsat(0.1 MPa) = 372.755919 K; tn 373.124 K)', () => {
    const fit = fitAntoine(points)
    expect(Math.abs(saturationTemperature(fit.model, 1e5) - 372.755919)).toBeLessThan(0.05)
    expect(Math.abs(saturationTemperature(fit.model, 101325) - 373.124)).toBeLessThan(0.05)
    expect(fit.rmsRelative).toBeLessThan(0.001)
  })
  it('lands near the classic log10/mmHg water constants for 1–100 °C, B = 1730.63, C = 233.426 (from memory)', () => {
    const fit = fitAntoine(points, { log: 'log10', pressureUnit: 'mmHg', temperatureUnit: 'C' })
    expect(Math.abs(fit.model.B - 1730.63)).toBeLessThan(10)
    expect(Math.abs(fit.model.C - 233.426)).toBeLessThan(1)
  })
})

describe('fitClausiusClapeyron', () => {
  // Water between 90 and 100 °C from Table B.2 (S); ΔHvap of water at 100 °C is 40.65 kJ/mol
  // (CRC Handbook, enthalpy of vaporization table; from memory). Two points give the mean over the interval.
  it('two points of water give ΔHvap within 2 % of 40.65 kJ/mol', () => {
    const water = b2('water')
    const fit = fitClausiusClapeyron([363.15, 373.15].map((T) => ({ T, P: vaporPressure(water, T) })))
    expect(Math.abs(fit.dHvap / 40650 - 1)).toBeLessThan(0.02)
    expect(Math.abs(vaporPressure(fit.model, 368.15) / vaporPressure(water, 368.15) - 1)).toBeLessThan(0.001)
  })
  it('one point needs a known ΔHvap', () => {
    expect(() => fitClausiusClapeyron([{ T: 373.15, P: 101325 }])).toThrow(
      'With one point, a Clausius–Clapeyron model needs a known enthalpy of vaporization (dHvap, J/mol).',
    )
    const fit = fitClausiusClapeyron([{ T: 373.15, P: 101325 }], { dHvap: 40650 })
    expect(saturationTemperature(fit.model, 101325)).toBeCloseTo(373.15, 9)
  })
})
