import { describe, expect, it } from 'vitest'
import { levenbergMarquardt } from './lm.js'
import { fitStatistics } from './statistics.js'

// Self-checks of the generic least-squares code against closed forms (no external source needed):
// a straight line y = a + b·t has the textbook OLS solution and covariance s²·(XᵀX)⁻¹.
const t = [0, 1, 2, 3, 4, 5, 6]
const y = [1.1, 2.9, 5.2, 7.1, 8.8, 11.2, 12.9]

function line() {
  return {
    nResiduals: t.length,
    nParams: 2,
    residuals(p: Float64Array, r: Float64Array) {
      t.forEach((ti, i) => (r[i] = p[0] + p[1] * ti - y[i]))
      return true
    },
    jacobian(p: Float64Array, r: Float64Array, J: Float64Array) {
      this.residuals(p, r)
      t.forEach((ti, i) => {
        J[2 * i] = 1
        J[2 * i + 1] = ti
      })
      return true
    },
  }
}

describe('levenbergMarquardt and fitStatistics', () => {
  it('solve a straight line exactly as ordinary least squares does', () => {
    const n = t.length
    const mt = t.reduce((s, v) => s + v, 0) / n
    const my = y.reduce((s, v) => s + v, 0) / n
    const stt = t.reduce((s, v) => s + (v - mt) ** 2, 0)
    const b = t.reduce((s, v, i) => s + (v - mt) * (y[i] - my), 0) / stt
    const a = my - b * mt
    const fit = levenbergMarquardt(line(), [0, 0])!
    expect(fit.converged).toBe(true)
    // LM stops once the Gauss–Newton step promises less than 1e-11 of the cost: about 1e-7 standard errors here.
    expect(fit.p[0]).toBeCloseTo(a, 6)
    expect(fit.p[1]).toBeCloseTo(b, 6)
    const stats = fitStatistics(fit.r, fit.J, n, 2)
    const s2 = fit.cost / (n - 2)
    expect(stats.covariance[1][1]).toBeCloseTo(s2 / stt, 10)
    expect(stats.covariance[0][0]).toBeCloseTo(s2 * (1 / n + (mt * mt) / stt), 10)
    expect(stats.leverage.reduce((s, h) => s + h, 0)).toBeCloseTo(2, 12)
    // Leverage of the first point of a line: 1/n + (t − t̄)²/Stt.
    expect(stats.leverage[0]).toBeCloseTo(1 / n + (mt * mt) / stt, 12)
  })
  it('returns null when the residuals cannot be computed at the start', () => {
    expect(levenbergMarquardt({ ...line(), jacobian: () => false }, [0, 0])).toBeNull()
  })
})
