/** Model fits and consistency tests on a data set's included points; the lead chemist marks the recommended fit. */
import type { Kysely } from 'kysely'
import type { SessionUser } from '../auth/index.js'
import type { Database } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as repo from '../repositories/datasets.repository.js'
import * as fits from '../repositories/fits.repository.js'
import { listPoints, type PointRecord } from '../repositories/points.repository.js'
import { DEFAULT_NRTL_ALPHA } from '@ebullio/schemas'
import { fitBinary, heringtonAreaTest, pointTest, type FitBinaryResult } from '@ebullio/thermo'
import { FITTABLE_STATES, requireState, thermo, visibleOrNotFound } from './lab-access.js'
import { engineInputs } from './systems.service.js'
import { bandOf, pureComponentChecks, suggestionsOf } from './uncertainty.service.js'

/** The activity models a data set can be fitted with (thermo's fitBinary). */
export type FitModelName = 'margules' | 'van-laar' | 'wilson' | 'nrtl'

export interface FitRequest {
  models: FitModelName[]
  objective?: 'bubble-point' | 'activity'
  alpha?: number
  fitAlpha?: boolean
}

/** Once submitted, only a lead chemist may still add fits or choose the recommended one. */
function onlyLeadOnceSubmitted(user: SessionUser, d: repo.DataSetRecord, action: string): void {
  if (d.state === 'submitted' && !user.roles.includes('lead_chemist')) {
    throw conflict(`This data set is submitted; only a lead chemist may go on ${action}.`)
  }
}

const included = (points: PointRecord[]) => points.filter((p) => !p.excluded)

function statistics(r: FitBinaryResult) {
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

/**
 * Fit each requested model to the included points (each point at its own measured P) and store the fits.
 * Excluded points are passed as excluded so their residuals are still reported.
 */
export async function runFits(db: Kysely<Database>, user: SessionUser, id: string, req: FitRequest) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  requireState(d, FITTABLE_STATES, 'fitting')
  onlyLeadOnceSubmitted(user, d, 'fitting')
  const points = await listPoints(db, id)
  if (included(points).length === 0) throw conflict('This data set has no included points to fit.')
  const inputs = await engineInputs(db, d.systemId)
  const results = req.models.map((model) => {
    const volumes = model === 'wilson' ? { V1: inputs.V1, V2: inputs.V2 } : {}
    // The α used is stored with the fit, so a default α stays readable after the default changes.
    const nrtl = model === 'nrtl' ? { alpha: req.alpha ?? DEFAULT_NRTL_ALPHA, fitAlpha: req.fitAlpha ?? false } : {}
    const options = { model, objective: req.objective ?? 'bubble-point', ...volumes, ...nrtl }
    const r = thermo(`Fitting ${model}`, () =>
      fitBinary({
        ...options,
        vaporPressure: inputs.vaporPressure,
        // A two-layer point is a three-phase point: its T is the three-phase temperature, y1 the three-phase vapour.
        points: points.map((p) => ({
          T: p.temperatureK,
          P: p.pressurePa,
          x1: p.x1,
          y1: p.y1,
          excluded: p.excluded,
          ...(p.heterogeneous ? { heterogeneous: true } : {}),
        })),
      }),
    )
    return { model, options, r }
  })
  const saved = await db.transaction().execute(async (tx) => {
    const locked = await repo.lockDataSet(tx, id)
    requireState(locked!, FITTABLE_STATES, 'fitting')
    const stored: fits.FitRecord[] = []
    for (const { model, options, r } of results) {
      const fit = await fits.insertFit(tx, {
        dataSetId: id,
        model,
        options: JSON.parse(JSON.stringify(options)),
        activity: r.activity as unknown as Record<string, unknown>,
        parameters: r.parameters,
        statistics: statistics(r),
        residuals: r.residuals.map((res, i) => ({ pointId: points[i].id, ...res })),
        pointIds: included(points).map((p) => p.id),
        runBy: user.id,
      })
      stored.push(fit)
      await appendAudit(tx, {
        actorId: user.id,
        entity: 'fit',
        entityId: fit.id,
        action: 'run fit',
        dataSetId: id,
        after: {
          model,
          ...nrtlAudit(options),
          parameters: r.parameters,
          rmsT: r.rmsT,
          rmsY: r.rmsY,
          converged: r.converged,
          points: fit.pointIds.length,
        },
      })
    }
    const after = await repo.updateDataSet(tx, id, {})
    return { fits: stored, rowVersion: after!.rowVersion }
  })
  return { ...saved, predictions: saved.fits.map((f, i) => predictionsOf(f, results[i].r, d.nominalPressurePa)) }
}

/** NRTL's α as the audit line states it: the value held, or the start value when α was fitted too. */
function nrtlAudit(o: { model: string; alpha?: number; fitAlpha?: boolean }) {
  return o.model === 'nrtl' ? { alpha: o.alpha, fitAlpha: o.fitAlpha } : {}
}

/** Band and next compositions at the nominal pressure; a fit whose band cannot be computed says why instead. */
function predictionsOf(fit: fits.FitRecord, r: FitBinaryResult, P: number) {
  const attempt = <T>(fn: () => T): T | { error: string } => {
    try {
      return fn()
    } catch (err) {
      if (err instanceof AppError) return { error: err.message }
      throw err
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

/** Run the area test and the point test on the included points and attach the results to this version. */
export async function runConsistency(db: Kysely<Database>, user: SessionUser, id: string, model: FitModelName) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  requireState(d, FITTABLE_STATES, 'running consistency tests')
  onlyLeadOnceSubmitted(user, d, 'running consistency tests')
  const all = await listPoints(db, id)
  const pts = included(all).map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1 }))
  if (pts.length === 0) throw conflict('This data set has no included points to test.')
  const inputs = await engineInputs(db, d.systemId)
  const area = thermo('Area test', () => heringtonAreaTest(pts, { vaporPressure: inputs.vaporPressure }))
  const volumes = model === 'wilson' ? { V1: inputs.V1, V2: inputs.V2 } : {}
  const point = thermo('Point test', () => pointTest(pts, { vaporPressure: inputs.vaporPressure, model, ...volumes }))
  const pureComponent = await pureComponentChecks(db, inputs, all)
  const saved = await db.transaction().execute(async (tx) => {
    const out = []
    for (const [test, r] of [
      ['herington-area', area],
      ['point', point],
    ] as const) {
      const result = JSON.parse(JSON.stringify({ ...r, model: test === 'point' ? model : undefined }))
      const rec = await fits.insertConsistency(tx, { dataSetId: id, test, passed: r.passed, result, runBy: user.id })
      await appendAudit(tx, {
        actorId: user.id,
        entity: 'consistency_result',
        entityId: rec.id,
        action: `run ${test} test`,
        dataSetId: id,
        after: { passed: r.passed },
      })
      out.push(rec)
    }
    const after = await repo.updateDataSet(tx, id, {})
    return { items: out, rowVersion: after!.rowVersion }
  })
  // Computed, not stored: it compares with today's vapour-pressure sets and pure measurements.
  return { ...saved, pureComponent }
}
