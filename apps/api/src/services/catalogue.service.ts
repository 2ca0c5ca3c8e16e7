/** The engineers' side: approved systems with their recommended fit, and curves computed from them at any pressure. */
import { createHash } from 'node:crypto'
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
import { LRUCache } from 'lru-cache'
import type { SessionUser } from '../auth/index.js'
import type { Db } from '../db/index.js'
import type { ChangeFeed } from '../ops/change-feed.js'
import { conflict, notFound } from '../errors/index.js'
import * as repo from '../repositories/datasets.repository.js'
import { findCurveSource, type CurveSource } from '../repositories/curves.repository.js'
import { findFit, listFitsOf } from '../repositories/fits.repository.js'
import { listSystems } from '../repositories/systems.repository.js'
import { pageWindow, PUBLISHED_STATES, readsEverything, thermo, visibleOrNotFound } from './lab-access.js'
import { binarySystem, engineInputs, type EngineInputs } from './systems.service.js'
import { recommendedSetOf } from './joint-fit-signing.js'

/** Room temperature at which the catalogue states whether the fitted model splits the liquid (common practice). */
const ROOM_T = 298.15

/** Shown with every design-related result (see the product rules on results that can hurt someone). */
export const DESIGN_CAUTION =
  "Preliminary estimate from equilibrium data (modified Raoult's law, ideal vapour). Flammable solvents, pressure equipment and final sizing follow local codes and a licensed engineer's review."

/** The caution worded for the vapour model the curve was computed with. */
export function cautionFor(vapor: { kind: string; correlation?: string } | null | undefined): string {
  return vapor?.kind === 'virial'
    ? DESIGN_CAUTION.replace(
        "modified Raoult's law, ideal vapour",
        `γ–φ, virial vapour (${vapor.correlation === 'hayden-oconnell' ? "Hayden–O'Connell" : 'Tsonopoulos'})`,
      )
    : DESIGN_CAUTION
}

/** Approved systems matching a component name or CAS number, each with its approved versions and recommended fit; paged in SQL. */
export async function catalogue(
  db: Db,
  o: { q?: string; page: number; pageSize: number },
): Promise<{ items: CatalogueEntryDto<Date>[]; total: number; page: number; pageSize: number }> {
  const systems = await listSystems(db, { q: o.q, published: true, ...pageWindow(o.page, o.pageSize) })
  const ids = systems.items.map((s) => s.id)
  const rows = await repo.listSignedVersionsOfSystems(db, ids)
  // the recommended fit's name as the lab screens give it: it depends on the version's other fits
  const named = rows.filter((r) => r.state === 'approved' && r.fit_id)
  const allFits = await listFitsOf(
    db,
    named.map((v) => v.id),
  )
  const labels = new Map<string, string>()
  for (const v of named) {
    const fits = allFits.filter((g) => g.dataSetId === v.id)
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
export async function curveAt(db: Db, user: SessionUser, id: string, o: CurveQuery) {
  return (await computeCurve(db, user, id, o)).curve
}

interface CurveQuery {
  /** Pa */
  P: number
  points: number
  fitId?: string
}

/** A curve as sent: the JSON bytes, and for a published data set its strong ETag (SHA-256 of the bytes). */
export interface CurveAnswer {
  body: Buffer
  etag: string | null
}

/**
 * Curves of published (approved or superseded) data sets, as sent. Such a version's fits never change (the database
 * freezes them), so a curve is decided by the fit, the two vapour-pressure sets it is computed with, the component
 * names it carries and the query; all of them are in the key, so a new preferred vapour-pressure set or a renamed
 * component is a new key, never a stale answer. Bounded by size; per process (replicas each keep their own).
 */
const curveCache = new LRUCache<string, CurveAnswer & { etag: string }>({
  maxSize: 64 * 2 ** 20,
  sizeCalculation: (v) => v.body.length + 200,
})

function curveKey(fitId: string, vaporPressureSetIds: readonly string[], names: readonly string[], o: CurveQuery) {
  return JSON.stringify([fitId, vaporPressureSetIds, names, o.P, o.points])
}

/** How many curves the cache holds (tests). */
export const cachedCurveCount = () => curveCache.size

/**
 * The curve answer of `curveAt`, served from the cache when the data set is published. The visibility rule runs
 * first on every request (also before a 304), on the curve's source: its state, fit, component names and
 * vapour-pressure sets. With a change feed the source of a published version is kept in this process until the
 * database says a data set, fit, system, component or vapour-pressure set changed (on any replica), so a repeated
 * curve reads nothing from the database. Drafts and versions under review are computed every time and get no ETag.
 */
export async function curveAnswer(
  db: Db,
  user: SessionUser,
  id: string,
  o: CurveQuery,
  changes?: ChangeFeed,
): Promise<CurveAnswer> {
  const sources = changes?.cache<CurveSource>('curve-sources', {
    max: 5000,
    forget: (change, lru) => {
      if (change.topic === 'curve' || change.topic === 'all') lru.clear()
    },
  })
  const sourceKey = o.fitId ? `${id} ${o.fitId}` : id
  let src = sources?.get(sourceKey)
  if (!src) {
    const since = sources?.begin() ?? 0
    src = await findCurveSource(db, id, o.fitId)
    if (src && PUBLISHED_STATES.includes(src.state)) sources?.set(sourceKey, src, since)
  }
  if (!src || (!readsEverything(user) && !PUBLISHED_STATES.includes(src.state)))
    throw notFound('There is no such data set.')
  const published = PUBLISHED_STATES.includes(src.state)
  const [vp1, vp2] = src.vaporPressureSetIds
  if (published && src.fitId && src.fitDataSetId === id && vp1 && vp2) {
    const hit = curveCache.get(curveKey(src.fitId, [vp1, vp2], src.componentNames, o))
    if (hit) return hit
  }
  const { curve, vaporPressureSetIds } = await computeCurve(db, user, id, o)
  const body = Buffer.from(JSON.stringify(curve))
  if (!published) return { body, etag: null }
  // The key is built from what the curve was computed with, so a change in between cannot file it under old inputs.
  const answer = { body, etag: `"${createHash('sha256').update(body).digest('base64url')}"` }
  curveCache.set(curveKey(curve.fitId, vaporPressureSetIds, curve.components, o), answer)
  return answer
}

async function computeCurve(db: Db, user: SessionUser, id: string, o: CurveQuery) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const chosen = await chosenActivity(db, d, o.fitId)
  const inputs = await engineInputs(db, d.systemId)
  const curve = {
    dataSetId: id,
    fitId: chosen.fitId,
    model: chosen.model,
    P: o.P,
    components: [inputs.system.component1.name, inputs.system.component2.name],
    // the vapour the fit was made with (a fit's options never change, so a cached curve stays right)
    ...curveOf(binarySystem({ ...inputs, vapor: chosen.vapor ?? inputs.vapor }, chosen.activity), o.P, o.points),
    caution: cautionFor(chosen.vapor),
  }
  return { curve, vaporPressureSetIds: inputs.vaporPressureSets.map((v) => v.id) }
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
