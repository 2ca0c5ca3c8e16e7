/**
 * Outlier flags of a fit, judged by thermo's rule (`outlierPointIds`: flagged by the fit's studentized
 * residual, or |ΔT|, |ΔP| or |Δy1| above twice the RMS of the included points). Flags are judged only against a
 * fit computed on the current point set, with the current exclusions: a fit computed on other points gives
 * no flags. A signature stores them, because they depend on which fit is recommended.
 */
import { OUTLIER_RULE, outlierPointIds } from '@ebullio/thermo'
import type { Db } from '../db/index.js'
import type { SignedOutliers } from '../repositories/approvals.repository.js'
import { findFit, type FitRecord } from '../repositories/fits.repository.js'
import { listPoints, type PointRecord } from '../repositories/points.repository.js'
import { currentPointSet } from './point-set.js'

export { OUTLIER_RULE }

/** One residual as stored with a fit (ΔT in K, ΔP in Pa, Δy1 mole fraction, measured − calculated). */
export interface StoredResidual {
  pointId?: string
  dT?: number | null
  dP?: number | null
  dy?: number | null
  flagged?: boolean
}

/** Ids of the points a fit flags, with today's exclusions; null when the fit was computed on other points. */
export function fitOutliers(fit: FitRecord, points: PointRecord[], currentDigest: string): string[] | null {
  if (fit.pointSetDigest !== currentDigest) return null
  const excluded = new Set(points.filter((p) => p.excluded).map((p) => p.id))
  return outlierPointIds(
    (fit.residuals as StoredResidual[])
      .filter((r) => typeof r.pointId === 'string')
      .map((r) => ({
        pointId: r.pointId!,
        dT: r.dT,
        dP: r.dP,
        dy: r.dy,
        flagged: r.flagged,
        excluded: excluded.has(r.pointId!),
      })),
  )
}

/** The flags against the recommended fit as stored now; null without a recommended fit on the current points. */
export async function signedOutliers(
  db: Db,
  dataSetId: string,
  recommendedFitId: string | null,
): Promise<SignedOutliers | null> {
  if (!recommendedFitId) return null
  const fit = await findFit(db, recommendedFitId)
  if (!fit || fit.dataSetId !== dataSetId) return null
  const points = await listPoints(db, dataSetId)
  const ids = fitOutliers(fit, points, (await currentPointSet(db, dataSetId)).digest)
  if (!ids) return null
  const label = new Map(points.map((p) => [p.id, p.sampleLabel]))
  return {
    fitId: fit.id,
    model: fit.model,
    pointIds: ids,
    sampleLabels: ids.map((id) => label.get(id) ?? id),
    rule: OUTLIER_RULE,
  }
}
