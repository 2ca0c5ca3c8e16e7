/**
 * How sure a fit is, and what to measure next: thermo's prediction band and sequential design on a stored
 * fit, and the pure-component boiling-point check of a data set. Nothing here is stored; every answer is
 * recomputed from the stored fit, points and vapour-pressure sets.
 */
import {
  fitBinary,
  predictionBand,
  predictionBandIsothermal,
  PURE_COMPONENT_TOLERANCE,
  pureComponentCheck,
  planNextMeasurements,
  type ActivityModel,
  type FitBinaryResult,
  type PureComponentCheck,
  type SuggestionCriterion,
} from '@ebullio/thermo'
import { dataKindOf, engineVaporLabel } from '@ebullio/schemas'
import type { SessionUser } from '../auth/index.js'
import type { Db } from '../db/index.js'
import { conflict, notFound } from '../errors/index.js'
import { listPureMeasurements } from '../repositories/components.repository.js'
import * as repo from '../repositories/datasets.repository.js'
import { findFit, type FitRecord } from '../repositories/fits.repository.js'
import { listPoints, type PointRecord } from '../repositories/points.repository.js'
import { enginePoint, pointSetOf } from './point-set.js'
import { thermo, visibleOrNotFound } from './lab-access.js'
import { engineInputs, type EngineInputs } from './systems.service.js'

/** What the band means, sent with it so a plot can say so. */
export const BAND_NOTE =
  'Band of ±2σ around the fitted curve from the parameter covariance (linear propagation): how well the fit pins the curve down, not the scatter to expect of a single new measurement.'

type Settings = FitBinaryResult['settings']

/** JSON turns NaN into null; the engine expects NaN for "not available". */
const numbers = (m: unknown): number[][] =>
  Array.isArray(m) ? m.map((row: unknown[]) => row.map((v) => (typeof v === 'number' ? v : NaN))) : []

/**
 * The fit's own settings (weights and residual variance). Fits stored before these were kept are fitted
 * again on the same points with the same options; the stored parameters and covariance are still used.
 */
function fitSettings(fit: FitRecord, points: PointRecord[], inputs: EngineInputs): Settings {
  const stored = fit.statistics.settings as Settings | undefined
  if (stored && typeof stored.residualVariance === 'number') return stored
  const used = new Set(fit.pointIds)
  const o = fit.options as {
    objective?: 'bubble-point' | 'bubble-pressure' | 'activity'
    vapor?: EngineInputs['vapor']
    V1?: number
    V2?: number
    uniquac?: { r1: number; r2: number; q1: number; q2: number }
    alpha?: number
    fitAlpha?: boolean
  }
  const again = thermo(`Fitting ${fit.model}`, () =>
    fitBinary({
      model: fit.model,
      objective: o.objective,
      V1: o.V1,
      V2: o.V2,
      uniquac: o.uniquac,
      alpha: o.alpha,
      fitAlpha: o.fitAlpha,
      vaporPressure: inputs.vaporPressure,
      ...(o.vapor ? { vapor: o.vapor } : {}),
      points: points.map((p) => ({ ...enginePoint(p), excluded: !used.has(p.id) })),
    }),
  )
  return again.settings
}

/** thermo's FitBinaryResult for a stored fit: the parts the band and the suggestions read. */
export function storedFitResult(fit: FitRecord, points: PointRecord[], inputs: EngineInputs): FitBinaryResult {
  const stats = fit.statistics
  return {
    activity: fit.activity as unknown as ActivityModel,
    // the vapour the fit was computed under (stored with it), not today's choice
    system: {
      vaporPressure: inputs.vaporPressure,
      activity: fit.activity as unknown as ActivityModel,
      ...(fit.options.vapor ? { vapor: fit.options.vapor as EngineInputs['vapor'] } : {}),
    },
    parameters: fit.parameters,
    covariance: numbers(stats.covariance),
    correlation: numbers(stats.correlation),
    converged: Boolean(stats.converged),
    iterations: Number(stats.iterations),
    objective: Number(stats.objective),
    objectiveKind: (fit.options.objective as FitBinaryResult['objectiveKind'] | undefined) ?? 'bubble-point',
    rmsT: Number(stats.rmsT),
    rmsY: Number(stats.rmsY),
    aadT: Number(stats.aadT),
    aadY: Number(stats.aadY),
    maxAbsT: Number(stats.maxAbsT),
    maxAbsY: Number(stats.maxAbsY),
    aic: Number(stats.aic),
    residuals: [],
    warnings: [],
    settings: fitSettings(fit, points, inputs),
  }
}

async function loadFit(db: Db, user: SessionUser, id: string, fitId: string) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const fit = await findFit(db, fitId)
  if (!fit || fit.dataSetId !== id) throw notFound('There is no such fit in this data set.')
  const inputs = await engineInputs(db, d.systemId)
  const points = await listPoints(db, id)
  return {
    d,
    fit,
    inputs,
    points,
    result: storedFitResult(fit, points, inputs),
    current: pointSetOf(points, d.vaporModel).digest,
  }
}

/** Which point set a band or suggestion list rests on (its fit's), and whether the points have changed since. */
const boundTo = (fit: FitRecord, current: string) => ({
  pointSetDigest: fit.pointSetDigest,
  pointCount: fit.pointCount,
  computedAt: fit.runAt,
  stale: fit.pointSetDigest !== current,
})

/** The T–x–y band of one fit at P (Pa), by default the data set's nominal pressure; `points` grid points (3–1001). */
export function bandOf(fit: FitRecord, result: FitBinaryResult, P: number, points: number) {
  const band = thermo('Prediction band', () => predictionBand(result, { P, points }))
  return {
    fitId: fit.id,
    model: fit.model,
    kind: 'isobaric' as const,
    ...band,
    vapour: engineVaporLabel(fit.options.vapor),
    note: BAND_NOTE,
  }
}

/** The P–x–y band of one fit at T (K), an isothermal data set's own temperature; pressures in Pa. */
export function isothermalBandOf(fit: FitRecord, result: FitBinaryResult, T: number, points: number) {
  const band = thermo('Prediction band', () => predictionBandIsothermal(result, { T, points }))
  return {
    fitId: fit.id,
    model: fit.model,
    kind: 'isothermal' as const,
    ...band,
    vapour: engineVaporLabel(fit.options.vapor),
    note: BAND_NOTE,
  }
}

/** Where the lab asks to look: a composition range and the least distance from the points already measured. */
export interface SuggestionLimits {
  range?: [number, number]
  exclusion?: number
  /** x1 of the data set's points (excluded points too: the lab did measure there) */
  measured?: number[]
}

/**
 * Up to `count` liquid compositions to measure next at P (Pa), best first, by `criterion` (default
 * 'sigma-y', largest predicted σy; 'd-optimal', largest gain in parameter information); named in the
 * response with the range, the exclusion distance and thermo's notes where the plan falls short. Deterministic
 * for a stored fit: the stored parameters and covariance are used, so the list changes only when a different
 * fit, criterion, range or point set is asked for.
 */
export function suggestionsOf(
  fit: FitRecord,
  result: FitBinaryResult,
  P: number,
  count: number,
  criterion: SuggestionCriterion = 'sigma-y',
  limits: SuggestionLimits = {},
) {
  const plan = thermo('Next compositions', () => planNextMeasurements(result, { P, count, criterion, ...limits }))
  return { fitId: fit.id, model: fit.model, P, criterion, ...plan, vapour: engineVaporLabel(fit.options.vapor) }
}

/** Why isothermal data without a recorded temperature have no band, and where suggestions need a pressure. */
export const ISOTHERMAL_BAND =
  'This isothermal data set has no temperature recorded, so its P–x–y band cannot be drawn. Ask for the band at a pressure to see the T–x–y band there.'
/** Where to measure next is planned along a T–x–y curve at one pressure. */
export const ISOTHERMAL_SUGGESTIONS =
  'Where to measure next is planned at one pressure (T–x–y); for isothermal data ask for it at a pressure.'

/** The pressure a band or suggestion list is computed at: the one asked for, else the nominal pressure. */
function bandPressure(d: repo.DataSetRecord, P: number | undefined): number {
  const at = P ?? d.nominalPressurePa
  if (at === null) throw conflict(ISOTHERMAL_BAND)
  return at
}

/**
 * The band of one fit: at the pressure asked for (T–x–y), else at the data set's own condition — the nominal
 * pressure of isobaric data (T–x–y), the temperature of isothermal data (P–x–y).
 */
export async function fitBand(db: Db, user: SessionUser, id: string, fitId: string, o: { P?: number; points: number }) {
  const { d, fit, result, current } = await loadFit(db, user, id, fitId)
  const band =
    o.P === undefined && dataKindOf(d.layout) === 'isothermal' && d.nominalTemperatureK !== null
      ? isothermalBandOf(fit, result, d.nominalTemperatureK, o.points)
      : bandOf(fit, result, bandPressure(d, o.P), o.points)
  return { dataSetId: id, ...band, ...boundTo(fit, current) }
}

export async function nextCompositions(
  db: Db,
  user: SessionUser,
  id: string,
  fitId: string,
  o: { P?: number; count: number; criterion?: SuggestionCriterion; range?: [number, number]; exclusion?: number },
) {
  const { d, fit, result, current, points } = await loadFit(db, user, id, fitId)
  const limits = { range: o.range, exclusion: o.exclusion, measured: points.map((p) => p.x1) }
  if (o.P === undefined && d.nominalPressurePa === null) throw conflict(ISOTHERMAL_SUGGESTIONS)
  return {
    dataSetId: id,
    ...suggestionsOf(fit, result, bandPressure(d, o.P), o.count, o.criterion, limits),
    ...boundTo(fit, current),
  }
}

/** A pure-component comparison, saying where the boiling point came from. */
export type SourcedCheck = Omit<PureComponentCheck, 'index'> &
  ({ source: 'point'; pointId: string } | { source: 'pure-measurement'; measurementId: string })

/**
 * Measured pure-component boiling points against the vapour-pressure sets the data set computes with:
 * the data set's included points at x1 = 0 or 1, and the boiling points measured for either component.
 * @param toleranceK allowed |T measured − T model|, K (thermo's default 0.3 K).
 */
export async function pureComponentChecks(db: Db, inputs: EngineInputs, points: PointRecord[], toleranceK?: number) {
  const [m1, m2] = await Promise.all([
    listPureMeasurements(db, inputs.system.component1.id),
    listPureMeasurements(db, inputs.system.component2.id),
  ])
  const own = points.filter((p) => !p.excluded && (p.x1 === 0 || p.x1 === 1))
  const rows = [
    ...own.map((p) => ({
      T: p.temperatureK,
      P: p.pressurePa,
      x1: p.x1,
      ref: { source: 'point' as const, pointId: p.id },
    })),
    ...m1.map((m) => ({
      T: m.temperatureK,
      P: m.pressurePa,
      x1: 1,
      ref: { source: 'pure-measurement' as const, measurementId: m.id },
    })),
    ...m2.map((m) => ({
      T: m.temperatureK,
      P: m.pressurePa,
      x1: 0,
      ref: { source: 'pure-measurement' as const, measurementId: m.id },
    })),
  ]
  const r = thermo('Pure-component check', () =>
    pureComponentCheck(
      rows.map(({ T, P, x1 }) => ({ T, P, x1 })),
      { vaporPressure: inputs.vaporPressure, tolerance: toleranceK },
    ),
  )
  const checks: SourcedCheck[] = r.checks.map(({ index, ...c }) => ({ ...c, ...rows[index].ref }))
  return {
    toleranceK: toleranceK ?? PURE_COMPONENT_TOLERANCE,
    passed: r.passed,
    checks,
    warnings: r.warnings,
    components: [inputs.system.component1.name, inputs.system.component2.name],
  }
}

export async function dataSetPureComponentCheck(db: Db, user: SessionUser, id: string, toleranceK?: number) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  return {
    dataSetId: id,
    ...(await pureComponentChecks(db, await engineInputs(db, d.systemId), await listPoints(db, id), toleranceK)),
  }
}
