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

/** Coefficients of the 4th-order continuous extension (Hairer, Nørsett & Wanner, Solving ODEs I, dopri5 dense output). */
const D = [
  -12715105075 / 11282082432,
  0,
  87487479700 / 32700410799,
  -10690763975 / 1880347072,
  701980252875 / 199316789632,
  -1453857185 / 822651844,
  69997945 / 29380423,
]

/** One Dormand–Prince step of size h from x: the 5th-order value, the error estimate and the stage slopes. */
export function dopriStep(f: (x: number) => number, x: number, h: number): { x: number; error: number; k: number[] } {
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
  return { x: x5, error: Math.abs(x5 - x4), k }
}

/** Dense output inside an accepted step from x0 to x1 of size h, at fraction θ ∈ [0, 1] of the step. */
export function denseOutput(x0: number, x1: number, h: number, k: number[], theta: number): number {
  const diff = x1 - x0
  const b = h * k[0] - diff
  const c = diff - h * k[6] - b
  const d = h * D.reduce((s, dj, j) => s + dj * k[j], 0)
  return x0 + theta * (diff + (1 - theta) * (b + theta * (c + (1 - theta) * d)))
}

/** Counters the integrator reports. */
export interface OdeStats {
  steps: number
  rejected: number
}

/** An accepted step, kept for dense output. */
export interface AcceptedStep {
  tau: number
  h: number
  x0: number
  x1: number
  k: number[]
}

/**
 * Integrate from (0, x0) to τ1 with step control; `stopWhen(τ, x)` (monotone in τ: false, then true) ends the
 * run at its first crossing, located by bisection on the step's continuous extension (no extra slope evaluations).
 * Every accepted step is pushed to `trace` so callers can read x anywhere by `valueAt`.
 */
export function integrate(
  f: (x: number) => number,
  x0: number,
  tau1: number,
  stats: OdeStats,
  trace: AcceptedStep[],
  stopWhen?: (tau: number, x: number) => boolean,
): { tau: number; x: number } {
  let tau = 0
  let x = x0
  let h = Math.min(0.01, tau1)
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
    trace.push({ tau, h: step, x0: x, x1: trial.x, k: trial.k })
    if (stopWhen && stopWhen(tau + step, trial.x)) {
      let lo = 0
      let hi = 1
      for (let i = 0; i < 60 && hi - lo > 1e-15; i++) {
        const mid = 0.5 * (lo + hi)
        if (stopWhen(tau + mid * step, denseOutput(x, trial.x, step, trial.k, mid))) hi = mid
        else lo = mid
      }
      return { tau: tau + hi * step, x: denseOutput(x, trial.x, step, trial.k, hi) }
    }
    tau += step
    x = trial.x
    h = step * Math.min(5, 0.9 * (tol / Math.max(trial.error, 1e-300)) ** 0.2)
  }
  return { tau: tau1, x }
}

/** x at τ from the recorded steps (τ within the integrated range). */
export function valueAt(trace: AcceptedStep[], tau: number): number {
  let lo = 0
  let hi = trace.length - 1
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1
    if (trace[mid].tau <= tau) lo = mid
    else hi = mid - 1
  }
  const s = trace[lo]
  return denseOutput(s.x0, s.x1, s.h, s.k, Math.min(1, Math.max(0, (tau - s.tau) / s.h)))
}
