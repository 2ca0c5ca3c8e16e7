import type { Db } from '../db/index.js'
import type { Calibration, GcMethod } from '../db/lab-tables.js'

export interface GcMethodRecord {
  id: string
  name: string
  detector: 'FID' | 'TCD'
  columnDescription: string | null
  conditions: string | null
  createdAt: Date
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
  id: m.id, name: m.name, detector: m.detector, columnDescription: m.column_description, conditions: m.conditions, createdAt: m.created_at,
})

export const toCalibration = (c: Calibration): CalibrationRecord => ({
  id: c.id, gcMethodId: c.gc_method_id, systemId: c.system_id, model: c.model, result: c.result, rangeMin: c.range_min,
  rangeMax: c.range_max, status: c.status, uploadId: c.upload_id, createdBy: c.created_by, createdAt: c.created_at, retiredAt: c.retired_at,
})

export async function listGcMethods(db: Db): Promise<GcMethodRecord[]> {
  return (await db.selectFrom('gc_method').selectAll().orderBy('name').execute()).map(toGcMethod)
}

export async function findGcMethod(db: Db, id: string): Promise<GcMethodRecord | undefined> {
  const r = await db.selectFrom('gc_method').selectAll().where('id', '=', id).executeTakeFirst()
  return r && toGcMethod(r)
}

export async function findGcMethodByName(db: Db, name: string): Promise<GcMethodRecord | undefined> {
  const r = await db.selectFrom('gc_method').selectAll().where('name', '=', name).executeTakeFirst()
  return r && toGcMethod(r)
}

export async function insertGcMethod(db: Db, m: Omit<GcMethodRecord, 'id' | 'createdAt'>, by: string): Promise<GcMethodRecord> {
  const r = await db.insertInto('gc_method').values({
    name: m.name, detector: m.detector, column_description: m.columnDescription, conditions: m.conditions, created_by: by,
  }).returningAll().executeTakeFirstOrThrow()
  return toGcMethod(r)
}

export async function listCalibrations(db: Db, f: { gcMethodId?: string; systemId?: string; status?: 'active' | 'retired' }): Promise<CalibrationRecord[]> {
  let q = db.selectFrom('calibration').selectAll()
  if (f.gcMethodId) q = q.where('gc_method_id', '=', f.gcMethodId)
  if (f.systemId) q = q.where('system_id', '=', f.systemId)
  if (f.status) q = q.where('status', '=', f.status)
  return (await q.orderBy('created_at', 'desc').execute()).map(toCalibration)
}

export async function findCalibration(db: Db, id: string): Promise<CalibrationRecord | undefined> {
  const r = await db.selectFrom('calibration').selectAll().where('id', '=', id).executeTakeFirst()
  return r && toCalibration(r)
}

/** The standards of a calibration with their replicate injections. */
export async function listStandards(db: Db, calibrationId: string) {
  const standards = await db.selectFrom('calibration_standard').selectAll().where('calibration_id', '=', calibrationId).orderBy('x1').execute()
  const injections = standards.length
    ? await db.selectFrom('calibration_injection').selectAll().where('standard_id', 'in', standards.map((s) => s.id)).orderBy('injection_no').execute()
    : []
  return standards.map((s) => ({
    id: s.id, label: s.label, basis: s.basis, fraction1: s.fraction1, x1: s.x1,
    injections: injections.filter((i) => i.standard_id === s.id).map((i) => ({ injection: i.injection_no, area1: i.area1, area2: i.area2, row: i.row_ref })),
  }))
}

/** Retire the active calibration of a method and system (the new one becomes the active one). */
export async function retireActive(db: Db, gcMethodId: string, systemId: string): Promise<string[]> {
  const rows = await db.updateTable('calibration').set({ status: 'retired', retired_at: new Date() })
    .where('gc_method_id', '=', gcMethodId).where('system_id', '=', systemId).where('status', '=', 'active')
    .returning('id').execute()
  return rows.map((r) => r.id)
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
  standards: { label: string; basis: 'mole' | 'mass'; fraction1: number; x1: number; injections: { injection: number; area1: number; area2: number; row: number }[] }[]
}

export async function insertCalibration(db: Db, c: NewCalibrationInput): Promise<CalibrationRecord> {
  const row = await db.insertInto('calibration').values({
    gc_method_id: c.gcMethodId, system_id: c.systemId, model: c.model, result: JSON.stringify(c.result),
    range_min: c.rangeMin, range_max: c.rangeMax, upload_id: c.uploadId, created_by: c.createdBy,
  }).returningAll().executeTakeFirstOrThrow()
  for (const s of c.standards) {
    const std = await db.insertInto('calibration_standard').values({
      calibration_id: row.id, label: s.label, basis: s.basis, fraction1: s.fraction1, x1: s.x1,
    }).returning('id').executeTakeFirstOrThrow()
    await db.insertInto('calibration_injection').values(s.injections.map((i) => ({
      standard_id: std.id, injection_no: i.injection, area1: i.area1, area2: i.area2, row_ref: i.row,
    }))).execute()
  }
  return toCalibration(row)
}
