/**
 * Fitted curves at the data set's pressure, computed in the browser with @ebullio/thermo from each fit's
 * activity model and the system's vapour-pressure sets (so toggling a model never waits for the server).
 * Loaded on demand by the workspace: this module is the one that pulls the engine into the page.
 */
import { findAzeotropes, phaseDiagram, type ActivityModel, type Azeotrope, type BinarySystem } from '@ebullio/thermo'
import type { DataSetDetail } from '../../api/datasets'
import { fitLabel, vaporPressureOf, type FitCurve } from './fit-helpers'

/** One isobaric diagram per fit that thermo can compute; fits it cannot draw are reported, not thrown. */
export function fitCurves(d: DataSetDetail): {
  curves: FitCurve[]
  failed: { name: string; message: string }[]
  ideal: FitCurve | null
} {
  const vp = vaporPressureOf(d)
  const failed: { name: string; message: string }[] = []
  if (!vp) return { curves: [], failed, ideal: null }
  const P = d.dataSet.nominalPressurePa
  const curveFor = (id: string, name: string, activity: ActivityModel): FitCurve | null => {
    try {
      const system: BinarySystem = {
        vaporPressure: vp,
        activity,
        names: [d.system.component1.name, d.system.component2.name],
      }
      // lle: the two-liquid region below the three-phase line, drawn when the model predicts a split
      const diagram = phaseDiagram(system, { P }, { points: 81, lle: true }) as FitCurve['diagram']
      let azeotropes: Azeotrope[] = []
      try {
        azeotropes = findAzeotropes(system, { P })
      } catch {
        azeotropes = []
      }
      return { fitId: id, name, diagram, azeotrope: azeotropes[0] ?? null, azeotropes }
    } catch (e) {
      failed.push({ name, message: (e as Error).message })
      return null
    }
  }
  const curves = d.fits
    .map((f) => curveFor(f.id, fitLabel(f, d.fits), f.activity as unknown as ActivityModel))
    .filter((c): c is FitCurve => !!c)
  return { curves, failed, ideal: curveFor('ideal', 'Ideal', { kind: 'ideal' }) }
}
