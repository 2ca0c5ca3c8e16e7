import { describe, expect, it } from 'vitest'
import type { ActivityModel } from '../types.js'
import { lnGammaT, T_REF } from './kernel.js'

// Temperature-dependent energies b(T) = b + bT·(T − 298.15 K): the model at T must equal the constant-energy model
// with b(T) (definition), and the analytic ∂ln γ/∂T must match a central difference (closed-form check).
const out = new Float64Array(4)
const lg = (m: ActivityModel, x1: number, T: number) => {
  lnGammaT(m, x1, T, out)
  return Array.from(out)
}

describe('temperature-dependent NRTL, Wilson and UNIQUAC energies', () => {
  const nrtl: ActivityModel = { kind: 'nrtl', b12: 2100, b21: 6800, alpha: 0.3, b12T: -4.2, b21T: 7.5 }
  const wilson: ActivityModel = { kind: 'wilson', a12: 1300, a21: 4100, V1: 58.7, V2: 18.07, a12T: 3.1, a21T: -6.4 }
  const rq = { r1: 2.1055, r2: 0.92, q1: 1.972, q2: 1.4 }
  const uniquac: ActivityModel = { kind: 'uniquac', a12: -350, a21: 1450, ...rq, a12T: 2.4, a21T: -5.2 }
  it('equal the constant-energy model with the energies evaluated at T', () => {
    const T = 351.4
    const n0 = lg({ kind: 'nrtl', b12: 2100 - 4.2 * (T - T_REF), b21: 6800 + 7.5 * (T - T_REF), alpha: 0.3 }, 0.37, T)
    expect(lg(nrtl, 0.37, T).slice(0, 2)).toEqual(n0.slice(0, 2).map((v) => expect.closeTo(v, 12)))
    const w0 = lg(
      { kind: 'wilson', a12: 1300 + 3.1 * (T - T_REF), a21: 4100 - 6.4 * (T - T_REF), V1: 58.7, V2: 18.07 },
      0.37,
      T,
    )
    expect(lg(wilson, 0.37, T).slice(0, 2)).toEqual(w0.slice(0, 2).map((v) => expect.closeTo(v, 12)))
    const u0 = lg({ kind: 'uniquac', a12: -350 + 2.4 * (T - T_REF), a21: 1450 - 5.2 * (T - T_REF), ...rq }, 0.37, T)
    expect(lg(uniquac, 0.37, T).slice(0, 2)).toEqual(u0.slice(0, 2).map((v) => expect.closeTo(v, 12)))
  })
  it.each([
    ['NRTL', nrtl],
    ['Wilson', wilson],
    ['UNIQUAC', uniquac],
  ] as const)('%s: ∂ln γ/∂T matches a central difference', (_name, m) => {
    for (const x1 of [0.1, 0.5, 0.9]) {
      const T = 340
      const h = 1e-3
      const [, , d1, d2] = lg(m, x1, T)
      const up = lg(m, x1, T + h)
      const dn = lg(m, x1, T - h)
      expect(d1).toBeCloseTo((up[0] - dn[0]) / (2 * h), 7)
      expect(d2).toBeCloseTo((up[1] - dn[1]) / (2 * h), 7)
    }
  })
})
