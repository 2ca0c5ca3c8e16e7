/**
 * Levenberg–Marquardt for small least-squares problems (2–3 parameters, up to thousands of
 * residuals). Our own rather than ml-levenberg-marquardt because the fits need analytic or
 * semi-analytic Jacobians, a residual function that may fail (no bubble point for a trial
 * parameter set), and the Jacobian at the optimum for the covariance.
 * Damping update after H. B. Nielsen, "Damping parameter in Marquardt's method", IMM-REP-1999-05 (from memory).
 */
import { cholesky, choleskySolve, normalEquations } from './linear-algebra.js'

/** A least-squares problem: minimise Σ r_k(p)². */
export interface LeastSquaresProblem {
  nResiduals: number
  nParams: number
  /** Fill r; return false when the residuals cannot be computed for p. */
  residuals(p: Float64Array, r: Float64Array): boolean
  /** Fill r and the row-major n×m Jacobian J = ∂r/∂p; return false on failure. */
  jacobian(p: Float64Array, r: Float64Array, J: Float64Array): boolean
}

/** Outcome of {@link levenbergMarquardt}: p the best parameters, cost = Σr² there, r and J at p. */
export interface LeastSquaresResult {
  p: Float64Array
  cost: number
  iterations: number
  converged: boolean
  r: Float64Array
  J: Float64Array
  /** True when the caller's `stop` ended the search (the result is then the iterate where it stopped). */
  stopped?: boolean
}

function sumSquares(r: Float64Array): number {
  let s = 0
  for (let i = 0; i < r.length; i++) s += r[i] * r[i]
  return s
}

/** Minimise Σr² from p0; returns null when the residuals cannot be evaluated at p0. */
export function levenbergMarquardt(
  problem: LeastSquaresProblem,
  p0: ArrayLike<number>,
  options: { maxIterations?: number; tolerance?: number; stop?: (p: Float64Array) => boolean } = {},
): LeastSquaresResult | null {
  const n = problem.nResiduals
  const m = problem.nParams
  const maxIterations = options.maxIterations ?? 200
  const tolerance = options.tolerance ?? 1e-11
  const p = Float64Array.from(p0)
  const trial = new Float64Array(m)
  const r = new Float64Array(n)
  const rTrial = new Float64Array(n)
  const J = new Float64Array(n * m)
  const A = new Float64Array(m * m)
  const L = new Float64Array(m * m)
  const g = new Float64Array(m)
  const step = new Float64Array(m)
  if (!problem.jacobian(p, r, J)) return null
  let cost = sumSquares(r)
  normalEquations(J, r, n, m, A, g)
  let lambda = 1e-3
  let nu = 2
  let iterations = 0
  let converged = false
  while (iterations < maxIterations) {
    // Stop when even the undamped Gauss–Newton step promises less than `tolerance`·cost: what is left
    // is below the noise of residuals that come from iterative bubble-point solves.
    if (
      cost < 1e-30 ||
      scaledGradient(A, g, m, cost) < 1e-10 ||
      gaussNewtonGain(A, g, m, L, step) <= tolerance * cost
    ) {
      converged = true
      break
    }
    iterations++
    for (let i = 0; i < m * m; i++) L[i] = A[i]
    for (let i = 0; i < m; i++) L[i * m + i] = A[i * m + i] * (1 + lambda) + 1e-300
    let accepted = false
    let newCost = Infinity
    if (cholesky(L, m)) {
      for (let i = 0; i < m; i++) step[i] = -g[i]
      choleskySolve(L, m, step)
      for (let i = 0; i < m; i++) trial[i] = p[i] + step[i]
      if (problem.residuals(trial, rTrial)) newCost = sumSquares(rTrial)
      let predicted = 0
      for (let i = 0; i < m; i++) predicted += step[i] * (lambda * A[i * m + i] * step[i] - g[i])
      const rho = (cost - newCost) / predicted
      if (Number.isFinite(newCost) && newCost < cost && rho > 0) {
        accepted = true
        lambda *= Math.max(1 / 3, 1 - Math.pow(2 * rho - 1, 3))
        nu = 2
      }
    }
    if (accepted) {
      const decrease = cost - newCost
      p.set(trial)
      if (!problem.jacobian(p, r, J)) return null
      cost = sumSquares(r)
      normalEquations(J, r, n, m, A, g)
      if (decrease <= 1e-15 * cost) {
        converged = true
        break
      }
      if (options.stop?.(p)) return { p, cost, iterations, converged: false, r, J, stopped: true }
    } else {
      lambda *= nu
      nu *= 2
      if (lambda > 1e20) {
        converged = scaledGradient(A, g, m, cost) < 1e-5
        break
      }
    }
  }
  return { p, cost, iterations, converged, r, J }
}

/** Largest cosine between the residual vector and a Jacobian column: 0 at a stationary point. */
function scaledGradient(A: Float64Array, g: Float64Array, m: number, cost: number): number {
  let worst = 0
  for (let i = 0; i < m; i++) {
    const d = Math.sqrt(A[i * m + i] * cost)
    if (d > 0) worst = Math.max(worst, Math.abs(g[i]) / d)
  }
  return worst
}

/** Reduction of Σr² promised by the Gauss–Newton step, gᵀ·A⁻¹·g (uses L and step as scratch). */
function gaussNewtonGain(A: Float64Array, g: Float64Array, m: number, L: Float64Array, step: Float64Array): number {
  for (let i = 0; i < m * m; i++) L[i] = A[i]
  for (let i = 0; i < m; i++) L[i * m + i] = A[i * m + i] * (1 + 1e-12) + 1e-300
  if (!cholesky(L, m)) return Infinity
  step.set(g)
  choleskySolve(L, m, step)
  let gain = 0
  for (let i = 0; i < m; i++) gain += g[i] * step[i]
  return gain
}
