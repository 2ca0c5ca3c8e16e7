/**
 * The least-squares objectives of fitBinary.
 * Bubble point: for each point, the bubble temperature and vapour composition at its own x1 and P;
 * residuals (Tcalc − T)/σT and (ycalc − y)/σy (a point without y has the T row only: Barker's method).
 * Bubble pressure (isothermal): the bubble pressure and vapour at its own x1 and T; residuals (Pcalc − P)/σP and
 * (ycalc − y)/σy. Under a virial vapour both are solved γ–φ (model-point.ts). The Jacobian is semi-analytic: by the implicit-function
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
import type { CompiledVirial } from '../virial/kernel.js'
import { point, pointSensitivities, solvePoint } from './model-point.js'
import { lnGammaSensitivities, perturbedModels, type Perturbed } from './gamma-gradient.js'

/** Included mixture points (0 < x1 < 1) in SI, with weights 1/σ. */
export interface FitData {
  n: number
  /** Residual rows of the full objective: one per point (T or P) plus one per point that has y. */
  nRows: number
  /** First residual row of each point (its T or P row; the y row, when it has y, follows). */
  rowOf: Int32Array
  /** 1 where the point has a measured vapour composition. */
  hasY: Uint8Array
  T: Float64Array
  lnP: Float64Array
  x1: Float64Array
  y1: Float64Array
  wT: Float64Array
  wY: Float64Array
  /** 1/σP, 1/Pa (isothermal fits). */
  wP: Float64Array
  vp1: LnPsat
  vp2: LnPsat
  /** The compiled virial vapour, null for an ideal vapour. */
  gv: CompiledVirial | null
  /**
   * True: each point's pressure is calculated at its T (bubble-pressure objective); false: its T at its P (or, when
   * `iso` is present, as `iso` says point by point).
   */
  isothermal: boolean
  /** Only when the points are of both kinds: 1 where the point is isothermal (P calculated), 0 isobaric (T). */
  iso?: Uint8Array
  /** ln Φ1, ln Φ2 at each point's measured T, P, y (virial vapour only): the activity objective's γ = yΦP/(xPsat). */
  lnPhiExp?: [Float64Array, Float64Array]
  /** 1 for rows marked heterogeneous (two liquid layers seen): compared with the model's three-phase point. */
  het?: Uint8Array
}

const g = new Float64Array(4)

/** Whether data point i is isothermal (its pressure calculated at its T). */
export function isIsothermal(d: FitData, i: number): boolean {
  return d.iso ? d.iso[i] === 1 : d.isothermal
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

/**
 * The bubble-point (or, for isothermal data, bubble-pressure) objective; `useY` false fits T–x (P–x) alone: the
 * point test, and Barker's method when no point has y. Rows follow `d.rowOf` with useY, one per point without.
 */
export function bubbleProblem(
  d: FitData,
  layout: ParameterLayout,
  useY: boolean,
): LeastSquaresProblem & { Tguess: Float64Array; rowOf: Int32Array } {
  const m = layout.names.length
  const Tguess = new Float64Array(d.n)
  // The measured temperature is the best first guess of each bubble point (within the noise of it).
  for (let i = 0; i < d.n; i++) Tguess[i] = d.T[i]
  const dlng = new Float64Array(2 * m)
  const dT = new Float64Array(m)
  const dy = new Float64Array(m)
  const rowOf = useY ? d.rowOf : Int32Array.from({ length: d.n }, (_, i) => i)
  const withY = (i: number) => useY && d.hasY[i] === 1
  const memo: (ThreePhaseMemo | null)[] = new Array(d.n).fill(null)
  // Isobaric with an ideal vapour keeps the original (fastest) path; the other three cases go through model-point.ts.
  const general = d.isothermal || d.gv !== null || d.iso !== undefined
  // Per point: what is calculated (P isothermal, T isobaric), its measured value and weight, and its context.
  const wCalc = d.iso ? Float64Array.from(d.iso, (v, i) => (v ? d.wP[i] : d.wT[i])) : d.isothermal ? d.wP : d.wT
  const measured = d.iso
    ? d.T.map((T, i) => (d.iso![i] ? Math.exp(d.lnP[i]) : T))
    : d.isothermal
      ? d.lnP.map(Math.exp)
      : d.T
  const ctxP = { vp1: d.vp1, vp2: d.vp2, gv: d.gv, isothermal: true }
  const ctxT = { vp1: d.vp1, vp2: d.vp2, gv: d.gv, isothermal: false }
  const ctxOf = (i: number) => (isIsothermal(d, i) ? ctxP : ctxT)
  const solve = (model: ActivityModel, i: number): boolean => {
    if (!general) return bubbleAt(model, d, i, Tguess, memo)
    const ctx = ctxOf(i)
    if (!solvePoint(model, ctx, d.x1[i], d.T[i], d.lnP[i], Tguess[i])) return false
    if (!ctx.isothermal) Tguess[i] = point[0]
    res[0] = point[0]
    res[1] = point[1]
    return true
  }
  const fill = (r: Float64Array, i: number) => {
    const k = rowOf[i]
    r[k] = (res[0] - measured[i]) * wCalc[i]
    if (withY(i)) r[k + 1] = (res[1] - d.y1[i]) * d.wY[i]
  }
  // Levenberg–Marquardt asks for the Jacobian at the trial point whose residuals it has just accepted: the solved
  // points of the last residual call are kept (what the sensitivities read: res[0], res[1], res[6] on the ideal
  // isobaric path, point[0..3] on the others) and reused when the parameters are the same, so no bubble point is
  // solved twice. Not for two-layer points (their three-phase memo carries more state).
  const cacheable = d.het === undefined
  const kept = new Float64Array(4 * d.n)
  const keptAt = new Float64Array(m)
  let keptValid = false
  const keep = (i: number) => {
    const o = 4 * i
    if (general) {
      kept[o] = point[0]
      kept[o + 1] = point[1]
      kept[o + 2] = point[2]
      kept[o + 3] = point[3]
    } else {
      kept[o] = res[0]
      kept[o + 1] = res[1]
      kept[o + 2] = res[6]
    }
  }
  const restore = (i: number) => {
    const o = 4 * i
    if (general) {
      point[0] = kept[o]
      point[1] = kept[o + 1]
      point[2] = kept[o + 2]
      point[3] = kept[o + 3]
      res[0] = kept[o]
      res[1] = kept[o + 1]
    } else {
      res[0] = kept[o]
      res[1] = kept[o + 1]
      res[6] = kept[o + 2]
    }
  }
  const sameAsKept = (p: ArrayLike<number>) => {
    if (!keptValid) return false
    for (let j = 0; j < m; j++) if (p[j] !== keptAt[j]) return false
    return true
  }
  return {
    nResiduals: useY ? d.nRows : d.n,
    nParams: m,
    Tguess,
    rowOf,
    residuals(p, r) {
      keptValid = false
      if (!layout.valid(p)) return false
      const model = layout.build(p)
      for (let i = 0; i < d.n; i++) {
        if (!solve(model, i)) return false
        fill(r, i)
        if (cacheable) keep(i)
      }
      if (cacheable) {
        for (let j = 0; j < m; j++) keptAt[j] = p[j]
        keptValid = true
      }
      return true
    },
    jacobian(p, r, J) {
      if (!layout.valid(p)) return false
      const model = layout.build(p)
      const pm = perturbedModels(layout, p, d.het !== undefined)
      const reuse = sameAsKept(p)
      for (let i = 0; i < d.n; i++) {
        if (reuse) restore(i)
        else if (!solve(model, i)) return false
        fill(r, i)
        if (general) pointSensitivities(model, ctxOf(i), d.x1[i], pm, dT, dy)
        else if (!memo[i]) bubbleSensitivities(model, d, d.x1[i], pm, dlng, dT, dy)
        else if (!threePhaseSensitivities(pm, d, i, memo[i], res[0], res[1], dT, dy)) return false
        const k = rowOf[i]
        for (let j = 0; j < m; j++) {
          J[k * m + j] = dT[j] * wCalc[i]
          if (withY(i)) J[(k + 1) * m + j] = dy[j] * d.wY[i]
        }
      }
      return true
    },
  }
}

/** Experimental ln γ1, ln γ2 of each point (NaN where y is 0, 1 or missing). */
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
    // Under a virial vapour γi = yi·Φi·P/(xi·Pi_sat), Φ at the measured T, P and y.
    const f1 = d.lnPhiExp ? d.lnPhiExp[0][i] : 0
    const f2 = d.lnPhiExp ? d.lnPhiExp[1][i] : 0
    l1[i] = y > 0 ? Math.log(y / x) + d.lnP[i] + f1 - (d.vp1.a - d.vp1.b / (T + d.vp1.c)) : NaN
    l2[i] = y < 1 ? Math.log((1 - y) / (1 - x)) + d.lnP[i] + f2 - (d.vp2.a - d.vp2.b / (T + d.vp2.c)) : NaN
  }
  return [l1, l2]
}

/** The activity objective: residuals ln γi(model) − ln γi(exp), unweighted; forward differences in θ. */
export function activityProblem(d: FitData, layout: ParameterLayout): LeastSquaresProblem {
  const m = layout.names.length
  const dlng = new Float64Array(2 * m)
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
      const base = layout.build(p)
      fill(base, r)
      if (layout.gradient) {
        for (let i = 0; i < d.n; i++) {
          layout.gradient(base, d.x1[i], d.T[i], dlng)
          for (let j = 0; j < m; j++) {
            J[2 * i * m + j] = Number.isNaN(l1[i]) ? 0 : dlng[2 * j]
            J[(2 * i + 1) * m + j] = Number.isNaN(l2[i]) ? 0 : dlng[2 * j + 1]
          }
        }
        return true
      }
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
