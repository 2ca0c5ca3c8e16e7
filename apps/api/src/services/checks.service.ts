/**
 * Thermometer and barometer checks: a reference liquid boiled at the day's pressure. The thermometer's
 * deviation is T measured − T from the liquid's vapour-pressure correlation at the barometer's pressure; the
 * barometer's is P read − the correlation's vapour pressure at the measured T. Both are judged on a control
 * chart per instrument (thermo's `controlChart`).
 */
import { saturationTemperature, vaporPressure, type VaporPressureModel } from '@ebullio/thermo'
import type { Db } from '../db/index.js'
import { conflict, notFound } from '../errors/index.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as repo from '../repositories/checks.repository.js'
import { findComponent, listVaporPressureSets } from '../repositories/components.repository.js'
import { thermo } from './lab-access.js'

export interface CheckInput {
  kind: 'thermometer' | 'barometer'
  instrument: string
  componentId: string
  temperatureK: number
  pressurePa: number
  measuredAt: Date
  note: string | null
}

async function correlationOf(db: Db, componentId: string) {
  const set = (await listVaporPressureSets(db, [componentId]))[0]
  if (!set) return null
  return { model: set.parameters as unknown as VaporPressureModel, source: set.source, setId: set.id }
}

/** A check with its reference value and deviation (K for a thermometer, Pa for a barometer). */
function judge(c: repo.CheckRecord, corr: { model: VaporPressureModel; source: string } | null) {
  if (!corr) return { ...c, reference: null, deviation: null, unit: c.kind === 'thermometer' ? 'K' : 'Pa' }
  const reference =
    c.kind === 'thermometer'
      ? saturationTemperature(corr.model, c.pressurePa)
      : vaporPressure(corr.model, c.temperatureK)
  const measured = c.kind === 'thermometer' ? c.temperatureK : c.pressurePa
  return {
    ...c,
    reference,
    deviation: measured - reference,
    unit: c.kind === 'thermometer' ? 'K' : 'Pa',
    correlationSource: corr.source,
  }
}

export async function addCheck(db: Db, actorId: string, input: CheckInput) {
  if (!(await findComponent(db, input.componentId))) throw notFound('There is no such component.')
  const corr = await correlationOf(db, input.componentId)
  if (!corr)
    throw conflict('The reference liquid has no vapour-pressure correlation; add one before recording checks with it.')
  const id = await repo.insertCheck(db, { ...input, measuredBy: actorId })
  await appendAudit(db, { actorId, entity: 'check_measurement', entityId: id, action: 'create', after: input })
  const [c] = await repo.listChecks(db, { id })
  return thermo('check', () => judge(c, corr))
}

/**
 * Checks with reference and deviation, in time order (the web draws one control chart per instrument).
 */
export async function listChecks(db: Db, o: { kind?: 'thermometer' | 'barometer'; instrument?: string }) {
  const rows = await repo.listChecks(db, o)
  const corr = new Map<string, Awaited<ReturnType<typeof correlationOf>>>()
  for (const id of new Set(rows.map((r) => r.componentId))) corr.set(id, await correlationOf(db, id))
  return rows.map((r) => judge(r, corr.get(r.componentId) ?? null))
}
