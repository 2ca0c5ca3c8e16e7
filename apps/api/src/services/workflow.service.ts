/** Submit, approve and return: the state machine with e-signatures, the four-eyes rule and notifications. */
import { webLink } from '@ebullio/schemas'
import type { Kysely } from 'kysely'
import type { SessionUser } from '../auth/index.js'
import { verifyPassword } from '../auth/password.js'
import type { Config } from '../config.js'
import type { Database, Db } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { notifyUser } from '../mail/outbox.js'
import { insertApproval, listApprovals } from '../repositories/approvals.repository.js'
import { signedOutliers } from './outliers.js'
import { appendAudit } from '../repositories/audit.repository.js'
import { countOpenThreads } from '../repositories/comments.repository.js'
import * as repo from '../repositories/datasets.repository.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'
import { countPoints } from '../repositories/points.repository.js'
import { activeLeadChemistIds, passwordHashOf } from '../repositories/users.repository.js'
import { contentDigest, DIGEST_V2 } from './digest.js'
import { contributorsOf } from './contributors.js'
import { refuseWhileStale } from './stale-results.js'
import { currentPointSet } from './point-set.js'
import { EDITABLE_STATES, requireState, staleWrite, visibleOrNotFound } from './lab-access.js'

const link = (config: Config, id: string) => webLink(config.publicUrl, 'dataset', { id })

async function lockFresh(tx: Db, user: SessionUser, id: string, rowVersion: number) {
  const d = visibleOrNotFound(user, await repo.lockDataSet(tx, id))
  if (d.rowVersion !== rowVersion) throw staleWrite(rowVersion, d.rowVersion)
  return d
}

/** Hand a draft (or a returned version) to the lead chemists. */
export async function submit(db: Kysely<Database>, config: Config, user: SessionUser, id: string, rowVersion: number) {
  return db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await repo.lockDataSet(tx, id))
    requireState(d, EDITABLE_STATES, 'submitting')
    if (d.rowVersion !== rowVersion) throw staleWrite(rowVersion, d.rowVersion)
    const { included } = await countPoints(tx, id)
    if (included < 3) throw conflict(`A data set needs at least 3 included points to be submitted; it has ${included}.`)
    await refuseWhileStale(tx, d, 'submit')
    const after = await repo.updateDataSet(tx, id, { state: 'submitted', submittedAt: new Date() })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: id,
      action: 'submit',
      dataSetId: id,
      before: { state: d.state },
      after: { state: 'submitted' },
    })
    const others = (await activeLeadChemistIds(tx)).filter((lead) => lead !== user.id)
    for (const lead of others) {
      await notifyUser(tx, lead, {
        subject: `Ebullio: "${d.title}" v${d.version} submitted for approval`,
        text: `${user.displayName} submitted the data set "${d.title}" (version ${d.version}) with ${included} points for approval.\n\nOpen it: ${link(config, id)}\n`,
      })
    }
    // Said as it is: with no other active lead chemist, nobody was told and nobody else can approve.
    return { ...after!, notifiedLeadChemists: others.length }
  })
}

export interface SignatureInput {
  password: string
  reason: string
  rowVersion: number
  overrideReason?: string | null
}

/** Re-entered password check for a signature; a wrong password records nothing. */
export async function checkSignaturePassword(db: Db, user: SessionUser, password: string): Promise<void> {
  if (!(await verifyPassword(await passwordHashOf(db, user.id), password))) {
    throw new AppError(403, 'signature_refused', 'The password is not correct; nothing was signed.')
  }
}

/** Literature data is approved as the lab's own measurement only once a lead chemist has marked it so. */
const literatureNotOwn = () =>
  new AppError(
    409,
    'literature_not_own',
    "This data set is literature data; a lead chemist must first mark it as the lab's own measurement (with a reason) before it can be approved.",
  )

/** What must hold before anyone may sign the approval: submitted, own data, the signer's password, a recommended fit. */
async function checkApprovable(tx: Db, user: SessionUser, d: DataSetRecord, password: string): Promise<string> {
  requireState(d, ['submitted'], 'approval')
  if (d.origin === 'literature' && !d.countsAsOwn) throw literatureNotOwn()
  await checkSignaturePassword(tx, user, password)
  if (!d.recommendedFitId) throw conflict('Mark one fit as the recommended fit before approving.')
  return d.recommendedFitId
}

/**
 * The four-eyes rule: who changed this version, and whether the signer is among them. ALLOW_SELF_APPROVAL (a
 * one-person lab) lets the signer approve their own changes; the signature says so.
 */
async function fourEyes(tx: Db, config: Config, user: SessionUser, d: DataSetRecord) {
  const changes = await contributorsOf(tx, d)
  const mine = changes.find((c) => c.userId === user.id)
  if (mine && !config.allowSelfApproval) {
    throw new AppError(
      403,
      'four_eyes',
      `You changed this version (${mine.changes.join(', ')}); another lead chemist must approve it.`,
      { changes: mine.changes },
    )
  }
  return { changes, selfApproval: mine !== undefined }
}

/** Open comment threads block the approval unless the signer says why; answers the override kept (null: none needed). */
async function threadsOverride(tx: Db, id: string, overrideReason: string | null | undefined): Promise<string | null> {
  const open = await countOpenThreads(tx, id)
  const override = overrideReason?.trim() || null
  if (open > 0 && !override) {
    throw conflict(
      `This data set has ${open} unresolved comment thread${open === 1 ? '' : 's'}; resolve them or give an override reason.`,
      { openThreads: open },
    )
  }
  return open > 0 ? override : null
}

/** Approving a version supersedes every other approved version of its lineage, each with its audit line. */
async function supersedeOthers(tx: Db, user: SessionUser, d: DataSetRecord): Promise<void> {
  for (const v of await repo.listVersions(tx, d.lineageId)) {
    if (v.id === d.id || v.state !== 'approved') continue
    await repo.updateDataSet(tx, v.id, { state: 'superseded', supersededAt: new Date() })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: v.id,
      action: 'supersede',
      dataSetId: v.id,
      before: { state: 'approved' },
      after: { state: 'superseded', by: d.id },
    })
  }
}

/** Approve a submitted version with an e-signature over its content digest; an older approved version becomes superseded. */
export async function approve(db: Kysely<Database>, config: Config, user: SessionUser, id: string, s: SignatureInput) {
  return db.transaction().execute(async (tx) => {
    const d = await lockFresh(tx, user, id, s.rowVersion)
    const recommendedFitId = await checkApprovable(tx, user, d, s.password)
    const pointSetDigest = await refuseWhileStale(tx, d, 'approve')
    const { changes, selfApproval } = await fourEyes(tx, config, user, d)
    const overrideReason = await threadsOverride(tx, id, s.overrideReason)
    const digest = await contentDigest(tx, id, DIGEST_V2)
    const outliers = await signedOutliers(tx, id, recommendedFitId)
    const approvalId = await insertApproval(tx, {
      dataSetId: id,
      signerId: user.id,
      meaning: 'approved',
      reason: s.reason,
      digest,
      digestAlgorithm: DIGEST_V2,
      pointSetDigest,
      changes,
      selfApproval,
      overrideReason,
      outliers,
    })
    const after = await repo.updateDataSet(tx, id, { state: 'approved', approvedAt: new Date() })
    await supersedeOthers(tx, user, d)
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: id,
      action: 'approve',
      dataSetId: id,
      before: { state: 'submitted' },
      after: { state: 'approved', approvalId, digest, selfApproval, overrideReason },
    })
    await notifyUser(tx, d.createdBy, {
      subject: `Ebullio: "${d.title}" v${d.version} approved`,
      text: `${user.displayName} approved the data set "${d.title}" (version ${d.version}).\nReason: ${s.reason}\nSignature digest (SHA-256): ${digest}\n\n${link(config, id)}\n`,
    })
    const approval = (await listApprovals(tx, id)).find((a) => a.id === approvalId)!
    return { dataSet: after!, approvalId, digest, approval }
  })
}

/** Return a submitted version for rework, signed with a reason. */
export async function returnForRework(
  db: Kysely<Database>,
  config: Config,
  user: SessionUser,
  id: string,
  s: SignatureInput,
) {
  return db.transaction().execute(async (tx) => {
    const d = await lockFresh(tx, user, id, s.rowVersion)
    requireState(d, ['submitted'], 'returning')
    await checkSignaturePassword(tx, user, s.password)
    const digest = await contentDigest(tx, id, DIGEST_V2)
    const outliers = await signedOutliers(tx, id, d.recommendedFitId)
    const approvalId = await insertApproval(tx, {
      dataSetId: id,
      signerId: user.id,
      meaning: 'returned for rework',
      reason: s.reason,
      digest,
      digestAlgorithm: DIGEST_V2,
      pointSetDigest: (await currentPointSet(tx, id)).digest,
      changes: await contributorsOf(tx, d),
      selfApproval: false,
      overrideReason: null,
      outliers,
    })
    const after = await repo.updateDataSet(tx, id, { state: 'returned' })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: id,
      action: 'return',
      dataSetId: id,
      before: { state: 'submitted' },
      after: { state: 'returned', approvalId, reason: s.reason },
    })
    await notifyUser(tx, d.createdBy, {
      subject: `Ebullio: "${d.title}" v${d.version} returned for rework`,
      text: `${user.displayName} returned the data set "${d.title}" (version ${d.version}) for rework.\nReason: ${s.reason}\n\n${link(config, id)}\n`,
    })
    const approval = (await listApprovals(tx, id)).find((a) => a.id === approvalId)!
    return { dataSet: after!, approvalId, digest, approval }
  })
}

/** Recompute the digest of the stored content and compare it with every signature of the version. */
export async function verifySignatures(db: Db, user: SessionUser, id: string) {
  visibleOrNotFound(user, await repo.findDataSet(db, id))
  const now = await contentDigest(db, id, DIGEST_V2)
  const approvals = await listApprovals(db, id)
  if (approvals.length === 0) throw notFound('This data set has no signatures.')
  // Each signature is checked with the algorithm it was made with (format 1 signatures keep verifying).
  const signatures = []
  for (const a of approvals) {
    const recomputed = a.digestAlgorithm === DIGEST_V2 ? now : await contentDigest(db, id, a.digestAlgorithm)
    signatures.push({ ...a, recomputedDigest: recomputed, matches: a.digest === recomputed })
  }
  return { currentDigest: now, digestAlgorithm: DIGEST_V2, signatures }
}
