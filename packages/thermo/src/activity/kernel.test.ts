import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { lnGammaT, nrtlDlnGamma1Dx1, nrtlTauGradient } from './kernel.js'
import { R } from '../types.js'
import type { ActivityModel } from '../types.js'

// Self-consistency, not a reference check: analytic ∂ln γ/∂T against central differences,
// and Gibbs–Duhem x1·dln γ1 + x2·dln γ2 = 0 at constant T (true for every gE model).
const models: ActivityModel[] = [
  { kind: 'wilson', a12: 775.48 * 4.184, a21: 1351.9 * 4.184, V1: 75.14, V2: 18.07 },
  { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha: 0.5081 },
  { kind: 'uniquac', a12: 300, a21: 900, r1: 2.77, r2: 0.92, q1: 2.51, q2: 1.4 },
]

describe('activity kernel', () => {
  const out = new Float64Array(4)
  const val = (m: ActivityModel, x: number, T: number) => {
    lnGammaT(m, x, T, out)
    return [out[0], out[1], out[2], out[3]]
  }
  for (const m of models) {
    it(`${m.kind}: analytic T-derivatives match finite differences`, () => {
      for (const x of [0, 0.1, 0.5, 0.9, 1]) {
        const [, , d1, d2] = val(m, x, 350)
        const up = val(m, x, 350.001)
        const dn = val(m, x, 349.999)
        expect(d1).toBeCloseTo((up[0] - dn[0]) / 0.002, 7)
        expect(d2).toBeCloseTo((up[1] - dn[1]) / 0.002, 7)
      }
    })
    it(`${m.kind}: obeys Gibbs–Duhem and vanishes for the pure component`, () => {
      for (const x of [0.2, 0.5, 0.8]) {
        const up = val(m, x + 1e-6, 350)
        const dn = val(m, x - 1e-6, 350)
        expect(x * (up[0] - dn[0]) + (1 - x) * (up[1] - dn[1])).toBeCloseTo(0, 10)
      }
      expect(val(m, 1, 350)[0]).toBeCloseTo(0, 14)
      expect(val(m, 0, 350)[1]).toBeCloseTo(0, 14)
    })
  }
})

describe('NRTL parameter gradient (fits’ Jacobians)', () => {
  it('the analytic ∂ln γ/∂τ agree with central differences in b12 and b21', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        fc.double({ min: 280, max: 450, noNaN: true }),
        fc.double({ min: -2000, max: 8000, noNaN: true }),
        fc.double({ min: -2000, max: 8000, noNaN: true }),
        fc.double({ min: 0.1, max: 0.7, noNaN: true }),
        fc.double({ min: -15, max: 15, noNaN: true }),
        (x1, T, b12, b21, alpha, slope) => {
          const m = { kind: 'nrtl' as const, b12, b21, alpha, b12T: slope, b21T: -slope }
          const out = new Float64Array(4)
          nrtlTauGradient(m, x1, T, out)
          const h = 1e-3
          const g = new Float64Array(4)
          const lnAt = (dm: Partial<typeof m>) => {
            lnGammaT({ ...m, ...dm }, x1, T, g)
            return [g[0], g[1]]
          }
          // ∂τ/∂b = 1/RT, so ∂ln γ/∂τ = RT·∂ln γ/∂b.
          const RT = R * T
          const [u1, u2] = lnAt({ b12: b12 + h })
          const [d1, d2] = lnAt({ b12: b12 - h })
          expect(out[0]).toBeCloseTo((RT * (u1 - d1)) / (2 * h), 5)
          expect(out[1]).toBeCloseTo((RT * (u2 - d2)) / (2 * h), 5)
          const [v1, v2] = lnAt({ b21: b21 + h })
          const [w1, w2] = lnAt({ b21: b21 - h })
          expect(out[2]).toBeCloseTo((RT * (v1 - w1)) / (2 * h), 5)
          expect(out[3]).toBeCloseTo((RT * (v2 - w2)) / (2 * h), 5)
        },
      ),
      { numRuns: 200, seed: 11 },
    )
  })
})

describe('NRTL ∂ln γ1/∂x1 (liquid-stability screens)', () => {
  it('agrees with central differences in x1', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.001, max: 0.999, noNaN: true }),
        fc.double({ min: 280, max: 450, noNaN: true }),
        fc.double({ min: -2000, max: 9000, noNaN: true }),
        fc.double({ min: -2000, max: 9000, noNaN: true }),
        fc.double({ min: 0.1, max: 0.7, noNaN: true }),
        (x1, T, b12, b21, alpha) => {
          const m = { kind: 'nrtl' as const, b12, b21, alpha, b12T: 3, b21T: -2 }
          const g = new Float64Array(4)
          const h = 1e-6 * Math.min(x1, 1 - x1)
          lnGammaT(m, x1 + h, T, g)
          const up = g[0]
          lnGammaT(m, x1 - h, T, g)
          const fd = (up - g[0]) / (2 * h)
          expect(nrtlDlnGamma1Dx1(m, x1, T)).toBeCloseTo(fd, Math.max(0, 4 - Math.ceil(Math.log10(Math.abs(fd) + 1))))
        },
      ),
      { numRuns: 300, seed: 5 },
    )
  })
})
