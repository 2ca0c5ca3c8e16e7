import type { Db } from '../db/index.js'

/** A printed report as registered when it was generated. */
export interface ReportRecord {
  id: string
  number: number
  dataSetId: string
  dataSetVersion: number
  dataSetState: string
  contentDigest: string
  approvalId: string | null
  generatedBy: string
  generatedByName: string
  generatedAt: Date
}

export async function insertReport(
  db: Db,
  r: Pick<
    ReportRecord,
    'dataSetId' | 'dataSetVersion' | 'dataSetState' | 'contentDigest' | 'approvalId' | 'generatedBy'
  >,
): Promise<string> {
  const row = await db
    .insertInto('lab_report')
    .values({
      data_set_id: r.dataSetId,
      data_set_version: r.dataSetVersion,
      data_set_state: r.dataSetState,
      content_digest: r.contentDigest,
      approval_id: r.approvalId,
      generated_by: r.generatedBy,
    })
    .returning('id')
    .executeTakeFirstOrThrow()
  return row.id
}

export async function findReport(db: Db, id: string): Promise<ReportRecord | undefined> {
  const r = await db
    .selectFrom('lab_report as r')
    .innerJoin('app_user as u', 'u.id', 'r.generated_by')
    .selectAll('r')
    .select('u.display_name')
    .where('r.id', '=', id)
    .executeTakeFirst()
  if (!r) return undefined
  return {
    id: r.id,
    number: Number(r.number),
    dataSetId: r.data_set_id,
    dataSetVersion: r.data_set_version,
    dataSetState: r.data_set_state,
    contentDigest: r.content_digest,
    approvalId: r.approval_id,
    generatedBy: r.generated_by,
    generatedByName: r.display_name,
    generatedAt: r.generated_at,
  }
}
