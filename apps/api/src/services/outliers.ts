/**
 * Outlier flags of a fit, judged the way the workspace shows them: a point is flagged when thermo flagged
 * its studentized residual, or when |ΔT| or |Δy1| exceeds twice the RMS of that residual over the included
 * points (the ±2σ rule; common practice, no source). A signature stores them, because they depend on which
 * fit is recommended and would otherwise change after signing.
 */
import type { Db } from '../db/index.js'
import type { SignedOutliers } from '../repositories/approvals.repository.js'
import { listFits } from '../repositories/fits.repository.js'
import { listPoints } from '../repositories/points.repository.js'

/** One residual as stored with a fit (ΔT in K, Δy1 mole fraction). */
export interface StoredResidual {
  pointId?: string
  dT?: number
  dy?: number
  flagged?: boolean
}

/** The rule in words, stored with the flags. */
export const OUTLIER_RULE = 'flagged by the fit, or |ΔT| or |Δy₁| above 2 × RMS of the included points'

/** Root mean square of the finite values; null when there are none. */
function rms(values: (number | undefined)[]): number | null {
  const v = values.filter((x): x is number => typeof x === 'number' && Number.isFinite(x))
  return v.length ? Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length) : null
}

/** Ids of the points beyond ±2σ of a fit, in residual order. */
export function outlierPointIds(residuals: StoredResidual[], excludedIds: Set<string>): string[] {
  const used = residuals.filter((r) => r.pointId && !excludedIds.has(r.pointId))
  const sT = rms(used.map((r) => r.dT))
  const sY = rms(used.map((r) => r.dy))
  const beyond = (v: number | undefined, s: number | null) =>
    s !== null && s > 0 && typeof v === 'number' && Math.abs(v) > 2 * s
  return residuals
    .filter((r) => r.pointId && (r.flagged === true || beyond(r.dT, sT) || beyond(r.dy, sY)))
    .map((r) => r.pointId!)
}

/** The flags against the recommended fit of a data set as stored now; null without a recommended fit. */
export async function signedOutliers(
  db: Db,
  dataSetId: string,
  recommendedFitId: string | null,
): Promise<SignedOutliers | null> {
  if (!recommendedFitId) return null
  const fit = (await listFits(db, dataSetId)).find((f) => f.id === recommendedFitId)
  if (!fit) return null
  const points = await listPoints(db, dataSetId)
  const ids = outlierPointIds(
    fit.residuals as StoredResidual[],
    new Set(points.filter((p) => p.excluded).map((p) => p.id)),
  )
  const label = new Map(points.map((p) => [p.id, p.sampleLabel]))
  return {
    fitId: fit.id,
    model: fit.model,
    pointIds: ids,
    sampleLabels: ids.map((id) => label.get(id) ?? id),
    rule: OUTLIER_RULE,
  }
}
