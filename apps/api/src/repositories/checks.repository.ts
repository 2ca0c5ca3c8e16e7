import type { Db } from '../db/index.js'
import type { CheckMeasurement } from '../db/lab-tables.js'

/** A thermometer or barometer check as stored: T in K, P in Pa. */
export interface CheckRecord {
  id: string
  kind: 'thermometer' | 'barometer'
  instrument: string
  componentId: string
  componentName: string
  temperatureK: number
  pressurePa: number
  measuredAt: Date
  note: string | null
  measuredBy: string | null
  createdAt: Date
}

const toCheck = (r: CheckMeasurement & { component_name: string }): CheckRecord => ({
  id: r.id,
  kind: r.kind,
  instrument: r.instrument,
  componentId: r.component_id,
  componentName: r.component_name,
  temperatureK: r.temperature_k,
  pressurePa: r.pressure_pa,
  measuredAt: r.measured_at,
  note: r.note,
  measuredBy: r.measured_by,
  createdAt: r.created_at,
})

export async function insertCheck(db: Db, c: Omit<CheckRecord, 'id' | 'componentName' | 'createdAt'>): Promise<string> {
  const r = await db
    .insertInto('check_measurement')
    .values({
      kind: c.kind,
      instrument: c.instrument,
      component_id: c.componentId,
      temperature_k: c.temperatureK,
      pressure_pa: c.pressurePa,
      measured_at: c.measuredAt,
      note: c.note,
      measured_by: c.measuredBy,
    })
    .returning('id')
    .executeTakeFirstOrThrow()
  return r.id
}

/** Checks in time order, optionally of one kind and instrument. */
export async function listChecks(
  db: Db,
  o: { kind?: string; instrument?: string; id?: string },
): Promise<CheckRecord[]> {
  let q = db
    .selectFrom('check_measurement as m')
    .innerJoin('component as c', 'c.id', 'm.component_id')
    .selectAll('m')
    .select('c.name as component_name')
  if (o.kind) q = q.where('m.kind', '=', o.kind as CheckRecord['kind'])
  if (o.instrument) q = q.where('m.instrument', '=', o.instrument)
  if (o.id) q = q.where('m.id', '=', o.id)
  return (await q.orderBy('m.measured_at').orderBy('m.id').execute()).map(toCheck)
}
