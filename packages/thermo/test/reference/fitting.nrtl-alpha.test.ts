import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  fitBinary,
  predictionBand,
  suggestNextCompositions,
  type BinaryPoint,
  type BinarySystem,
} from '../../src/index.js'
import { b2, CAL, TABLE_12_5 } from './helpers/constants.js'
import { seededRandom as prng } from '../../src/random.js'

// A fitted NRTL α stays within 0.1–0.7 (common practice, no source; Renon and Prausnitz recommended
// about 0.2–0.47, from memory). Data: acetone/methanol generated from SVNA 7th ed. Table 12.5 Wilson
// parameters (M, per reference-values.md) with Table B.2 Antoine constants, 101.325 kPa, seeded Gaussian
// noise σT = 0.1 K, σy = 0.005. Wilson data do not pin an NRTL α, so the fit must say so.
const am = TABLE_12_5.acetoneMethanol
const acetoneMethanol: BinarySystem = {
  vaporPressure: [b2('acetone'), b2('methanol')],
  activity: { kind: 'wilson', a12: am.a12 * CAL, a21: am.a21 * CAL, V1: am.V1, V2: am.V2 },
}
function generate(system: BinarySystem, seed: number, n = 15): BinaryPoint[] {
  const rng = prng(seed)
  return Array.from({ length: n }, (_, i) => {
    const x1 = 0.05 + (0.9 * i) / (n - 1)
    const b = bubbleTemperature(system, { P: 101325, x1 })
    return { T: b.T + 0.1 * rng.gaussian(), P: 101325, x1, y1: b.y1 + 0.005 * rng.gaussian() }
  })
}
const fitNrtl = (points: BinaryPoint[], system: BinarySystem) =>
  fitBinary({ points, vaporPressure: system.vaporPressure, model: 'nrtl', fitAlpha: true })

describe('fitBinary with a fitted NRTL α', () => {
  it('acetone/methanol (Wilson-generated, seed 1): α is held at its bound 0.7 and says so', () => {
    const fit = fitNrtl(generate(acetoneMethanol, 1), acetoneMethanol)
    expect(fit.converged).toBe(true)
    expect(fit.parameters.map((p) => p.name)).toEqual(['b12', 'b21', 'alpha'])
    expect(fit.parameters[2]).toEqual({ name: 'alpha', value: 0.7, standardError: null, atBound: true })
    expect(fit.warnings).toContain('α reached its bound 0.7: the data do not determine α; hold it at a fixed value.')
    // Covariance of the two remaining parameters, with finite standard errors.
    expect(fit.covariance.length).toBe(2)
    for (const p of fit.parameters.slice(0, 2)) expect(Number.isFinite(p.standardError)).toBe(true)
    expect(fit.settings.fitAlpha).toBe(false)
    expect(fit.settings.alpha).toBe(0.7)
    // The band and the suggestions still work on the held fit.
    expect(predictionBand(fit, { P: 101325, points: 11 }).sigmaY.every(Number.isFinite)).toBe(true)
    expect(suggestNextCompositions(fit, { P: 101325, count: 2 }).length).toBe(2)
  })

  it('acetone/methanol over eight seeds: α never leaves 0.1–0.7 and a held α always carries its warning', () => {
    for (let seed = 1; seed <= 8; seed++) {
      const fit = fitNrtl(generate(acetoneMethanol, seed), acetoneMethanol)
      const a = fit.parameters[2]
      expect(a.value).toBeGreaterThanOrEqual(0.1)
      expect(a.value).toBeLessThanOrEqual(0.7)
      expect(fit.warnings.some((w) => w.startsWith('α reached its bound'))).toBe(a.atBound === true)
      if (!fit.converged)
        expect(fit.warnings).toContain('The fit stopped before it fully converged; treat the parameters with care.')
    }
  })

  it('1-propanol/water round trip (SVNA Table 12.5 NRTL, α = 0.5081): α is fitted inside and recovered within 3σ', () => {
    const pw = TABLE_12_5.propanolWater
    const system: BinarySystem = {
      vaporPressure: [b2('1-propanol'), b2('water')],
      activity: { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha },
    }
    const fit = fitNrtl(generate(system, 7, 40), system)
    expect(fit.converged).toBe(true)
    const a = fit.parameters[2]
    expect(a.atBound).toBeUndefined()
    expect(fit.covariance.length).toBe(3)
    expect(Math.abs(a.value - pw.alpha)).toBeLessThan(3 * (a.standardError as number))
    expect(Math.abs(fit.parameters[0].value - pw.b12 * CAL)).toBeLessThan(
      3 * (fit.parameters[0].standardError as number),
    )
    expect(Math.abs(fit.parameters[1].value - pw.b21 * CAL)).toBeLessThan(
      3 * (fit.parameters[1].standardError as number),
    )
  })
})
