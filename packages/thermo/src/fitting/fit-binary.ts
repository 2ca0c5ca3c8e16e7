import { spanWarnings } from '../vapor-pressure/compiled.js'
import { ThermoError } from '../errors.js'
import type { ActivityModel, BinarySystem, VaporPressureModel } from '../types.js'
import { buildFitData, checkModelOptions, modelName, type BinaryPoint } from './fit-input.js'
import { levenbergMarquardt, type LeastSquaresProblem, type LeastSquaresResult } from './lm.js'
import { activityProblem, bubbleProblem, type FitData } from './objectives.js'
import { alphaOf, boundedAlphaLayout, boundReached } from './alpha-bounds.js'
import { parameterLayout, type FittableModel, type ParameterLayout, type UniquacStructure } from './parameters.js'
import { pointResiduals, summarise } from './report.js'
import { fitStatistics } from './statistics.js'
import { liquidSplitWarnings, type NamedFitWarning } from './liquid-split.js'

/** Options of {@link fitBinary}. */
export interface FitBinaryOptions {
  points: BinaryPoint[]
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  model: FittableModel
  /** Liquid molar volumes, cm³/mol (Wilson only). */
  V1?: number
  V2?: number
  /** UNIQUAC structure parameters r and q of both components (UNIQUAC only). */
  uniquac?: UniquacStructure
  /** NRTL or Wilson energies linear in T: b(T) = b + bT·(T − 298.15 K), bT fitted (J/(mol·K)); α held. */
  temperatureDependent?: boolean
  /** NRTL α, default 0.3 (fixed unless fitAlpha). */
  alpha?: number
  fitAlpha?: boolean
  /** 'bubble-point' (default) or 'activity'. */
  objective?: 'bubble-point' | 'activity'
}

/** A point's residuals after the fit, measured − calculated: dT = T_meas − T_calc (K), dy = y_meas − y_calc; see {@link fitBinary} for the flag rule. */
export interface PointResidual {
  dT: number
  dy: number
  studentized: number
  leverage: number
  flagged: boolean
  excluded: boolean
}

/** One fitted parameter; standardError in the parameter's unit, null when it was held at a bound. */
export interface FittedParameter {
  name: string
  value: number
  standardError: number | null
  atBound?: boolean
}

/** Result of {@link fitBinary}. */
export interface FitBinaryResult {
  activity: ActivityModel
  system: BinarySystem
  /**
   * Fitted parameters. A fitted NRTL α that reached a bound of NRTL_ALPHA_BOUNDS is held there: its entry
   * has atBound true and standardError null, and covariance/correlation cover the other parameters only.
   */
  parameters: FittedParameter[]
  covariance: number[][]
  correlation: number[][]
  converged: boolean
  iterations: number
  /** Minimised sum of squares (weighted for bubble-point, in ln γ for activity). */
  objective: number
  objectiveKind: 'bubble-point' | 'activity'
  rmsT: number
  rmsY: number
  aadT: number
  aadY: number
  maxAbsT: number
  maxAbsY: number
  aic: number
  residuals: PointResidual[]
  warnings: string[]
  /**
   * Warnings a program can act on (their messages are also in `warnings`): 'spurious-liquid-split' — the
   * parameters predict two liquid layers in the data's temperature range that no point shows (x1I, x1II, T say
   * where); 'heterogeneous-points-not-split' — points marked as two layers but the model never splits.
   * Always set by fitBinary (optional only for results built elsewhere).
   */
  namedWarnings?: NamedFitWarning[]
  /** What is needed to rebuild the parameter layout (prediction bands, suggestions). */
  settings: {
    model: FittableModel
    V1?: number
    V2?: number
    uniquac?: UniquacStructure
    temperatureDependent?: boolean
    alpha: number
    fitAlpha: boolean
    sigmaT: number
    sigmaY: number
    residualVariance: number
  }
}

/** Scaled distance between parameter vectors, to tell separate minima apart. */
function distinct(a: ArrayLike<number>, b: ArrayLike<number>, layout: ParameterLayout): boolean {
  for (let j = 0; j < a.length; j++)
    if (Math.abs(a[j] - b[j]) > 1e-3 * Math.max(Math.abs(a[j]), layout.scales[j])) return true
  return false
}

/** Cheap multi-start: rank the grid by activity cost, refine the best few, keep the distinct minima, best first. */
function activityCandidates(data: FitData, layout: ParameterLayout, objectiveTolerance: number): LeastSquaresResult[] {
  const problem = activityProblem(data, layout)
  const r = new Float64Array(problem.nResiduals)
  const ranked = layout.starts
    .map((p) => ({ p, cost: problem.residuals(Float64Array.from(p), r) ? r.reduce((s, v) => s + v * v, 0) : Infinity }))
    .filter((s) => Number.isFinite(s.cost))
    .sort((a, b) => a.cost - b.cost)
    .slice(0, 2)
  const found: LeastSquaresResult[] = []
  for (const s of ranked) {
    // Only a starting point for the bubble-point fit, so a loose tolerance is enough.
    const fit = levenbergMarquardt(problem, s.p, { maxIterations: 100, tolerance: objectiveTolerance })
    if (fit && found.every((f) => distinct(f.p, fit.p, layout))) found.push(fit)
  }
  return found.sort((a, b) => a.cost - b.cost)
}

function bestBubbleFit(problem: LeastSquaresProblem, starts: ArrayLike<number>[]): LeastSquaresResult | null {
  let best: LeastSquaresResult | null = null
  for (const s of starts) {
    const fit = levenbergMarquardt(problem, s, { maxIterations: 200 })
    if (fit && (!best || fit.cost < best.cost - 1e-12 * best.cost)) best = fit
  }
  return best
}

/**
 * Fit binary activity-model parameters to measured T–x–y points under modified Raoult's law.
 *
 * Objective 'bubble-point' (default): each point's bubble temperature and vapour composition at its own
 * x1 and P; minimise Σ[(ΔT/σT)² + (Δy/σy)²], σT = 0.1 K and σy = 0.005 unless a point gives its own
 * (common practice, no source). Objective 'activity': minimise Σ(Δ ln γi)², γi = yi·P/(xi·Pi_sat(T)).
 * Levenberg–Marquardt from several starting points (grid ranked by the cheap activity objective),
 * deterministic. Pure-component points (x1 = 0 or 1) carry no information on the mixing parameters:
 * they are reported but not fitted (see pureComponentCheck). Excluded points are reported, not fitted.
 * A point is flagged as a probable outlier when its externally studentized residual (the larger of its
 * T and y residuals) exceeds 3 in absolute value.
 * Parameters: A12, A21 (dimensionless), a12, a21 (Wilson and UNIQUAC), b12, b21 (J/mol), alpha.
 * @throws ThermoError for too few points, mole fractions outside [0, 1], non-finite values, P ≤ 0.
 */
export function fitBinary(options: FitBinaryOptions): FitBinaryResult {
  checkModelOptions(options)
  const objectiveKind = options.objective ?? 'bubble-point'
  const alpha = options.alpha ?? 0.3
  const fitAlpha = options.model === 'nrtl' && (options.fitAlpha ?? false)
  const layout = parameterLayout(options.model, {
    V1: options.V1,
    V2: options.V2,
    uniquac: options.uniquac,
    temperatureDependent: options.temperatureDependent,
    alpha,
    fitAlpha,
  })
  const m = layout.names.length
  const { data, index } = buildFitData(options.points, options.vaporPressure, options.model, m)
  // A fitted α is searched through a bounded transform, then settled in α itself (settleAlpha).
  const search = fitAlpha ? boundedAlphaLayout(layout) : layout
  const fit = searchFit(data, search, objectiveKind)
  if (!fit) {
    throw new ThermoError(
      'no-convergence',
      `The ${modelName(options.model)} fit found no parameters for which every point has a bubble point; check the data and the vapour-pressure models.`,
    )
  }
  if (!fitAlpha) {
    return finishFit(options, layout, data, index, fit, objectiveKind, { alpha, fitAlpha, held: null })
  }
  return settleAlpha(options, data, index, fit, objectiveKind)
}

/** Residuals and Jacobian of `problem` at p, as a result with the given convergence flag; null on failure. */
function atPoint(problem: LeastSquaresProblem, p: number[], converged: boolean): LeastSquaresResult | null {
  const r = new Float64Array(problem.nResiduals)
  const J = new Float64Array(problem.nResiduals * problem.nParams)
  if (!problem.jacobian(Float64Array.from(p), r, J)) return null
  return { p: Float64Array.from(p), cost: r.reduce((t, v) => t + v * v, 0), iterations: 0, converged, r, J }
}

function problemOf(
  data: FitData,
  layout: ParameterLayout,
  objectiveKind: 'bubble-point' | 'activity',
): LeastSquaresProblem {
  return objectiveKind === 'activity' ? activityProblem(data, layout) : bubbleProblem(data, layout, true)
}

/** Multi-start search: activity-objective candidates, then the bubble-point refinement. */
function searchFit(
  data: FitData,
  layout: ParameterLayout,
  objectiveKind: 'bubble-point' | 'activity',
): LeastSquaresResult | null {
  const candidates = activityCandidates(data, layout, objectiveKind === 'activity' ? 1e-11 : 1e-6)
  if (objectiveKind === 'activity') return candidates[0] ?? null
  const problem = problemOf(data, layout, objectiveKind)
  const starts = candidates.length > 0 ? candidates.slice(0, 2).map((c) => c.p) : layout.starts
  let fit = bestBubbleFit(problem, starts)
  if (!fit && candidates.length > 0) fit = bestBubbleFit(problem, layout.starts)
  return fit
}

/**
 * From the bounded search's optimum, polish in (b12, b21, α) so that the covariance is in α; when α
 * ends within ALPHA_BOUND_TOLERANCE of a bound, hold it there and fit b12, b21 alone.
 */
function settleAlpha(
  options: FitBinaryOptions,
  data: FitData,
  index: number[],
  bounded: LeastSquaresResult,
  objectiveKind: 'bubble-point' | 'activity',
): FitBinaryResult {
  const direct = parameterLayout('nrtl', { alpha: alphaOf(bounded.p[2]), fitAlpha: true })
  const start = [bounded.p[0], bounded.p[1], alphaOf(bounded.p[2])]
  const polished = levenbergMarquardt(problemOf(data, direct, objectiveKind), start, { maxIterations: 200 })
  const best = polished && polished.cost <= bounded.cost * (1 + 1e-9) ? polished : null
  const a = best ? best.p[2] : start[2]
  const bound = boundReached(a)
  const inside =
    bound === null ? (best ?? atPoint(problemOf(data, direct, objectiveKind), start, bounded.converged)) : null
  if (inside)
    return finishFit(options, direct, data, index, inside, objectiveKind, { alpha: a, fitAlpha: true, held: null })
  const heldAlpha = bound ?? a
  const held = parameterLayout('nrtl', { alpha: heldAlpha, fitAlpha: false })
  const fit = levenbergMarquardt(problemOf(data, held, objectiveKind), start.slice(0, 2), { maxIterations: 200 })
  if (!fit) {
    throw new ThermoError(
      'no-convergence',
      `The NRTL fit found no parameters for which every point has a bubble point; check the data and the vapour-pressure models.`,
    )
  }
  return finishFit(options, held, data, index, fit, objectiveKind, {
    alpha: heldAlpha,
    fitAlpha: false,
    held: bound ?? heldAlpha,
  })
}

function finishFit(
  options: FitBinaryOptions,
  layout: ParameterLayout,
  data: FitData,
  index: number[],
  fit: LeastSquaresResult,
  objectiveKind: 'bubble-point' | 'activity',
  nrtl: { alpha: number; fitAlpha: boolean; held: number | null },
): FitBinaryResult {
  const m = layout.names.length
  const nRows = fit.r.length
  const stats = fitStatistics(fit.r, fit.J, nRows, m)
  const activity = layout.build(fit.p)
  const system: BinarySystem = { vaporPressure: options.vaporPressure, activity }
  const residuals = pointResiduals(
    options.points,
    system,
    data,
    index,
    stats,
    fit.r,
    objectiveKind === 'bubble-point',
    layout,
    fit.p,
  )
  const summary = summarise(residuals, index)
  const warnings: string[] = []
  if (!fit.converged) warnings.push('The fit stopped before it fully converged; treat the parameters with care.')
  if (nrtl.held !== null)
    warnings.push(`α reached its bound ${nrtl.held}: the data do not determine α; hold it at a fixed value.`)
  if (!stats.inverse)
    warnings.push(
      'The parameters are not separately determined by these data (singular fit); standard errors are not available.',
    )
  for (let i = 0; i < m; i++)
    for (let j = 0; j < i; j++) {
      const r = stats.correlation[i][j]
      if (Math.abs(r) > 0.99)
        warnings.push(
          `${layout.names[j]} and ${layout.names[i]} are strongly correlated (r = ${r.toFixed(3)}): the data do not tell them apart well.`,
        )
    }
  const flagged = residuals.filter((r) => r.flagged && !r.excluded).length
  if (flagged > 0)
    warnings.push(
      `${flagged} point${flagged > 1 ? 's look' : ' looks'} like an outlier (|studentized residual| > 3); check ${flagged > 1 ? 'them' : 'it'} before approving.`,
    )
  const Ts = Array.from(data.T)
  warnings.push(...spanWarnings(options.vaporPressure, Math.min(...Ts), Math.max(...Ts)))
  const namedWarnings = liquidSplitWarnings(
    activity,
    Math.min(...Ts),
    Math.max(...Ts),
    data.het?.reduce((s, v) => s + v, 0) ?? 0,
  )
  warnings.push(...namedWarnings.map((w) => w.message))
  const sigmaT = 1 / (Array.from(data.wT).reduce((s, v) => s + v, 0) / data.n)
  const sigmaY = 1 / (Array.from(data.wY).reduce((s, v) => s + v, 0) / data.n)
  return {
    activity,
    system,
    parameters: [
      ...layout.names.map((name, j) => ({ name, value: fit.p[j], standardError: stats.standardErrors[j] })),
      ...(nrtl.held !== null ? [{ name: 'alpha', value: nrtl.held, standardError: null, atBound: true }] : []),
    ],
    covariance: stats.covariance,
    correlation: stats.correlation,
    converged: fit.converged,
    iterations: fit.iterations,
    objective: fit.cost,
    objectiveKind,
    ...summary,
    aic: stats.aic,
    residuals,
    warnings,
    namedWarnings,
    settings: {
      model: options.model,
      V1: options.V1,
      V2: options.V2,
      uniquac: options.uniquac,
      temperatureDependent: options.temperatureDependent,
      alpha: nrtl.alpha,
      fitAlpha: nrtl.fitAlpha,
      sigmaT,
      sigmaY,
      residualVariance: stats.s2,
    },
  }
}

/**
 * Fit the model to T–x alone (bubble temperatures at each point's x1 and P, vapour compositions unused),
 * from the starting grid ranked by that same objective. Used by the point test.
 * @returns the fitted activity model and whether the fit converged.
 */
export function fitTemperatureOnly(options: FitBinaryOptions): {
  activity: ActivityModel
  converged: boolean
  index: number[]
} {
  checkModelOptions(options)
  const alpha = options.alpha ?? 0.3
  const layout = parameterLayout(options.model, {
    V1: options.V1,
    V2: options.V2,
    uniquac: options.uniquac,
    temperatureDependent: options.temperatureDependent,
    alpha,
    fitAlpha: false,
  })
  const { data, index } = buildFitData(options.points, options.vaporPressure, options.model, layout.names.length)
  const problem = bubbleProblem(data, layout, false)
  const r = new Float64Array(problem.nResiduals)
  const ranked = layout.starts
    .map((p) => ({ p, cost: problem.residuals(Float64Array.from(p), r) ? r.reduce((s, v) => s + v * v, 0) : Infinity }))
    .filter((s) => Number.isFinite(s.cost))
    .sort((a, b) => a.cost - b.cost)
  const fit = bestBubbleFit(
    problem,
    ranked.slice(0, 3).map((s) => s.p),
  )
  if (!fit) {
    throw new ThermoError(
      'no-convergence',
      `The ${modelName(options.model)} fit to T–x found no parameters for which every point has a bubble point.`,
    )
  }
  return { activity: layout.build(fit.p), converged: fit.converged, index }
}
