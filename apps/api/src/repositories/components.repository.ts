import type { ComponentDto, VaporPressureSetDto } from '@ebullio/schemas'
import { sql } from 'kysely'
import type { Db } from '../db/index.js'
import type { Component, PureMeasurement, VaporPressureSet } from '../db/lab-tables.js'
import { componentRank } from './search-rank.js'

/** A pure component as the API shows it (the shared wire type, with Date timestamps). Molar mass in g/mol, liquid molar volume in cm³/mol. */
export type ComponentRecord = ComponentDto<Date>

/** A vapour-pressure set as the API shows it. */
export type VaporPressureRecord = VaporPressureSetDto<Date>

export const toComponent = (c: Component): ComponentRecord => ({
  id: c.id,
  name: c.name,
  casNumber: c.cas_number,
  formula: c.formula,
  molarMass: c.molar_mass,
  liquidMolarVolume: c.liquid_molar_volume,
  properties: c.properties ?? null,
  rowVersion: c.row_version,
  createdAt: c.created_at,
})

export const toVaporPressure = (v: VaporPressureSet): VaporPressureRecord => ({
  id: v.id,
  componentId: v.component_id,
  kind: v.kind,
  parameters: v.parameters,
  rangeMin: v.range_min,
  rangeMax: v.range_max,
  rangeUnit: v.range_unit,
  source: v.source,
  preferred: v.preferred,
  enteredBy: v.entered_by,
  createdAt: v.created_at,
})

const toMeasurement = (m: PureMeasurement) => ({
  id: m.id,
  componentId: m.component_id,
  temperatureK: m.temperature_k,
  pressurePa: m.pressure_pa,
  note: m.note,
  measuredBy: m.measured_by,
  createdAt: m.created_at,
  thermometer: m.thermometer,
  still: m.still,
  measuredOn: dateText(m.measured_on),
  uploadId: m.upload_id,
  dataSetId: m.data_set_id,
  rowRef: m.row_ref,
})

/** node-postgres reads a `date` as local midnight; give it back as the YYYY-MM-DD it was stored as. */
function dateText(v: unknown): string | null {
  if (v === null || v === undefined) return null
  if (!(v instanceof Date)) return String(v)
  const pad = (n: number) => String(n).padStart(2, '0')
  return `${v.getFullYear()}-${pad(v.getMonth() + 1)}-${pad(v.getDate())}`
}

export interface ComponentQuery {
  q?: string
  sort: 'name' | 'created_at' | 'molar_mass'
  order: 'asc' | 'desc'
  limit: number
  offset: number
}

/** Components matching a name, CAS or formula search (best matches first), one page, with the total count. */
export async function listComponents(db: Db, o: ComponentQuery): Promise<{ items: ComponentRecord[]; total: number }> {
  let query = db.selectFrom('component')
  const q = o.q?.trim()
  if (q) query = query.where(sql<boolean>`${componentRank('', q)} < 3`)
  const total = await query.select(sql<string>`count(*)`.as('n')).executeTakeFirstOrThrow()
  let ordered = query.selectAll()
  // A search shows the best matches first (exact, then prefix, then contained); the chosen sort orders within.
  if (q) ordered = ordered.orderBy(componentRank('', q))
  const rows = await ordered.orderBy(o.sort, o.order).orderBy('id').limit(o.limit).offset(o.offset).execute()
  return { items: rows.map(toComponent), total: Number(total.n) }
}

export async function findComponent(db: Db, id: string): Promise<ComponentRecord | undefined> {
  const row = await db.selectFrom('component').selectAll().where('id', '=', id).executeTakeFirst()
  return row && toComponent(row)
}

export async function findComponentByName(db: Db, name: string): Promise<ComponentRecord | undefined> {
  const row = await db.selectFrom('component').selectAll().where('name', '=', name).executeTakeFirst()
  return row && toComponent(row)
}

export async function insertComponent(
  db: Db,
  c: Omit<ComponentRecord, 'id' | 'rowVersion' | 'createdAt'>,
  by: string | null,
): Promise<ComponentRecord> {
  const row = await db
    .insertInto('component')
    .values({
      name: c.name,
      cas_number: c.casNumber,
      formula: c.formula,
      molar_mass: c.molarMass,
      liquid_molar_volume: c.liquidMolarVolume,
      properties: c.properties ?? null,
      created_by: by,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  return toComponent(row)
}

/** Update when the row version still matches; undefined when it does not (a stale write). */
export async function updateComponent(
  db: Db,
  id: string,
  rowVersion: number,
  patch: Partial<Omit<ComponentRecord, 'id' | 'rowVersion' | 'createdAt'>>,
): Promise<ComponentRecord | undefined> {
  const row = await db
    .updateTable('component')
    .set({
      ...(patch.name !== undefined && { name: patch.name }),
      ...(patch.casNumber !== undefined && { cas_number: patch.casNumber }),
      ...(patch.formula !== undefined && { formula: patch.formula }),
      ...(patch.molarMass !== undefined && { molar_mass: patch.molarMass }),
      ...(patch.liquidMolarVolume !== undefined && { liquid_molar_volume: patch.liquidMolarVolume }),
      ...(patch.properties !== undefined && { properties: patch.properties }),
      row_version: sql`row_version + 1`,
    })
    .where('id', '=', id)
    .where('row_version', '=', rowVersion)
    .returningAll()
    .executeTakeFirst()
  return row && toComponent(row)
}

export async function deleteComponent(db: Db, id: string): Promise<void> {
  await db.deleteFrom('component').where('id', '=', id).execute()
}

export async function componentInUse(db: Db, id: string): Promise<boolean> {
  const r = await db
    .selectFrom('binary_system')
    .select('id')
    .where((eb) => eb.or([eb('component1_id', '=', id), eb('component2_id', '=', id)]))
    .executeTakeFirst()
  return !!r
}

export async function listVaporPressureSets(db: Db, componentIds: string[]): Promise<VaporPressureRecord[]> {
  if (componentIds.length === 0) return []
  const rows = await db
    .selectFrom('vapor_pressure_set')
    .selectAll()
    .where('component_id', 'in', componentIds)
    .orderBy('preferred', 'desc')
    .orderBy('created_at', 'desc')
    .execute()
  return rows.map(toVaporPressure)
}

export async function insertVaporPressureSet(
  db: Db,
  v: Omit<VaporPressureRecord, 'id' | 'createdAt'>,
): Promise<VaporPressureRecord> {
  if (v.preferred) {
    await db
      .updateTable('vapor_pressure_set')
      .set({ preferred: false })
      .where('component_id', '=', v.componentId)
      .execute()
  }
  const row = await db
    .insertInto('vapor_pressure_set')
    .values({
      component_id: v.componentId,
      kind: v.kind,
      parameters: JSON.stringify(v.parameters),
      range_min: v.rangeMin,
      range_max: v.rangeMax,
      range_unit: v.rangeUnit,
      source: v.source,
      preferred: v.preferred,
      entered_by: v.enteredBy,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  return toVaporPressure(row)
}

export async function listPureMeasurements(db: Db, componentId: string) {
  const rows = await db
    .selectFrom('pure_measurement')
    .selectAll()
    .where('component_id', '=', componentId)
    .orderBy('temperature_k')
    .execute()
  return rows.map(toMeasurement)
}

export async function insertPureMeasurement(
  db: Db,
  m: {
    componentId: string
    temperatureK: number
    pressurePa: number
    note: string | null
    measuredBy: string
    thermometer?: string | null
    still?: string | null
    measuredOn?: string | null
    uploadId?: string | null
    dataSetId?: string | null
    rowRef?: number | null
  },
) {
  const row = await db
    .insertInto('pure_measurement')
    .values({
      component_id: m.componentId,
      temperature_k: m.temperatureK,
      pressure_pa: m.pressurePa,
      note: m.note,
      measured_by: m.measuredBy,
      thermometer: m.thermometer ?? null,
      still: m.still ?? null,
      measured_on: m.measuredOn ?? null,
      upload_id: m.uploadId ?? null,
      data_set_id: m.dataSetId ?? null,
      row_ref: m.rowRef ?? null,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  return toMeasurement(row)
}
