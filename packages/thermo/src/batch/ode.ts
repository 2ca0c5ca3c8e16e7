/**
 * Adaptive Dormand–Prince 5(4) for the scalar Rayleigh equation dx/dτ = f(x), τ = ln(L0/L).
 * Local error per step ≤ ABS_TOL + REL_TOL·|x| (estimated by the embedded 4th-order solution).
 */

/** Absolute local-error tolerance on the pot mole fraction. */
export const ABS_TOL = 1e-11
/** Relative local-error tolerance on the pot mole fraction. */
export const REL_TOL = 1e-9

const A = [
  [],
  [1 / 5],
  [3 / 40, 9 / 40],
  [44 / 45, -56 / 15, 32 / 9],
  [19372 / 6561, -25360 / 2187, 64448 / 6561, -212 / 729],
  [9017 / 3168, -355 / 33, 46732 / 5247, 49 / 176, -5103 / 18656],
  [35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84],
]
const B5 = [35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84, 0]
const B4 = [5179 / 57600, 0, 7571 / 16695, 393 / 640, -92097 / 339200, 187 / 2100, 1 / 40]

/** One Dormand–Prince step of size h from x: the 5th-order value and the error estimate. */
export function dopriStep(f: (x: number) => number, x: number, h: number): { x: number; error: number } {
  const k: number[] = []
  for (let s = 0; s < 7; s++) {
    let xs = x
    for (let j = 0; j < s; j++) xs += h * A[s][j] * k[j]
    k.push(f(xs))
  }
  let x5 = x
  let x4 = x
  for (let s = 0; s < 7; s++) {
    x5 += h * B5[s] * k[s]
    x4 += h * B4[s] * k[s]
  }
  return { x: x5, error: Math.abs(x5 - x4) }
}

/** Counters the integrator reports. */
export interface OdeStats {
  steps: number
  rejected: number
}

/**
 * Integrate from (τ0, x0) to τ1 with step control; `stopWhen(τ, x)` (monotone in τ, false then true) ends the
 * run at its first crossing, located by bisection on the last step. Returns the final τ and x.
 */
export function integrate(f: (x: number) => number, tau0: number, x0: number, tau1: number, stats: OdeStats, stopWhen?: (tau: number, x: number) => boolean, h0 = 0.01): { tau: number; x: number; stopped: boolean; h: number } {
  let tau = tau0
  let x = x0
  let h = Math.min(h0, tau1 - tau0)
  while (tau < tau1) {
    const step = Math.min(h, tau1 - tau)
    const trial = dopriStep(f, x, step)
    const tol = ABS_TOL + REL_TOL * Math.abs(x)
    if (trial.error > tol && step > 1e-12) {
      stats.rejected++
      h = step * Math.max(0.2, 0.9 * (tol / trial.error) ** 0.2)
      continue
    }
    stats.steps++
    if (stopWhen && stopWhen(tau + step, trial.x)) {
      let lo = 0
      let hi = step
      for (let i = 0; i < 60 && hi - lo > 1e-14 * Math.max(1, tau); i++) {
        const mid = 0.5 * (lo + hi)
        if (stopWhen(tau + mid, dopriStep(f, x, mid).x)) hi = mid
        else lo = mid
      }
      return { tau: tau + hi, x: dopriStep(f, x, hi).x, stopped: true, h }
    }
    tau += step
    x = trial.x
    h = step * Math.min(5, 0.9 * (tol / Math.max(trial.error, 1e-300)) ** 0.2)
  }
  return { tau: tau1, x, stopped: false, h }
}
