/**
 * The system's recommended parameter set: a submitted joint fit signed by a lead chemist who neither ran it nor
 * changed a contributing data set (four-eyes, as for data sets), with a password e-signature over the digest of
 * the joint fit and the data sets it rests on (RFC 8785; the recipe is in docs/workflow.md). Two formats, named in
 * each signature (`digest_algorithm`): `ebullio-parameter-set/2` (every new signature) signs each data set's kind,
 * nominal temperature (isothermal) and vapour model with its points; `ebullio-parameter-set/1` (signatures made
 * before) signed the points alone and is recomputed exactly as it was, so those signatures still verify.
 * Signing supersedes the system's previous recommended set, which stays in the record. A lead chemist may instead
 * return a submitted set for rework, signed with a reason; its author is told by mail and may submit it again.
 */
import {
  dataKindOf,
  jointFitLabel,
  vaporChoiceOfEngine,
  pressureAgainstRange,
  webLink,
  type RecommendedParameterSetDto,
} from '@ebullio/schemas'
import type { SessionUser } from '../auth/index.js'
import type { Config } from '../config.js'
import type { Db } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { displayNamesOf } from '../repositories/approvals.repository.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as datasets from '../repositories/datasets.repository.js'
import * as repo from '../repositories/joint-fits.repository.js'
import { listPoints } from '../repositories/points.repository.js'
import { contributorsOf, type Contributor } from './contributors.js'
import { setVapourCorrection } from './vapour-correction.js'
import { notifyUser } from '../mail/outbox.js'
import {
  memberContent,
  memberDigest,
  MEMBER_DIGEST_V2,
  refuseStale,
  jointFitDetail,
  staleJointFit,
} from './joint-fits.service.js'
import { canonicalJson8785, pointSetOf, sha256Hex } from './point-set.js'
import { checkSignaturePassword } from './workflow.service.js'
import { binarySystem, engineInputs, getSystem } from './systems.service.js'
import { cautionFor, curveOf } from './catalogue.service.js'
import type { ActivityModel } from '@ebullio/thermo'

export const PARAMETER_SET_DIGEST_V1 = 'ebullio-parameter-set/1'
export const PARAMETER_SET_DIGEST_V2 = 'ebullio-parameter-set/2'
/** The format of every new signature. */
export const PARAMETER_SET_DIGEST = PARAMETER_SET_DIGEST_V2

/**
 * What a signature of a recommended parameter set covers: the system, the joint fit's result (model, options,
 * activity model, parameters with standard errors, covariance, statistics, range) and, per contributing data set
 * in fit order, its identity and what the fit read of it as stored now. Format 2: the data set's kind, nominal
 * temperature (isothermal, when it has one), vapour model and the digest of memberContent (`ebullio-joint-member/2`),
 * and the fit's RMS ΔP (null without isothermal members). Format 1 (signatures made before format 2), exactly as it
 * was: the digest of the points alone (`ebullio-point-set/1`); nothing may ever be added to it.
 */
export async function parameterSetContent(db: Db, id: string, format: string = PARAMETER_SET_DIGEST_V2) {
  const fit = await repo.findJointFit(db, id)
  if (!fit) return null
  const system = await getSystem(db, fit.systemId)
  const v1 = format === PARAMETER_SET_DIGEST_V1
  const members = []
  for (const m of await repo.listMembers(db, id)) {
    const d = (await datasets.findDataSet(db, m.dataSetId))!
    const points = await listPoints(db, m.dataSetId)
    const identity = {
      id: d.id,
      lineageId: d.lineageId,
      version: d.version,
      title: d.title,
      nominalPressurePa: d.nominalPressurePa,
    }
    if (v1) {
      const now = pointSetOf(points)
      members.push({ ...identity, pointSet: { digest: now.digest, included: now.included }, statistics: m.statistics })
      continue
    }
    const { format: _f, pointSet: _p, ...read } = memberContent(d, points)
    const now = memberDigest(d, points, MEMBER_DIGEST_V2)
    members.push({
      ...identity,
      ...read,
      pointSet: { format: MEMBER_DIGEST_V2, digest: now.digest, included: now.included },
      statistics: m.statistics,
    })
  }
  const s = fit.statistics as Record<string, unknown>
  return {
    format: v1 ? PARAMETER_SET_DIGEST_V1 : PARAMETER_SET_DIGEST_V2,
    system: {
      id: system.id,
      component1: { id: system.component1.id, name: system.component1.name },
      component2: { id: system.component2.id, name: system.component2.name },
    },
    jointFit: {
      id: fit.id,
      model: fit.model,
      options: fit.options,
      activity: fit.activity,
      parameters: fit.parameters,
      covariance: s.covariance ?? null,
      rmsT: s.rmsT ?? null,
      rmsY: s.rmsY ?? null,
      converged: s.converged ?? null,
      ...(v1 ? {} : { rmsP: s.rmsP ?? null }),
      range: fit.range,
    },
    dataSets: members,
  }
}

/** SHA-256 (hex) of the RFC 8785 canonical JSON of {@link parameterSetContent} in the given format. */
export async function parameterSetDigest(
  db: Db,
  id: string,
  format: string = PARAMETER_SET_DIGEST_V2,
): Promise<string> {
  return sha256Hex(canonicalJson8785(await parameterSetContent(db, id, format)))
}

/** Who ran the joint fit and everyone who changed a contributing data set, with what they did. */
export async function jointFitContributors(db: Db, fit: repo.JointFitRecord): Promise<Contributor[]> {
  const by = new Map<string, Contributor>()
  const add = (c: Contributor) => {
    const seen = by.get(c.userId)
    if (seen) seen.changes = [...new Set([...seen.changes, ...c.changes])]
    else by.set(c.userId, { ...c, changes: [...c.changes] })
  }
  const runner = await contributorName(db, fit.runBy)
  add({ userId: fit.runBy, name: runner, changes: ['ran the joint fit'] })
  for (const m of await repo.listMembers(db, fit.id)) {
    const d = (await datasets.findDataSet(db, m.dataSetId))!
    for (const c of await contributorsOf(db, d))
      add({ ...c, changes: c.changes.map((w) => `${w} in "${d.title}" v${d.version}`) })
  }
  return [...by.values()].sort((a, b) => a.name.localeCompare(b.name))
}

async function contributorName(db: Db, userId: string): Promise<string> {
  return (await displayNamesOf(db, [userId])).get(userId) ?? userId
}

export interface JointFitSignatureInput {
  password: string
  reason: string
  rowVersion: number
}

/**
 * Sign a submitted joint fit as the system's recommended parameter set. Refused while a contributing data set's
 * points changed since the run, while a contributing data set is not approved, when the fit did not converge,
 * and (four-eyes) when the signer ran it or changed a contributing data set. The previous recommended set of the
 * system becomes superseded (kept, audited).
 */
export async function approveJointFit(
  db: Db,
  config: Config,
  user: SessionUser,
  id: string,
  s: JointFitSignatureInput,
) {
  const run = async (tx: Db) => {
    const fit = await repo.lockJointFit(tx, id)
    if (!fit) throw notFound('There is no such joint fit.')
    if (fit.rowVersion !== s.rowVersion) throw staleJointFit(s.rowVersion, fit.rowVersion)
    if (fit.state !== 'submitted')
      throw conflict(`This joint fit is ${fit.state}; only a submitted joint fit can be signed.`, { state: fit.state })
    await checkSignaturePassword(tx, user, s.password)
    const detail = await jointFitDetail(tx, user, id)
    refuseStale(detail, 'approve')
    const unapproved = detail.members.filter((m) => m.state !== 'approved')
    if (unapproved.length)
      throw conflict(
        `The recommended parameter set must rest on approved data only; ${unapproved.map((m) => `"${m.title}" v${m.version} is ${m.state}`).join(', ')}. Approve ${unapproved.length === 1 ? 'it' : 'them'} first, then run the joint fit again if the points changed.`,
      )
    if ((fit.statistics as { converged?: boolean }).converged === false)
      throw conflict('This joint fit did not converge; it cannot be the recommended parameter set.')
    const changes = await jointFitContributors(tx, fit)
    const mine = changes.find((c) => c.userId === user.id)
    if (mine && !config.allowSelfApproval) {
      throw new AppError(
        403,
        'four_eyes',
        `You ${mine.changes.join('; ')}; another lead chemist must sign this parameter set.`,
        { changes: mine.changes },
      )
    }
    const digest = await parameterSetDigest(tx, id)
    const previous = (await repo.listJointFits(tx, fit.systemId, ['approved'])).filter((f) => f.id !== id)
    for (const old of previous) {
      await repo.updateJointFit(tx, old.id, { state: 'superseded', supersededAt: new Date(), supersededBy: id })
      await appendAudit(tx, {
        actorId: user.id,
        entity: 'joint_fit',
        entityId: old.id,
        action: 'supersede joint fit',
        before: { state: 'approved' },
        after: { state: 'superseded', by: id },
      })
    }
    const approvalId = await repo.insertJointFitApproval(tx, {
      jointFitId: id,
      signerId: user.id,
      meaning: 'approved',
      reason: s.reason,
      digest,
      digestAlgorithm: PARAMETER_SET_DIGEST,
      changes,
      selfApproval: mine !== undefined,
    })
    await repo.updateJointFit(tx, id, { state: 'approved', approvedAt: new Date() })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'joint_fit',
      entityId: id,
      action: 'approve joint fit',
      before: { state: 'submitted' },
      after: {
        state: 'approved',
        approvalId,
        digest,
        selfApproval: mine !== undefined,
        supersedes: previous.map((p) => p.id),
      },
    })
    return { approvalId, digest }
  }
  const signed = await db.transaction().execute(run)
  return { ...signed, jointFit: await jointFitDetail(db, user, id) }
}

/**
 * Recompute the digest of the stored content and compare it with each signature of the joint fit, each with the
 * format it was made with (format 1 signatures keep verifying).
 */
export async function verifyJointFit(db: Db, id: string) {
  const fit = await repo.findJointFit(db, id)
  if (!fit) throw notFound('There is no such joint fit.')
  const now = await parameterSetDigest(db, id)
  const approvals = await repo.listJointFitApprovals(db, id)
  if (!approvals.length) throw notFound('This joint fit has no signatures.')
  const signatures = []
  for (const a of approvals) {
    const recomputed =
      a.digestAlgorithm === PARAMETER_SET_DIGEST ? now : await parameterSetDigest(db, id, a.digestAlgorithm)
    signatures.push({ ...a, recomputedDigest: recomputed, matches: a.digest === recomputed })
  }
  return { currentDigest: now, digestAlgorithm: PARAMETER_SET_DIGEST, signatures }
}

/**
 * Return a submitted joint fit for rework: a lead chemist signs (password re-entered) with the reason, over the same
 * content a signature of approval covers; the fit becomes 'returned', its author (who ran it, and who submitted it
 * when someone else did) is told by mail with a link to the system's lab page, and the audit log records it. The
 * author may submit it again; another lead chemist then signs it (four-eyes as always).
 */
export async function returnJointFit(db: Db, config: Config, user: SessionUser, id: string, s: JointFitSignatureInput) {
  const returned = await db.transaction().execute(async (tx) => {
    const fit = await repo.lockJointFit(tx, id)
    if (!fit) throw notFound('There is no such joint fit.')
    if (fit.rowVersion !== s.rowVersion) throw staleJointFit(s.rowVersion, fit.rowVersion)
    if (fit.state !== 'submitted')
      throw conflict(`This joint fit is ${fit.state}; only a submitted joint fit can be returned for rework.`, {
        state: fit.state,
      })
    await checkSignaturePassword(tx, user, s.password)
    const digest = await parameterSetDigest(tx, id)
    const approvalId = await repo.insertJointFitApproval(tx, {
      jointFitId: id,
      signerId: user.id,
      meaning: 'returned for rework',
      reason: s.reason,
      digest,
      digestAlgorithm: PARAMETER_SET_DIGEST,
      changes: await jointFitContributors(tx, fit),
      selfApproval: false,
    })
    await repo.updateJointFit(tx, id, { state: 'returned' })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'joint_fit',
      entityId: id,
      action: 'return joint fit',
      before: { state: 'submitted' },
      after: { state: 'returned', approvalId, digest, reason: s.reason },
    })
    const system = await getSystem(tx, fit.systemId)
    const label = jointFitLabel({
      model: fit.model,
      dataSetCount: (await repo.listMembers(tx, id)).length,
      temperatureDependent: fit.options.temperatureDependent !== false,
    })
    for (const author of new Set([fit.runBy, ...(fit.submittedBy ? [fit.submittedBy] : [])])) {
      await notifyUser(tx, author, {
        subject: `Ebullio: the joint parameter set for ${system.name} was returned for rework`,
        text: `${user.displayName} returned the joint parameter set ${label} for ${system.name} for rework.\nReason: ${s.reason}\n\nRework it and submit it again, or run a new joint fit: ${webLink(config.publicUrl, 'labSystem', { id: fit.systemId })}?joint=${id}\n`,
      })
    }
    return { approvalId, digest }
  })
  return { ...returned, jointFit: await jointFitDetail(db, user, id) }
}

/** The system's signed recommended parameter set as engineers read it, or null when it has none. */
export async function recommendedSetOf(db: Db, systemId: string): Promise<RecommendedParameterSetDto<Date> | null> {
  const fit = (await repo.recommendedOf(db, [systemId])).get(systemId)
  if (!fit) return null
  const approval = (await repo.listJointFitApprovals(db, fit.id)).filter((a) => a.meaning === 'approved').at(-1) ?? null
  const dataSets = []
  for (const m of await repo.listMembers(db, fit.id)) {
    const d = (await datasets.findDataSet(db, m.dataSetId))!
    dataSets.push({
      dataSetId: d.id,
      title: d.title,
      version: d.version,
      kind: dataKindOf(d.layout),
      nominalPressurePa: d.nominalPressurePa,
      nominalTemperatureK: d.nominalTemperatureK,
      pointCount: m.pointCount,
    })
  }
  return {
    id: fit.id,
    systemId,
    model: fit.model,
    label: jointFitLabel({
      model: fit.model,
      dataSetCount: dataSets.length,
      temperatureDependent: fit.options.temperatureDependent !== false,
    }),
    activity: fit.activity as RecommendedParameterSetDto['activity'],
    parameters: fit.parameters as unknown as RecommendedParameterSetDto['parameters'],
    range: fit.range,
    approvedAt: fit.approvedAt,
    signedBy: approval?.signerName ?? null,
    digest: approval?.digest ?? null,
    vaporModel: vaporChoiceOfEngine(fit.options.vapor),
    vapor: (fit.options.vapor as RecommendedParameterSetDto['vapor'] | undefined) ?? { kind: 'ideal' },
    dataSets,
  }
}

/** The recommended set, or 404 for a system without one. */
export async function recommendedSet(db: Db, systemId: string): Promise<RecommendedParameterSetDto<Date>> {
  await getSystem(db, systemId)
  const r = await recommendedSetOf(db, systemId)
  if (!r) throw notFound('This system has no signed recommended parameter set.')
  const fit = await repo.findJointFit(db, r.id)
  return { ...r, vapourCorrection: fit ? await setVapourCorrection(db, fit) : null }
}

const kPa = (P: number) => `${(P / 1000).toPrecision(4)} kPa`

/**
 * The engineer's T–x–y at P (Pa) with the system's recommended parameter set, and a warning when P lies outside
 * the pressure range the set was fitted on (the curve is then an extrapolation).
 */
export async function recommendedCurve(db: Db, systemId: string, o: { P: number; points: number }) {
  await getSystem(db, systemId)
  const set = await recommendedSetOf(db, systemId)
  if (!set) throw notFound('This system has no signed recommended parameter set.')
  const inputs = await engineInputs(db, systemId)
  // The set's own vapour model (kept with the joint fit), with which its parameters were fitted.
  const vapor = (await repo.findJointFit(db, set.id))?.options.vapor as typeof inputs.vapor | undefined
  const where = pressureAgainstRange(o.P, set.range)
  const fitted = `${kPa(set.range.Pmin)} to ${kPa(set.range.Pmax)}`
  return {
    systemId,
    recommendedSetId: set.id,
    label: jointFitLabel({ model: set.model, dataSetCount: set.dataSets.length }, 'recommended for the system'),
    model: set.model,
    P: o.P,
    range: set.range,
    pressureInRange: where === 'inside',
    rangeWarning:
      where === 'inside'
        ? null
        : `${kPa(o.P)} is ${where} the pressures the recommended parameter set was fitted on (${fitted}): this curve is an extrapolation and may be wrong. Ask the lab for data at this pressure before relying on it.`,
    components: [inputs.system.component1.name, inputs.system.component2.name],
    ...curveOf(
      binarySystem({ ...inputs, vapor: vapor ?? inputs.vapor }, set.activity as unknown as ActivityModel),
      o.P,
      o.points,
    ),
    caution: cautionFor(vapor),
  }
}
