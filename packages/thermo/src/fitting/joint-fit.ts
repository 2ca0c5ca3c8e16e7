import { ThermoError } from '../errors.js'
import type { VaporPressureModel } from '../types.js'
import type { VaporModel } from '../virial/virial-types.js'
import { fitBinary, type FitBinaryResult } from './fit-binary.js'
import type { BinaryPoint } from './fit-input.js'

/** Options of {@link fitJoint}: several data sets of one system, fitted with one parameter set. */
export interface JointFitOptions {
  dataSets: { id: string; points: BinaryPoint[] }[]
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  model: 'nrtl' | 'wilson'
  /** Liquid molar volumes, cm³/mol (Wilson only). */
  V1?: number
  V2?: number
  /** NRTL α (held), default 0.3. */
  alpha?: number
  /** Fit b12T, b21T (or a12T, a21T) too; default true. */
  temperatureDependent?: boolean
  /** The vapour model (absent: ideal), as in fitBinary. */
  vapor?: VaporModel
}

/** One data set's statistics under the joint parameters (fitted points only; dT, dy = measured − calculated). */
export interface JointDataSetStatistics {
  id: string
  n: number
  rmsT: number
  rmsY: number
  /** Mean dT and dy: a systematic offset of one data set against the others shows here (NaN without values). */
  biasT: number
  biasY: number
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

/**
 * One parameter set for several data sets of one system (different pressures or temperatures): the points of every
 * data set are fitted together at their own P, with temperature-dependent energies b(T) = b + bT·(T − 298.15 K) by
 * default, so the parameters hold over the whole range. Weights, objective and statistics as in fitBinary.
 * Residuals are measured − calculated. The per-data-set statistics show whether one data set disagrees with the rest.
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
  }
  const owner: number[] = []
  const points: BinaryPoint[] = []
  sets.forEach((s, k) => {
    for (const p of s.points) {
      points.push(p)
      owner.push(k)
    }
  })
  const fit = fitBinary({
    points,
    vaporPressure: options.vaporPressure,
    model: options.model,
    V1: options.V1,
    V2: options.V2,
    alpha: options.alpha,
    temperatureDependent: options.temperatureDependent ?? true,
    vapor: options.vapor,
  })
  const fitted = (i: number) => !points[i].excluded && points[i].x1 > 0 && points[i].x1 < 1
  const dataSets = sets.map((s, k) => {
    const rows = points.map((_, i) => i).filter((i) => owner[i] === k && fitted(i))
    // The fit's own residuals (measured − calculated at the optimum): no bubble point is solved again.
    const dT = rows.map((i) => fit.residuals[i].dT).filter((v): v is number => v !== null)
    const dy = rows.map((i) => fit.residuals[i].dy).filter((v): v is number => v !== null)
    const Ts = rows.map((i) => points[i].T)
    const Ps = rows.map((i) => points[i].P)
    const mean = (v: number[]) => (v.length ? v.reduce((a, b) => a + b, 0) / v.length : NaN)
    const rms = (v: number[]) => Math.sqrt(mean(v.map((x) => x * x)))
    return {
      id: s.id,
      n: rows.length,
      rmsT: rms(dT),
      rmsY: rms(dy),
      biasT: mean(dT),
      biasY: mean(dy),
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
