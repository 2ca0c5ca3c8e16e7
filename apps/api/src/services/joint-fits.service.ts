/**
 * Joint fits: one NRTL or Wilson parameter set (temperature-dependent energies) over several data sets of one
 * system (thermo's fitJoint), each contributing data set bound to the digest of the point set it was fitted on.
 * A lead chemist runs and submits one; another lead chemist signs it as the system's recommended parameter set
 * (four-eyes as for data sets); the signed set supersedes the previous one, which stays in the record.
 */
import type { JointFitDto, JointFitMemberDto, JointFitRequest } from '@ebullio/schemas'
import { DEFAULT_NRTL_ALPHA, webLink } from '@ebullio/schemas'
import { fitJoint, phaseDiagram, type ActivityModel, type PhaseDiagram } from '@ebullio/thermo'
import type { SessionUser } from '../auth/index.js'
import type { Config } from '../config.js'
import type { Db } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { notifyUser } from '../mail/outbox.js'
import { displayNamesOf } from '../repositories/approvals.repository.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as datasets from '../repositories/datasets.repository.js'
import * as repo from '../repositories/joint-fits.repository.js'
import { listPoints, type PointRecord } from '../repositories/points.repository.js'
import { pointSetOf } from './point-set.js'
import { staleResults } from './stale-results.js'
import { thermo } from './lab-access.js'
import { binarySystem, engineInputs, getSystem } from './systems.service.js'
import { activeLeadChemistIds } from '../repositories/users.repository.js'

/** Points of a data set as the engine reads them (a two-layer point is a three-phase point). */
export const enginePoints = (points: PointRecord[]) =>
  points.map((p) => ({
    T: p.temperatureK,
    P: p.pressurePa,
    x1: p.x1,
    y1: p.y1,
    excluded: p.excluded,
    ...(p.heterogeneous ? { heterogeneous: true } : {}),
  }))

/** The data set, checked to be a current version of the system (a superseded version has a newer one). */
function member(d: datasets.DataSetRecord | undefined, systemId: string, id: string): datasets.DataSetRecord {
  if (!d) throw notFound(`There is no data set ${id}.`)
  if (d.systemId !== systemId) throw conflict(`"${d.title}" v${d.version} belongs to another system.`)
  if (d.state === 'superseded')
    throw conflict(`"${d.title}" v${d.version} is superseded by a newer version; choose the current version.`)
  // The joint fit solves bubble temperatures at each point's P (ideal vapour): isobaric T–x–y data only, for now.
  if (d.nominalPressurePa === null || (d.layout ?? 'txy') !== 'txy')
    throw conflict(
      `"${d.title}" v${d.version} is not an isobaric T–x–y data set; a joint fit takes isobaric T–x–y data sets only.`,
    )
  return d
}

/** Run a joint fit over the chosen data sets of a system and store it as a draft (audited). */
export async function runJointFit(db: Db, user: SessionUser, systemId: string, req: JointFitRequest) {
  await getSystem(db, systemId)
  const chosen: { d: datasets.DataSetRecord; points: PointRecord[]; pointSet: { digest: string; included: number } }[] =
    []
  for (const id of req.dataSetIds) {
    const d = member(await datasets.findDataSet(db, id), systemId, id)
    const points = await listPoints(db, id)
    if (!points.some((p) => !p.excluded)) throw conflict(`"${d.title}" v${d.version} has no included points.`)
    chosen.push({ d, points, pointSet: pointSetOf(points) })
  }
  const inputs = await engineInputs(db, systemId)
  const options = JSON.parse(
    JSON.stringify({
      model: req.model,
      temperatureDependent: req.temperatureDependent ?? true,
      ...(req.model === 'nrtl' ? { alpha: req.alpha ?? DEFAULT_NRTL_ALPHA } : { V1: inputs.V1, V2: inputs.V2 }),
    }),
  ) as { model: 'nrtl' | 'wilson'; temperatureDependent: boolean; alpha?: number; V1?: number; V2?: number }
  const r = thermo('Joint fit', () =>
    fitJoint({
      ...options,
      vaporPressure: inputs.vaporPressure,
      dataSets: chosen.map((c) => ({ id: c.d.id, points: enginePoints(c.points) })),
    }),
  )
  const statistics = JSON.parse(
    JSON.stringify({
      converged: r.converged,
      iterations: r.iterations,
      objective: r.objective,
      rmsT: r.rmsT,
      rmsY: r.rmsY,
      aadT: r.aadT,
      aadY: r.aadY,
      maxAbsT: r.maxAbsT,
      maxAbsY: r.maxAbsY,
      aic: r.aic,
      covariance: r.covariance,
      correlation: r.correlation,
      warnings: r.warnings,
    }),
  )
  const saved = await db.transaction().execute(async (tx) => {
    const fit = await repo.insertJointFit(
      tx,
      {
        systemId,
        model: options.model,
        options,
        activity: r.activity as unknown as Record<string, unknown>,
        parameters: r.parameters as unknown as Record<string, unknown>[],
        statistics,
        range: r.range,
        runBy: user.id,
      },
      chosen.map((c, i) => {
        const { id: _id, ...stats } = r.dataSets[i]
        return {
          dataSetId: c.d.id,
          position: i,
          pointSetDigest: c.pointSet.digest,
          pointCount: c.pointSet.included,
          statistics: stats as unknown as Record<string, unknown>,
        }
      }),
    )
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'joint_fit',
      entityId: fit.id,
      action: 'run joint fit',
      after: {
        systemId,
        model: options.model,
        parameters: r.parameters,
        rmsT: r.rmsT,
        rmsY: r.rmsY,
        converged: r.converged,
        dataSets: chosen.map((c) => ({ id: c.d.id, version: c.d.version, pointSetDigest: c.pointSet.digest })),
      },
    })
    return fit
  })
  return jointFitDetail(db, user, saved.id)
}

/** Members with their data sets' titles and whether their points changed since the run. */
export async function membersOf(db: Db, fit: repo.JointFitRecord): Promise<JointFitMemberDto[]> {
  const out: JointFitMemberDto[] = []
  for (const m of await repo.listMembers(db, fit.id)) {
    const d = (await datasets.findDataSet(db, m.dataSetId))!
    const current = pointSetOf(await listPoints(db, m.dataSetId)).digest
    out.push({
      dataSetId: m.dataSetId,
      title: d.title,
      version: d.version,
      state: d.state,
      nominalPressurePa: d.nominalPressurePa,
      pointSetDigest: m.pointSetDigest,
      pointCount: m.pointCount,
      stale: current !== m.pointSetDigest,
      statistics: m.statistics as unknown as JointFitMemberDto['statistics'],
    })
  }
  return out
}

/** A joint fit with its members, staleness and signatures (lab roles only: it names draft data sets). */
export async function jointFitDetail(db: Db, _user: SessionUser, id: string): Promise<JointFitDto<Date>> {
  const fit = await repo.findJointFit(db, id)
  if (!fit) throw notFound('There is no such joint fit.')
  const members = await membersOf(db, fit)
  const names = await displayNamesOf(db, [fit.runBy])
  const signatures = (await repo.listJointFitApprovals(db, id)).map(({ jointFitId: _j, ...a }) => a)
  return {
    ...fit,
    activity: fit.activity as JointFitDto['activity'],
    parameters: fit.parameters as unknown as JointFitDto['parameters'],
    statistics: fit.statistics as unknown as JointFitDto['statistics'],
    runByName: names.get(fit.runBy) ?? fit.runBy,
    members,
    stale: members.some((m) => m.stale),
    signatures,
  }
}

/** The joint fits of a system, newest first. */
export async function listJointFits(db: Db, user: SessionUser, systemId: string) {
  await getSystem(db, systemId)
  const items = []
  for (const f of await repo.listJointFits(db, systemId)) items.push(await jointFitDetail(db, user, f.id))
  return { items }
}

/**
 * Each contributing data set's included points against the joint model's T–x–y curve at its nominal pressure,
 * for the plot of each data set against the joint parameters.
 */
export async function jointFitPlots(db: Db, user: SessionUser, id: string, gridPoints = 51) {
  const fit = await jointFitDetail(db, user, id)
  const inputs = await engineInputs(db, fit.systemId)
  const system = binarySystem(inputs, fit.activity as unknown as ActivityModel)
  const plots = []
  for (const m of fit.members) {
    const points = await listPoints(db, m.dataSetId)
    // an isothermal member has no nominal pressure: its T–x–y is drawn at the mean of its measured pressures
    const P = m.nominalPressurePa ?? points.reduce((s, p) => s + p.pressurePa, 0) / Math.max(points.length, 1)
    const diagram = thermo(
      'T–x–y curve',
      () => phaseDiagram(system, { P }, { points: gridPoints }) as Extract<PhaseDiagram, { kind: 'isobaric' }>,
    )
    plots.push({
      dataSetId: m.dataSetId,
      title: m.title,
      version: m.version,
      P: m.nominalPressurePa,
      points: points.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1, excluded: p.excluded })),
      curve: { x1: diagram.x1, y1: diagram.y1, T: diagram.T },
    })
  }
  return { jointFitId: id, components: [inputs.system.component1.name, inputs.system.component2.name], plots }
}

/** Delete a draft joint fit (audited). */
export async function deleteJointFit(db: Db, user: SessionUser, id: string) {
  return db.transaction().execute(async (tx) => {
    const fit = await repo.lockJointFit(tx, id)
    if (!fit) throw notFound('There is no such joint fit.')
    if (fit.state !== 'draft')
      throw conflict(`This joint fit is ${fit.state}; only a draft joint fit may be deleted. It stays in the record.`)
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'joint_fit',
      entityId: id,
      action: 'delete joint fit',
      before: { systemId: fit.systemId, model: fit.model, parameters: fit.parameters, runBy: fit.runBy },
    })
    await repo.deleteJointFit(tx, id)
    return { deleted: id }
  })
}

/** Refuse while a contributing data set's points changed since the run (409 stale_results, naming them). */
export function refuseStale(fit: JointFitDto<Date>, action: string): void {
  const stale = fit.members.filter((m) => m.stale)
  if (!stale.length) return
  throw staleResults(
    `Cannot ${action}: the points of ${stale.map((m) => `"${m.title}" v${m.version}`).join(', ')} changed since this joint fit was run on them (${stale.map((m) => m.pointCount).join(', ')} included points). Run the joint fit again.`,
    stale.map((m) => ({
      kind: 'fit' as const,
      id: fit.id,
      pointCount: m.pointCount,
      runAt: fit.runAt,
      what: `the joint fit over "${m.title}" v${m.version}`,
    })),
  )
}

/** Hand a draft joint fit to the other lead chemists for signature as the recommended parameter set. */
export async function submitJointFit(db: Db, config: Config, user: SessionUser, id: string, rowVersion: number) {
  return db.transaction().execute(async (tx) => {
    const fit = await repo.lockJointFit(tx, id)
    if (!fit) throw notFound('There is no such joint fit.')
    if (fit.state !== 'draft') throw conflict(`This joint fit is ${fit.state}; only a draft can be submitted.`)
    if (fit.rowVersion !== rowVersion) throw staleJointFit(rowVersion, fit.rowVersion)
    refuseStale(await jointFitDetail(tx, user, id), 'submit')
    if ((fit.statistics as { converged?: boolean }).converged === false)
      throw conflict('This joint fit did not converge; run it again (another model or other data sets).')
    const after = await repo.updateJointFit(tx, id, {
      state: 'submitted',
      submittedBy: user.id,
      submittedAt: new Date(),
    })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'joint_fit',
      entityId: id,
      action: 'submit joint fit',
      before: { state: 'draft' },
      after: { state: 'submitted' },
    })
    const system = await getSystem(tx, fit.systemId)
    const others = (await activeLeadChemistIds(tx)).filter((lead) => lead !== user.id)
    for (const lead of others) {
      await notifyUser(tx, lead, {
        subject: `Ebullio: a recommended parameter set for ${system.name} awaits your signature`,
        text: `${user.displayName} submitted a joint ${fit.model === 'nrtl' ? 'NRTL' : 'Wilson'} parameter set for ${system.name} as the system's recommended parameter set.\n\nOpen it: ${webLink(config.publicUrl, 'labSystem', { id: fit.systemId })}\n`,
      })
    }
    return { ...after, notifiedLeadChemists: others.length }
  })
}

/** The optimistic-concurrency refusal of a joint fit. */
export function staleJointFit(expected: number, current: number) {
  return new AppError(
    409,
    'stale_write',
    `This joint fit was changed by someone else since you loaded it (you had version ${expected}, it is now ${current}). Reload it.`,
    { expectedRowVersion: expected, currentRowVersion: current },
  )
}
