import { ThermoError } from '../errors.js'
import type { VaporPressureModel } from '../types.js'
import type { VaporModel } from '../virial/virial-types.js'
import { fitBinary, type FitBinaryResult } from './fit-binary.js'
import type { BinaryPoint } from './fit-input.js'
import type { UniquacStructure } from './parameters.js'

/** One data set of a joint fit: its points, whether it was measured at fixed P or fixed T, and its vapour model. */
export interface JointFitMember {
  id: string
  points: BinaryPoint[]
  /**
   * 'isobaric' (default): each point's bubble temperature at its P is compared (dT); 'isothermal': each point's bubble
   * pressure at its T (dP, Pa; weights 1/σP as in fitBinary's bubble-pressure objective).
   */
  kind?: 'isobaric' | 'isothermal'
  /** The data set's vapour model (absent: the joint fit's `vapor`, else ideal). Every member must have the same. */
  vapor?: VaporModel
}

/** Options of {@link fitJoint}: several data sets of one system, fitted with one parameter set. */
export interface JointFitOptions {
  dataSets: JointFitMember[]
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  model: 'nrtl' | 'wilson' | 'uniquac'
  /** Liquid molar volumes, cm³/mol (Wilson only). */
  V1?: number
  V2?: number
  /** UNIQUAC structure parameters r and q of both components (UNIQUAC only; refused naming them when absent). */
  uniquac?: UniquacStructure
  /** NRTL α (held), default 0.3. */
  alpha?: number
  /** Fit b12T, b21T (NRTL) or a12T, a21T (Wilson, UNIQUAC) too; default true. */
  temperatureDependent?: boolean
  /** The vapour model of members that do not give their own (absent: ideal), as in fitBinary. */
  vapor?: VaporModel
}

/**
 * One data set's statistics under the joint parameters (fitted points only; dT, dP, dy = measured − calculated).
 * An isobaric member has dT (K), an isothermal one dP (Pa): the other's statistics are NaN (absent for dP).
 */
export interface JointDataSetStatistics {
  id: string
  kind: 'isobaric' | 'isothermal'
  n: number
  rmsT: number
  rmsY: number
  /** Mean dT and dy: a systematic offset of one data set against the others shows here (NaN without values). */
  biasT: number
  biasY: number
  /** RMS and mean dP, Pa (isothermal members only). */
  rmsP?: number
  biasP?: number
  Tmin: number
  Tmax: number
  Pmin: number
  Pmax: number
}

/** Result of {@link fitJoint}: the fit of the pooled points plus per-data-set statistics and the fitted range. */
export interface JointFitResult extends FitBinaryResult {
  dataSets: JointDataSetStatistics[]
  /** The temperatures and pressures the parameters were fitted over (K, Pa): use them inside this range only. */
  range: { Tmin: number; Tmax: number; Pmin: number; Pmax: number }
}

/** JSON with sorted keys (arrays in order): two vapour models are the same model when these agree. */
function sortedJson(v: unknown): string {
  if (v === null || typeof v !== 'object') return JSON.stringify(v ?? null)
  if (Array.isArray(v)) return `[${v.map(sortedJson).join(',')}]`
  const o = v as Record<string, unknown>
  const keys = Object.keys(o)
    .filter((k) => o[k] !== undefined)
    .sort()
  return `{${keys.map((k) => `${JSON.stringify(k)}:${sortedJson(o[k])}`).join(',')}}`
}

const vaporName = (v: VaporModel | undefined) =>
  v === undefined || v.kind === 'ideal' ? 'ideal vapour' : `${v.correlation ?? 'virial'} virial vapour`

/**
 * The one vapour model of all members. Members that disagree are refused, naming two of them: one activity
 * parameter set reproduces the data only together with the vapour model it was fitted under (γ = y·Φ·P/(x·Psat)
 * depends on Φ), so parameters fitted partly under one vapour and partly under another hold under neither.
 */
function commonVapor(sets: JointFitMember[], fallback: VaporModel | undefined): VaporModel | undefined {
  const of = (s: JointFitMember) => {
    const v = s.vapor ?? fallback
    return v === undefined || v.kind === 'ideal' ? undefined : v
  }
  const first = of(sets[0])
  const key = sortedJson(first ?? { kind: 'ideal' })
  for (const s of sets.slice(1)) {
    const v = of(s)
    if (sortedJson(v ?? { kind: 'ideal' }) === key) continue
    const same = vaporName(first) === vaporName(v)
    throw new ThermoError(
      'invalid-input',
      `Data sets "${sets[0].id}" (${vaporName(first)}) and "${s.id}" (${same ? 'a ' + vaporName(v) + ' with other constants' : vaporName(v)}) have different vapour models; one parameter set holds under one vapour model only. Give the data sets the same vapour model, then fit them jointly.`,
    )
  }
  return first
}

/**
 * One parameter set for several data sets of one system (different pressures or temperatures): the points of every
 * data set are fitted together (NRTL, Wilson or UNIQUAC), with temperature-dependent energies
 * b(T) = b + bT·(T − 298.15 K) by default, so the
 * parameters hold over the whole range. An isobaric member's points are compared by their bubble temperatures at
 * their own P (ΔT/σT), an isothermal member's by their bubble pressures at their own T (ΔP/σP), both with Δy/σy:
 * the objective Σ[(ΔT/σT)² or (ΔP/σP)² + (Δy/σy)²] over all points, weights and statistics as in fitBinary.
 * Every member must have the same vapour model (ideal or one virial vapour; refused otherwise, see commonVapor);
 * under a virial vapour every point is solved γ–φ. Residuals are measured − calculated. The per-data-set statistics
 * show whether one data set disagrees with the rest.
 */
export function fitJoint(options: JointFitOptions): JointFitResult {
  const sets = options.dataSets
  if (!Array.isArray(sets) || sets.length < 1) {
    throw new ThermoError('invalid-input', 'A joint fit needs at least one data set.')
  }
  const ids = new Set<string>()
  for (const s of sets) {
    if (ids.has(s.id)) throw new ThermoError('invalid-input', `Data set "${s.id}" is listed twice.`)
    ids.add(s.id)
    if (s.kind !== undefined && s.kind !== 'isobaric' && s.kind !== 'isothermal')
      throw new ThermoError(
        'invalid-input',
        `Data set "${s.id}": kind must be isobaric or isothermal; got ${JSON.stringify(s.kind)}.`,
      )
  }
  const vapor = commonVapor(sets, options.vapor)
  const isoSet = sets.map((s) => s.kind === 'isothermal')
  const allIso = isoSet.every(Boolean)
  const mixed = !allIso && isoSet.some(Boolean)
  const owner: number[] = []
  const points: BinaryPoint[] = []
  sets.forEach((s, k) => {
    for (const p of s.points) {
      // With members of both kinds each point says its kind; otherwise the objective does.
      points.push(mixed ? { ...p, isothermal: isoSet[k] } : p)
      owner.push(k)
    }
  })
  const fit = fitBinary({
    points,
    vaporPressure: options.vaporPressure,
    model: options.model,
    V1: options.V1,
    V2: options.V2,
    uniquac: options.uniquac,
    alpha: options.alpha,
    temperatureDependent: options.temperatureDependent ?? true,
    objective: allIso ? 'bubble-pressure' : 'bubble-point',
    ...(vapor ? { vapor } : {}),
  })
  const fitted = (i: number) => !points[i].excluded && points[i].x1 > 0 && points[i].x1 < 1
  const mean = (v: number[]) => (v.length ? v.reduce((a, b) => a + b, 0) / v.length : NaN)
  const rms = (v: number[]) => Math.sqrt(mean(v.map((x) => x * x)))
  // Each data set's fitted points, in one pass over the pooled points.
  const rowsOf: number[][] = sets.map(() => [])
  for (let i = 0; i < points.length; i++) if (fitted(i)) rowsOf[owner[i]].push(i)
  const dataSets = sets.map((s, k): JointDataSetStatistics => {
    const rows = rowsOf[k]
    // The fit's own residuals (measured − calculated at the optimum): no bubble point is solved again.
    const values = (f: (i: number) => number | null | undefined) =>
      rows.map(f).filter((v): v is number => typeof v === 'number')
    const dT = values((i) => fit.residuals[i].dT)
    const dy = values((i) => fit.residuals[i].dy)
    const Ts = rows.map((i) => points[i].T)
    const Ps = rows.map((i) => points[i].P)
    const dP = isoSet[k] ? values((i) => fit.residuals[i].dP) : []
    return {
      id: s.id,
      kind: isoSet[k] ? 'isothermal' : 'isobaric',
      n: rows.length,
      rmsT: rms(dT),
      rmsY: rms(dy),
      biasT: mean(dT),
      biasY: mean(dy),
      ...(isoSet[k] ? { rmsP: rms(dP), biasP: mean(dP) } : {}),
      Tmin: Math.min(...Ts),
      Tmax: Math.max(...Ts),
      Pmin: Math.min(...Ps),
      Pmax: Math.max(...Ps),
    }
  })
  const range = {
    Tmin: Math.min(...dataSets.map((d) => d.Tmin)),
    Tmax: Math.max(...dataSets.map((d) => d.Tmax)),
    Pmin: Math.min(...dataSets.map((d) => d.Pmin)),
    Pmax: Math.max(...dataSets.map((d) => d.Pmax)),
  }
  return { ...fit, dataSets, range }
}
