import { checkPressure, ThermoError } from '../errors.js'
import { res, solveBubbleT, startTemperature } from '../equilibrium/kernel.js'
import { compileSystem } from '../equilibrium/system.js'
import type { FitBinaryResult } from './fit-binary.js'
import { invertSymmetric } from './linear-algebra.js'
import { bubbleSensitivities, perturbedModels } from './objectives.js'
import { parameterLayout } from './parameters.js'
import { point, pointSensitivities, solvePoint } from './model-point.js'

/** Bubble points and their parameter sensitivities along a list of liquid compositions at P (Pa). */
function sensitivities(fit: FitBinaryResult, P: number, xs: number[]) {
  const s = fit.settings
  const layout = parameterLayout(s.model, {
    V1: s.V1,
    V2: s.V2,
    uniquac: s.uniquac,
    temperatureDependent: s.temperatureDependent,
    alpha: s.alpha,
    fitAlpha: s.fitAlpha,
  })
  // A parameter held at its bound (NRTL α) is part of the layout's fixed settings, not of p.
  const p = Float64Array.from(
    fit.parameters.filter((q) => !q.atBound),
    (q) => q.value,
  )
  const c = compileSystem(fit.system)
  const pm = perturbedModels(layout, p)
  const m = p.length
  const dlng = new Float64Array(2 * m)
  const lnP = Math.log(P)
  let T = NaN
  const ctx = { vp1: c.vp1, vp2: c.vp2, gv: c.gv, isothermal: false }
  return xs.map((x1) => {
    if (c.gv) {
      // Virial vapour: γ–φ bubble points and their implicit sensitivities (model-point.ts).
      if (!solvePoint(c.act, ctx, x1, NaN, lnP, Number.isFinite(T) ? T : startTemperature(c.vp1, c.vp2, lnP, x1))) {
        throw new ThermoError(
          'no-convergence',
          `No bubble point at x1 = ${x1.toFixed(4)} and ${P} Pa with the fitted parameters.`,
        )
      }
      T = point[0]
      const gT = new Float64Array(m)
      const gY = new Float64Array(m)
      pointSensitivities(c.act, ctx, x1, pm, gT, gY)
      return { x1, T, y1: point[1], gT, gY }
    }
    if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, Number.isFinite(T) ? T : startTemperature(c.vp1, c.vp2, lnP, x1))) {
      throw new ThermoError(
        'no-convergence',
        `No bubble point at x1 = ${x1.toFixed(4)} and ${P} Pa with the fitted parameters.`,
      )
    }
    T = res[0]
    const y1 = res[1]
    const gT = new Float64Array(m)
    const gY = new Float64Array(m)
    bubbleSensitivities(c.act, c, x1, pm, dlng, gT, gY)
    return { x1, T, y1, gT, gY }
  })
}

function variance(cov: number[][], g: Float64Array): number {
  let v = 0
  for (let i = 0; i < g.length; i++) for (let j = 0; j < g.length; j++) v += g[i] * cov[i][j] * g[j]
  return Math.max(v, 0)
}

function checkCount(name: string, n: number, lo: number, hi: number): void {
  if (!Number.isInteger(n) || n < lo || n > hi) {
    throw new ThermoError(
      'invalid-input',
      `The number of ${name} must be a whole number from ${lo} to ${hi}; got ${n}.`,
    )
  }
}

/** A fitted T–x–y curve with its ±2σ confidence band. */
export interface PredictionBand {
  P: number
  x1: number[]
  T: number[]
  y1: number[]
  sigmaT: number[]
  sigmaY: number[]
  Tlow: number[]
  Thigh: number[]
  ylow: number[]
  yhigh: number[]
  warnings: string[]
}

/**
 * The fitted T–x–y curve at P (Pa) with a ±2σ band from the parameter covariance, by linear
 * propagation σ² = gᵀ·C·g with g = ∂(T or y1)/∂θ. It shows how sure the fit is of the curve
 * (a confidence band of the model), not the scatter of a single new measurement.
 * @param options points: compositions on a cosine grid from 0 to 1, default 51 (3–1001).
 */
export function predictionBand(fit: FitBinaryResult, options: { P: number; points?: number }): PredictionBand {
  checkPressure(options.P)
  const n = options.points ?? 51
  checkCount('band points', n, 3, 1001)
  const xs = Array.from({ length: n }, (_, i) => (i === n - 1 ? 1 : 0.5 * (1 - Math.cos((Math.PI * i) / (n - 1)))))
  const rows = sensitivities(fit, options.P, xs)
  const warnings = fit.covariance.flat().every(Number.isFinite)
    ? []
    : ['The fit has no usable covariance, so the band cannot be drawn.']
  const sigmaT = rows.map((r) => Math.sqrt(variance(fit.covariance, r.gT)))
  const sigmaY = rows.map((r) => Math.sqrt(variance(fit.covariance, r.gY)))
  return {
    P: options.P,
    x1: xs,
    T: rows.map((r) => r.T),
    y1: rows.map((r) => r.y1),
    sigmaT,
    sigmaY,
    Tlow: rows.map((r, i) => r.T - 2 * sigmaT[i]),
    Thigh: rows.map((r, i) => r.T + 2 * sigmaT[i]),
    ylow: rows.map((r, i) => Math.max(0, r.y1 - 2 * sigmaY[i])),
    yhigh: rows.map((r, i) => Math.min(1, r.y1 + 2 * sigmaY[i])),
    warnings,
  }
}

/** A suggested next measurement: liquid x1, its bubble T (K) and predicted y1, and σy before measuring there. */
export interface SuggestedComposition {
  x1: number
  T: number
  y1: number
  sigmaY: number
}

/** How {@link suggestNextCompositions} ranks a candidate composition. */
export type SuggestionCriterion = 'sigma-y' | 'd-optimal'

/** det(I₂ + UᵀCU)/… for the two rows u1 = gT/σT, u2 = gY/σY of one hypothetical point, scaled by 1/s². */
function determinantGain(
  cov: number[][],
  gT: Float64Array,
  gY: Float64Array,
  wT: number,
  wY: number,
  s2: number,
): number {
  const m = gT.length
  let tt = 0
  let ty = 0
  let yy = 0
  for (let i = 0; i < m; i++)
    for (let j = 0; j < m; j++) {
      tt += gT[i] * cov[i][j] * gT[j]
      ty += gT[i] * cov[i][j] * gY[j]
      yy += gY[i] * cov[i][j] * gY[j]
    }
  const a = 1 + (tt * wT * wT) / s2
  const d = 1 + (yy * wY * wY) / s2
  const b = (ty * wT * wY) / s2
  return a * d - b * b
}

/**
 * Where to measure next: liquid compositions on a grid x1 = 0.01…0.99, chosen greedily (sequential
 * design): rank every composition, pick the best, add a hypothetical measurement there (σT, σy as in the
 * fit) to the parameter information, and repeat; picks stay at least min(0.05, 0.5/count) apart. Best first.
 * Criteria: 'sigma-y' (default) picks the largest predicted σy of the curve; 'd-optimal' picks the
 * largest reduction of det(covariance), i.e. the largest det(I + UᵀCU) for the point's T and y rows U
 * (A. C. Atkinson, A. N. Donev, Optimum Experimental Designs, 1992, ch. 11; from memory). For a
 * two-parameter model D-optimal picks go toward the dilute ends, where γ∞ and so the parameters are
 * pinned. Pure: the same fit and options always give the same list.
 * @param options P in Pa, count 1–20, criterion (default 'sigma-y').
 */
export function suggestNextCompositions(
  fit: FitBinaryResult,
  options: { P: number; count: number; criterion?: SuggestionCriterion },
): SuggestedComposition[] {
  checkPressure(options.P)
  checkCount('suggestions', options.count, 1, 20)
  const criterion = options.criterion ?? 'sigma-y'
  if (criterion !== 'sigma-y' && criterion !== 'd-optimal') {
    throw new ThermoError(
      'invalid-input',
      `The suggestion criterion must be 'sigma-y' or 'd-optimal'; got ${String(criterion)}.`,
    )
  }
  const m = fit.covariance.length
  const info = new Float64Array(m * m)
  fit.covariance.forEach((row, i) => row.forEach((v, j) => (info[i * m + j] = v)))
  const inv = invertSymmetric(info, m)
  if (!inv)
    throw new ThermoError('no-covariance', 'The fit has no usable covariance, so no next measurement can be suggested.')
  const grid = Array.from({ length: 99 }, (_, i) => (i + 1) / 100)
  const rows = sensitivities(fit, options.P, grid)
  const { sigmaT, sigmaY, residualVariance } = fit.settings
  const s2 = Number.isFinite(residualVariance) && residualVariance > 0 ? residualVariance : 1
  const spacing = Math.min(0.05, 0.5 / options.count)
  const picks: SuggestedComposition[] = []
  let cov = fit.covariance
  for (let k = 0; k < options.count; k++) {
    let best = -1
    let bestScore = -Infinity
    rows.forEach((r, i) => {
      if (picks.some((p) => Math.abs(p.x1 - r.x1) < spacing - 1e-12)) return
      const score =
        criterion === 'sigma-y' ? variance(cov, r.gY) : determinantGain(cov, r.gT, r.gY, 1 / sigmaT, 1 / sigmaY, s2)
      // Strictly greater: ties go to the lower x1, so the list is reproducible.
      if (score > bestScore) {
        bestScore = score
        best = i
      }
    })
    if (best < 0) break
    const r = rows[best]
    picks.push({ x1: r.x1, T: r.T, y1: r.y1, sigmaY: Math.sqrt(variance(cov, r.gY)) })
    // Information of the hypothetical point: its T and y rows, weighted as the fit weighted its data.
    for (let i = 0; i < m; i++)
      for (let j = 0; j < m; j++) {
        inv[i * m + j] += ((r.gT[i] * r.gT[j]) / (sigmaT * sigmaT) + (r.gY[i] * r.gY[j]) / (sigmaY * sigmaY)) / s2
      }
    const next = invertSymmetric(inv, m)
    if (!next) break
    cov = Array.from({ length: m }, (_, i) => Array.from({ length: m }, (_, j) => next[i * m + j]))
  }
  return picks
}
