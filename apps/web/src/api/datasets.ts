/**
 * Data sets, their points, fits and consistency results (issue 5's `/api/data-sets` routes).
 * Quantities as the server stores them: T in K, P in Pa, compositions as mole fractions of component 1.
 */
import type {
  DataSetDto,
  DataSetStateDto,
  FitDetailDto,
  FitResidualDto,
  PointDto,
  SuggestionCriterionName,
  SystemDto,
  VapourCorrectionDto,
} from '@ebullio/schemas'
import type { PredictionBand, PredictionBandIsothermal } from '@ebullio/thermo'
import { api, query } from './client'
import type { CommentItem } from './comments'
import type { CalibrationSummary } from './uploads'

export type DataSetState = DataSetStateDto
export type ModelName = 'ideal' | 'margules' | 'van-laar' | 'wilson' | 'nrtl' | 'uniquac'

export type DataSet = DataSetDto

export interface DataSetListItem extends DataSet {
  systemName: string
  authorName: string
  pointCount: number
  openComments: number
}

/** One equilibrium state. T in K, P in Pa, x1/y1 mole fractions with standard uncertainties (k = 1). */
export type Point = PointDto

/** One residual of a fit at a point: ΔT in K, Δy1 mole fraction (measured − model). */
export type FitResidual = FitResidualDto

/** A stored fit (the shared wire type). */
export type Fit = FitDetailDto & {
  /** computed on other points than the data set has now (pointSetDigest differs from the data set's) */
  stale?: boolean
}

export interface ConsistencyResult {
  id: string
  test: 'herington-area' | 'redlich-kister-area' | 'point' | 'quality-score'
  passed: boolean
  result: Record<string, unknown>
  runAt: string
  pointSetDigest?: string | null
  pointCount?: number | null
  /** computed on other points than the data set has now */
  stale?: boolean
}

export interface Approval {
  id: string
  signerId: string
  signerName?: string
  meaning: 'approved' | 'returned for rework'
  reason: string
  digest: string
  selfApproval: boolean
  overrideReason: string | null
  signedAt: string
  /** the outlier flags the signer saw (null: signed before they were kept, or no recommended fit) */
  outliers?: { fitId: string; model: string; pointIds: string[]; sampleLabels: string[]; rule: string } | null
}

/** Everything the workspace shows about one data set version. */
export interface DataSetDetail {
  dataSet: DataSet
  system: LabSystem
  points: Point[]
  fits: Fit[]
  consistency: ConsistencyResult[]
  approvals: Approval[]
  comments: CommentItem[]
  uploads: {
    id: string
    kind: string
    originalName: string
    sizeBytes?: number
    sha256?: string
    uploadedAt?: string
    [k: string]: unknown
  }[]
  versions: { id: string; version: number; state: DataSetState; approvedAt: string | null }[]
  /** the calibrations behind the points (file, date, model, coefficients ± u, range) */
  calibrations: CalibrationSummary[]
  /** the two components' preferred vapour-pressure models, when they could be read */
  vaporPressure?: [Record<string, unknown>, Record<string, unknown>] | null
  authorName?: string
  /** how large a virial vapour's correction would be here, for a data set with an ideal vapour (null: not known) */
  vapourCorrection?: VapourCorrection | null
}

/** The server's comparison of an ideal with a virial vapour at the data set's own points (the shared wire type). */
export type VapourCorrection = VapourCorrectionDto

/** The server answers with the data set's own fields at the top level and its parts beside them. */
type DetailAnswer = DataSet & Omit<DataSetDetail, 'dataSet' | 'vaporPressure' | 'authorName'>

/** A vapour-pressure set, a component with its sets, and a binary system: the shared wire types. */
export type { VaporPressureSet, ComponentDetail as LabComponent } from './components'
export type LabSystem = SystemDto

/** One line of the append-only audit log of a data set's lineage. */
export interface AuditEntry {
  id: string
  at: string
  actorId: string | null
  actorName: string | null
  entity: string
  entityId: string
  action: string
  dataSetId: string | null
  /** summary of the change after it (shape depends on the action) */
  after?: unknown
}

export interface DataSetListQuery {
  state?: string
  systemId?: string
  q?: string
  createdBy?: string
  pressureMinPa?: number
  pressureMaxPa?: number
  /** ISO instants: created or last changed at or after …After, before …Before (exclusive) */
  createdAfter?: string
  createdBefore?: string
  updatedAfter?: string
  updatedBefore?: string
  sort?: string
  order?: 'asc' | 'desc'
  limit: number
  offset: number
}

export interface NewDataSet {
  systemId: string
  title: string
  /** Pa; null for isothermal data */
  nominalPressurePa: number | null
  /** K; isothermal data only */
  nominalTemperatureK?: number | null
  vaporModel?: DataSet['vaporModel']
  apparatusNotes: string | null
  projectRef: string | null
  /** where the numbers come from (default: measured here by GC), with a citation for literature data */
  origin?: DataSet['origin']
  originMethod?: string | null
  citation?: DataSet['citation']
  layout?: DataSet['layout']
}

/** POST …/fits body: models, NRTL α (dimensionless) held or fitted. */
export interface FitRequest {
  models: Exclude<ModelName, 'ideal'>[]
  objective?: 'bubble-point' | 'bubble-pressure' | 'activity'
  alpha?: number
  fitAlpha?: boolean
}

/**
 * A fit's ±2σ band as the server computed it: the T–x–y band at a pressure (isobaric data, or any data asked at a
 * pressure) or the P–x–y band at an isothermal data set's temperature (pressures in Pa).
 */
export type FitBand = {
  fitId: string
  model: ModelName
  /** what the band means, from the server */
  note: string
  /** the vapour model the fit (and so the band) was computed under, in words */
  vapour?: string
} & ((PredictionBand & { kind?: 'isobaric' }) | (PredictionBandIsothermal & { kind: 'isothermal' }))

/** A liquid composition to measure next, with its bubble T (K), predicted y1 and σy there before measuring. */
export interface SuggestedComposition {
  x1: number
  T: number
  y1: number
  sigmaY: number
}

/** Where to measure next as the server planned it: the picks, the range and distance used, and its notes. */
export interface NextCompositions {
  items: SuggestedComposition[]
  P: number
  fitId: string
  criterion: SuggestionCriterionName
  range: [number, number]
  exclusion: number
  notes: string[]
}

/** One pure-component boiling point compared with the vapour-pressure set: T, Tmodel, dT in K, P in Pa. */
export interface PureCheck {
  component: 1 | 2
  T: number
  P: number
  Tmodel: number
  dT: number
  passed: boolean
  source: 'point' | 'pure-measurement'
  pointId?: string
  measurementId?: string
}

export interface PureCheckResult {
  toleranceK: number
  passed: boolean
  checks: PureCheck[]
  warnings: string[]
  components: [string, string]
}

const base = '/api/data-sets'

async function getDetail(id: string): Promise<DataSetDetail> {
  const {
    system,
    points,
    fits,
    consistency,
    approvals,
    comments,
    uploads,
    versions,
    calibrations,
    vapourCorrection,
    ...dataSet
  } = await api.get<DetailAnswer>(`${base}/${id}`)
  return {
    dataSet: dataSet as DataSet,
    system,
    points,
    fits,
    consistency,
    approvals,
    comments: comments ?? [],
    uploads: uploads ?? [],
    versions: versions ?? [],
    calibrations: calibrations ?? [],
    vapourCorrection: vapourCorrection ?? null,
  }
}

export const datasetsApi = {
  list: ({ limit, offset, ...q }: DataSetListQuery) =>
    api.get<{ items: DataSetListItem[]; total: number }>(
      base + query({ ...q, page: Math.floor(offset / limit) + 1, pageSize: limit }),
    ),
  create: (body: NewDataSet) => api.post<DataSet>(base, body, { quiet: true }),
  get: getDetail,
  update: (id: string, body: Partial<Omit<NewDataSet, 'systemId'>> & { rowVersion: number }) =>
    api.patch<DataSet>(`${base}/${id}`, body, { quiet: true }),
  exclude: (id: string, pointId: string, rowVersion: number, excluded: boolean, reason: string | null) =>
    api.patch<Point>(`${base}/${id}/points/${pointId}`, { rowVersion, excluded, reason }, { quiet: true }),
  runFits: (id: string, req: FitRequest) =>
    api.post<{ fits: Fit[]; rowVersion: number }>(`${base}/${id}/fits`, req, { quiet: true }),
  recommend: (id: string, fitId: string) => api.post<DataSet>(`${base}/${id}/recommended-fit`, { fitId }),
  runConsistency: (id: string, model?: ModelName) =>
    api.post<{ items: ConsistencyResult[] }>(`${base}/${id}/consistency`, model ? { model } : {}, { quiet: true }),
  submit: (id: string, rowVersion: number) =>
    api.post<DataSet & { notifiedLeadChemists?: number }>(`${base}/${id}/submit`, { rowVersion }),
  deleteFit: (id: string, fitId: string) =>
    api.del<{ deleted: string; rowVersion: number }>(`${base}/${id}/fits/${fitId}`),
  revise: (id: string) => api.post<DataSet>(`${base}/${id}/revise`),
  band: (id: string, fitId: string) => api.get<FitBand>(`${base}/${id}/fits/${fitId}/band`, { quiet: true }),
  nextCompositions: (
    id: string,
    fitId: string,
    count = 5,
    criterion: SuggestionCriterionName = 'sigma-y',
    limits: { from?: number; to?: number; exclusion?: number } = {},
  ) =>
    api.get<NextCompositions>(
      `${base}/${id}/fits/${fitId}/next-compositions` + query({ count, criterion, ...limits }),
      { quiet: true },
    ),
  pureComponentCheck: (id: string) => api.get<PureCheckResult>(`${base}/${id}/pure-component-check`, { quiet: true }),
  pointsCsvUrl: (id: string) => `${base}/${id}/export/points.csv`,
  /** the printed report (PDF) of a version; each download is registered with its own report id */
  reportPdfUrl: (id: string) => `${base}/${id}/report.pdf`,
  audit: (id: string) => api.get<{ items: AuditEntry[] }>(`${base}/${id}/audit`),
  uploadUrl: (uploadId: string) => `/api/uploads/${uploadId}/content`,
}
