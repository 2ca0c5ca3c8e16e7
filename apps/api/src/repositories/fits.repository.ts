import type { FitDto } from '@ebullio/schemas'
import type { Db } from '../db/index.js'
import type { ConsistencyResult, Fit } from '../db/lab-tables.js'

/** A stored model fit: parameters with standard errors, statistics and per-point residuals as thermo returned them (the shared wire type, with Date timestamps). */
export type FitRecord = FitDto<Date>

export interface ConsistencyRecord {
  id: string
  dataSetId: string
  test: 'herington-area' | 'redlich-kister-area' | 'point' | 'quality-score'
  passed: boolean
  result: Record<string, unknown>
  runBy: string
  runAt: Date
  /** SHA-256 of the point set the tests ran on (null: before it was kept) */
  pointSetDigest: string | null
  pointCount: number | null
}

export const toFit = (f: Fit): FitRecord => ({
  id: f.id,
  dataSetId: f.data_set_id,
  model: f.model,
  options: f.options,
  activity: f.activity,
  parameters: f.parameters,
  statistics: f.statistics,
  residuals: f.residuals,
  pointIds: f.point_ids,
  runBy: f.run_by,
  runAt: f.run_at,
  pointSetDigest: f.point_set_digest,
  pointCount: f.point_count,
})

const toConsistency = (c: ConsistencyResult): ConsistencyRecord => ({
  id: c.id,
  dataSetId: c.data_set_id,
  test: c.test,
  passed: c.passed,
  result: c.result,
  runBy: c.run_by,
  runAt: c.run_at,
  pointSetDigest: c.point_set_digest,
  pointCount: c.point_count,
})

export async function listFits(db: Db, dataSetId: string): Promise<FitRecord[]> {
  return (
    await db
      .selectFrom('fit')
      .selectAll()
      .where('data_set_id', '=', dataSetId)
      .orderBy('run_at')
      .orderBy('id')
      .execute()
  ).map(toFit)
}

/** The fits of several data sets in one query, in the same order as {@link listFits} within each data set. */
export async function listFitsOf(db: Db, dataSetIds: readonly string[]): Promise<FitRecord[]> {
  if (dataSetIds.length === 0) return []
  return (
    await db
      .selectFrom('fit')
      .selectAll()
      .where('data_set_id', 'in', [...dataSetIds])
      .orderBy('run_at')
      .orderBy('id')
      .execute()
  ).map(toFit)
}

export async function findFit(db: Db, id: string): Promise<FitRecord | undefined> {
  const r = await db.selectFrom('fit').selectAll().where('id', '=', id).executeTakeFirst()
  return r && toFit(r)
}

export async function insertFit(db: Db, f: Omit<FitRecord, 'id' | 'runAt'> & { runAt?: Date }): Promise<FitRecord> {
  const r = await db
    .insertInto('fit')
    .values({
      data_set_id: f.dataSetId,
      model: f.model,
      options: JSON.stringify(f.options),
      activity: JSON.stringify(f.activity),
      parameters: JSON.stringify(f.parameters),
      statistics: JSON.stringify(f.statistics),
      residuals: JSON.stringify(f.residuals),
      point_ids: f.pointIds,
      run_by: f.runBy,
      point_set_digest: f.pointSetDigest,
      point_count: f.pointCount,
      ...(f.runAt ? { run_at: f.runAt } : {}),
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  return toFit(r)
}

/** Copy fits to a new version, remapping point ids; returns old fit id → new fit id. */
export async function copyFits(
  db: Db,
  fromId: string,
  toId: string,
  pointMap: Map<string, string>,
): Promise<Map<string, string>> {
  const map = new Map<string, string>()
  for (const f of await listFits(db, fromId)) {
    // The copy keeps when it was computed and on which point set (the carried-over points have the same values).
    const remap = (p: string) => pointMap.get(p) ?? p
    const residuals = f.residuals.map((r) => (typeof r.pointId === 'string' ? { ...r, pointId: remap(r.pointId) } : r))
    const copy = await insertFit(db, { ...f, dataSetId: toId, pointIds: f.pointIds.map(remap), residuals })
    map.set(f.id, copy.id)
  }
  return map
}

export async function listConsistency(db: Db, dataSetId: string): Promise<ConsistencyRecord[]> {
  return (
    await db
      .selectFrom('consistency_result')
      .selectAll()
      .where('data_set_id', '=', dataSetId)
      .orderBy('run_at')
      .execute()
  ).map(toConsistency)
}

export async function insertConsistency(
  db: Db,
  c: Omit<ConsistencyRecord, 'id' | 'runAt'>,
): Promise<ConsistencyRecord> {
  const r = await db
    .insertInto('consistency_result')
    .values({
      data_set_id: c.dataSetId,
      test: c.test,
      passed: c.passed,
      result: JSON.stringify(c.result),
      run_by: c.runBy,
      point_set_digest: c.pointSetDigest,
      point_count: c.pointCount,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  return toConsistency(r)
}

/** Delete one fit (a draft's; the database refuses it for approved versions). */
export async function deleteFit(db: Db, id: string): Promise<void> {
  await db.deleteFrom('fit').where('id', '=', id).execute()
}
