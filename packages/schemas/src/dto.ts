import type { ComponentProperties } from './component-properties.js'
import type { RecommendedParameterSetDto } from './joint-fit.js'
/**
 * Types only: the JSON the API answers with and the web app reads, for the engineer and admin screens
 * (components, systems, points, fits, the catalogue, GC methods and calibrations). `D` is the type of a
 * timestamp: `Date` in the API before serialisation, `string` (ISO 8601) on the wire, the default.
 * Units: T in K, P in Pa, molar mass g/mol, liquid molar volume cm³/mol, compositions as mole fractions of
 * component 1 (the lighter one), uncertainties standard (k = 1).
 */

/** A pure component. */
export interface ComponentDto<D = string> {
  id: string
  name: string
  casNumber: string | null
  formula: string | null
  /** g/mol */
  molarMass: number
  /** cm³/mol */
  liquidMolarVolume: number | null
  /** Critical constants and structure parameters with their source; null when not entered. */
  properties: ComponentProperties | null
  rowVersion: number
  createdAt: D
}

/** A published vapour-pressure correlation, stored as published (thermo's VaporPressureModel in `parameters`). */
export interface VaporPressureSetDto<D = string> {
  id: string
  componentId: string
  kind: 'antoine' | 'clausius-clapeyron'
  parameters: Record<string, unknown>
  rangeMin: number | null
  rangeMax: number | null
  rangeUnit: 'C' | 'K' | null
  source: string
  preferred: boolean
  enteredBy: string | null
  createdAt: D
}

/** A binary system; component 1 is the lighter (lower-boiling) one. */
export interface SystemDto<D = string> {
  id: string
  component1: ComponentDto<D>
  component2: ComponentDto<D>
  name: string
  notes: string | null
  createdAt: D
}

/** One measured equilibrium state of a data set. */
export interface PointDto {
  id: string
  dataSetId: string
  seq: number
  sampleLabel: string
  /** K */
  temperatureK: number
  /** Pa */
  pressurePa: number
  x1: number
  x1Uncertainty: number
  /** null for a point without vapour composition (T–x or P–x data) */
  y1: number | null
  y1Uncertainty: number | null
  /** σP of the measured pressure, Pa (null: the engine's default applies) */
  pressureUncertaintyPa?: number | null
  excluded: boolean
  exclusionReason: string | null
  uploadId: string | null
  calibrationId: string | null
  /** Lines of the uploaded file the point came from (the header is line 1). */
  rowRefs: number[]
  /**
   * The liquid in the still had split into two layers: x1 is the overall liquid composition, T the three-phase
   * temperature and y1 the three-phase vapour. Absent on points stored before this field existed.
   */
  heterogeneous?: boolean
  /** Both analysed layers of a heterogeneous point, x1 ascending (I poorer in component 1); null when not analysed. */
  liquidPhases?: [LiquidLayerDto, LiquidLayerDto] | null
}

/** One liquid layer of a heterogeneous point: x1 with its standard uncertainty (k = 1). */
export interface LiquidLayerDto {
  x1: number
  uncertainty: number
}

/** Activity models a fit can use. */
export type FitModelName = 'margules' | 'van-laar' | 'wilson' | 'nrtl' | 'uniquac'

/** A fitted parameter in thermo's name and unit (Margules/Van Laar A12, A21; Wilson a12, a21 J/mol; NRTL b12, b21 J/mol, alpha). */
export interface FitParameterDto {
  name: string
  value: number
  /** null when the parameter was held at a bound (a fitted NRTL α at 0.1 or 0.7). */
  standardError: number | null
  /** true when a fitted parameter reached its bound and was held there. */
  atBound?: boolean
  /** the parameter's unit when it has one (J/mol), as thermo names it */
  unit?: string
}

/** A stored model fit as thermo returned it. */
export interface FitDto<D = string> {
  id: string
  dataSetId: string
  model: FitModelName
  options: Record<string, unknown>
  activity: Record<string, unknown>
  parameters: FitParameterDto[]
  statistics: Record<string, unknown>
  residuals: Record<string, unknown>[]
  pointIds: string[]
  runBy: string
  runAt: D
  /** SHA-256 of the point set the fit was computed on (null: computed before it was kept) */
  pointSetDigest: string | null
  /** included points of that point set */
  pointCount: number | null
}

/** One residual of a stored fit at a point: ΔT in K, Δy1 mole fraction (measured − model). */
export interface FitResidualDto {
  pointId: string
  dT: number
  dy: number
  /** true when the point is flagged as an outlier of this fit */
  outlier?: boolean
  [k: string]: unknown
}

/** The statistics thermo stores with a fit (rms ΔT in K, rms Δy1, AIC), and whatever else it reports. */
export interface FitStatisticsDto {
  rmsT?: number
  rmsY?: number
  aic?: number
  converged?: boolean
  [k: string]: unknown
}

/** A stored fit as the web reads it: {@link FitDto} with the known shapes of its JSON parts. */
export type FitDetailDto<D = string> = Omit<FitDto<D>, 'activity' | 'statistics' | 'residuals'> & {
  /** thermo's ActivityModel */
  activity: Record<string, unknown> & { kind: string }
  statistics: FitStatisticsDto
  residuals: FitResidualDto[]
}

/** An approved version of a data set in the catalogue, with the fit it was approved with. */
export interface ApprovedVersionDto<D = string> {
  dataSetId: string
  title: string
  version: number
  /** Pa; null for isothermal data */
  nominalPressurePa: number | null
  /** K, isothermal data only */
  nominalTemperatureK?: number | null
  approvedAt: D | null
  /** `label`: the fit's name as the lab screens give it (fit-label.ts) */
  recommendedFit: { id: string; model: FitModelName; label: string; parameters: FitParameterDto[] } | null
  /** What the recommended fit says about the liquid splitting; null without a fit or when it cannot be computed. */
  miscibility?: CatalogueMiscibilityDto | null
}

/**
 * A partially miscible system in the catalogue: `partial` when the recommended fit predicts two liquid layers at
 * room temperature (`atRoomTemperature`, T in K) or a three-phase line at the version's pressure (`threePhase`,
 * T in K, liquids x1I < x1II, vapour y1).
 */
export interface CatalogueMiscibilityDto {
  partial: boolean
  atRoomTemperature: { T: number; x1I: number; x1II: number } | null
  threePhase: { T: number; x1I: number; x1II: number; y1: number } | null
}

/** One system of the engineers' catalogue: its approved versions (newest first) and the superseded ones. */
export interface CatalogueEntryDto<D = string> {
  system: SystemDto<D>
  approved: ApprovedVersionDto<D>[]
  superseded: { dataSetId: string; version: number; approvedAt: D | null }[]
  /** The system's signed recommended parameter set (joint fit over several data sets), null when it has none. */
  recommendedSet?: RecommendedParameterSetDto<D> | null
}

/** A GC method; a retired one keeps its history and none of its calibrations can be active. */
export interface GcMethodDto<D = string> {
  id: string
  name: string
  detector: 'FID' | 'TCD'
  columnDescription: string | null
  conditions: string | null
  createdAt: D
  status: 'active' | 'retired'
  retiredAt: D | null
}

/** A fitted GC calibration of a method for a system; `R` is thermo's fitted Calibration as stored. */
export interface CalibrationDto<D = string, R = Record<string, unknown>> {
  id: string
  gcMethodId: string
  systemId: string
  model: 'response-factor' | 'linear' | 'quadratic'
  result: R
  rangeMin: number
  rangeMax: number
  status: 'active' | 'retired'
  uploadId: string
  createdBy: string
  createdAt: D
  retiredAt: D | null
}

/** Where a data set version stands in the review workflow. */
export type DataSetStateDto = 'draft' | 'submitted' | 'approved' | 'returned' | 'superseded'

/** A data set version as the API shows it. Pressure in Pa; `D` is Date on the server and string on the wire. */
export interface DataSetDto<D = string> {
  id: string
  lineageId: string
  version: number
  previousVersionId: string | null
  systemId: string
  title: string
  state: DataSetStateDto
  /** null for isothermal data (layouts pxy, px) */
  nominalPressurePa: number | null
  /** K; set for isothermal data (null for isobaric data, and for isothermal sets made before it was kept) */
  nominalTemperatureK: number | null
  /** ideal gas, or a virial gas (Tsonopoulos or Hayden–O'Connell, with η12 and its source) with an optional Poynting factor */
  vaporModel:
    | { kind: 'ideal' }
    | {
        kind: 'virial'
        correlation: 'tsonopoulos' | 'hayden-oconnell'
        poynting: boolean
        eta12?: number
        eta12Source?: string
      }
  apparatusNotes: string | null
  projectRef: string | null
  recommendedFitId: string | null
  createdBy: string
  createdAt: D
  updatedAt: D
  submittedAt: D | null
  approvedAt: D | null
  supersededAt: D | null
  rowVersion: number
  /** where the numbers come from: 'gc' (measured here by GC), 'other-method', 'literature' */
  origin: 'gc' | 'other-method' | 'literature'
  originMethod: string | null
  citation: {
    authors: string
    title: string
    source: string
    year: number
    volume: string | null
    pages: string | null
    doi: string | null
    table: string | null
  } | null
  /** a literature set marked by a lead chemist as the lab's own measurement (may then be approved) */
  countsAsOwn: boolean
  countsAsOwnBy: string | null
  countsAsOwnReason: string | null
  /** 'txy' isobaric T–x–y, 'tx' isobaric T–x, 'pxy' isothermal P–x–y, 'px' isothermal P–x */
  layout: 'txy' | 'tx' | 'pxy' | 'px'
}

/** What a person needs to recognise a stored GC calibration: its file, date, model, coefficients ± u, range and use. */
export interface CalibrationSummaryDto<D = string> {
  id: string
  gcMethodId: string
  gcMethodName: string
  model: 'response-factor' | 'linear' | 'quadratic'
  status: 'active' | 'retired'
  coefficientNames: string[]
  coefficients: number[]
  /** standard errors of the coefficients, same order */
  standardErrors: number[]
  /** calibrated range, mole fraction of component 1 */
  rangeMin: number
  rangeMax: number
  createdAt: D
  retiredAt: D | null
  uploadId: string
  originalName: string
  sha256: string
  /** data sets (lineages, all versions counted once) with points computed with it */
  dataSetCount: number
}

/**
 * One thing wrong with an uploaded file, located so the analyst can find it in the spreadsheet:
 * `row` is the line number in the file (the header is line 1), `column` the header as written.
 * Errors block a commit; warnings must be acknowledged before committing.
 */
export interface UploadProblemDto {
  row: number | null
  column: string | null
  value: string | null
  message: string
  severity: 'error' | 'warning'
}

/**
 * How far a virial vapour moves a data set's bubble points from an ideal vapour's, at its own included points with
 * its recommended (else newest) fit's activity model (thermo's vaporCorrectionSize). The virial vapour compared is
 * the data set's own when it chose one; for an ideal-vapour data set Tsonopoulos when both components have its
 * data, else Hayden–O'Connell when both have theirs (mean radius of gyration). T in K, P in Pa.
 */
export interface VapourCorrectionDto {
  /** true when the data set uses an ideal vapour although the correction exceeds the measurement uncertainty */
  exceeds: boolean
  /** the correction exceeds σT (σP) or σy at some point, whatever vapour the data set uses */
  exceedsUncertainty: boolean
  /** the vapour model the data set was reduced with */
  vapour: 'ideal' | 'virial'
  /** the correlation of the second virial coefficients the comparison used */
  correlation: 'tsonopoulos' | 'hayden-oconnell'
  kind: 'isobaric' | 'isothermal'
  maxAbsDy: number
  /** K (isobaric) */
  maxAbsDT: number | null
  /** Pa (isothermal) */
  maxAbsDP: number | null
  /** the activity model it was computed with, in words ("the nrtl fit") */
  basis: string
  /** the sentence the lab screens show; null when there is nothing to say */
  message: string | null
}

/**
 * The same comparison for each data set a system's recommended parameter set rests on, computed with the set's own
 * activity model at each member's points (`exceeds`: the set uses an ideal vapour and some member's correction
 * exceeds that member's measurement uncertainty).
 */
export interface SetVapourCorrectionDto {
  exceeds: boolean
  vapour: 'ideal' | 'virial'
  correlation: 'tsonopoulos' | 'hayden-oconnell'
  members: (Omit<VapourCorrectionDto, 'exceeds' | 'vapour' | 'correlation' | 'basis' | 'message'> & {
    dataSetId: string
    title: string
    version: number
  })[]
}
