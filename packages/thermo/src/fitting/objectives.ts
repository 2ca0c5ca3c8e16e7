/**
 * The two least-squares objectives of fitBinary.
 * Bubble point: for each point, the bubble temperature and vapour composition at its own x1 and P;
 * residuals (Tcalc − T)/σT and (ycalc − y)/σy. The Jacobian is semi-analytic: by the implicit-function
 * theorem on F(T, θ) = ln Σ xi·γi·Pi_sat − ln P = 0, dT/dθ = −(∂F/∂θ)/(∂F/∂T), so only ∂ln γ/∂θ needs
 * finite differences (cheap activity evaluations, no extra bubble-point solves).
 * Activity: residuals ln γi(model) − ln γi(exp), γi(exp) = yi·P/(xi·Pi_sat(T)).
 */
import { lnGammaT } from '../activity/kernel.js'
import { res, solveBubbleT } from '../equilibrium/kernel.js'
import type { LnPsat } from '../vapor-pressure/compiled.js'
import type { ActivityModel } from '../types.js'
import type { LeastSquaresProblem } from './lm.js'
import type { ParameterLayout } from './parameters.js'
import { threePhaseRow, threePhaseSensitivities, type ThreePhaseMemo } from './heterogeneous.js'

/** Included mixture points (0 < x1 < 1) in SI, with weights 1/σ. */
export interface FitData {
  n: number
  T: Float64Array
  lnP: Float64Array
  x1: Float64Array
  y1: Float64Array
  wT: Float64Array
  wY: Float64Array
  vp1: LnPsat
  vp2: LnPsat
  /** 1 for rows marked heterogeneous (two liquid layers seen): compared with the model's three-phase point. */
  het?: Uint8Array
}

const g = new Float64Array(4)

/** Models at p + h·e_j for forward differences in the parameters, with their steps h. */
function perturbedModels(
  layout: ParameterLayout,
  p: Float64Array,
): { base: ActivityModel; models: ActivityModel[]; steps: number[] } {
  const models: ActivityModel[] = []
  const steps: number[] = []
  const q = Float64Array.from(p)
  for (let j = 0; j < p.length; j++) {
    const h = 1e-6 * Math.max(Math.abs(p[j]), layout.scales[j])
    q[j] = p[j] + h
    models.push(layout.build(q))
    q[j] = p[j]
    steps.push(h)
  }
  return { base: layout.build(p), models, steps }
}

type Perturbed = ReturnType<typeof perturbedModels>

/** ∂ln γ1/∂θj and ∂ln γ2/∂θj at (x1, T) into out[2j], out[2j+1]; base = ln γ1, ln γ2 of the unperturbed model. */
function lnGammaSensitivities(
  pm: Perturbed,
  x1: number,
  T: number,
  base1: number,
  base2: number,
  out: Float64Array,
): void {
  for (let j = 0; j < pm.steps.length; j++) {
    lnGammaT(pm.models[j], x1, T, g)
    out[2 * j] = (g[0] - base1) / pm.steps[j]
    out[2 * j + 1] = (g[1] - base2) / pm.steps[j]
  }
}

/**
 * Solve the bubble point of data point i with `model`, warm-started from Tguess[i]; on success
 * res[] holds T, y1, γ and the slope ∂F/∂T, and Tguess[i] is updated.
 */
function bubbleAt(
  model: ActivityModel,
  d: FitData,
  i: number,
  Tguess: Float64Array,
  memo: (ThreePhaseMemo | null)[],
): boolean {
  // A two-layer point is compared with the three-phase point; where the model has none, with its bubble point.
  if (d.het?.[i] && threePhaseRow(model, d, i, memo)) return true
  if (d.het?.[i]) memo[i] = null
  const ok = solveBubbleT(model, d.vp1, d.vp2, d.lnP[i], d.x1[i], Tguess[i])
  if (ok) Tguess[i] = res[0]
  return ok
}

/** dT/dθj and dy1/dθj at the bubble point just solved (T, y1 = res[0], res[1]), into dT[j], dy[j]. */
export function bubbleSensitivities(
  model: ActivityModel,
  d: { vp1: LnPsat },
  x1: number,
  pm: Perturbed,
  dlng: Float64Array,
  dT: Float64Array,
  dy: Float64Array,
): void {
  const T = res[0]
  const y1 = res[1]
  const fp = res[6]
  lnGammaT(model, x1, T, g)
  const c1 = T + d.vp1.c
  const e1 = g[2] + d.vp1.b / (c1 * c1)
  lnGammaSensitivities(pm, x1, T, g[0], g[1], dlng)
  for (let j = 0; j < pm.steps.length; j++) {
    const dF = y1 * dlng[2 * j] + (1 - y1) * dlng[2 * j + 1]
    dT[j] = -dF / fp
    dy[j] = y1 * (dlng[2 * j] + e1 * dT[j])
  }
}

/** The bubble-point objective; `useY` false fits T–x alone (the point test). */
export function bubbleProblem(
  d: FitData,
  layout: ParameterLayout,
  useY: boolean,
): LeastSquaresProblem & { Tguess: Float64Array } {
  const m = layout.names.length
  const Tguess = new Float64Array(d.n)
  // The measured temperature is the best first guess of each bubble point (within the noise of it).
  for (let i = 0; i < d.n; i++) Tguess[i] = d.T[i]
  const dlng = new Float64Array(2 * m)
  const dT = new Float64Array(m)
  const dy = new Float64Array(m)
  const rows = useY ? 2 : 1
  const memo: (ThreePhaseMemo | null)[] = new Array(d.n).fill(null)
  return {
    nResiduals: rows * d.n,
    nParams: m,
    Tguess,
    residuals(p, r) {
      if (!layout.valid(p)) return false
      const model = layout.build(p)
      for (let i = 0; i < d.n; i++) {
        if (!bubbleAt(model, d, i, Tguess, memo)) return false
        r[rows * i] = (res[0] - d.T[i]) * d.wT[i]
        if (useY) r[rows * i + 1] = (res[1] - d.y1[i]) * d.wY[i]
      }
      return true
    },
    jacobian(p, r, J) {
      if (!layout.valid(p)) return false
      const model = layout.build(p)
      const pm = perturbedModels(layout, p)
      for (let i = 0; i < d.n; i++) {
        if (!bubbleAt(model, d, i, Tguess, memo)) return false
        r[rows * i] = (res[0] - d.T[i]) * d.wT[i]
        if (useY) r[rows * i + 1] = (res[1] - d.y1[i]) * d.wY[i]
        if (!memo[i]) bubbleSensitivities(model, d, d.x1[i], pm, dlng, dT, dy)
        else if (!threePhaseSensitivities(pm, d, i, memo[i], res[0], res[1], dT, dy)) return false
        for (let j = 0; j < m; j++) {
          J[rows * i * m + j] = dT[j] * d.wT[i]
          if (useY) J[(rows * i + 1) * m + j] = dy[j] * d.wY[i]
        }
      }
      return true
    },
  }
}

/** Experimental ln γ1, ln γ2 of each point (NaN where y is 0 or 1). */
export function experimentalLnGamma(d: FitData): [Float64Array, Float64Array] {
  const l1 = new Float64Array(d.n)
  const l2 = new Float64Array(d.n)
  for (let i = 0; i < d.n; i++) {
    const T = d.T[i]
    const y = d.y1[i]
    const x = d.x1[i]
    if (d.het?.[i]) {
      l1[i] = NaN
      l2[i] = NaN
      continue
    }
    l1[i] = y > 0 ? Math.log(y / x) + d.lnP[i] - (d.vp1.a - d.vp1.b / (T + d.vp1.c)) : NaN
    l2[i] = y < 1 ? Math.log((1 - y) / (1 - x)) + d.lnP[i] - (d.vp2.a - d.vp2.b / (T + d.vp2.c)) : NaN
  }
  return [l1, l2]
}

/** The activity objective: residuals ln γi(model) − ln γi(exp), unweighted; forward differences in θ. */
export function activityProblem(d: FitData, layout: ParameterLayout): LeastSquaresProblem {
  const m = layout.names.length
  const [l1, l2] = experimentalLnGamma(d)
  const fill = (model: ActivityModel, r: Float64Array) => {
    for (let i = 0; i < d.n; i++) {
      lnGammaT(model, d.x1[i], d.T[i], g)
      r[2 * i] = Number.isNaN(l1[i]) ? 0 : g[0] - l1[i]
      r[2 * i + 1] = Number.isNaN(l2[i]) ? 0 : g[1] - l2[i]
    }
  }
  return {
    nResiduals: 2 * d.n,
    nParams: m,
    residuals(p, r) {
      if (!layout.valid(p)) return false
      fill(layout.build(p), r)
      return true
    },
    jacobian(p, r, J) {
      if (!layout.valid(p)) return false
      fill(layout.build(p), r)
      const q = Float64Array.from(p)
      for (let j = 0; j < m; j++) {
        const h = 1e-6 * Math.max(Math.abs(p[j]), layout.scales[j])
        q[j] = p[j] + h
        const model = layout.build(q)
        q[j] = p[j]
        for (let i = 0; i < d.n; i++) {
          lnGammaT(model, d.x1[i], d.T[i], g)
          // r = ln γ(model) − ln γ(exp), so (g − l) − r is the change of ln γ over the step.
          J[2 * i * m + j] = Number.isNaN(l1[i]) ? 0 : (g[0] - l1[i] - r[2 * i]) / h
          J[(2 * i + 1) * m + j] = Number.isNaN(l2[i]) ? 0 : (g[1] - l2[i] - r[2 * i + 1]) / h
        }
      }
      return true
    },
  }
}

export { perturbedModels }
