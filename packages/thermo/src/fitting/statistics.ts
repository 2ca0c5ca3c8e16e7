/**
 * Regression statistics at the optimum of a weighted least-squares fit (n residual rows, m parameters):
 * covariance s²·(JᵀJ)⁻¹ with s² = Σr²/(n − m) (so σT, σy set relative weights and the scatter sets
 * the scale), hat-matrix leverages h = diag(J(JᵀJ)⁻¹Jᵀ), externally studentized residuals
 * t = r / (s₍ₖ₎·√(1 − h)) where s₍ₖ₎ leaves row k out (D. A. Belsley, E. Kuh, R. E. Welsch,
 * Regression Diagnostics, 1980, ch. 2; from memory), and AIC = n·ln(Σr²/n) + 2m.
 */
import { invertSymmetric, normalEquations } from './linear-algebra.js'

/** Statistics of one fit; arrays per residual row. */
export interface FitStatistics {
  covariance: number[][]
  correlation: number[][]
  standardErrors: number[]
  leverage: Float64Array
  studentized: Float64Array
  s2: number
  aic: number
  inverse: Float64Array | null
}

/** Compute {@link FitStatistics} from the residuals r and row-major Jacobian J at the optimum. */
export function fitStatistics(r: Float64Array, J: Float64Array, n: number, m: number): FitStatistics {
  const A = new Float64Array(m * m)
  normalEquations(J, r, n, m, A, new Float64Array(m))
  const inverse = invertSymmetric(A, m)
  let cost = 0
  for (let k = 0; k < n; k++) cost += r[k] * r[k]
  const dof = n - m
  const s2 = dof > 0 ? cost / dof : NaN
  const covariance = Array.from({ length: m }, (_, i) =>
    Array.from({ length: m }, (_, j) => (inverse ? inverse[i * m + j] * s2 : NaN)),
  )
  const standardErrors = covariance.map((row, i) => Math.sqrt(row[i]))
  const correlation = covariance.map((row, i) =>
    row.map((v, j) => (i === j ? 1 : v / (standardErrors[i] * standardErrors[j]))),
  )
  const leverage = new Float64Array(n)
  const studentized = new Float64Array(n)
  for (let k = 0; k < n; k++) {
    const h = inverse ? quadratic(inverse, J, k, m) : NaN
    leverage[k] = h
    const deleted = dof > 1 ? (cost - (r[k] * r[k]) / (1 - h)) / (dof - 1) : NaN
    // A row that carries no information (h = 0 and r = 0, e.g. y at a pure end) has t = 0.
    studentized[k] = r[k] === 0 ? 0 : r[k] / Math.sqrt(Math.max(deleted, 1e-300) * (1 - h))
  }
  const aic = n * Math.log(Math.max(cost, 1e-300) / n) + 2 * m
  return { covariance, correlation, standardErrors, leverage, studentized, s2, aic, inverse }
}

/** J_k · M · J_kᵀ for row k of J. */
function quadratic(M: Float64Array, J: Float64Array, k: number, m: number): number {
  let s = 0
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) s += J[k * m + i] * M[i * m + j] * J[k * m + j]
  return s
}
