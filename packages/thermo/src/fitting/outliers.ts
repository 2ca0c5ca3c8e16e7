/**
 * The outlier rule the lab screens, the API and a signature share: a point is flagged when the fit flagged
 * its studentized residual (|t| > 3, see fitBinary), or when |ΔT|, |ΔP| or |Δy1| exceeds twice the RMS of that
 * residual over the included points (ΔP for fits on measured pressures: isothermal data) (the ±2σ rule; common practice, no source). Excluded points are judged
 * too (so an excluded outlier still shows as one) but do not enter the RMS.
 */

/** One point's residuals as a fit reports them (measured − calculated: ΔT in K, ΔP in Pa, Δy1 mole fraction). */
export interface OutlierResidual {
  /** the point's identifier (any string the caller uses) */
  pointId: string
  dT?: number | null
  dP?: number | null
  dy?: number | null
  /** the fit's own studentized-residual flag */
  flagged?: boolean
  excluded?: boolean
}

/** The rule in words, as stored with a signature. */
export const OUTLIER_RULE = 'flagged by the fit, or |ΔT|, |ΔP| or |Δy₁| above 2 × RMS of the included points'

/** Root mean square of the finite values; null when there are none. */
export function rootMeanSquare(values: readonly (number | null | undefined)[]): number | null {
  const v = values.filter((x): x is number => typeof x === 'number' && Number.isFinite(x))
  return v.length ? Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length) : null
}

/**
 * Identifiers of the points the rule flags, in residual order.
 * @param residuals one entry per point of the fit; `excluded` marks points left out of the fit now.
 */
export function outlierPointIds(residuals: readonly OutlierResidual[]): string[] {
  const used = residuals.filter((r) => !r.excluded)
  const sT = rootMeanSquare(used.map((r) => r.dT))
  const sP = rootMeanSquare(used.map((r) => r.dP))
  const sY = rootMeanSquare(used.map((r) => r.dy))
  const beyond = (v: number | null | undefined, s: number | null) =>
    s !== null && s > 0 && typeof v === 'number' && Math.abs(v) > 2 * s
  return residuals
    .filter((r) => r.pointId && (r.flagged === true || beyond(r.dT, sT) || beyond(r.dP, sP) || beyond(r.dy, sY)))
    .map((r) => r.pointId)
}
