/**
 * Ordinary least squares with the parameter covariance: calibrations have 2–10 standards and 1–3
 * coefficients, so the normal equations are accurate enough; they are inverted by the fitting module's
 * scaled Cholesky inverse, the engine's one linear solver.
 */
import { ThermoError } from '../errors.js'
import { invertSymmetric } from '../fitting/linear-algebra.js'

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

/** Largest (XᵀX)⁻¹ diagonal, scaled to unit diagonal, that still counts as determined: 1/(1 − R²) of a coefficient. */
const MAX_VARIANCE_INFLATION = 1e13

/** (XᵀX)⁻¹ by the fitting module's Cholesky inverse; a singular or nearly singular system is refused. */
function invertNormalMatrix(xtx: number[][]): number[][] {
  const p = xtx.length
  const inv = invertSymmetric(Float64Array.from(xtx.flat()), p)
  const determined = inv && xtx.every((row, i) => inv[i * p + i] * row[i] <= MAX_VARIANCE_INFLATION)
  if (!determined) {
    throw new ThermoError(
      'singular-fit',
      'The standards do not determine the calibration: their area ratios are too alike. Add standards spread over the working range.',
    )
  }
  return Array.from({ length: p }, (_, i) => Array.from(inv.subarray(i * p, (i + 1) * p)))
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
  const inv = invertNormalMatrix(xtx)
  const coefficients = inv.map((row) => row.reduce((s, v, j) => s + v * xty[j], 0))
  const residuals = X.map((row, k) => y[k] - row.reduce((s, v, j) => s + v * coefficients[j], 0))
  const degreesOfFreedom = n - p
  const residualVariance = degreesOfFreedom > 0 ? residuals.reduce((s, r) => s + r * r, 0) / degreesOfFreedom : NaN
  const covariance = inv.map((row) => row.map((v) => v * residualVariance))
  const standardErrors = covariance.map((row, i) => Math.sqrt(Math.max(row[i], 0)))
  return { coefficients, covariance, standardErrors, residuals, residualVariance, degreesOfFreedom }
}

/** Sample mean and sample standard deviation (n − 1); sd is NaN for one value. */
export function meanAndSd(values: number[]): { mean: number; sd: number } {
  const mean = values.reduce((s, v) => s + v, 0) / values.length
  if (values.length < 2) return { mean, sd: NaN }
  const ss = values.reduce((s, v) => s + (v - mean) ** 2, 0)
  return { mean, sd: Math.sqrt(ss / (values.length - 1)) }
}
