import type { ComponentProperties } from '@ebullio/schemas'
/** Pure components, their vapour-pressure sets and pure-component boiling measurements. */
import { fitAntoine, saturationTemperature, type VaporPressureModel } from '@ebullio/thermo'
import { thermo, translateDbError } from './lab-access.js'
import type { Db } from '../db/index.js'
import { conflict, notFound } from '../errors/index.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as repo from '../repositories/components.repository.js'

const COMPONENT_ERRORS = {
  component_name_key: 'A component with this name already exists.',
  component_cas_number_key: 'A component with this CAS number already exists.',
  component_cas_number_check: 'The CAS number is not valid (its check digit does not match).',
}

export interface ComponentInput {
  name: string
  casNumber: string | null
  formula: string | null
  molarMass: number
  liquidMolarVolume: number | null
  properties: ComponentProperties | null
}

export async function createComponent(db: Db, actorId: string, input: ComponentInput): Promise<repo.ComponentRecord> {
  try {
    const c = await repo.insertComponent(db, input, actorId)
    await appendAudit(db, { actorId, entity: 'component', entityId: c.id, action: 'create', after: input })
    return c
  } catch (err) {
    return translateDbError(err, COMPONENT_ERRORS)
  }
}

/** A component with its vapour-pressure sets and measurements. */
export async function getComponent(db: Db, id: string) {
  const c = await repo.findComponent(db, id)
  if (!c) throw notFound('There is no such component.')
  const sets = await repo.listVaporPressureSets(db, [id])
  const model = sets[0]?.parameters as unknown as VaporPressureModel | undefined
  // Each boiling point beside the temperature the preferred correlation gives at its pressure.
  const pureMeasurements = (await repo.listPureMeasurements(db, id)).map((m) => {
    let correlatedK: number | null
    try {
      correlatedK = model ? saturationTemperature(model, m.pressurePa) : null
    } catch {
      correlatedK = null
    }
    return { ...m, correlatedK, dT: correlatedK === null ? null : m.temperatureK - correlatedK }
  })
  return { ...c, vaporPressureSets: sets, pureMeasurements, correlationSource: sets[0]?.source ?? null }
}

export async function updateComponent(
  db: Db,
  actorId: string,
  id: string,
  rowVersion: number,
  patch: Partial<ComponentInput>,
): Promise<repo.ComponentRecord> {
  const before = await repo.findComponent(db, id)
  if (!before) throw notFound('There is no such component.')
  try {
    const after = await repo.updateComponent(db, id, rowVersion, patch)
    if (!after)
      throw conflict(
        `This component was changed by someone else (you had version ${rowVersion}, it is now ${before.rowVersion}). Reload it.`,
      )
    await appendAudit(db, { actorId, entity: 'component', entityId: id, action: 'update', before, after: patch })
    return after
  } catch (err) {
    return translateDbError(err, COMPONENT_ERRORS)
  }
}

export async function deleteComponent(db: Db, actorId: string, id: string): Promise<void> {
  const before = await repo.findComponent(db, id)
  if (!before) throw notFound('There is no such component.')
  if (await repo.componentInUse(db, id))
    throw conflict('This component belongs to a binary system and cannot be deleted.')
  await repo.deleteComponent(db, id)
  await appendAudit(db, { actorId, entity: 'component', entityId: id, action: 'delete', before })
}

export interface VaporPressureInput {
  model: VaporPressureModel
  source: string
  preferred: boolean
}

/** Store a published correlation exactly as given, with its source and validity range. */
export async function addVaporPressureSet(db: Db, actorId: string, componentId: string, input: VaporPressureInput) {
  if (!(await repo.findComponent(db, componentId))) throw notFound('There is no such component.')
  const m = input.model
  const range = m.range ?? null
  const set = await repo.insertVaporPressureSet(db, {
    componentId,
    kind: m.kind,
    parameters: m as unknown as Record<string, unknown>,
    rangeMin: range?.[0] ?? null,
    rangeMax: range?.[1] ?? null,
    rangeUnit: range ? (m.kind === 'antoine' ? m.temperatureUnit : 'K') : null,
    source: input.source,
    preferred: input.preferred,
    enteredBy: actorId,
  })
  await appendAudit(db, {
    actorId,
    entity: 'vapor_pressure_set',
    entityId: set.id,
    action: 'create',
    after: { componentId, ...input },
  })
  return set
}

export async function addPureMeasurement(
  db: Db,
  actorId: string,
  componentId: string,
  m: {
    temperatureK: number
    pressurePa: number
    note: string | null
    thermometer?: string | null
    still?: string | null
    measuredOn?: string | null
  },
) {
  if (!(await repo.findComponent(db, componentId))) throw notFound('There is no such component.')
  const row = await repo.insertPureMeasurement(db, { componentId, ...m, measuredBy: actorId })
  await appendAudit(db, { actorId, entity: 'pure_measurement', entityId: row.id, action: 'create', after: m })
  return row
}

/** Fit an Antoine set (thermo's fitAntoine) to the component's measured boiling points and store it. */
export async function fitVaporPressureFromMeasurements(
  db: Db,
  actorId: string,
  componentId: string,
  preferred: boolean,
) {
  const measurements = await repo.listPureMeasurements(db, componentId)
  if (!(await repo.findComponent(db, componentId))) throw notFound('There is no such component.')
  const fit = thermo('Antoine fit', () => fitAntoine(measurements.map((m) => ({ T: m.temperatureK, P: m.pressurePa }))))
  const set = await addVaporPressureSet(db, actorId, componentId, {
    model: fit.model,
    preferred,
    source: `Fitted in Ebullio to ${measurements.length} measured boiling points`,
  })
  return { set, fit }
}

/** A page of components, answered by the repository as it is (no rule applies). */
export { listComponents } from '../repositories/components.repository.js'
