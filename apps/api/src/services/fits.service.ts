/** Model fits and consistency tests on a data set's included points; the lead chemist marks the recommended fit. */
import type { Kysely } from 'kysely'
import type { SessionUser } from '../auth/index.js'
import type { Database, Db } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { staleResults } from './stale-results.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as repo from '../repositories/datasets.repository.js'
import * as fits from '../repositories/fits.repository.js'
import { listPoints, type PointRecord } from '../repositories/points.repository.js'
import { dataKindOf, DEFAULT_NRTL_ALPHA, vaporModelLabel } from '@ebullio/schemas'
import { canonicalJson8785, computedOn, currentPointSet, enginePoint, pointSetOf, withStale } from './point-set.js'
import { areaTest, dataQualityScore, fitBinary, pointTest, type FitBinaryResult } from '@ebullio/thermo'
import { EDITABLE_STATES, FITTABLE_STATES, requireState, thermo, visibleOrNotFound } from './lab-access.js'
import { engineInputs, uniquacStructure } from './systems.service.js'
import {
  bandOf,
  ISOTHERMAL_BAND,
  ISOTHERMAL_SUGGESTIONS,
  isothermalBandOf,
  pureComponentChecks,
  suggestionsOf,
} from './uncertainty.service.js'

/** The activity models a data set can be fitted with (thermo's fitBinary). */
export type FitModelName = 'margules' | 'van-laar' | 'wilson' | 'nrtl' | 'uniquac'

export interface FitRequest {
  models: FitModelName[]
  /** default: 'bubble-pressure' for isothermal data, 'bubble-point' for isobaric data */
  objective?: 'bubble-point' | 'bubble-pressure' | 'activity'
  alpha?: number
  fitAlpha?: boolean
}

/** The objective a fit uses unless one is asked for: pressures for isothermal data, temperatures for isobaric data. */
export const defaultObjective = (d: repo.DataSetRecord) =>
  dataKindOf(d.layout) === 'isothermal' ? ('bubble-pressure' as const) : ('bubble-point' as const)

/** Once submitted, only a lead chemist may still add fits or choose the recommended one. */
function onlyLeadOnceSubmitted(user: SessionUser, d: repo.DataSetRecord, action: string): void {
  if (d.state === 'submitted' && !user.roles.includes('lead_chemist')) {
    throw conflict(`This data set is submitted; only a lead chemist may go on ${action}.`)
  }
}

const included = (points: PointRecord[]) => points.filter((p) => !p.excluded)

function statistics(r: FitBinaryResult) {
  const extra = r as unknown as { rmsP?: number; aadP?: number; maxAbsP?: number; method?: string }
  const {
    converged,
    iterations,
    objective,
    rmsT,
    rmsY,
    aadT,
    aadY,
    maxAbsT,
    maxAbsY,
    aic,
    covariance,
    correlation,
    warnings,
    settings,
  } = r
  // settings (weights, residual variance) let the prediction band and next-composition design run on the stored fit.
  return {
    converged,
    iterations,
    objective,
    objectiveKind: r.objectiveKind,
    ...(extra.rmsP !== undefined && { rmsP: extra.rmsP, aadP: extra.aadP, maxAbsP: extra.maxAbsP }),
    ...(extra.method !== undefined && { method: extra.method }),
    rmsT,
    rmsY,
    aadT,
    aadY,
    maxAbsT,
    maxAbsY,
    aic,
    covariance,
    correlation,
    warnings,
    settings,
  }
}

/** Two fits are the same run when model, options and point set are the same (the engine is deterministic). */
const sameRun = (f: fits.FitRecord, model: string, options: Record<string, unknown>, digest: string) =>
  f.model === model && f.pointSetDigest === digest && canonicalJson8785(f.options) === canonicalJson8785(options)

/**
 * Fit each requested model to the included points (each point at its own measured P) and store the fits,
 * each with the digest of the point set it was computed on. Excluded points are passed as excluded so their
 * residuals are still reported. A run identical to a stored fit (same model, options and point set) is not
 * stored twice: the stored fit is returned (`reused: true`).
 */
export async function runFits(db: Kysely<Database>, user: SessionUser, id: string, req: FitRequest) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  requireState(d, FITTABLE_STATES, 'fitting')
  onlyLeadOnceSubmitted(user, d, 'fitting')
  const points = await listPoints(db, id)
  if (included(points).length === 0) throw conflict('This data set has no included points to fit.')
  const pointSet = pointSetOf(points, d.vaporModel)
  const existing = await fits.listFits(db, id)
  const inputs = await engineInputs(db, d.systemId, d.vaporModel)
  // A virial vapour is stored with the fit, with the critical data it used; an ideal one is not named (as before).
  const vapor = inputs.vapor.kind === 'virial' ? { vapor: inputs.vapor } : {}
  // UNIQUAC's r and q come from the components, stored with the fit; refused before anything runs when missing.
  const structure = req.models.includes('uniquac') ? { uniquac: uniquacStructure(inputs.system) } : null
  const results = req.models.map((model) => {
    const volumes = model === 'wilson' ? { V1: inputs.V1, V2: inputs.V2 } : model === 'uniquac' ? structure! : {}
    // The α used is stored with the fit, so a default α stays readable after the default changes.
    const nrtl = model === 'nrtl' ? { alpha: req.alpha ?? DEFAULT_NRTL_ALPHA, fitAlpha: req.fitAlpha ?? false } : {}
    const options = JSON.parse(
      JSON.stringify({ model, objective: req.objective ?? defaultObjective(d), ...volumes, ...nrtl, ...vapor }),
    )
    if (existing.some((f) => sameRun(f, model, options, pointSet.digest))) return { model, options, r: null }
    const r = thermo(`Fitting ${model}`, () =>
      fitBinary({
        ...options,
        vaporPressure: inputs.vaporPressure,
        // A two-layer point is a three-phase point: its T is the three-phase temperature, y1 the three-phase vapour.
        points: points.map(enginePoint),
      }),
    )
    return { model, options, r }
  })
  const saved = await db.transaction().execute(async (tx) => {
    const locked = (await repo.lockDataSet(tx, id))!
    // Checked again under the row lock: a submit that landed meanwhile closes fitting to analysts.
    requireState(locked, FITTABLE_STATES, 'fitting')
    onlyLeadOnceSubmitted(user, locked, 'fitting')
    const stored: (fits.FitRecord & { reused: boolean })[] = []
    let added = 0
    for (const { model, options, r } of results) {
      const same = (await fits.listFits(tx, id)).find((f) => sameRun(f, model, options, pointSet.digest))
      if (same || !r) {
        if (same) stored.push({ ...same, reused: true })
        continue
      }
      const fit = await fits.insertFit(tx, {
        dataSetId: id,
        model,
        options,
        activity: r.activity as unknown as Record<string, unknown>,
        parameters: r.parameters,
        statistics: statistics(r),
        residuals: r.residuals.map((res, i) => ({ pointId: points[i].id, ...res })),
        pointIds: included(points).map((p) => p.id),
        runBy: user.id,
        pointSetDigest: pointSet.digest,
        pointCount: pointSet.included,
      })
      added++
      stored.push({ ...fit, reused: false })
      await appendAudit(tx, {
        actorId: user.id,
        entity: 'fit',
        entityId: fit.id,
        action: 'run fit',
        dataSetId: id,
        after: {
          model,
          ...nrtlAudit(options),
          objective: r.objectiveKind,
          vapor: vaporModelLabel(d.vaporModel),
          parameters: r.parameters,
          rmsT: r.rmsT,
          rmsY: r.rmsY,
          converged: r.converged,
          points: fit.pointIds.length,
          pointSetDigest: pointSet.digest,
        },
      })
    }
    const after = added > 0 ? await repo.updateDataSet(tx, id, {}) : locked
    const current = pointSetOf(await listPoints(tx, id), locked.vaporModel).digest
    return { fits: stored.map((f) => withStale(f, current)), rowVersion: after!.rowVersion, pointSetDigest: current }
  })
  const byFit = new Map(results.filter((x) => x.r).map((x) => [x.model + canonicalJson8785(x.options), x.r!]))
  return {
    ...saved,
    predictions: saved.fits.flatMap((f) => {
      const r = byFit.get(f.model + canonicalJson8785(f.options))
      return r && !f.reused ? [predictionsOf(f, r, d)] : []
    }),
  }
}

/** Delete a fit of a draft (or returned) version; a recommended fit stops being recommended. Audited. */
export async function deleteFit(db: Kysely<Database>, user: SessionUser, id: string, fitId: string) {
  return db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await repo.lockDataSet(tx, id))
    const fit = await fits.findFit(tx, fitId)
    if (!fit || fit.dataSetId !== id) throw notFound('There is no such fit in this data set.')
    requireState(d, EDITABLE_STATES, 'deleting fits')
    const wasRecommended = d.recommendedFitId === fitId
    await fits.deleteFit(tx, fitId)
    const after = await repo.updateDataSet(tx, id, wasRecommended ? { recommendedFitId: null } : {})
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'fit',
      entityId: fitId,
      action: 'delete fit',
      dataSetId: id,
      before: {
        model: fit.model,
        ...nrtlAudit(fit.options as { model: string }),
        parameters: fit.parameters,
        runBy: fit.runBy,
        runAt: fit.runAt,
        pointSetDigest: fit.pointSetDigest,
        recommended: wasRecommended,
      },
    })
    return { deleted: fitId, recommendedFitId: after!.recommendedFitId, rowVersion: after!.rowVersion }
  })
}

/** The fits of a data set, each with `stale` against the current point set. */
export async function listFitsWithStale(db: Db, user: SessionUser, id: string) {
  visibleOrNotFound(user, await repo.findDataSet(db, id))
  const current = (await currentPointSet(db, id)).digest
  return { items: (await fits.listFits(db, id)).map((f) => withStale(f, current)), pointSetDigest: current }
}

/** NRTL's α as the audit line states it: the value held, or the start value when α was fitted too. */
function nrtlAudit(o: { model: string; alpha?: number; fitAlpha?: boolean }) {
  return o.model === 'nrtl' ? { alpha: o.alpha, fitAlpha: o.fitAlpha } : {}
}

/**
 * Band and next compositions at the nominal pressure (isothermal data: the P–x–y band at their temperature, no
 * suggestions); a fit whose band cannot be computed says why instead.
 */
function predictionsOf(fit: fits.FitRecord, r: FitBinaryResult, d: repo.DataSetRecord) {
  const P = d.nominalPressurePa
  const attempt = <T>(fn: () => T): T | { error: string } => {
    try {
      return fn()
    } catch (err) {
      if (err instanceof AppError) return { error: err.message }
      throw err
    }
  }
  if (P === null || dataKindOf(d.layout) === 'isothermal') {
    // isothermal data: the P–x–y band at their temperature; suggestions are planned at one pressure only
    const T = d.nominalTemperatureK
    return {
      fitId: fit.id,
      band: T === null ? { error: ISOTHERMAL_BAND } : attempt(() => isothermalBandOf(fit, r, T, 51)),
      nextCompositions: { error: ISOTHERMAL_SUGGESTIONS },
    }
  }
  return {
    fitId: fit.id,
    band: attempt(() => bandOf(fit, r, P, 51)),
    nextCompositions: attempt(() => suggestionsOf(fit, r, P, 5)),
  }
}

/** The lead chemist's choice of the fit the data set is approved with. */
export async function markRecommended(db: Kysely<Database>, user: SessionUser, id: string, fitId: string) {
  return db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await repo.lockDataSet(tx, id))
    const fit = await fits.findFit(tx, fitId)
    if (!fit || fit.dataSetId !== id) throw notFound('There is no such fit in this data set.')
    requireState(d, FITTABLE_STATES, 'choosing the recommended fit')
    onlyLeadOnceSubmitted(user, d, 'choosing the recommended fit')
    const current = pointSetOf(await listPoints(tx, id), d.vaporModel).digest
    if (fit.pointSetDigest !== current) {
      throw staleResults(`This fit was ${computedOn(fit)}, not on the points the data set has now; run it again.`, [
        { kind: 'fit', id: fit.id, pointCount: fit.pointCount, runAt: fit.runAt },
      ])
    }
    // An unconverged optimum is not a result: its parameters and standard errors mean nothing.
    if ((fit.statistics as { converged?: boolean }).converged === false) {
      throw conflict(
        'This fit did not converge, so it cannot be the recommended fit. Run the model again or choose another fit.',
      )
    }
    const after = await repo.updateDataSet(tx, id, { recommendedFitId: fitId })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: id,
      action: 'mark recommended fit',
      dataSetId: id,
      before: { recommendedFitId: d.recommendedFitId },
      after: { recommendedFitId: fitId, model: fit.model },
    })
    return after!
  })
}

/** A test that could not run on these data, and the engine's reason. */
export interface TestNotRun {
  test: 'area' | 'point' | 'quality-score'
  reason: string
}

/** Run a test; a refusal by the engine (e.g. no vapour compositions) becomes "cannot run" with its reason. */
function attempt<T>(test: TestNotRun['test'], notRun: TestNotRun[], fn: () => T): T | null {
  try {
    return fn()
  } catch (err) {
    if ((err as { name?: string }).name !== 'ThermoError') throw err
    notRun.push({ test, reason: (err as Error).message })
    return null
  }
}

/**
 * Run the area test (Herington for isobaric data, Redlich–Kister for isothermal data), the point test and the
 * data-quality score on the included points, under the data set's vapour model, and attach the results to this
 * version. Tests the data cannot support (no vapour compositions) are answered in `notRun` with the reason.
 */
export async function runConsistency(db: Kysely<Database>, user: SessionUser, id: string, model: FitModelName) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  requireState(d, FITTABLE_STATES, 'running consistency tests')
  onlyLeadOnceSubmitted(user, d, 'running consistency tests')
  const all = await listPoints(db, id)
  const pointSet = pointSetOf(all, d.vaporModel)
  const kept = included(all)
  if (kept.length === 0) throw conflict('This data set has no included points to test.')
  const pts = kept.map(enginePoint)
  const inputs = await engineInputs(db, d.systemId, d.vaporModel)
  const isothermal = dataKindOf(d.layout) === 'isothermal'
  const vapor = inputs.vapor.kind === 'virial' ? { vapor: inputs.vapor } : {}
  const base = { vaporPressure: inputs.vaporPressure, ...vapor }
  const volumes =
    model === 'wilson'
      ? { V1: inputs.V1, V2: inputs.V2 }
      : model === 'uniquac'
        ? { uniquac: uniquacStructure(inputs.system) }
        : {}
  const notRun: TestNotRun[] = []
  // the engine picks Herington's test for isobaric data and Redlich–Kister's for isothermal data, and says which ran
  const area = attempt('area', notRun, () => areaTest(pts, { ...base, kind: isothermal ? 'isothermal' : 'isobaric' }))
  const point = attempt('point', notRun, () => pointTest(pts, { ...base, model, ...volumes, isothermal }))
  // The quality score names points by their index in `all`: keep the ids with it.
  const quality = attempt('quality-score', notRun, () =>
    dataQualityScore(all.map(enginePoint), { ...base, model, ...volumes, isothermal }),
  )
  const qualityResult = quality && {
    ...quality,
    model,
    points: quality.points.map((q) => ({ ...q, pointId: all[q.index].id, sample: all[q.index].sampleLabel })),
  }
  const runs = [
    ...(area
      ? [[area.test === 'redlich-kister' ? 'redlich-kister-area' : 'herington-area', area, area.passed] as const]
      : []),
    ...(point ? [['point', { ...point, model }, point.passed] as const] : []),
    ...(qualityResult ? [['quality-score', qualityResult, qualityResult.quality >= QUALITY_PASS] as const] : []),
  ]
  const pureComponent = await pureComponentChecks(db, inputs, all)
  const saved = await db.transaction().execute(async (tx) => {
    const locked = (await repo.lockDataSet(tx, id))!
    // Checked again under the row lock, like fits.
    requireState(locked, FITTABLE_STATES, 'running consistency tests')
    onlyLeadOnceSubmitted(user, locked, 'running consistency tests')
    const out = []
    for (const [test, r, passed] of runs) {
      const result = JSON.parse(JSON.stringify({ ...r, vaporModel: d.vaporModel }))
      const rec = await fits.insertConsistency(tx, {
        dataSetId: id,
        test,
        passed,
        result,
        runBy: user.id,
        pointSetDigest: pointSet.digest,
        pointCount: pointSet.included,
      })
      await appendAudit(tx, {
        actorId: user.id,
        entity: 'consistency_result',
        entityId: rec.id,
        action: test === 'quality-score' ? 'run quality score' : `run ${test} test`,
        dataSetId: id,
        after: { passed, pointSetDigest: pointSet.digest },
      })
      out.push(rec)
    }
    const after = out.length ? await repo.updateDataSet(tx, id, {}) : locked
    const current = pointSetOf(await listPoints(tx, id), locked.vaporModel).digest
    return { items: out.map((c) => withStale(c, current)), rowVersion: after!.rowVersion, pointSetDigest: current }
  })
  // Computed, not stored: it compares with today's vapour-pressure sets and pure measurements.
  return { ...saved, notRun, pureComponent }
}

/**
 * The combined quality figure at or above which the data-quality result is marked as passed: 0.75, three of the
 * four tests' full shares (Ebullio's choice, no source).
 */
export const QUALITY_PASS = 0.75
