/**
 * Ordinary least squares with the parameter covariance, small and dependency-free:
 * calibrations have 2–10 standards and 1–3 coefficients, so normal equations solved
 * by Gauss–Jordan are accurate enough and keep the maths readable.
 */
import { ThermoError } from '../errors.js'

/** Result of an ordinary least-squares fit y ≈ X·b. */
export interface LeastSquaresFit {
  coefficients: number[]
  /** Covariance of the coefficients, s²·(XᵀX)⁻¹. */
  covariance: number[][]
  standardErrors: number[]
  /** y − X·b, one per row. */
  residuals: number[]
  /** Residual variance s² = Σr² / (n − p). */
  residualVariance: number
  degreesOfFreedom: number
}

/** Invert a small symmetric positive-definite matrix (Gauss–Jordan with partial pivoting). */
export function invertMatrix(a: number[][]): number[][] {
  const n = a.length
  const m = a.map((row, i) => [...row, ...row.map((_, j) => (i === j ? 1 : 0))])
  for (let col = 0; col < n; col++) {
    let pivot = col
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[pivot][col])) pivot = r
    const scale = Math.max(...m.map((row) => Math.abs(row[col])), 1e-300)
    if (Math.abs(m[pivot][col]) < 1e-13 * scale) {
      throw new ThermoError(
        'singular-fit',
        'The standards do not determine the calibration: their area ratios are too alike. Add standards spread over the working range.',
      )
    }
    ;[m[col], m[pivot]] = [m[pivot], m[col]]
    const p = m[col][col]
    for (let j = 0; j < 2 * n; j++) m[col][j] /= p
    for (let r = 0; r < n; r++) {
      if (r === col) continue
      const f = m[r][col]
      if (f !== 0) for (let j = 0; j < 2 * n; j++) m[r][j] -= f * m[col][j]
    }
  }
  return m.map((row) => row.slice(n))
}

/**
 * Fit y ≈ X·b by ordinary least squares.
 * @param X design matrix, one row per observation (n rows, p columns, n > p)
 * @param y observations (n values)
 */
export function leastSquares(X: number[][], y: number[]): LeastSquaresFit {
  const n = X.length
  const p = X[0].length
  const xtx = Array.from({ length: p }, (_, i) =>
    Array.from({ length: p }, (_, j) => X.reduce((s, row) => s + row[i] * row[j], 0)),
  )
  const xty = Array.from({ length: p }, (_, i) => X.reduce((s, row, k) => s + row[i] * y[k], 0))
  const inv = invertMatrix(xtx)
  const coefficients = inv.map((row) => row.reduce((s, v, j) => s + v * xty[j], 0))
  const residuals = X.map((row, k) => y[k] - row.reduce((s, v, j) => s + v * coefficients[j], 0))
  const degreesOfFreedom = n - p
  const residualVariance = degreesOfFreedom > 0 ? residuals.reduce((s, r) => s + r * r, 0) / degreesOfFreedom : NaN
  const covariance = inv.map((row) => row.map((v) => v * residualVariance))
  const standardErrors = covariance.map((row, i) => Math.sqrt(Math.max(row[i], 0)))
  return { coefficients, covariance, standardErrors, residuals, residualVariance, degreesOfFreedom }
}

/**
 * Two-sided 95 % Student-t quantile t(0.975, ν), from the standard printed table
 * (common practice, values from memory to 3 decimals); ν > 30 uses the normal value 1.960.
 */
export function studentT975(dof: number): number {
  const table = [
    12.706, 4.303, 3.182, 2.776, 2.571, 2.447, 2.365, 2.306, 2.262, 2.228, 2.201, 2.179, 2.16, 2.145, 2.131, 2.12, 2.11,
    2.101, 2.093, 2.086, 2.08, 2.074, 2.069, 2.064, 2.06, 2.056, 2.052, 2.048, 2.045, 2.042,
  ]
  if (dof < 1) return Infinity
  return dof <= 30 ? table[Math.floor(dof) - 1] : 1.96
}

/** Sample mean and sample standard deviation (n − 1); sd is NaN for one value. */
export function meanAndSd(values: number[]): { mean: number; sd: number } {
  const mean = values.reduce((s, v) => s + v, 0) / values.length
  if (values.length < 2) return { mean, sd: NaN }
  const ss = values.reduce((s, v) => s + (v - mean) ** 2, 0)
  return { mean, sd: Math.sqrt(ss / (values.length - 1)) }
}
