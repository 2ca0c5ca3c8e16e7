import { spanWarnings } from '../vapor-pressure/compiled.js'
import { associationWarnings } from '../virial/model.js'
import { ThermoError } from '../errors.js'
import type { ActivityModel, BinarySystem, VaporPressureModel } from '../types.js'
import { buildFitData, checkModelOptions, modelName, type BinaryPoint } from './fit-input.js'
import type { VaporModel } from '../virial/virial-types.js'
import { levenbergMarquardt, type LeastSquaresProblem, type LeastSquaresResult } from './lm.js'
import { activityProblem, bubbleProblem, type FitData } from './objectives.js'
import { alphaOf, boundedAlphaLayout, boundReached } from './alpha-bounds.js'
import { parameterLayout, type FittableModel, type ParameterLayout, type UniquacStructure } from './parameters.js'
import { pointResiduals, summarise } from './report.js'
import { fitStatistics, type FitStatistics } from './statistics.js'
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
  /** NRTL, Wilson or UNIQUAC energies linear in T: b(T) = b + bT·(T − 298.15 K), bT fitted (J/(mol·K)); α held. */
  temperatureDependent?: boolean
  /** NRTL α, default 0.3 (fixed unless fitAlpha). */
  alpha?: number
  fitAlpha?: boolean
  /**
   * 'bubble-point' (default; isobaric: residuals dT, dy), 'bubble-pressure' (isothermal: residuals dP in Pa, dy) or
   * 'activity' (Σ(Δ ln γ)², needs y at every fitted point).
   */
  objective?: FitObjective
  /** The vapour model; absent or ideal: modified Raoult's law; virial: every point solved γ–φ. */
  vapor?: VaporModel
}

/** The objectives of {@link fitBinary}. */
export type FitObjective = 'bubble-point' | 'bubble-pressure' | 'activity'

/** How a fit's vapour was modelled: 'ideal', or a virial vapour by Tsonopoulos or by Hayden–O'Connell. */
export type FitVaporModel = 'ideal' | 'virial-tsonopoulos' | 'virial-hayden-oconnell'

/**
 * A point's residuals after the fit, measured − calculated: dT = T_meas − T_calc (K; null in an isothermal fit),
 * dP = P_meas − P_calc (Pa; isothermal fits only), dy = y_meas − y_calc (null when the point has no y); see
 * {@link fitBinary} for the flag rule.
 */
export interface PointResidual {
  dT: number | null
  dP?: number
  dy: number | null
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
  /** Minimised sum of squares (weighted for bubble-point and bubble-pressure, in ln γ for activity). */
  objective: number
  objectiveKind: FitObjective
  /** The vapour model the fit used. Always set by fitBinary (optional only for results built elsewhere). */
  vaporModel?: FitVaporModel
  /**
   * 'barker' when no fitted point has a vapour composition (T–x or P–x data, fitted by the bubble-point or
   * bubble-pressure equation alone: J. A. Barker, Aust. J. Chem. 6 (1953) 207), else 'with-y'. Always set by fitBinary.
   */
  method?: 'barker' | 'with-y'
  /** Over the fitted points (NaN when there are none: dT in an isothermal fit, dy without y). */
  rmsT: number
  rmsY: number
  aadT: number
  aadY: number
  maxAbsT: number
  maxAbsY: number
  /** Pressure deviations, Pa (isothermal fits only). */
  rmsP?: number
  aadP?: number
  maxAbsP?: number
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
    /** Mean σP of the fitted points, Pa (isothermal fits; with points of both kinds, over the isothermal ones). */
    sigmaP?: number
    /** The vapour model of the fit (absent: ideal). */
    vapor?: VaporModel
    residualVariance: number
  }
}

/** Scaled distance between parameter vectors, to tell separate minima apart. */
function distinct(a: ArrayLike<number>, b: ArrayLike<number>, layout: ParameterLayout, tolerance = 1e-3): boolean {
  for (let j = 0; j < a.length; j++)
    if (Math.abs(a[j] - b[j]) > tolerance * Math.max(Math.abs(a[j]), layout.scales[j])) return true
  return false
}

/** Iterates this close to a minimum already found (relative, as in {@link distinct}) are in its basin. */
const SAME_BASIN = 1e-2

/** At most this many points, evenly spread, rank the starting grid (the ranking only orders the starts). */
const RANKING_POINTS = 30

/**
 * Above this many points (a joint fit over several data sets, or one long series), candidates that only start the
 * bubble-point fit are refined on the RANKING_POINTS subset too: a start near the minimum is all they are for, and
 * the bubble-point fit on every point settles it (measured: a third of a joint fit's time went into refining the
 * candidates on all 90 points; see bench/README.md).
 */
const SUBSET_REFINEMENT_ABOVE = 2 * RANKING_POINTS

/**
 * Cheap multi-start: rank the grid by activity cost (on at most RANKING_POINTS evenly spread points), refine the best
 * two, keep the distinct minima, best first. A refinement that comes within SAME_BASIN of a minimum already found is
 * stopped there: it would converge to that minimum.
 */
function activityCandidates(
  data: FitData,
  layout: ParameterLayout,
  objectiveTolerance: number,
  startOnly = false,
): LeastSquaresResult[] {
  const ranking = data.n > RANKING_POINTS ? activityProblem(evenSubset(data, RANKING_POINTS), layout) : null
  const problem = startOnly && ranking && data.n > SUBSET_REFINEMENT_ABOVE ? ranking : activityProblem(data, layout)
  if (!ranking) return refineCandidates(problem, problem, layout, objectiveTolerance)
  return refineCandidates(ranking, problem, layout, objectiveTolerance)
}

/** Rank the starts by `ranking`'s cost, refine the best two with `problem` (see activityCandidates). */
function refineCandidates(
  ranking: LeastSquaresProblem,
  problem: LeastSquaresProblem,
  layout: ParameterLayout,
  objectiveTolerance: number,
): LeastSquaresResult[] {
  const r = new Float64Array(ranking.nResiduals)
  const ranked = layout.starts
    .map((p) => ({ p, cost: ranking.residuals(Float64Array.from(p), r) ? r.reduce((s, v) => s + v * v, 0) : Infinity }))
    .filter((s) => Number.isFinite(s.cost))
    .sort((a, b) => a.cost - b.cost)
    .slice(0, 2)
  const found: LeastSquaresResult[] = []
  for (const s of ranked) {
    // Only a starting point for the bubble-point fit, so a loose tolerance is enough.
    const fit = levenbergMarquardt(problem, s.p, {
      maxIterations: 100,
      tolerance: objectiveTolerance,
      stop: (p) => found.some((f) => !distinct(f.p, p, layout, SAME_BASIN)),
    })
    if (fit && !fit.stopped && found.every((f) => distinct(f.p, fit.p, layout))) found.push(fit)
  }
  return found.sort((a, b) => a.cost - b.cost)
}

/** The FitData of `count` points spread evenly over d's points (what the activity objective reads). */
function evenSubset(d: FitData, count: number): FitData {
  const pick = Array.from({ length: count }, (_, k) => Math.round((k * (d.n - 1)) / (count - 1)))
  const take = (a: Float64Array) => Float64Array.from(pick, (i) => a[i])
  return {
    ...d,
    n: count,
    T: take(d.T),
    lnP: take(d.lnP),
    x1: take(d.x1),
    y1: take(d.y1),
    hasY: Uint8Array.from(pick, (i) => d.hasY[i]),
    ...(d.het ? { het: Uint8Array.from(pick, (i) => d.het![i]) } : {}),
    ...(d.iso ? { iso: Uint8Array.from(pick, (i) => d.iso![i]) } : {}),
    ...(d.lnPhiExp ? { lnPhiExp: [take(d.lnPhiExp[0]), take(d.lnPhiExp[1])] as [Float64Array, Float64Array] } : {}),
  }
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
 * Fit binary activity-model parameters to measured VLE points.
 *
 * Objective 'bubble-point' (default, isobaric data): each point's bubble temperature and vapour composition at its
 * own x1 and P; minimise Σ[(ΔT/σT)² + (Δy/σy)²]. Objective 'bubble-pressure' (isothermal data): each point's bubble
 * pressure and vapour at its own x1 and T; minimise Σ[(ΔP/σP)² + (Δy/σy)²]. σT = 0.1 K, σy = 0.005, σP = 100 Pa
 * unless a point gives its own (DEFAULT_SIGMA_T, DEFAULT_SIGMA_Y, DEFAULT_SIGMA_P; common practice, no source).
 * A point without y (y1 null) contributes its T (or P) row only; when no point has y this is Barker's method
 * (J. A. Barker, Aust. J. Chem. 6 (1953) 207) and the result says `method: 'barker'`. Objective 'activity':
 * minimise Σ(Δ ln γi)², γi = yi·Φi·P/(xi·Pi_sat(T)) (Φ = 1 for an ideal vapour); it needs y at every fitted point.
 * `vapor` (virial): every bubble point is solved γ–φ; the result says `vaporModel`.
 * Levenberg–Marquardt from several starting points (grid ranked by the cheap activity objective, or by the fit's own
 * objective when too few points have y), deterministic. Pure-component points (x1 = 0 or 1) carry no information on
 * the mixing parameters: they are reported but not fitted (see pureComponentCheck). Excluded points are reported,
 * not fitted. Residuals are measured − calculated. A point is flagged as a probable outlier when its externally
 * studentized residual (the larger of its T or P and y residuals) exceeds 3 in absolute value.
 * Parameters: A12, A21 (dimensionless), a12, a21 (Wilson and UNIQUAC), b12, b21 (J/mol), alpha.
 * Also callable as fitBinary(points, options-without-points).
 * @throws ThermoError for too few points, mole fractions outside [0, 1], non-finite values, P ≤ 0;
 *   'needs-vapour-composition' for the activity objective on a point without y.
 */
export function fitBinary(options: FitBinaryOptions): FitBinaryResult
export function fitBinary(points: BinaryPoint[], options: Omit<FitBinaryOptions, 'points'>): FitBinaryResult
export function fitBinary(
  first: FitBinaryOptions | BinaryPoint[],
  rest?: Omit<FitBinaryOptions, 'points'>,
): FitBinaryResult {
  const options: FitBinaryOptions = Array.isArray(first) ? { ...(rest as FitBinaryOptions), points: first } : first
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
  const { data, index } = buildFitData(options.points, options.vaporPressure, options.model, m, {
    vapor: options.vapor,
    isothermal: objectiveKind === 'bubble-pressure',
  })
  checkObjectiveData(options, data, index, objectiveKind)
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

/** Refuse what the chosen objective cannot do with these points, naming the point. */
function checkObjectiveData(options: FitBinaryOptions, data: FitData, index: number[], objectiveKind: FitObjective) {
  if (objectiveKind === 'activity') {
    const k = data.hasY.indexOf(0)
    if (k >= 0) {
      throw new ThermoError(
        'needs-vapour-composition',
        `Point ${index[k] + 1} has no vapour composition (y1); the activity objective needs y1 at every fitted point. Fit data without y with the bubble-point or bubble-pressure objective (Barker's method).`,
        { point: index[k] + 1 },
      )
    }
  }
  if (data.het && (data.gv || data.isothermal || data.iso)) {
    throw new ThermoError(
      'invalid-input',
      'Points marked as two liquid layers can be fitted only as isobaric data with an ideal vapour; unmark them or fit without a virial vapour.',
    )
  }
}

/** Residuals and Jacobian of `problem` at p, as a result with the given convergence flag; null on failure. */
function atPoint(problem: LeastSquaresProblem, p: number[], converged: boolean): LeastSquaresResult | null {
  const r = new Float64Array(problem.nResiduals)
  const J = new Float64Array(problem.nResiduals * problem.nParams)
  if (!problem.jacobian(Float64Array.from(p), r, J)) return null
  return { p: Float64Array.from(p), cost: r.reduce((t, v) => t + v * v, 0), iterations: 0, converged, r, J }
}

function problemOf(data: FitData, layout: ParameterLayout, objectiveKind: FitObjective): LeastSquaresProblem {
  return objectiveKind === 'activity' ? activityProblem(data, layout) : bubbleProblem(data, layout, true)
}

/** The starting grid ranked by the fit's own objective; the best `count` starts. */
function rankedStarts(problem: LeastSquaresProblem, layout: ParameterLayout, count: number): number[][] {
  const r = new Float64Array(problem.nResiduals)
  return layout.starts
    .map((p) => ({ p, cost: problem.residuals(Float64Array.from(p), r) ? r.reduce((s, v) => s + v * v, 0) : Infinity }))
    .filter((s) => Number.isFinite(s.cost))
    .sort((a, b) => a.cost - b.cost)
    .slice(0, count)
    .map((s) => s.p)
}

/**
 * Multi-start search: activity-objective candidates, then the bubble-point (bubble-pressure) refinement. When fewer
 * points have y than there are parameters (Barker's method included) the grid is ranked by the fit's own objective.
 */
function searchFit(data: FitData, layout: ParameterLayout, objectiveKind: FitObjective): LeastSquaresResult | null {
  const withY = data.hasY.reduce((s, v) => s + v, 0)
  if (objectiveKind !== 'activity' && withY < layout.names.length) {
    const problem = problemOf(data, layout, objectiveKind)
    return bestBubbleFit(problem, rankedStarts(problem, layout, 3))
  }
  const candidates = activityCandidates(
    data,
    layout,
    objectiveKind === 'activity' ? 1e-11 : 1e-6,
    objectiveKind !== 'activity',
  )
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
  objectiveKind: FitObjective,
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

/** How NRTL α ended: its value, whether it was fitted, and the bound it is held at (null when not held). */
interface AlphaOutcome {
  alpha: number
  fitAlpha: boolean
  held: number | null
}

/** The fitted parameters with standard errors, plus α when it was held at a bound. */
function fittedParameters(
  layout: ParameterLayout,
  fit: LeastSquaresResult,
  stats: FitStatistics,
  nrtl: AlphaOutcome,
): FittedParameter[] {
  return [
    ...layout.names.map((name, j) => ({ name, value: fit.p[j], standardError: stats.standardErrors[j] })),
    ...(nrtl.held !== null ? [{ name: 'alpha', value: nrtl.held, standardError: null, atBound: true }] : []),
  ]
}

/** Warnings about the regression itself: convergence, α at a bound, singular or strongly correlated parameters, outliers. */
function regressionWarnings(
  layout: ParameterLayout,
  fit: LeastSquaresResult,
  stats: FitStatistics,
  nrtl: AlphaOutcome,
  residuals: PointResidual[],
): string[] {
  const warnings: string[] = []
  if (!fit.converged) warnings.push('The fit stopped before it fully converged; treat the parameters with care.')
  if (nrtl.held !== null)
    warnings.push(`α reached its bound ${nrtl.held}: the data do not determine α; hold it at a fixed value.`)
  if (!stats.inverse)
    warnings.push(
      'The parameters are not separately determined by these data (singular fit); standard errors are not available.',
    )
  const m = layout.names.length
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
  return warnings
}

/** Warnings about the fitted model over the data's temperatures: vapour-pressure ranges and liquid splitting. */
function modelWarnings(
  options: FitBinaryOptions,
  data: FitData,
  activity: ActivityModel,
): { warnings: string[]; namedWarnings: NamedFitWarning[] } {
  let Tmin = Infinity
  let Tmax = -Infinity
  for (const T of data.T) {
    if (T < Tmin) Tmin = T
    if (T > Tmax) Tmax = T
  }
  const namedWarnings = liquidSplitWarnings(activity, Tmin, Tmax, data.het?.reduce((s, v) => s + v, 0) ?? 0)
  return {
    warnings: [
      ...spanWarnings(options.vaporPressure, Tmin, Tmax),
      ...namedWarnings.map((w) => w.message),
      // a Hayden–O'Connell vapour with a carboxylic acid: the truncated virial φ is doubtful (virial/README.md)
      ...(options.vapor ? associationWarnings(options.vapor) : []),
    ],
    namedWarnings,
  }
}

/** The settings that rebuild the parameter layout and weights (prediction bands, suggestions). */
function fitSettings(
  options: FitBinaryOptions,
  data: FitData,
  stats: FitStatistics,
  nrtl: AlphaOutcome,
): FitBinaryResult['settings'] {
  const meanSigma = (w: Float64Array) => 1 / (w.reduce((s, v) => s + v, 0) / data.n)
  return {
    model: options.model,
    V1: options.V1,
    V2: options.V2,
    uniquac: options.uniquac,
    temperatureDependent: options.temperatureDependent,
    alpha: nrtl.alpha,
    fitAlpha: nrtl.fitAlpha,
    sigmaT: meanSigma(data.wT),
    sigmaY: meanSigma(data.wY),
    ...(data.isothermal ? { sigmaP: meanSigma(data.wP) } : {}),
    ...(data.iso
      ? { sigmaP: 1 / (data.wP.reduce((s, v, i) => s + v * data.iso![i], 0) / data.iso.reduce((s, v) => s + v, 0)) }
      : {}),
    ...(options.vapor ? { vapor: options.vapor } : {}),
    residualVariance: stats.s2,
  }
}

/** The result of a fit at its optimum: statistics, per-point residuals, summaries, warnings and settings. */
function finishFit(
  options: FitBinaryOptions,
  layout: ParameterLayout,
  data: FitData,
  index: number[],
  fit: LeastSquaresResult,
  objectiveKind: FitObjective,
  nrtl: AlphaOutcome,
): FitBinaryResult {
  const stats = fitStatistics(fit.r, fit.J, fit.r.length, layout.names.length)
  const activity = layout.build(fit.p)
  const system: BinarySystem = {
    vaporPressure: options.vaporPressure,
    activity,
    ...(options.vapor ? { vapor: options.vapor } : {}),
  }
  const residuals = pointResiduals(
    options.points,
    system,
    data,
    index,
    stats,
    fit.r,
    objectiveKind !== 'activity',
    layout,
    fit.p,
  )
  const model = modelWarnings(options, data, activity)
  return {
    activity,
    system,
    parameters: fittedParameters(layout, fit, stats, nrtl),
    covariance: stats.covariance,
    correlation: stats.correlation,
    converged: fit.converged,
    iterations: fit.iterations,
    objective: fit.cost,
    objectiveKind,
    vaporModel: !data.gv ? 'ideal' : data.gv.hoc ? 'virial-hayden-oconnell' : 'virial-tsonopoulos',
    method: data.hasY.includes(1) ? 'with-y' : 'barker',
    ...summarise(residuals, index, data.isothermal || data.iso !== undefined),
    aic: stats.aic,
    residuals,
    warnings: [...regressionWarnings(layout, fit, stats, nrtl, residuals), ...model.warnings],
    namedWarnings: model.namedWarnings,
    settings: fitSettings(options, data, stats, nrtl),
  }
}

/**
 * Fit the model to T–x alone (bubble temperatures at each point's x1 and P, vapour compositions unused; with
 * objective 'bubble-pressure', P–x: bubble pressures at each point's T), from the starting grid ranked by that same
 * objective. Used by the point test.
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
  const { data, index } = buildFitData(options.points, options.vaporPressure, options.model, layout.names.length, {
    vapor: options.vapor,
    isothermal: options.objective === 'bubble-pressure',
  })
  const problem = bubbleProblem(data, layout, false)
  const fit = bestBubbleFit(problem, rankedStarts(problem, layout, 3))
  if (!fit) {
    throw new ThermoError(
      'no-convergence',
      `The ${modelName(options.model)} fit to T–x found no parameters for which every point has a bubble point.`,
    )
  }
  return { activity: layout.build(fit.p), converged: fit.converged, index }
}
