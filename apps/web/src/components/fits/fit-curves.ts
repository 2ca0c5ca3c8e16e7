/**
 * Fitted curves at the data set's pressure, computed in the browser with @ebullio/thermo from each fit's
 * activity model and the system's vapour-pressure sets (so toggling a model never waits for the server).
 * Loaded on demand by the workspace: this module is the one that pulls the engine into the page.
 */
import { findAzeotropes, phaseDiagram, type ActivityModel, type Azeotrope, type BinarySystem } from '@ebullio/thermo'
import type { DataSetDetail } from '../../api/datasets'
import { fitLabel, vaporPressureOf, type FitCurve } from './fit-helpers'

/**
 * One diagram per fit that thermo can compute, at the data set's own condition: T–x–y at its pressure, or P–x–y at
 * the temperature of isothermal data; each fit under the vapour it was computed with. Fits it cannot draw are
 * reported, not thrown.
 */
export function fitCurves(d: DataSetDetail): {
  curves: FitCurve[]
  failed: { name: string; message: string }[]
  ideal: FitCurve | null
} {
  const vp = vaporPressureOf(d)
  const failed: { name: string; message: string }[] = []
  if (!vp) return { curves: [], failed, ideal: null }
  const condition = conditionOf(d)
  if (!condition) return { curves: [], failed, ideal: null }
  const curveFor = (id: string, name: string, activity: ActivityModel, vapor?: unknown): FitCurve | null => {
    try {
      const system: BinarySystem = {
        vaporPressure: vp,
        activity,
        names: [d.system.component1.name, d.system.component2.name],
        ...(vapor ? { vapor: vapor as BinarySystem['vapor'] } : {}),
      }
      // lle: the two-liquid region below the three-phase line, drawn when the model predicts a split
      const drawn = phaseDiagram(system, condition, { points: 81, lle: 'P' in condition })
      const diagram =
        drawn.kind === 'isobaric'
          ? drawn
          : ({
              kind: 'isobaric',
              P: NaN,
              x1: drawn.x1,
              y1: drawn.y1,
              T: [],
              warnings: drawn.warnings,
            } as FitCurve['diagram'])
      let azeotropes: Azeotrope[] = []
      try {
        azeotropes = findAzeotropes(system, condition)
      } catch {
        azeotropes = []
      }
      return {
        fitId: id,
        name,
        diagram,
        ...(drawn.kind === 'isothermal' ? { pressures: drawn.P } : {}),
        azeotrope: azeotropes[0] ?? null,
        azeotropes,
      }
    } catch (e) {
      failed.push({ name, message: (e as Error).message })
      return null
    }
  }
  const curves = d.fits
    .map((f) => curveFor(f.id, fitLabel(f, d.fits), f.activity as unknown as ActivityModel, f.options.vapor))
    .filter((c): c is FitCurve => !!c)
  return { curves, failed, ideal: curveFor('ideal', 'Ideal', { kind: 'ideal' }) }
}

/** The data set's own condition: its pressure, or the temperature of isothermal data (else the points' mean T). */
function conditionOf(d: DataSetDetail): { P: number } | { T: number } | null {
  const ds = d.dataSet
  if (ds.nominalTemperatureK !== null && ds.nominalTemperatureK !== undefined) return { T: ds.nominalTemperatureK }
  if (ds.layout === 'pxy' || ds.layout === 'px') {
    const ts = d.points.map((p) => p.temperatureK)
    return ts.length ? { T: ts.reduce((a, b) => a + b, 0) / ts.length } : null
  }
  return ds.nominalPressurePa !== null ? { P: ds.nominalPressurePa } : null
}
