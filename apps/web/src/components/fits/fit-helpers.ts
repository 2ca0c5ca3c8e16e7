/**
 * Pure helpers of the fit panel and plots, with no engine code, so the workspace can show tables at once
 * while @ebullio/thermo loads in the background for the curves.
 */
import type { Azeotrope, PhaseDiagram, VaporPressureModel } from '@ebullio/thermo'
import type { DataSetDetail, Fit, FitBand, ModelName } from '../../api/datasets'
import type { TxyBand } from '../plots/plot-types'

/** Display names of the models, in the order the fit panel offers them. */
export const MODEL_LABELS: Record<ModelName, string> = {
  ideal: 'Ideal (Raoult)',
  margules: 'Margules',
  'van-laar': 'Van Laar',
  wilson: 'Wilson',
  nrtl: 'NRTL',
  uniquac: 'UNIQUAC',
}
/** Models the server fits; the ideal solution is drawn as a reference curve, it has nothing to fit. */
export const MODEL_ORDER: ModelName[] = ['margules', 'van-laar', 'wilson', 'nrtl', 'uniquac']

/** How a fit is named on every screen and in every export: one shared rule (packages/schemas/src/fit-label.ts). */
import { fitLabel, labelWithNote } from '@ebullio/schemas'
export { fitLabel, labelWithNote }

/**
 * The two vapour-pressure models the workspace store read for the system (the components' preferred sets);
 * null while they are unknown or when the system has none yet.
 */
export function vaporPressureOf(d: DataSetDetail): [VaporPressureModel, VaporPressureModel] | null {
  const direct = d.vaporPressure
  return Array.isArray(direct) && direct.length === 2
    ? (direct as unknown as [VaporPressureModel, VaporPressureModel])
    : null
}

export interface FitCurve {
  fitId: string
  name: string
  /**
   * with the three-phase line and the two-liquid region when the model predicts a liquid split. For isothermal data
   * the curve is P–x–y: `pressures` (Pa) holds the bubble pressures and `diagram.T` is empty.
   */
  diagram: Extract<PhaseDiagram, { kind: 'isobaric' }>
  pressures?: number[]
  azeotrope: Azeotrope | null
  /** every azeotrope at the data set's pressure, with its kind */
  azeotropes: Azeotrope[]
}

/** Residuals of one fit, tolerant of the field names thermo and the server may use: ΔT in K, Δy mole fraction. */
export function residualsOf(
  f: Fit,
): { pointId: string; dT: number | null; dP: number | null; dy: number | null; outlier: boolean }[] {
  return (f.residuals ?? []).map((r, i) => {
    const o = r as Record<string, unknown>
    const num = (...keys: string[]) => {
      for (const k of keys) if (typeof o[k] === 'number') return o[k] as number
      return null
    }
    return {
      pointId: String(o.pointId ?? o.id ?? f.pointIds[i] ?? ''),
      dT: num('dT', 'deltaT', 'temperature', 'T'),
      /** Pa, measured − calculated (fits on pressures) */
      dP: num('dP'),
      dy: num('dy', 'dy1', 'deltaY', 'y1', 'y'),
      outlier: o.flagged === true || o.outlier === true,
    }
  })
}

/** Root mean square of the finite values (the σ of the ±2σ band), null when there are none. */
export function rms(values: (number | null)[]): number | null {
  const v = values.filter((x): x is number => x !== null && Number.isFinite(x))
  return v.length ? Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length) : null
}

/** A result bound to the point set it was computed on. */
export interface BoundResult {
  stale?: boolean
  pointCount?: number | null
  runAt: string
}

/** "computed on 12 points on 3 Dec 2026, 14:05" — what a result rests on, shown beside it (greyed when stale). */
export function computedOnText(r: BoundResult): string {
  const when = new Date(r.runAt).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' })
  const n = r.pointCount
  return n === null || n === undefined
    ? `computed on an unrecorded point set on ${when}`
    : `computed on ${n} point${n === 1 ? '' : 's'} on ${when}`
}

/** "Stale: computed on 12 points on …; the points have changed since." or null for a current result. */
export function staleText(r: BoundResult): string | null {
  return r.stale ? `Stale: ${computedOnText(r)}; the points have changed since.` : null
}

/** The latest result of each consistency test: what the panel, the record and the signature show. */
export function latestConsistency<T extends { test: string; runAt: string }>(all: T[]): T[] {
  const latest = new Map<string, T>()
  for (const c of all) {
    const seen = latest.get(c.test)
    if (!seen || new Date(c.runAt).getTime() >= new Date(seen.runAt).getTime()) latest.set(c.test, c)
  }
  return [...latest.values()]
}

/** What is stale among the results a signature would rest on (recommended fit, latest consistency results), in words. */
export function staleForSigning(d: DataSetDetail): string[] {
  const out: string[] = []
  const rec = d.fits.find((f) => f.id === d.dataSet.recommendedFitId)
  if (rec?.stale) out.push(`the recommended fit (${fitLabel(rec, d.fits)}, ${computedOnText(rec)})`)
  for (const c of latestConsistency(d.consistency))
    if (c.stale)
      out.push(
        `${c.test === 'quality-score' ? 'the data-quality score' : `the ${c.test === 'point' ? 'point' : 'area'} test`} (${computedOnText(c)})`,
      )
  return out
}

/**
 * The band in the plots' shape: for a P–x–y band the ordinate slots (`T`, `Tlow`, `Thigh`) hold pressures in Pa,
 * which the P–x–y plot converts to the user's unit like every other pressure on it.
 */
export function plotBandOf(b: FitBand, name: string): TxyBand {
  return b.kind === 'isothermal'
    ? { name, x1: b.x1, T: b.P, Tlow: b.Plow, Thigh: b.Phigh, ylow: b.ylow, yhigh: b.yhigh }
    : { name, x1: b.x1, T: b.T, Tlow: b.Tlow, Thigh: b.Thigh, ylow: b.ylow, yhigh: b.yhigh }
}
