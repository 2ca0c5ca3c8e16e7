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
  /** ΔP (Pa) in the display pressure unit */
  scaleDP?: (v: number) => number
}

/** ΔT, ΔP (fits on pressures, isothermal data) or Δy₁ of each drawn fit; a fit without that residual is left out. */
export function residualSeries(which: 'dT' | 'dP' | 'dy', o: ResidualSeriesInput): ResidualSeries[] {
  const x1Of = new Map(o.points.map((p) => [p.id, p.x1]))
  const excluded = new Set(o.points.filter((p) => p.excluded).map((p) => p.id))
  const scaleT = (v: number | null) => (v === null || !o.scaleDT ? v : o.scaleDT(v))
  const scaleP = (v: number | null) => (v === null || !o.scaleDP ? v : o.scaleDP(v))
  return o.fits
    .filter((f) => o.visible.includes(f.id))
    .map((f) => {
      const r = residualsOf(f).map((x) => ({ ...x, dT: scaleT(x.dT), dP: scaleP(x.dP) }))
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
    .filter((s) => s.points.length > 0)
}
