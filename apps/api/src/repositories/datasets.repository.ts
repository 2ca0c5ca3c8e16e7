import type { DataSetDto } from '@ebullio/schemas'
import type { ActivityModel } from '@ebullio/thermo'
import { sql } from 'kysely'
import type { Db } from '../db/index.js'
import type { DataSet, DataSetState } from '../db/lab-tables.js'

/** A data set version as the API shows it (the shared wire type, with Date timestamps). Pressure in Pa. */
export type DataSetRecord = DataSetDto<Date>

export const toDataSet = (d: DataSet): DataSetRecord => ({
  id: d.id,
  lineageId: d.lineage_id,
  version: d.version,
  previousVersionId: d.previous_version_id,
  systemId: d.system_id,
  title: d.title,
  state: d.state,
  nominalPressurePa: d.nominal_pressure_pa,
  apparatusNotes: d.apparatus_notes,
  projectRef: d.project_ref,
  recommendedFitId: d.recommended_fit_id,
  createdBy: d.created_by,
  createdAt: d.created_at,
  updatedAt: d.updated_at,
  submittedAt: d.submitted_at,
  approvedAt: d.approved_at,
  supersededAt: d.superseded_at,
  rowVersion: d.row_version,
  origin: d.origin,
  originMethod: d.origin_method,
  citation: d.citation,
  countsAsOwn: d.counts_as_own,
  countsAsOwnBy: d.counts_as_own_by,
  countsAsOwnReason: d.counts_as_own_reason,
  layout: d.layout,
  nominalTemperatureK: d.nominal_temperature_k,
  vaporModel: d.vapor_model,
})

export interface DataSetQuery {
  states?: DataSetState[]
  systemId?: string
  origin?: 'gc' | 'other-method' | 'literature'
  createdBy?: string
  q?: string
  pressureMinPa?: number
  pressureMaxPa?: number
  /** created at or after (inclusive) / before (exclusive) */
  createdAfter?: Date
  createdBefore?: Date
  /** last changed at or after (inclusive) / before (exclusive) */
  updatedAfter?: Date
  updatedBefore?: Date
  sort: 'created_at' | 'updated_at' | 'nominal_pressure_pa' | 'state' | 'title' | 'submitted_at'
  order: 'asc' | 'desc'
  limit: number
  offset: number
}

export interface DataSetListItem extends DataSetRecord {
  systemName: string
  authorName: string
  pointCount: number
  openComments: number
}

/** One page of data sets with their system name, author, point count and unresolved comments. */
export async function listDataSets(db: Db, o: DataSetQuery): Promise<{ items: DataSetListItem[]; total: number }> {
  let q = db
    .selectFrom('data_set as d')
    .innerJoin('binary_system as s', 's.id', 'd.system_id')
    .innerJoin('component as c1', 'c1.id', 's.component1_id')
    .innerJoin('component as c2', 'c2.id', 's.component2_id')
    .innerJoin('app_user as u', 'u.id', 'd.created_by')
  if (o.states?.length) q = q.where('d.state', 'in', o.states)
  if (o.systemId) q = q.where('d.system_id', '=', o.systemId)
  if (o.origin) q = q.where('d.origin', '=', o.origin)
  if (o.createdBy) q = q.where('d.created_by', '=', o.createdBy)
  if (o.pressureMinPa !== undefined) q = q.where('d.nominal_pressure_pa', '>=', o.pressureMinPa)
  if (o.pressureMaxPa !== undefined) q = q.where('d.nominal_pressure_pa', '<=', o.pressureMaxPa)
  if (o.createdAfter) q = q.where('d.created_at', '>=', o.createdAfter)
  if (o.createdBefore) q = q.where('d.created_at', '<', o.createdBefore)
  if (o.updatedAfter) q = q.where('d.updated_at', '>=', o.updatedAfter)
  if (o.updatedBefore) q = q.where('d.updated_at', '<', o.updatedBefore)
  if (o.q) {
    const like = `%${o.q}%`
    q = q.where((eb) =>
      eb.or([
        eb('d.title', 'ilike', like),
        eb('d.project_ref', 'ilike', like),
        eb('c1.name', 'ilike', like),
        eb('c2.name', 'ilike', like),
      ]),
    )
  }
  const total = await q.select(sql<string>`count(*)`.as('n')).executeTakeFirstOrThrow()
  const rows = await q
    .selectAll('d')
    .select([
      sql<string>`c1.name || ' / ' || c2.name`.as('system_name'),
      'u.display_name as author_name',
      (eb) =>
        eb
          .selectFrom('point')
          .select(sql<number>`count(*)::int`.as('n'))
          .whereRef('point.data_set_id', '=', 'd.id')
          .as('point_count'),
      (eb) =>
        eb
          .selectFrom('comment')
          .select(sql<number>`count(*)::int`.as('n'))
          .whereRef('comment.data_set_id', '=', 'd.id')
          .where('comment.resolved', '=', false)
          .where('comment.parent_id', 'is', null)
          .as('open_comments'),
    ])
    .orderBy(`d.${o.sort}`, o.order)
    .orderBy('d.id')
    .limit(o.limit)
    .offset(o.offset)
    .execute()
  return {
    items: rows.map((r) => ({
      ...toDataSet(r),
      systemName: r.system_name,
      authorName: r.author_name,
      pointCount: r.point_count ?? 0,
      openComments: r.open_comments ?? 0,
    })),
    total: Number(total.n),
  }
}

export async function findDataSet(db: Db, id: string): Promise<DataSetRecord | undefined> {
  const r = await db.selectFrom('data_set').selectAll().where('id', '=', id).executeTakeFirst()
  return r && toDataSet(r)
}

/** Lock the row for the rest of the transaction, so two state changes cannot interleave. */
export async function lockDataSet(db: Db, id: string): Promise<DataSetRecord | undefined> {
  const r = await db.selectFrom('data_set').selectAll().where('id', '=', id).forUpdate().executeTakeFirst()
  return r && toDataSet(r)
}

export async function listVersions(db: Db, lineageId: string): Promise<DataSetRecord[]> {
  return (
    await db.selectFrom('data_set').selectAll().where('lineage_id', '=', lineageId).orderBy('version').execute()
  ).map(toDataSet)
}

export async function insertDataSet(
  db: Db,
  d: {
    id?: string
    lineageId?: string
    version?: number
    previousVersionId?: string | null
    systemId: string
    title: string
    nominalPressurePa: number | null
    nominalTemperatureK?: number | null
    vaporModel?: DataSetRecord['vaporModel']
    apparatusNotes: string | null
    projectRef: string | null
    createdBy: string
    origin?: DataSetRecord['origin']
    originMethod?: string | null
    citation?: DataSetRecord['citation']
    layout?: DataSetRecord['layout']
    countsAsOwn?: boolean
    countsAsOwnBy?: string | null
    countsAsOwnReason?: string | null
  },
): Promise<DataSetRecord> {
  const id = d.id ?? crypto.randomUUID()
  const r = await db
    .insertInto('data_set')
    .values({
      id,
      lineage_id: d.lineageId ?? id,
      version: d.version ?? 1,
      previous_version_id: d.previousVersionId ?? null,
      system_id: d.systemId,
      title: d.title,
      nominal_pressure_pa: d.nominalPressurePa,
      apparatus_notes: d.apparatusNotes,
      project_ref: d.projectRef,
      created_by: d.createdBy,
      origin: d.origin ?? 'gc',
      origin_method: d.originMethod ?? null,
      citation: d.citation ? JSON.stringify(d.citation) : null,
      layout: d.layout ?? 'txy',
      nominal_temperature_k: d.nominalTemperatureK ?? null,
      vapor_model: JSON.stringify(d.vaporModel ?? { kind: 'ideal' }),
      counts_as_own: d.countsAsOwn ?? false,
      counts_as_own_by: d.countsAsOwnBy ?? null,
      counts_as_own_reason: d.countsAsOwnReason ?? null,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  return toDataSet(r)
}

export type DataSetPatch = Partial<
  Pick<
    DataSetRecord,
    | 'title'
    | 'nominalPressurePa'
    | 'apparatusNotes'
    | 'projectRef'
    | 'state'
    | 'recommendedFitId'
    | 'submittedAt'
    | 'approvedAt'
    | 'supersededAt'
    | 'systemId'
    | 'origin'
    | 'originMethod'
    | 'citation'
    | 'countsAsOwn'
    | 'countsAsOwnBy'
    | 'countsAsOwnReason'
    | 'nominalTemperatureK'
    | 'vaporModel'
    | 'layout'
  >
>

/**
 * Apply a change and bump the row version. With `expectedRowVersion` the write happens only if nobody
 * changed the row since the caller read it; undefined means the write was stale.
 */
export async function updateDataSet(
  db: Db,
  id: string,
  patch: DataSetPatch,
  expectedRowVersion?: number,
): Promise<DataSetRecord | undefined> {
  let q = db
    .updateTable('data_set')
    .set({
      ...(patch.title !== undefined && { title: patch.title }),
      ...(patch.nominalPressurePa !== undefined && { nominal_pressure_pa: patch.nominalPressurePa }),
      ...(patch.nominalTemperatureK !== undefined && { nominal_temperature_k: patch.nominalTemperatureK }),
      ...(patch.vaporModel !== undefined && { vapor_model: JSON.stringify(patch.vaporModel) }),
      ...(patch.layout !== undefined && { layout: patch.layout }),
      ...(patch.apparatusNotes !== undefined && { apparatus_notes: patch.apparatusNotes }),
      ...(patch.projectRef !== undefined && { project_ref: patch.projectRef }),
      ...(patch.state !== undefined && { state: patch.state }),
      ...(patch.recommendedFitId !== undefined && { recommended_fit_id: patch.recommendedFitId }),
      ...(patch.submittedAt !== undefined && { submitted_at: patch.submittedAt }),
      ...(patch.approvedAt !== undefined && { approved_at: patch.approvedAt }),
      ...(patch.supersededAt !== undefined && { superseded_at: patch.supersededAt }),
      ...(patch.systemId !== undefined && { system_id: patch.systemId }),
      ...(patch.origin !== undefined && { origin: patch.origin }),
      ...(patch.originMethod !== undefined && { origin_method: patch.originMethod }),
      ...(patch.citation !== undefined && { citation: patch.citation ? JSON.stringify(patch.citation) : null }),
      ...(patch.countsAsOwn !== undefined && { counts_as_own: patch.countsAsOwn }),
      ...(patch.countsAsOwnBy !== undefined && { counts_as_own_by: patch.countsAsOwnBy }),
      ...(patch.countsAsOwnReason !== undefined && { counts_as_own_reason: patch.countsAsOwnReason }),
      updated_at: sql`now()`,
      row_version: sql`row_version + 1`,
    })
    .where('id', '=', id)
  if (expectedRowVersion !== undefined) q = q.where('row_version', '=', expectedRowVersion)
  const r = await q.returningAll().executeTakeFirst()
  return r && toDataSet(r)
}

export async function deleteDataSet(db: Db, id: string): Promise<void> {
  await db.deleteFrom('data_set').where('id', '=', id).execute()
}

/**
 * The approved and superseded versions of these systems, newest version first, each with its recommended fit
 * (id, model, parameters, activity model and statistics; null when none): the catalogue's rows.
 */
export async function listSignedVersionsOfSystems(db: Db, systemIds: string[]) {
  if (systemIds.length === 0) return []
  // newest first; two lineages at the same version number by when they were signed (the newest first), so the
  // version an engineer's page opens at does not depend on the order PostgreSQL happens to return them in
  return db
    .selectFrom('data_set as d')
    .leftJoin('fit as f', 'f.id', 'd.recommended_fit_id')
    .select([
      'd.id',
      'd.system_id',
      'd.version',
      'd.state',
      'd.title',
      'd.nominal_pressure_pa',
      'd.nominal_temperature_k',
      'd.approved_at',
      'f.id as fit_id',
      'f.model',
      'f.parameters',
      sql<ActivityModel | null>`f.activity`.as('activity'),
      sql<unknown>`f.statistics`.as('statistics'),
    ])
    .where('d.state', 'in', ['approved', 'superseded'])
    .where('d.system_id', 'in', systemIds)
    .orderBy('d.version', 'desc')
    .orderBy('d.approved_at', (ob) => ob.desc().nullsLast())
    .orderBy('d.id')
    .execute()
}
