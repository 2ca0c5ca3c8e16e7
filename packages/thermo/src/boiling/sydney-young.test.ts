import { describe, expect, it } from 'vitest'
import { sydneyYoungCorrection } from './sydney-young.js'

describe('sydneyYoungCorrection', () => {
  it('applies Δt = c·(760 − p/mmHg)·T exactly (worked by hand)', () => {
    // 350 K at 740 mmHg, c = 0.00012: Δt = 0.00012 · 20 · 350 = 0.84 K
    const r = sydneyYoungCorrection({ T: 350, P: (740 * 101325) / 760 })
    expect(r.deltaT).toBeCloseTo(0.84, 12)
    expect(r.T).toBeCloseTo(350.84, 12)
    expect(r.c).toBe(0.00012)
    expect(r.warnings).toEqual([])
  })

  it('is zero at standard pressure and negative above it', () => {
    expect(sydneyYoungCorrection({ T: 373, P: 101325 }).deltaT).toBeCloseTo(0, 12)
    expect(sydneyYoungCorrection({ T: 373, P: 105000, c: 0.0001 }).deltaT).toBeLessThan(0)
  })

  it('warns far from standard pressure', () => {
    expect(sydneyYoungCorrection({ T: 330, P: 60000 }).warnings).toEqual([
      "The measurement pressure is 60.0 kPa, far from 101.325 kPa: Sydney Young's rule is meant for small differences; use a vapour-pressure equation instead.",
    ])
  })

  it.each([
    [{ T: -5, P: 101325 }, 'The boiling temperature must be a positive number of kelvin; got -5.'],
    [{ T: 350, P: 0 }, 'The pressure must be a positive number of pascals; got 0.'],
    [{ T: 350, P: Number.NaN }, 'The pressure must be a positive number of pascals; got NaN.'],
    [{ T: 350, P: 101325, c: -1 }, 'The Sydney Young coefficient c must be a positive number per mmHg; got -1.'],
  ])('rejects %j', (input, message) => {
    expect(() => sydneyYoungCorrection(input)).toThrow(message)
  })
})
