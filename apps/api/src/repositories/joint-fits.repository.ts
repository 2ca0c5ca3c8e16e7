/** Joint fits of a system, their members (contributing data sets) and their signatures. */
import type { Selectable } from 'kysely'
import type { Db } from '../db/index.js'
import type { JointFitMemberTable, JointFitState, JointFitTable, MemberDigestFormat } from '../db/joint-fit-tables.js'

export interface JointFitRecord {
  id: string
  systemId: string
  model: 'nrtl' | 'wilson' | 'uniquac'
  options: Record<string, unknown>
  activity: Record<string, unknown>
  parameters: Record<string, unknown>[]
  statistics: Record<string, unknown>
  range: { Tmin: number; Tmax: number; Pmin: number; Pmax: number }
  state: JointFitState
  runBy: string
  runAt: Date
  submittedBy: string | null
  submittedAt: Date | null
  approvedAt: Date | null
  supersededAt: Date | null
  supersededBy: string | null
  rowVersion: number
}

export interface JointFitMemberRecord {
  jointFitId: string
  dataSetId: string
  position: number
  pointSetDigest: string
  /** how pointSetDigest was computed: the points alone (format 1) or kind, temperature, vapour and points (2) */
  digestFormat: MemberDigestFormat
  pointCount: number
  statistics: Record<string, unknown>
}

export interface JointFitApprovalRecord {
  id: string
  jointFitId: string
  signerId: string
  signerName: string
  meaning: 'approved' | 'returned for rework'
  reason: string
  digest: string
  digestAlgorithm: string
  changes: { userId: string; name: string; changes: string[] }[]
  selfApproval: boolean
  signedAt: Date
}

const toJointFit = (r: Selectable<JointFitTable>): JointFitRecord => ({
  id: r.id,
  systemId: r.system_id,
  model: r.model,
  options: r.options,
  activity: r.activity,
  parameters: r.parameters,
  statistics: r.statistics,
  range: { Tmin: r.t_min_k, Tmax: r.t_max_k, Pmin: r.p_min_pa, Pmax: r.p_max_pa },
  state: r.state,
  runBy: r.run_by,
  runAt: r.run_at,
  submittedBy: r.submitted_by,
  submittedAt: r.submitted_at,
  approvedAt: r.approved_at,
  supersededAt: r.superseded_at,
  supersededBy: r.superseded_by,
  rowVersion: r.row_version,
})

const toMember = (m: Selectable<JointFitMemberTable>): JointFitMemberRecord => ({
  jointFitId: m.joint_fit_id,
  dataSetId: m.data_set_id,
  position: m.position,
  pointSetDigest: m.point_set_digest,
  digestFormat: m.digest_format,
  pointCount: m.point_count,
  statistics: m.statistics,
})

export async function insertJointFit(
  db: Db,
  f: Omit<
    JointFitRecord,
    | 'id'
    | 'state'
    | 'runAt'
    | 'submittedBy'
    | 'submittedAt'
    | 'approvedAt'
    | 'supersededAt'
    | 'supersededBy'
    | 'rowVersion'
  >,
  members: Omit<JointFitMemberRecord, 'jointFitId'>[],
): Promise<JointFitRecord> {
  const row = await db
    .insertInto('joint_fit')
    .values({
      system_id: f.systemId,
      model: f.model,
      options: JSON.stringify(f.options),
      activity: JSON.stringify(f.activity),
      parameters: JSON.stringify(f.parameters),
      statistics: JSON.stringify(f.statistics),
      t_min_k: f.range.Tmin,
      t_max_k: f.range.Tmax,
      p_min_pa: f.range.Pmin,
      p_max_pa: f.range.Pmax,
      run_by: f.runBy,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  await db
    .insertInto('joint_fit_member')
    .values(
      members.map((m) => ({
        joint_fit_id: row.id,
        data_set_id: m.dataSetId,
        position: m.position,
        point_set_digest: m.pointSetDigest,
        digest_format: m.digestFormat,
        point_count: m.pointCount,
        statistics: JSON.stringify(m.statistics),
      })),
    )
    .execute()
  return toJointFit(row)
}

export async function findJointFit(db: Db, id: string): Promise<JointFitRecord | undefined> {
  const r = await db.selectFrom('joint_fit').selectAll().where('id', '=', id).executeTakeFirst()
  return r && toJointFit(r)
}

export async function lockJointFit(db: Db, id: string): Promise<JointFitRecord | undefined> {
  const r = await db.selectFrom('joint_fit').selectAll().where('id', '=', id).forUpdate().executeTakeFirst()
  return r && toJointFit(r)
}

/** A system's joint fits, newest first; `states` narrows them. */
export async function listJointFits(db: Db, systemId: string, states?: JointFitState[]): Promise<JointFitRecord[]> {
  let q = db.selectFrom('joint_fit').selectAll().where('system_id', '=', systemId)
  if (states) q = q.where('state', 'in', states)
  return (await q.orderBy('run_at', 'desc').orderBy('id').execute()).map(toJointFit)
}

/** The approved (recommended) sets of several systems, by system. */
export async function recommendedOf(db: Db, systemIds: string[]): Promise<Map<string, JointFitRecord>> {
  if (!systemIds.length) return new Map()
  const rows = await db
    .selectFrom('joint_fit')
    .selectAll()
    .where('system_id', 'in', systemIds)
    .where('state', '=', 'approved')
    .execute()
  return new Map(rows.map((r) => [r.system_id, toJointFit(r)]))
}

export async function listMembers(db: Db, jointFitId: string): Promise<JointFitMemberRecord[]> {
  return (
    await db
      .selectFrom('joint_fit_member')
      .selectAll()
      .where('joint_fit_id', '=', jointFitId)
      .orderBy('position')
      .execute()
  ).map(toMember)
}

/** The joint fits (not yet signed) a data set takes part in. */
export async function openJointFitsOf(db: Db, dataSetId: string): Promise<string[]> {
  const rows = await db
    .selectFrom('joint_fit_member as m')
    .innerJoin('joint_fit as j', 'j.id', 'm.joint_fit_id')
    .select('j.id')
    .where('m.data_set_id', '=', dataSetId)
    .execute()
  return rows.map((r) => r.id)
}

export async function updateJointFit(
  db: Db,
  id: string,
  patch: Partial<
    Pick<JointFitRecord, 'state' | 'submittedBy' | 'submittedAt' | 'approvedAt' | 'supersededAt' | 'supersededBy'>
  >,
): Promise<JointFitRecord> {
  const r = await db
    .updateTable('joint_fit')
    .set((eb) => ({
      ...(patch.state !== undefined ? { state: patch.state } : {}),
      ...(patch.submittedBy !== undefined ? { submitted_by: patch.submittedBy } : {}),
      ...(patch.submittedAt !== undefined ? { submitted_at: patch.submittedAt } : {}),
      ...(patch.approvedAt !== undefined ? { approved_at: patch.approvedAt } : {}),
      ...(patch.supersededAt !== undefined ? { superseded_at: patch.supersededAt } : {}),
      ...(patch.supersededBy !== undefined ? { superseded_by: patch.supersededBy } : {}),
      row_version: eb('row_version', '+', 1),
    }))
    .where('id', '=', id)
    .returningAll()
    .executeTakeFirstOrThrow()
  return toJointFit(r)
}

export async function deleteJointFit(db: Db, id: string): Promise<void> {
  await db.deleteFrom('joint_fit').where('id', '=', id).execute()
}

export async function insertJointFitApproval(
  db: Db,
  a: Omit<JointFitApprovalRecord, 'id' | 'signedAt' | 'signerName'>,
): Promise<string> {
  const r = await db
    .insertInto('joint_fit_approval')
    .values({
      joint_fit_id: a.jointFitId,
      signer_id: a.signerId,
      meaning: a.meaning,
      reason: a.reason,
      digest: a.digest,
      digest_algorithm: a.digestAlgorithm,
      changes: JSON.stringify(a.changes),
      self_approval: a.selfApproval,
    })
    .returning('id')
    .executeTakeFirstOrThrow()
  return r.id
}

export async function listJointFitApprovals(db: Db, jointFitId: string): Promise<JointFitApprovalRecord[]> {
  const rows = await db
    .selectFrom('joint_fit_approval as a')
    .innerJoin('app_user as u', 'u.id', 'a.signer_id')
    .selectAll('a')
    .select('u.display_name')
    .where('a.joint_fit_id', '=', jointFitId)
    .orderBy('a.signed_at')
    .orderBy('a.id')
    .execute()
  return rows.map((r) => ({
    id: r.id,
    jointFitId: r.joint_fit_id,
    signerId: r.signer_id,
    signerName: r.display_name,
    meaning: r.meaning,
    reason: r.reason,
    digest: r.digest,
    digestAlgorithm: r.digest_algorithm,
    changes: r.changes,
    selfApproval: r.self_approval,
    signedAt: r.signed_at,
  }))
}
