/**
 * Simple batch distillation against published and closed-form results.
 * - Constant-α Rayleigh closed form: ln(L/L0) = [ln(x/x0) + α·ln((1 − x0)/(1 − x))]/(α − 1)
 *   (integration of dx/(y − x) with y = αx/(1 + (α − 1)x); e.g. Geankoplis, Transport Processes and Separation
 *   Process Principles, 4th ed., §11.3 — from memory). Tolerance 1e-7 relative: the integrator's own tolerance is 1e-9 per step.
 * - Geankoplis 4th ed., Example 11.3-2: 100 mol of 50 mol % n-pentane/n-heptane at 101.32 kPa, distilled until 40 mol
 *   has gone over, with the equilibrium table given there (tag S). Remaining liquid x ≈ 0.279 with monotone-spline
 *   interpolation (tag C), book's graphical answer about 0.277 (tag M): ±0.003 and ±0.005.
 */
import { describe, expect, it } from 'vitest'
import { simpleBatchDistillation } from '../../src/batch/index.js'

const closedFormPot = (alpha: number, x0: number, x: number, L0: number) =>
  L0 * Math.exp((Math.log(x / x0) + alpha * Math.log((1 - x0) / (1 - x))) / (alpha - 1))

describe('Rayleigh, constant α: numerical integration vs closed form', () => {
  it.each([
    [2.5, 0.5, 0.2],
    [1.3, 0.4, 0.1],
    [6, 0.9, 0.05],
    [2.5, 0.5, 0.001],
  ])('α = %d, x0 = %d → pot x = %d', (alpha, x0, x) => {
    const r = simpleBatchDistillation({ alpha }, { charge: { moles: 100, x1: x0 }, until: { potX1: x } })
    const L = closedFormPot(alpha, x0, x, 100)
    expect(Math.abs(r.end.potMoles - L) / L).toBeLessThan(1e-7)
  })
  it('every frame lies on the closed form', () => {
    const r = simpleBatchDistillation(
      { alpha: 3 },
      { charge: { moles: 1, x1: 0.6 }, until: { potMoles: 0.05 }, frames: 200 },
    )
    for (const f of r.frames.slice(1))
      expect(Math.abs(f.potMoles - closedFormPot(3, 0.6, f.potX1, 1)) / f.potMoles).toBeLessThan(1e-7)
  })
})

describe('Geankoplis 4th ed. Example 11.3-2 (n-pentane/n-heptane, equilibrium table from the example)', () => {
  const table = [
    { x: 0.059, y: 0.271 },
    { x: 0.145, y: 0.521 },
    { x: 0.254, y: 0.701 },
    { x: 0.398, y: 0.836 },
    { x: 0.594, y: 0.925 },
    { x: 0.867, y: 0.984 },
  ]
  const r = simpleBatchDistillation({ table }, { charge: { moles: 100, x1: 0.5 }, until: { distillateMoles: 40 } })
  it('remaining liquid x ≈ 0.279 (monotone spline, C) and about 0.277 (book, graphical, M)', () => {
    expect(r.end.potMoles).toBeCloseTo(60, 9)
    expect(Math.abs(r.end.potX1 - 0.279)).toBeLessThan(0.003)
    expect(Math.abs(r.end.potX1 - 0.277)).toBeLessThan(0.005)
  })
  it('the distillate balance closes: 40·xD + 60·x = 50', () => {
    expect(40 * r.end.distillateX1 + 60 * r.end.potX1).toBeCloseTo(50, 9)
  })
})
