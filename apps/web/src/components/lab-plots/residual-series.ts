/**
 * The residual plot's series, one per drawn fit: measured − calculated at each point (ΔT = T_meas − T_calc,
 * Δy₁ = y_meas − y_calc, as the engine reports them; never flipped here), with σ = RMS of the included points.
 */
import type { Fit, Point } from '../../api/datasets'
import { residualsOf, rms } from '../fits/fit-helpers'
import type { ResidualSeries } from '../plots'

export interface ResidualSeriesInput {
  fits: Fit[]
  points: Point[]
  /** ids of the fits drawn */
  visible: string[]
  /** legend name of a fit */
  nameOf: (f: Fit) => string
  /** ΔT in the display unit's difference (× 1.8 in °F); identity for K and °C */
  scaleDT?: (v: number) => number
}

export function residualSeries(which: 'dT' | 'dy', o: ResidualSeriesInput): ResidualSeries[] {
  const x1Of = new Map(o.points.map((p) => [p.id, p.x1]))
  const excluded = new Set(o.points.filter((p) => p.excluded).map((p) => p.id))
  const scale = (v: number | null) => (v === null || which === 'dy' || !o.scaleDT ? v : o.scaleDT(v))
  return o.fits
    .filter((f) => o.visible.includes(f.id))
    .map((f) => {
      const r = residualsOf(f).map((x) => ({ ...x, dT: scale(x.dT) }))
      const included = r.filter((x) => !excluded.has(x.pointId))
      return {
        name: o.nameOf(f),
        sigma: rms(included.map((x) => x[which])),
        points: r
          .filter((x) => x[which] !== null && x1Of.has(x.pointId))
          .map((x) => ({
            id: x.pointId,
            x1: x1Of.get(x.pointId)!,
            residual: x[which]!,
            excluded: excluded.has(x.pointId),
          })),
      }
    })
}
