/** Binary systems and the engine inputs (vapour-pressure models, molar volumes) they imply. */
import { missingVirialData, virialInputsOf, type VaporModelChoice } from '@ebullio/schemas'
import type { BinarySystem, VaporModel, VaporPressureModel } from '@ebullio/thermo'
import type { Db } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { appendAudit } from '../repositories/audit.repository.js'
import {
  findComponent,
  listVaporPressureSets,
  type VaporPressureRecord,
} from '../repositories/components.repository.js'
import * as repo from '../repositories/systems.repository.js'

export async function createSystem(
  db: Db,
  actorId: string,
  input: { component1Id: string; component2Id: string; notes: string | null },
): Promise<repo.SystemRecord> {
  if (input.component1Id === input.component2Id) throw conflict('A binary system needs two different components.')
  for (const id of [input.component1Id, input.component2Id]) {
    if (!(await findComponent(db, id))) throw notFound('There is no such component.')
  }
  const existing = await repo.findSystemByPair(db, input.component1Id, input.component2Id)
  if (existing) throw conflict(`The system ${existing.name} already exists.`, { systemId: existing.id })
  const s = await repo.insertSystem(db, { ...input, createdBy: actorId })
  await appendAudit(db, { actorId, entity: 'binary_system', entityId: s.id, action: 'create', after: { name: s.name } })
  return s
}

export async function getSystem(db: Db, id: string): Promise<repo.SystemRecord> {
  const s = await repo.findSystem(db, id)
  if (!s) throw notFound('There is no such binary system.')
  return s
}

/** The preferred (else newest) vapour-pressure set of a component. */
function pick(sets: VaporPressureRecord[], componentId: string, name: string): VaporPressureRecord {
  const set = sets.find((s) => s.componentId === componentId)
  if (!set) throw conflict(`${name} has no vapour-pressure set; add one before fitting or computing curves.`)
  return set
}

export interface EngineInputs {
  system: repo.SystemRecord
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  vaporPressureSets: [VaporPressureRecord, VaporPressureRecord]
  /** liquid molar volumes in cm³/mol (Wilson), when known */
  V1: number | undefined
  V2: number | undefined
  /** g/mol */
  molarMasses: [number, number]
  /** the vapour model of the data set computed on (ideal unless it chose a virial vapour) */
  vapor: VaporModel
}

/**
 * UNIQUAC's structural parameters (r, q of each component, dimensionless) from the component records, for a UNIQUAC
 * fit; refused (422 `missing_uniquac_data`) naming each component and what it lacks.
 */
export function uniquacStructure(system: repo.SystemRecord): { r1: number; r2: number; q1: number; q2: number } {
  const comps = [system.component1, system.component2]
  const gaps = comps.flatMap((c) => {
    const missing = [...(c.properties?.uniquacR ? [] : ['UNIQUAC r']), ...(c.properties?.uniquacQ ? [] : ['UNIQUAC q'])]
    return missing.length ? [`${c.name}: ${missing.join(', ')}`] : []
  })
  if (gaps.length)
    throw new AppError(
      422,
      'missing_uniquac_data',
      `A UNIQUAC fit needs each component's r and q; missing — ${gaps.join('; ')}. Enter them on the components screen (with their source).`,
    )
  const [a, b] = comps.map((c) => c.properties!)
  return { r1: a.uniquacR!, r2: b.uniquacR!, q1: a.uniquacQ!, q2: b.uniquacQ! }
}

/**
 * thermo's vapour model for a data set's choice: a virial vapour takes each component's critical data (and its
 * liquid molar volume for the Poynting factor) from the component records; refused, naming what is missing.
 */
export function engineVapor(system: repo.SystemRecord, choice: VaporModelChoice | undefined): VaporModel {
  if (!choice || choice.kind === 'ideal') return { kind: 'ideal' }
  const comps = [system.component1, system.component2]
  const correlation = choice.correlation ?? 'tsonopoulos'
  const why = missingVirialData(comps, correlation)
  if (why) throw new AppError(422, 'missing_critical_data', why)
  const noVolume = comps.filter((c) => !c.liquidMolarVolume).map((c) => c.name)
  if (choice.poynting && noVolume.length)
    throw new AppError(
      422,
      'missing_critical_data',
      `The Poynting factor needs each component's liquid molar volume; missing — ${noVolume.join(', ')}. Enter it on the components screen or switch the Poynting factor off.`,
    )
  const [c1, c2] = comps.map((c) => {
    const v = virialInputsOf(c.properties, correlation)
    if (!v.ok) throw new Error('unreachable: checked above')
    const volume = c.liquidMolarVolume ? { liquidMolarVolume: c.liquidMolarVolume } : {}
    if (correlation === 'hayden-oconnell')
      return { Tc: v.Tc, Pc: v.Pc, omega: v.omega, Vc: v.Vc, RD: v.RD, dipole: v.dipole, eta: v.eta, ...volume }
    return { Tc: v.Tc, Pc: v.Pc, omega: v.omega, Vc: v.Vc, tsonopoulos: { a: v.a, b: v.b }, ...volume }
  })
  if (correlation === 'hayden-oconnell')
    return {
      kind: 'virial',
      correlation,
      components: [c1, c2],
      eta12: choice.eta12 ?? 0,
      poynting: choice.poynting,
    }
  return { kind: 'virial', correlation: 'tsonopoulos', components: [c1, c2], poynting: choice.poynting }
}

/** What thermo needs to compute with this system. */
export async function engineInputs(db: Db, systemId: string, vapor?: VaporModelChoice): Promise<EngineInputs> {
  return engineInputsOf(db, await getSystem(db, systemId), vapor)
}

/** {@link engineInputs} for a system record already read (no second read of the system). */
export async function engineInputsOf(
  db: Db,
  system: repo.SystemRecord,
  vapor?: VaporModelChoice,
): Promise<EngineInputs> {
  const sets = await listVaporPressureSets(db, [system.component1.id, system.component2.id])
  const s1 = pick(sets, system.component1.id, system.component1.name)
  const s2 = pick(sets, system.component2.id, system.component2.name)
  return {
    system,
    vaporPressure: [s1.parameters as unknown as VaporPressureModel, s2.parameters as unknown as VaporPressureModel],
    vaporPressureSets: [s1, s2],
    V1: system.component1.liquidMolarVolume ?? undefined,
    V2: system.component2.liquidMolarVolume ?? undefined,
    molarMasses: [system.component1.molarMass, system.component2.molarMass],
    vapor: engineVapor(system, vapor),
  }
}

/** thermo's BinarySystem from stored inputs and an activity model. */
export function binarySystem(inputs: EngineInputs, activity: BinarySystem['activity']): BinarySystem {
  return {
    vaporPressure: inputs.vaporPressure,
    activity,
    ...(inputs.vapor.kind === 'virial' ? { vapor: inputs.vapor } : {}),
  }
}

/** A page of systems, answered by the repository as it is (no rule applies). */
export { listSystems } from '../repositories/systems.repository.js'
