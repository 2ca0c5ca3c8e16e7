/** The engineers' side: approved systems with their recommended fit, and curves computed from them at any pressure. */
import { fitLabel, type CatalogueEntryDto, type CatalogueMiscibilityDto } from '@ebullio/schemas'
import {
  findAzeotropes,
  liquidLiquidEquilibrium,
  phaseDiagram,
  relativeVolatility,
  type ActivityModel,
  type BinarySystem,
  type PhaseDiagram,
} from '@ebullio/thermo'
import { sql } from 'kysely'
import type { SessionUser } from '../auth/index.js'
import type { Db } from '../db/index.js'
import { conflict, notFound } from '../errors/index.js'
import * as repo from '../repositories/datasets.repository.js'
import { findFit, listFits } from '../repositories/fits.repository.js'
import { listSystems } from '../repositories/systems.repository.js'
import { pageWindow, thermo, visibleOrNotFound } from './lab-access.js'
import { binarySystem, engineInputs, type EngineInputs } from './systems.service.js'
import { recommendedSetOf } from './joint-fit-signing.js'

/** Room temperature at which the catalogue states whether the fitted model splits the liquid (common practice). */
const ROOM_T = 298.15

/** Shown with every design-related result (see the product rules on results that can hurt someone). */
export const DESIGN_CAUTION =
  "Preliminary estimate from equilibrium data (modified Raoult's law, ideal vapour). Flammable solvents, pressure equipment and final sizing follow local codes and a licensed engineer's review."

/** The caution worded for the vapour model the curve was computed with. */
export function cautionFor(vapor: { kind: string } | null | undefined): string {
  return vapor?.kind === 'virial'
    ? DESIGN_CAUTION.replace("modified Raoult's law, ideal vapour", 'γ–φ, virial vapour (Tsonopoulos)')
    : DESIGN_CAUTION
}

/** Approved systems matching a component name or CAS number, each with its approved versions and recommended fit; paged in SQL. */
export async function catalogue(
  db: Db,
  o: { q?: string; page: number; pageSize: number },
): Promise<{ items: CatalogueEntryDto<Date>[]; total: number; page: number; pageSize: number }> {
  const systems = await listSystems(db, { q: o.q, published: true, ...pageWindow(o.page, o.pageSize) })
  const ids = systems.items.map((s) => s.id)
  const rows =
    ids.length === 0
      ? []
      : await db
          .selectFrom('data_set as d')
          .leftJoin('fit as f', 'f.id', 'd.recommended_fit_id')
          .select([
            'd.id',
            'd.system_id',
            'd.version',
            'd.state',
            'd.title',
            'd.nominal_pressure_pa',
            'd.nominal_temperature_k',
            'd.approved_at',
            'f.id as fit_id',
            'f.model',
            'f.parameters',
            sql<ActivityModel | null>`f.activity`.as('activity'),
            sql<unknown>`f.statistics`.as('statistics'),
          ])
          .where('d.state', 'in', ['approved', 'superseded'])
          .where('d.system_id', 'in', ids)
          .orderBy('d.version', 'desc')
          .execute()
  // the recommended fit's name as the lab screens give it: it depends on the version's other fits
  const labels = new Map<string, string>()
  for (const v of rows.filter((r) => r.state === 'approved' && r.fit_id)) {
    const fits = await listFits(db, v.id)
    const f = fits.find((g) => g.id === v.fit_id)
    if (f) labels.set(v.id, fitLabel(f, fits))
  }
  const inputs = new Map<string, Awaited<ReturnType<typeof engineInputs>> | null>()
  for (const id of ids) inputs.set(id, await engineInputs(db, id).catch(() => null))
  const items = systems.items.map((s) => {
    const versions = rows.filter((r) => r.system_id === s.id)
    return {
      system: s,
      approved: versions
        .filter((v) => v.state === 'approved')
        .map((v) => ({
          dataSetId: v.id,
          title: v.title,
          version: v.version,
          nominalPressurePa: v.nominal_pressure_pa,
          nominalTemperatureK: v.nominal_temperature_k,
          approvedAt: v.approved_at,
          recommendedFit:
            v.fit_id && v.model && v.parameters
              ? {
                  id: v.fit_id,
                  model: v.model,
                  label: labels.get(v.id) ?? v.model,
                  parameters: v.parameters,
                }
              : null,
          miscibility: v.activity ? miscibilityOf(inputs.get(s.id) ?? null, v.activity, conditionOf(v)) : null,
        })),
      superseded: versions
        .filter((v) => v.state === 'superseded')
        .map((v) => ({ dataSetId: v.id, version: v.version, approvedAt: v.approved_at })),
    }
  })
  for (const item of items as CatalogueEntryDto<Date>[])
    item.recommendedSet = await recommendedSetOf(db, item.system.id)
  return { items, total: systems.total, page: o.page, pageSize: o.pageSize }
}

/**
 * Whether the recommended fit splits the liquid: two liquids at room temperature, or a three-phase line at the
 * version's pressure. Null when it cannot be computed (no vapour-pressure sets, or the engine refuses).
 */
function miscibilityOf(
  inputs: Awaited<ReturnType<typeof engineInputs>> | null,
  activity: ActivityModel,
  condition: { P: number } | { T: number } | null,
): CatalogueMiscibilityDto | null {
  if (!inputs || !condition) return null
  try {
    const system = binarySystem(inputs, activity)
    const room = liquidLiquidEquilibrium(system, { T: ROOM_T })
    const d = phaseDiagram(system, condition, { points: 21 })
    const threePhase = d.kind === 'isobaric' ? (d.threePhase ?? null) : null
    return {
      partial: room !== null || threePhase !== null,
      atRoomTemperature: room && { T: ROOM_T, x1I: room.x1I, x1II: room.x1II },
      threePhase,
    }
  } catch (err) {
    if ((err as { name?: string }).name === 'ThermoError') return null
    throw err
  }
}

/** The version's own condition: its pressure (isobaric) or its temperature (isothermal). */
function conditionOf(v: { nominal_pressure_pa: number | null; nominal_temperature_k: number | null }) {
  if (v.nominal_pressure_pa !== null) return { P: v.nominal_pressure_pa }
  return v.nominal_temperature_k !== null ? { T: v.nominal_temperature_k } : null
}

/** The activity model to compute with: the fit asked for, else the recommended one. */
async function chosenActivity(
  db: Db,
  d: repo.DataSetRecord,
  fitId?: string,
): Promise<{ fitId: string; model: string; activity: ActivityModel; vapor: EngineInputs['vapor'] | null }> {
  const id = fitId ?? d.recommendedFitId
  if (!id) throw conflict('This data set has no recommended fit yet; choose a fit.')
  const fit = await findFit(db, id)
  if (!fit || fit.dataSetId !== d.id) throw notFound('There is no such fit in this data set.')
  return {
    fitId: fit.id,
    model: fit.model,
    activity: fit.activity as unknown as ActivityModel,
    // the vapour the fit was made with: curves drawn from it use the same one
    vapor: (fit.options.vapor as EngineInputs['vapor'] | undefined) ?? null,
  }
}

/**
 * T–x–y and x–y at pressure P (Pa) with the three-phase line and the two-liquid region where the model splits the
 * liquid, relative volatility across composition, and every azeotrope with its kind (`azeotrope`: the first).
 */
export async function curveAt(db: Db, user: SessionUser, id: string, o: { P: number; points: number; fitId?: string }) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const chosen = await chosenActivity(db, d, o.fitId)
  const inputs = await engineInputs(db, d.systemId)
  return {
    dataSetId: id,
    fitId: chosen.fitId,
    model: chosen.model,
    P: o.P,
    components: [inputs.system.component1.name, inputs.system.component2.name],
    ...curveOf(binarySystem(inputs, chosen.activity), o.P, o.points),
    caution: cautionFor(chosen.vapor),
  }
}

/** The isobaric diagram (with the liquid split), every azeotrope and α across composition at P (Pa). */
export function curveOf(system: BinarySystem, P: number, points: number) {
  const diagram = thermo(
    'T–x–y curve',
    () => phaseDiagram(system, { P }, { points, lle: true }) as Extract<PhaseDiagram, { kind: 'isobaric' }>,
  )
  const azeotropes = thermo('Azeotrope search', () => findAzeotropes(system, { P }))
  // Inside the two-liquid gap there is no single liquid to take α of: those compositions are left out.
  const gap = diagram.threePhase
  const volatility = Array.from({ length: 21 }, (_, i) => i / 20)
    .filter((x1) => !gap || x1 <= gap.x1I || x1 >= gap.x1II)
    .map((x1) => {
      const r = thermo('Relative volatility', () => relativeVolatility(system, { P, x1 }))
      return { x1, alpha: r.alpha, T: r.T }
    })
  return {
    diagram,
    threePhase: diagram.threePhase ?? null,
    azeotrope: azeotropes[0] ?? null,
    azeotropes,
    relativeVolatility: volatility,
  }
}
