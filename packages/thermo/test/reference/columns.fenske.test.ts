/**
 * Fenske equation and total-reflux stepping, constant relative volatility.
 * Sources: reference-values §6 "Fenske with constant α = 2.5, xD = 0.98, xB = 0.02: Nmin = 8.4947 stages
 * including the reboiler" (tag C, recomputed from the equation). For constant α, stepping at total reflux
 * multiplies x/(1 − x) by 1/α per stage exactly, so the staircase must agree with Fenske (the equation itself,
 * M. R. Fenske, Ind. Eng. Chem. 24 (1932) 482 — citation from memory).
 */
import { describe, expect, it } from 'vitest'
import { fenske, mccabeThiele } from '../../src/columns/index.js'

describe('Fenske, constant α (reference-values §6, tag C)', () => {
  const cases = [
    // alpha, xD, xB, Nmin, tolerance, source
    [2.5, 0.98, 0.02, 8.4947, 5e-5, 'reference-values §6 (C)'],
    [2, 0.9, 0.1, Math.log(81) / Math.log(2), 1e-12, 'equation by hand: ln 81 / ln 2'],
  ] as const
  it.each(cases)('α = %d, xD = %d, xB = %d → Nmin = %d', (alpha, xD, xB, Nmin, tol) => {
    const r = fenske({ alpha }, { xD, xB })
    expect(Math.abs(r.Nmin - Nmin)).toBeLessThan(tol)
    expect(r.alpha).toBe(alpha)
    expect(r.includesReboiler).toBe(true)
  })
})

describe('McCabe–Thiele at total reflux agrees with Fenske for constant α', () => {
  it('lands on xB after exactly 8 stages when Fenske says 8', () => {
    const alpha = 2.5
    const xD = 0.98
    const ratio = xD / (1 - xD) / alpha ** 8
    const xB = (ratio / (1 + ratio)) * (1 + 1e-9)
    expect(fenske({ alpha }, { xD, xB }).Nmin).toBeCloseTo(8, 6)
    const r = mccabeThiele({ alpha }, { xF: 0.5, q: 1, xD, xB, R: Infinity })
    expect(r.stages).toBe(8)
    expect(r.fractionalStages).toBeCloseTo(8, 6)
    expect(r.feedStage).toBeNull()
  })

  it.each([
    [2.5, 0.98, 0.02],
    [1.5, 0.95, 0.05],
    [4, 0.999, 0.01],
  ])('α = %d, xD = %d, xB = %d: Fenske lies within the last stepped stage', (alpha, xD, xB) => {
    const N = fenske({ alpha }, { xD, xB }).Nmin
    const r = mccabeThiele({ alpha }, { xF: 0.5, q: 1, xD, xB, R: Infinity })
    expect(r.stages).toBe(Math.ceil(N))
    expect(Math.abs(r.fractionalStages - N)).toBeLessThan(0.5)
  })
})
