import type { PointDto } from '@ebullio/schemas'
import { sql } from 'kysely'
import type { Db } from '../db/index.js'
import type { Point } from '../db/lab-tables.js'

/** One equilibrium state (the shared wire type). T in K, P in Pa; x1, y1 mole fractions with standard uncertainties (k = 1). */
export type PointRecord = PointDto

export interface InjectionRecord {
  phase: 'liquid' | 'vapour' | 'upper' | 'lower'
  injection: number
  area1: number
  area2: number
  row: number
}

export const toPoint = (p: Point): PointRecord => ({
  id: p.id,
  dataSetId: p.data_set_id,
  seq: p.seq,
  sampleLabel: p.sample_label,
  temperatureK: p.temperature_k,
  pressurePa: p.pressure_pa,
  x1: p.x1,
  x1Uncertainty: p.x1_uncertainty,
  y1: p.y1,
  y1Uncertainty: p.y1_uncertainty,
  pressureUncertaintyPa: p.pressure_uncertainty_pa,
  excluded: p.excluded,
  exclusionReason: p.exclusion_reason,
  uploadId: p.upload_id,
  calibrationId: p.calibration_id,
  rowRefs: p.row_refs,
  heterogeneous: p.heterogeneous,
  liquidPhases:
    p.x1_phase_i !== null && p.x1_phase_ii !== null
      ? [
          { x1: p.x1_phase_i, uncertainty: p.x1_phase_i_uncertainty ?? 0 },
          { x1: p.x1_phase_ii, uncertainty: p.x1_phase_ii_uncertainty ?? 0 },
        ]
      : null,
})

export async function listPoints(db: Db, dataSetId: string): Promise<PointRecord[]> {
  return (await db.selectFrom('point').selectAll().where('data_set_id', '=', dataSetId).orderBy('seq').execute()).map(
    toPoint,
  )
}

export async function findPoint(db: Db, id: string): Promise<PointRecord | undefined> {
  const r = await db.selectFrom('point').selectAll().where('id', '=', id).executeTakeFirst()
  return r && toPoint(r)
}

export async function listInjections(db: Db, pointId: string): Promise<InjectionRecord[]> {
  const rows = await db
    .selectFrom('point_injection')
    .selectAll()
    .where('point_id', '=', pointId)
    .orderBy('phase')
    .orderBy('injection_no')
    .execute()
  return rows.map((r) => ({
    phase: r.phase,
    injection: r.injection_no,
    area1: r.area1,
    area2: r.area2,
    row: r.row_ref,
  }))
}

export async function nextSeq(db: Db, dataSetId: string): Promise<number> {
  const r = await db
    .selectFrom('point')
    .select(sql<number>`coalesce(max(seq), 0)::int`.as('m'))
    .where('data_set_id', '=', dataSetId)
    .executeTakeFirstOrThrow()
  return r.m + 1
}

export type NewPointInput = Omit<PointRecord, 'id' | 'dataSetId' | 'seq' | 'excluded' | 'exclusionReason'> & {
  seq?: number
  excluded?: boolean
  exclusionReason?: string | null
  injections: InjectionRecord[]
}

const CHUNK = 1000

/** Insert points and their injections in bulk (chunked to stay under PostgreSQL's parameter limit). */
export async function insertPoints(
  db: Db,
  dataSetId: string,
  firstSeq: number,
  points: NewPointInput[],
): Promise<string[]> {
  const ids: string[] = []
  for (let i = 0; i < points.length; i += CHUNK) {
    const chunk = points.slice(i, i + CHUNK)
    const rows = await db
      .insertInto('point')
      .values(
        chunk.map((p, j) => ({
          data_set_id: dataSetId,
          seq: p.seq ?? firstSeq + i + j,
          sample_label: p.sampleLabel,
          temperature_k: p.temperatureK,
          pressure_pa: p.pressurePa,
          x1: p.x1,
          x1_uncertainty: p.x1Uncertainty,
          y1: p.y1,
          y1_uncertainty: p.y1Uncertainty,
          pressure_uncertainty_pa: p.pressureUncertaintyPa ?? null,
          excluded: p.excluded ?? false,
          exclusion_reason: p.exclusionReason ?? null,
          upload_id: p.uploadId,
          calibration_id: p.calibrationId,
          row_refs: p.rowRefs,
          heterogeneous: p.heterogeneous ?? false,
          x1_phase_i: p.liquidPhases?.[0].x1 ?? null,
          x1_phase_i_uncertainty: p.liquidPhases?.[0].uncertainty ?? null,
          x1_phase_ii: p.liquidPhases?.[1].x1 ?? null,
          x1_phase_ii_uncertainty: p.liquidPhases?.[1].uncertainty ?? null,
        })),
      )
      .returning('id')
      .execute()
    ids.push(...rows.map((r) => r.id))
  }
  const injections = points.flatMap((p, k) =>
    p.injections.map((inj) => ({
      point_id: ids[k],
      phase: inj.phase,
      injection_no: inj.injection,
      area1: inj.area1,
      area2: inj.area2,
      row_ref: inj.row,
    })),
  )
  for (let i = 0; i < injections.length; i += CHUNK) {
    await db
      .insertInto('point_injection')
      .values(injections.slice(i, i + CHUNK))
      .execute()
  }
  return ids
}

/** Copy every point and injection of one version into another (for "revise"); returns old id → new id. */
export async function copyPoints(db: Db, fromId: string, toId: string): Promise<Map<string, string>> {
  const points = await listPoints(db, fromId)
  const injections = points.length
    ? await db
        .selectFrom('point_injection')
        .selectAll()
        .where(
          'point_id',
          'in',
          points.map((p) => p.id),
        )
        .execute()
    : []
  const ids = await insertPoints(
    db,
    toId,
    1,
    points.map((p) => ({
      ...p,
      injections: injections
        .filter((i) => i.point_id === p.id)
        .map((i) => ({ phase: i.phase, injection: i.injection_no, area1: i.area1, area2: i.area2, row: i.row_ref })),
    })),
  )
  const map = new Map<string, string>()
  points.forEach((p, i) => map.set(p.id, ids[i]))
  return map
}

export async function setExclusion(db: Db, id: string, excluded: boolean, reason: string | null): Promise<PointRecord> {
  const r = await db
    .updateTable('point')
    .set({ excluded, exclusion_reason: excluded ? reason : null })
    .where('id', '=', id)
    .returningAll()
    .executeTakeFirstOrThrow()
  return toPoint(r)
}

export async function countPoints(db: Db, dataSetId: string): Promise<{ total: number; included: number }> {
  const r = await db
    .selectFrom('point')
    .select([
      sql<number>`count(*)::int`.as('total'),
      sql<number>`count(*) filter (where not excluded)::int`.as('included'),
    ])
    .where('data_set_id', '=', dataSetId)
    .executeTakeFirstOrThrow()
  return r
}
