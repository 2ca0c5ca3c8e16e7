import type { Db } from '../db/index.js'
import type { SignatureMeaning } from '../db/lab-tables.js'

/** An electronic signature record (append-only in the database). */
export interface ApprovalRecord {
  id: string
  dataSetId: string
  signerId: string
  signerName: string
  meaning: SignatureMeaning
  reason: string
  digest: string
  selfApproval: boolean
  overrideReason: string | null
  signedAt: Date
  /** the outlier flags the signer saw (null: no recommended fit, or signed before flags were kept) */
  outliers: SignedOutliers | null
  /** how `digest` was computed ('ebullio-signed-content/1' or '/2'; services/digest.ts) */
  digestAlgorithm: string
  /** the point set signed (null for format 1) */
  pointSetDigest: string | null
  /** who changed what in the signed version (null for format 1 signatures) */
  changes: { userId: string; name: string; changes: string[] }[] | null
}

/** Points beyond ±2σ of one fit, as shown when signing. */
export interface SignedOutliers {
  fitId: string
  model: string
  pointIds: string[]
  sampleLabels: string[]
  /** how they were judged, in words */
  rule: string
}

export async function insertApproval(
  db: Db,
  a: Omit<ApprovalRecord, 'id' | 'signedAt' | 'signerName' | 'outliers' | 'changes'> & {
    outliers?: SignedOutliers | null
    changes?: ApprovalRecord['changes']
  },
): Promise<string> {
  const r = await db
    .insertInto('approval')
    .values({
      data_set_id: a.dataSetId,
      signer_id: a.signerId,
      meaning: a.meaning,
      reason: a.reason,
      digest: a.digest,
      self_approval: a.selfApproval,
      override_reason: a.overrideReason,
      outliers: a.outliers ? JSON.stringify(a.outliers) : null,
      digest_algorithm: a.digestAlgorithm,
      point_set_digest: a.pointSetDigest,
      changes: a.changes ? JSON.stringify(a.changes) : null,
    })
    .returning('id')
    .executeTakeFirstOrThrow()
  return r.id
}

export async function listApprovals(db: Db, dataSetId: string): Promise<ApprovalRecord[]> {
  const rows = await db
    .selectFrom('approval')
    .innerJoin('app_user', 'app_user.id', 'approval.signer_id')
    .selectAll('approval')
    .select('app_user.display_name')
    .where('approval.data_set_id', '=', dataSetId)
    .orderBy('approval.signed_at')
    .execute()
  return rows.map((r) => ({
    id: r.id,
    dataSetId: r.data_set_id,
    signerId: r.signer_id,
    signerName: r.display_name,
    meaning: r.meaning,
    reason: r.reason,
    digest: r.digest,
    selfApproval: r.self_approval,
    overrideReason: r.override_reason,
    signedAt: r.signed_at,
    outliers: (r.outliers as SignedOutliers | null) ?? null,
    digestAlgorithm: r.digest_algorithm,
    pointSetDigest: r.point_set_digest,
    changes: (r.changes as ApprovalRecord['changes']) ?? null,
  }))
}

/** Display names of users by id. */
export async function displayNamesOf(db: Db, ids: string[]): Promise<Map<string, string>> {
  if (!ids.length) return new Map()
  const rows = await db.selectFrom('app_user').select(['id', 'display_name']).where('id', 'in', ids).execute()
  return new Map(rows.map((r) => [r.id, r.display_name]))
}

/** Every "approved" signature (id, data set, signed digest), oldest first: what the restore drill re-verifies. */
export async function listApprovedSignatures(db: Db) {
  return db
    .selectFrom('approval')
    .select(['id', 'data_set_id', 'digest'])
    .where('meaning', '=', 'approved')
    .orderBy('id')
    .execute()
}
