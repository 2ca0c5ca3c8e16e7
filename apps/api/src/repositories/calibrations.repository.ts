import type { CalibrationSummaryDto } from '@ebullio/schemas'
import { sql } from 'kysely'
import type { Db } from '../db/index.js'
import type { Calibration, GcMethod } from '../db/lab-tables.js'

export interface GcMethodRecord {
  id: string
  name: string
  detector: 'FID' | 'TCD'
  columnDescription: string | null
  conditions: string | null
  createdAt: Date
  /** A retired method keeps its history; none of its calibrations can be active. */
  status: 'active' | 'retired'
  retiredAt: Date | null
}

export interface CalibrationRecord {
  id: string
  gcMethodId: string
  systemId: string
  model: 'response-factor' | 'linear' | 'quadratic'
  /** thermo's fitted Calibration, as computed */
  result: Record<string, unknown>
  rangeMin: number
  rangeMax: number
  status: 'active' | 'retired'
  uploadId: string
  createdBy: string
  createdAt: Date
  retiredAt: Date | null
}

export const toGcMethod = (m: GcMethod): GcMethodRecord => ({
  id: m.id,
  name: m.name,
  detector: m.detector,
  columnDescription: m.column_description,
  conditions: m.conditions,
  createdAt: m.created_at,
  status: m.status,
  retiredAt: m.retired_at,
})

export const toCalibration = (c: Calibration): CalibrationRecord => ({
  id: c.id,
  gcMethodId: c.gc_method_id,
  systemId: c.system_id,
  model: c.model,
  result: c.result,
  rangeMin: c.range_min,
  rangeMax: c.range_max,
  status: c.status,
  uploadId: c.upload_id,
  createdBy: c.created_by,
  createdAt: c.created_at,
  retiredAt: c.retired_at,
})

const GC_METHOD_SORT = { name: 'name', detector: 'detector', created_at: 'created_at' } as const

export async function listGcMethods(db: Db): Promise<GcMethodRecord[]> {
  return (await db.selectFrom('gc_method').selectAll().orderBy('name').execute()).map(toGcMethod)
}

/** One page of GC methods; `q` matches the name, column description or conditions. */
export async function listGcMethodsPage(
  db: Db,
  f: {
    q?: string
    detector?: 'FID' | 'TCD'
    status?: 'active' | 'retired'
    sort: keyof typeof GC_METHOD_SORT
    order: 'asc' | 'desc'
    limit: number
    offset: number
  },
): Promise<{ items: GcMethodRecord[]; total: number }> {
  let q = db.selectFrom('gc_method')
  if (f.detector) q = q.where('detector', '=', f.detector)
  if (f.status) q = q.where('status', '=', f.status)
  if (f.q) {
    const like = `%${f.q}%`
    q = q.where((eb) =>
      eb.or([eb('name', 'ilike', like), eb('column_description', 'ilike', like), eb('conditions', 'ilike', like)]),
    )
  }
  const total = await q.select(sql<string>`count(*)`.as('n')).executeTakeFirstOrThrow()
  const rows = await q
    .selectAll()
    .orderBy(GC_METHOD_SORT[f.sort], f.order)
    .orderBy('name')
    .orderBy('id')
    .limit(f.limit)
    .offset(f.offset)
    .execute()
  return { items: rows.map(toGcMethod), total: Number(total.n) }
}

export async function findGcMethod(db: Db, id: string): Promise<GcMethodRecord | undefined> {
  const r = await db.selectFrom('gc_method').selectAll().where('id', '=', id).executeTakeFirst()
  return r && toGcMethod(r)
}

export async function findGcMethodByName(db: Db, name: string): Promise<GcMethodRecord | undefined> {
  const r = await db.selectFrom('gc_method').selectAll().where('name', '=', name).executeTakeFirst()
  return r && toGcMethod(r)
}

export async function insertGcMethod(
  db: Db,
  m: Omit<GcMethodRecord, 'id' | 'createdAt' | 'status' | 'retiredAt'>,
  by: string,
): Promise<GcMethodRecord> {
  const r = await db
    .insertInto('gc_method')
    .values({
      name: m.name,
      detector: m.detector,
      column_description: m.columnDescription,
      conditions: m.conditions,
      created_by: by,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  return toGcMethod(r)
}

export interface CalibrationQuery {
  gcMethodId?: string
  systemId?: string
  status?: 'active' | 'retired'
  model?: CalibrationRecord['model']
  /** matches the GC method's name or either component's name */
  q?: string
  createdAfter?: Date
  createdBefore?: Date
  sort: 'created_at' | 'status' | 'model' | 'gc_method' | 'system'
  order: 'asc' | 'desc'
  limit: number
  offset: number
}

const CALIBRATION_SORT = {
  created_at: 'k.created_at',
  status: 'k.status',
  model: 'k.model',
  gc_method: 'g.name',
  system: 'c1.name',
} as const

export async function listCalibrations(
  db: Db,
  f: { gcMethodId?: string; systemId?: string; status?: 'active' | 'retired' },
): Promise<CalibrationRecord[]> {
  let q = db.selectFrom('calibration').selectAll()
  if (f.gcMethodId) q = q.where('gc_method_id', '=', f.gcMethodId)
  if (f.systemId) q = q.where('system_id', '=', f.systemId)
  if (f.status) q = q.where('status', '=', f.status)
  return (await q.orderBy('created_at', 'desc').execute()).map(toCalibration)
}

/** One page of calibrations, each with its GC method's and system's names. */
export async function listCalibrationsPage(
  db: Db,
  f: CalibrationQuery,
): Promise<{ items: (CalibrationRecord & { gcMethodName: string; systemName: string })[]; total: number }> {
  let q = db
    .selectFrom('calibration as k')
    .innerJoin('gc_method as g', 'g.id', 'k.gc_method_id')
    .innerJoin('binary_system as s', 's.id', 'k.system_id')
    .innerJoin('component as c1', 'c1.id', 's.component1_id')
    .innerJoin('component as c2', 'c2.id', 's.component2_id')
  if (f.gcMethodId) q = q.where('k.gc_method_id', '=', f.gcMethodId)
  if (f.systemId) q = q.where('k.system_id', '=', f.systemId)
  if (f.status) q = q.where('k.status', '=', f.status)
  if (f.model) q = q.where('k.model', '=', f.model)
  if (f.createdAfter) q = q.where('k.created_at', '>=', f.createdAfter)
  if (f.createdBefore) q = q.where('k.created_at', '<', f.createdBefore)
  if (f.q) {
    const like = `%${f.q}%`
    q = q.where((eb) =>
      eb.or([eb('g.name', 'ilike', like), eb('c1.name', 'ilike', like), eb('c2.name', 'ilike', like)]),
    )
  }
  const total = await q.select(sql<string>`count(*)`.as('n')).executeTakeFirstOrThrow()
  const rows = await q
    .selectAll('k')
    .select(['g.name as gc_method_name', sql<string>`c1.name || ' / ' || c2.name`.as('system_name')])
    .orderBy(CALIBRATION_SORT[f.sort], f.order)
    .orderBy('k.created_at', 'desc')
    .orderBy('k.id')
    .limit(f.limit)
    .offset(f.offset)
    .execute()
  return {
    items: rows.map((r) => ({ ...toCalibration(r), gcMethodName: r.gc_method_name, systemName: r.system_name })),
    total: Number(total.n),
  }
}

export async function findCalibration(db: Db, id: string): Promise<CalibrationRecord | undefined> {
  const r = await db.selectFrom('calibration').selectAll().where('id', '=', id).executeTakeFirst()
  return r && toCalibration(r)
}

/** The standards of a calibration with their replicate injections. */
export async function listStandards(db: Db, calibrationId: string) {
  const standards = await db
    .selectFrom('calibration_standard')
    .selectAll()
    .where('calibration_id', '=', calibrationId)
    .orderBy('x1')
    .execute()
  const injections = standards.length
    ? await db
        .selectFrom('calibration_injection')
        .selectAll()
        .where(
          'standard_id',
          'in',
          standards.map((s) => s.id),
        )
        .orderBy('injection_no')
        .execute()
    : []
  return standards.map((s) => ({
    id: s.id,
    label: s.label,
    basis: s.basis,
    fraction1: s.fraction1,
    x1: s.x1,
    injections: injections
      .filter((i) => i.standard_id === s.id)
      .map((i) => ({ injection: i.injection_no, area1: i.area1, area2: i.area2, row: i.row_ref })),
  }))
}

/** Retire the active calibration of a method and system (the new one becomes the active one). */
export async function retireActive(db: Db, gcMethodId: string, systemId: string): Promise<string[]> {
  const rows = await db
    .updateTable('calibration')
    .set({ status: 'retired', retired_at: new Date() })
    .where('gc_method_id', '=', gcMethodId)
    .where('system_id', '=', systemId)
    .where('status', '=', 'active')
    .returning('id')
    .execute()
  return rows.map((r) => r.id)
}

/** Retire every active calibration of a method (before the method itself: the database insists). */
export async function retireMethodCalibrations(db: Db, gcMethodId: string): Promise<string[]> {
  const rows = await db
    .updateTable('calibration')
    .set({ status: 'retired', retired_at: new Date() })
    .where('gc_method_id', '=', gcMethodId)
    .where('status', '=', 'active')
    .returning('id')
    .execute()
  return rows.map((r) => r.id)
}

export async function retireGcMethod(db: Db, id: string, by: string): Promise<GcMethodRecord> {
  const r = await db
    .updateTable('gc_method')
    .set({ status: 'retired', retired_at: new Date(), retired_by: by })
    .where('id', '=', id)
    .returningAll()
    .executeTakeFirstOrThrow()
  return toGcMethod(r)
}

export async function retireCalibration(db: Db, id: string): Promise<void> {
  await db.updateTable('calibration').set({ status: 'retired', retired_at: new Date() }).where('id', '=', id).execute()
}

export interface NewCalibrationInput {
  gcMethodId: string
  systemId: string
  model: CalibrationRecord['model']
  result: unknown
  rangeMin: number
  rangeMax: number
  uploadId: string
  createdBy: string
  standards: {
    label: string
    basis: 'mole' | 'mass'
    fraction1: number
    x1: number
    injections: { injection: number; area1: number; area2: number; row: number }[]
  }[]
}

export async function insertCalibration(db: Db, c: NewCalibrationInput): Promise<CalibrationRecord> {
  const row = await db
    .insertInto('calibration')
    .values({
      gc_method_id: c.gcMethodId,
      system_id: c.systemId,
      model: c.model,
      result: JSON.stringify(c.result),
      range_min: c.rangeMin,
      range_max: c.rangeMax,
      upload_id: c.uploadId,
      created_by: c.createdBy,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  for (const s of c.standards) {
    const std = await db
      .insertInto('calibration_standard')
      .values({
        calibration_id: row.id,
        label: s.label,
        basis: s.basis,
        fraction1: s.fraction1,
        x1: s.x1,
      })
      .returning('id')
      .executeTakeFirstOrThrow()
    await db
      .insertInto('calibration_injection')
      .values(
        s.injections.map((i) => ({
          standard_id: std.id,
          injection_no: i.injection,
          area1: i.area1,
          area2: i.area2,
          row_ref: i.row,
        })),
      )
      .execute()
  }
  return toCalibration(row)
}

/** What a person needs to recognise a calibration (the shared wire type, with Date timestamps). */
export type CalibrationSummary = CalibrationSummaryDto<Date>

/** Summaries of the given calibrations (any order in, creation order out). */
export async function summarizeCalibrations(db: Db, ids: string[]): Promise<CalibrationSummary[]> {
  if (ids.length === 0) return []
  const rows = await db
    .selectFrom('calibration as k')
    .innerJoin('gc_method as g', 'g.id', 'k.gc_method_id')
    .innerJoin('upload as u', 'u.id', 'k.upload_id')
    .select([
      'k.id',
      'k.gc_method_id',
      'g.name as gc_method_name',
      'k.model',
      'k.status',
      'k.result',
      'k.range_min',
      'k.range_max',
      'k.created_at',
      'k.retired_at',
      'k.upload_id',
      'u.original_name',
      'u.sha256',
    ])
    .select((eb) =>
      eb
        .selectFrom('point as p')
        .innerJoin('data_set as d', 'd.id', 'p.data_set_id')
        .select(sql<string>`count(distinct d.lineage_id)`.as('n'))
        .whereRef('p.calibration_id', '=', 'k.id')
        .as('data_set_count'),
    )
    .where('k.id', 'in', ids)
    .orderBy('k.created_at')
    .execute()
  return rows.map((r) => {
    const result = r.result as { coefficients?: number[]; coefficientNames?: string[]; standardErrors?: number[] }
    return {
      id: r.id,
      gcMethodId: r.gc_method_id,
      gcMethodName: r.gc_method_name,
      model: r.model,
      status: r.status,
      coefficientNames: result.coefficientNames ?? [],
      coefficients: result.coefficients ?? [],
      standardErrors: result.standardErrors ?? [],
      rangeMin: r.range_min,
      rangeMax: r.range_max,
      createdAt: r.created_at,
      retiredAt: r.retired_at,
      uploadId: r.upload_id,
      originalName: r.original_name,
      sha256: r.sha256,
      dataSetCount: Number(r.data_set_count ?? 0),
    }
  })
}

/** The active calibration of a GC method for a system, if any (at most one: a unique index says so). */
export async function findActiveCalibration(
  db: Db,
  gcMethodId: string,
  systemId: string,
): Promise<CalibrationRecord | undefined> {
  const r = await db
    .selectFrom('calibration')
    .selectAll()
    .where('gc_method_id', '=', gcMethodId)
    .where('system_id', '=', systemId)
    .where('status', '=', 'active')
    .executeTakeFirst()
  return r && toCalibration(r)
}

/** The calibrations behind a data set's points, in the order they were made. */
export async function calibrationsOfDataSet(db: Db, dataSetId: string): Promise<CalibrationSummary[]> {
  const ids = await db
    .selectFrom('point')
    .select('calibration_id')
    .distinct()
    .where('data_set_id', '=', dataSetId)
    .where('calibration_id', 'is not', null)
    .execute()
  return summarizeCalibrations(
    db,
    ids.map((r) => r.calibration_id!),
  )
}

/** A GC method's status, its row locked for the rest of the transaction (undefined: no such method). */
export async function lockGcMethod(db: Db, id: string) {
  return db.selectFrom('gc_method').select(['id', 'status']).where('id', '=', id).forUpdate().executeTakeFirst()
}
