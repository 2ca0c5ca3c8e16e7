/**
 * Joint fits: one NRTL, Wilson or UNIQUAC parameter set (temperature-dependent energies) over several data sets of one
 * system (thermo's fitJoint): isobaric data sets by their bubble temperatures, isothermal ones by their bubble
 * pressures, all under the one vapour model they share (refused when they differ). Each contributing data set is
 * bound to the digest of what the fit read of it (format 'ebullio-joint-member/2': kind, temperature, vapour model
 * and points; see memberDigest).
 * A lead chemist runs and submits one; another lead chemist signs it as the system's recommended parameter set
 * (four-eyes as for data sets); the signed set supersedes the previous one, which stays in the record.
 */
import type { JointFitDto, JointFitMemberDto, JointFitModel, JointFitRequest } from '@ebullio/schemas'
import { dataKindOf, DEFAULT_NRTL_ALPHA, FIT_MODEL_LABELS, vaporModelLabel, webLink } from '@ebullio/schemas'
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
import { canonicalJson8785, enginePoint, pointSetOf, sha256Hex } from './point-set.js'
import { staleResults } from './stale-results.js'
import { thermo } from './lab-access.js'
import { binarySystem, engineInputs, getSystem, uniquacStructure, type EngineInputs } from './systems.service.js'

type EngineVapor = EngineInputs['vapor']
import { activeLeadChemistIds } from '../repositories/users.repository.js'

/** Points of a data set as the engine reads them (σP where given; a two-layer point is a three-phase point). */
export const enginePoints = (points: PointRecord[]) => points.map(enginePoint)

/** The member digest format of every joint fit run now; members stored before keep 'ebullio-point-set/1'. */
export const MEMBER_DIGEST_V2 = 'ebullio-joint-member/2'
export const MEMBER_DIGEST_V1 = 'ebullio-point-set/1'

/**
 * What a joint fit reads of a contributing data set, as signed content (format 'ebullio-joint-member/2'): the kind of
 * data (isobaric: bubble temperatures compared; isothermal: bubble pressures), the nominal temperature of an
 * isothermal set (K, when it has one), the data set's vapour model (always, the ideal gas included) and the digest
 * of its points (format 'ebullio-point-set/1', see point-set.ts), so changing the vapour model or the kind makes
 * the joint fit stale as changing a point does.
 */
export function memberContent(d: datasets.DataSetRecord, points: readonly PointRecord[]) {
  const kind = dataKindOf(d.layout ?? 'txy')
  return {
    format: MEMBER_DIGEST_V2,
    kind,
    ...(kind === 'isothermal' && d.nominalTemperatureK !== null ? { nominalTemperatureK: d.nominalTemperatureK } : {}),
    vaporModel: d.vaporModel ?? { kind: 'ideal' },
    pointSet: pointSetOf(points).digest,
  }
}

/**
 * The digest of a member in the given format: format 2 {@link memberContent}; format 1 (members stored before
 * format 2) the digest of the points alone, exactly as it was computed then.
 */
export function memberDigest(
  d: datasets.DataSetRecord,
  points: readonly PointRecord[],
  format: string = MEMBER_DIGEST_V2,
): { digest: string; included: number } {
  const set = pointSetOf(points)
  if (format === MEMBER_DIGEST_V1) return set
  return { digest: sha256Hex(canonicalJson8785(memberContent(d, points))), included: set.included }
}

/** The data set, checked to be a current version of the system (a superseded version has a newer one). */
function member(d: datasets.DataSetRecord | undefined, systemId: string, id: string): datasets.DataSetRecord {
  if (!d) throw notFound(`There is no data set ${id}.`)
  if (d.systemId !== systemId) throw conflict(`"${d.title}" v${d.version} belongs to another system.`)
  if (d.state === 'superseded')
    throw conflict(`"${d.title}" v${d.version} is superseded by a newer version; choose the current version.`)
  return d
}

/**
 * The one vapour model of the chosen data sets; refused (409) when they differ, naming them: one parameter set
 * holds under one vapour model only (the γ it reproduces depends on the vapour's φ).
 */
function sharedVapour(chosen: datasets.DataSetRecord[]): datasets.DataSetRecord['vaporModel'] {
  const key = (d: datasets.DataSetRecord) => canonicalJson8785(d.vaporModel ?? { kind: 'ideal' })
  const groups = new Map<string, datasets.DataSetRecord[]>()
  for (const d of chosen) groups.set(key(d), [...(groups.get(key(d)) ?? []), d])
  if (groups.size > 1) {
    const parts = [...groups.values()].map(
      (ds) => `${ds.map((d) => `"${d.title}" v${d.version}`).join(', ')}: ${vaporModelLabel(ds[0].vaporModel)}`,
    )
    throw conflict(
      `The chosen data sets have different vapour models (${parts.join('; ')}). One parameter set holds under one vapour model only: give them the same vapour model, or fit them in separate joint fits.`,
    )
  }
  return chosen[0].vaporModel ?? { kind: 'ideal' }
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
    chosen.push({ d, points, pointSet: memberDigest(d, points) })
  }
  const inputs = await engineInputs(db, systemId, sharedVapour(chosen.map((c) => c.d)))
  // The engine's vapour (with the components' critical data as they are now) is kept with the result, as fits do.
  const vapor = inputs.vapor.kind === 'virial' ? { vapor: inputs.vapor } : {}
  // UNIQUAC's r and q come from the components (refused naming what is missing before anything runs), stored.
  const held =
    req.model === 'nrtl'
      ? { alpha: req.alpha ?? DEFAULT_NRTL_ALPHA }
      : req.model === 'uniquac'
        ? { uniquac: uniquacStructure(inputs.system) }
        : { V1: inputs.V1, V2: inputs.V2 }
  const options = JSON.parse(
    JSON.stringify({
      model: req.model,
      temperatureDependent: req.temperatureDependent ?? true,
      ...held,
      ...vapor,
    }),
  ) as {
    model: JointFitModel
    temperatureDependent: boolean
    alpha?: number
    V1?: number
    V2?: number
    uniquac?: { r1: number; r2: number; q1: number; q2: number }
  }
  const r = thermo('Joint fit', () =>
    fitJoint({
      ...options,
      vaporPressure: inputs.vaporPressure,
      dataSets: chosen.map((c) => ({
        id: c.d.id,
        kind: dataKindOf(c.d.layout ?? 'txy'),
        points: enginePoints(c.points),
        ...vapor,
      })),
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
      ...(r.rmsP !== undefined ? { rmsP: r.rmsP, aadP: r.aadP, maxAbsP: r.maxAbsP } : {}),
      objectiveKind: r.objectiveKind,
      vaporModel: r.vaporModel,
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
          digestFormat: MEMBER_DIGEST_V2,
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
        dataSets: chosen.map((c) => ({
          id: c.d.id,
          version: c.d.version,
          pointSetDigest: c.pointSet.digest,
          digestFormat: MEMBER_DIGEST_V2,
        })),
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
    // Each member is compared in the format it was stored in (format 1: the points alone).
    const current = memberDigest(d, await listPoints(db, m.dataSetId), m.digestFormat).digest
    out.push({
      dataSetId: m.dataSetId,
      title: d.title,
      version: d.version,
      state: d.state,
      nominalPressurePa: d.nominalPressurePa,
      kind: dataKindOf(d.layout ?? 'txy'),
      nominalTemperatureK: d.nominalTemperatureK,
      vaporModel: (d.vaporModel ?? { kind: 'ideal' }) as JointFitMemberDto['vaporModel'],
      pointSetDigest: m.pointSetDigest,
      digestFormat: m.digestFormat,
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
 * Each contributing data set's points against the joint model, for the plot of each data set against the joint
 * parameters: an isobaric set against the T–x–y curve at its nominal pressure, an isothermal one against the P–x–y
 * curve at its temperature (its nominal temperature, else the mean of its points'), under the fit's vapour model.
 */
export async function jointFitPlots(db: Db, user: SessionUser, id: string, gridPoints = 51) {
  const fit = await jointFitDetail(db, user, id)
  const inputs = await engineInputs(db, fit.systemId)
  const vapor = fit.options.vapor as EngineVapor | undefined
  const system = binarySystem(
    { ...inputs, vapor: vapor ?? { kind: 'ideal' } },
    fit.activity as unknown as ActivityModel,
  )
  const plots = []
  for (const m of fit.members) {
    const points = await listPoints(db, m.dataSetId)
    const mean = (f: (p: PointRecord) => number) => points.reduce((s, p) => s + f(p), 0) / Math.max(points.length, 1)
    const common = {
      dataSetId: m.dataSetId,
      title: m.title,
      version: m.version,
      points: points.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1, excluded: p.excluded })),
    }
    if (m.kind === 'isothermal') {
      const T = m.nominalTemperatureK ?? mean((p) => p.temperatureK)
      const diagram = thermo(
        'P–x–y curve',
        () => phaseDiagram(system, { T }, { points: gridPoints }) as Extract<PhaseDiagram, { kind: 'isothermal' }>,
      )
      plots.push({
        ...common,
        kind: 'isothermal' as const,
        P: null,
        T,
        curve: { x1: diagram.x1, y1: diagram.y1, P: diagram.P },
      })
      continue
    }
    // an isobaric member without a nominal pressure (none today) would be drawn at the mean of its pressures
    const P = m.nominalPressurePa ?? mean((p) => p.pressurePa)
    const diagram = thermo(
      'T–x–y curve',
      () => phaseDiagram(system, { P }, { points: gridPoints }) as Extract<PhaseDiagram, { kind: 'isobaric' }>,
    )
    plots.push({
      ...common,
      kind: 'isobaric' as const,
      P: m.nominalPressurePa,
      T: null,
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
    if (fit.state !== 'draft' && fit.state !== 'returned')
      throw conflict(`This joint fit is ${fit.state}; only a draft or a returned joint fit can be submitted.`)
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
      before: { state: fit.state },
      after: { state: 'submitted' },
    })
    const system = await getSystem(tx, fit.systemId)
    const others = (await activeLeadChemistIds(tx)).filter((lead) => lead !== user.id)
    for (const lead of others) {
      await notifyUser(tx, lead, {
        subject: `Ebullio: a recommended parameter set for ${system.name} awaits your signature`,
        text: `${user.displayName} submitted a joint ${FIT_MODEL_LABELS[fit.model] ?? fit.model} parameter set for ${system.name} as the system's recommended parameter set.\n\nOpen it: ${webLink(config.publicUrl, 'labSystem', { id: fit.systemId })}\n`,
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
