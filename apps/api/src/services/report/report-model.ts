/** What a printed report shows, gathered once from the stored record (plain data: the PDF and plots are pure functions of it). */
import type { ApprovalRecord } from '../../repositories/approvals.repository.js'
import type { CalibrationSummary, GcMethodRecord } from '../../repositories/calibrations.repository.js'
import type { CommentRecord } from '../../repositories/comments.repository.js'
import type { DataSetRecord } from '../../repositories/datasets.repository.js'
import type { ConsistencyRecord, FitRecord } from '../../repositories/fits.repository.js'
import type { PointDto, RecommendedParameterSetDto } from '@ebullio/schemas'

export interface ReportCurve {
  /** the fit the curve is computed from */
  fitId: string
  model: string
  x1: number[]
  y1: number[]
  /** K (isobaric curve) */
  T: number[]
  /** Pa (isothermal curve) */
  P?: number[]
}

export interface ReportModel {
  report: {
    id: string
    number: number
    generatedAt: Date
    generatedBy: string
    /** the address of the verify page for this report */
    verifyUrl: string
    labName: string
    timeZone: string
  }
  dataSet: DataSetRecord
  system: { name: string; component1: ComponentLine; component2: ComponentLine; notes: string | null }
  vaporPressure: { component: string; kind: string; source: string }[]
  gcMethods: GcMethodRecord[]
  calibrations: CalibrationSummary[]
  points: PointDto[]
  /** every fit, `stale` when it was computed on other points than the data set has now */
  fits: (FitRecord & { stale: boolean })[]
  /** every consistency result, `stale` likewise */
  consistency: (ConsistencyRecord & { stale: boolean })[]
  /** digest of the data set's current point set (services/point-set.ts) */
  pointSetDigest: string
  /** the recommended fit's curve at the nominal pressure; null with a reason when it cannot be drawn */
  curve: ReportCurve | null
  curveNote: string | null
  comments: CommentRecord[]
  approvals: ApprovalRecord[]
  /** SHA-256 of the canonical signed content as stored now (what the report prints) */
  digest: string
  /** the outlier flags as signed by the latest approval, else null */
  outlierIds: string[]
  caution: string
  /**
   * The system's signed recommended parameter set (a joint fit over several data sets) with how its energies
   * depend on temperature, or null when the system has none.
   */
  recommendedSet: (RecommendedParameterSetDto<Date> & { temperatureForm: string | null; caution: string }) | null
}

export interface ComponentLine {
  name: string
  cas: string | null
  formula: string | null
}
