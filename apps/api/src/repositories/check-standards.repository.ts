import type { Db } from '../db/index.js'

/** One GC check standard as stored: known and measured x1 of component 1 (mole fractions). */
export interface CheckStandardRecord {
  id: string
  gcMethodId: string
  calibrationId: string
  uploadId: string
  dataSetId: string | null
  label: string
  knownX1: number
  measuredX1: number
  x1Uncertainty: number
  replicateRsd: number | null
  injections: { injection: number; area1: number; area2: number; row: number }[]
  rowRefs: number[]
  measuredAt: Date
  recordedBy: string | null
}

export type NewCheckStandard = Omit<CheckStandardRecord, 'id' | 'measuredAt'>

export async function insertCheckStandards(db: Db, rows: NewCheckStandard[]): Promise<string[]> {
  if (rows.length === 0) return []
  const r = await db
    .insertInto('check_standard_result')
    .values(
      rows.map((c) => ({
        gc_method_id: c.gcMethodId,
        calibration_id: c.calibrationId,
        upload_id: c.uploadId,
        data_set_id: c.dataSetId,
        label: c.label,
        known_x1: c.knownX1,
        measured_x1: c.measuredX1,
        x1_uncertainty: c.x1Uncertainty,
        replicate_rsd: c.replicateRsd,
        injections: JSON.stringify(c.injections),
        row_refs: c.rowRefs,
        recorded_by: c.recordedBy,
      })),
    )
    .returning('id')
    .execute()
  return r.map((x) => x.id)
}

/** A GC method's check standards in time order (then by file line). */
export async function listCheckStandards(db: Db, gcMethodId: string): Promise<CheckStandardRecord[]> {
  const rows = await db
    .selectFrom('check_standard_result')
    .selectAll()
    .where('gc_method_id', '=', gcMethodId)
    .orderBy('measured_at')
    .orderBy('row_refs')
    .execute()
  return rows.map((r) => ({
    id: r.id,
    gcMethodId: r.gc_method_id,
    calibrationId: r.calibration_id,
    uploadId: r.upload_id,
    dataSetId: r.data_set_id,
    label: r.label,
    knownX1: r.known_x1,
    measuredX1: r.measured_x1,
    x1Uncertainty: r.x1_uncertainty,
    replicateRsd: r.replicate_rsd,
    injections: r.injections,
    rowRefs: r.row_refs,
    measuredAt: r.measured_at,
    recordedBy: r.recorded_by,
  }))
}
