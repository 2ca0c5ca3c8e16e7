/**
 * Student's t distribution for a whole number of degrees of freedom, computed exactly rather than read from
 * a printed table. With θ = atan(t/√ν), the probability A(t|ν) = P(|T| ≤ t) is a finite sum
 * (M. Abramowitz, I. A. Stegun, Handbook of Mathematical Functions, 1964, eq. 26.7.3–26.7.4; from memory):
 *   ν = 1:     A = 2θ/π
 *   ν odd:     A = (2/π)·[θ + sinθ·cosθ·(1 + (2/3)cos²θ + … + (2·4…(ν−3))/(1·3…(ν−2))·cos^(ν−3)θ)]
 *   ν even:    A = sinθ·(1 + (1/2)cos²θ + (1·3)/(2·4)cos⁴θ + … + (1·3…(ν−3))/(2·4…(ν−2))·cos^(ν−2)θ)
 * A rises monotonically with θ on (0, π/2), so the quantile is found by bisection on θ to full double precision.
 */
import { ThermoError } from '../errors.js'

/** P(|T| ≤ tan θ · √ν) for ν degrees of freedom (A&S 26.7.3–26.7.4). */
function twoSidedProbability(theta: number, dof: number): number {
  const s = Math.sin(theta)
  const c2 = Math.cos(theta) ** 2
  if (dof % 2 === 1) {
    let term = 1
    let sum = dof > 1 ? 1 : 0
    for (let k = 3; k <= dof - 2; k += 2) {
      term *= (c2 * (k - 1)) / k
      sum += term
    }
    return (2 / Math.PI) * (theta + s * Math.cos(theta) * sum)
  }
  let term = 1
  let sum = 1
  for (let k = 2; k <= dof - 2; k += 2) {
    term *= (c2 * (k - 1)) / k
    sum += term
  }
  return s * sum
}

/**
 * The Student-t quantile t(p, ν): the value a t-distributed variable with ν degrees of freedom stays below
 * with probability p. For a two-sided 95 % interval use p = 0.975.
 * @param p probability, 0 < p < 1
 * @param dof degrees of freedom, a whole number ≥ 1
 */
export function studentTQuantile(p: number, dof: number): number {
  if (!(p > 0 && p < 1))
    throw new ThermoError('invalid-input', `The probability must lie strictly between 0 and 1; got ${p}.`)
  if (!Number.isInteger(dof) || dof < 1) {
    throw new ThermoError('invalid-input', `The degrees of freedom must be a whole number of at least 1; got ${dof}.`)
  }
  if (p === 0.5) return 0
  const target = Math.abs(2 * p - 1)
  let lo = 0
  let hi = Math.PI / 2
  for (let i = 0; i < 200 && hi - lo > 1e-17; i++) {
    const mid = 0.5 * (lo + hi)
    if (twoSidedProbability(mid, dof) < target) lo = mid
    else hi = mid
  }
  const t = Math.tan(0.5 * (lo + hi)) * Math.sqrt(dof)
  return p > 0.5 ? t : -t
}

/**
 * The two-sided 95 % critical value t(0.975, ν); Infinity when there are no degrees of freedom left
 * (no scatter to judge a coefficient by).
 */
export function studentT975(dof: number): number {
  return dof < 1 ? Infinity : studentTQuantile(0.975, Math.floor(dof))
}
