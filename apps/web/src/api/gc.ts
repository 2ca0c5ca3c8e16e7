/** GC methods and calibrations (issue 5's `/api/gc-methods` and `/api/calibrations` routes). */
import type { CalibrationDto, GcMethodDto } from '@ebullio/schemas'
import { api, query } from './client'

export type GcMethod = GcMethodDto

/** thermo's fitted Calibration as stored (subset the screens read). */
export interface CalibrationResult {
  model: string
  signalKind?: string
  coefficients: number[]
  coefficientNames: string[]
  standardErrors: number[]
  residualStandardDeviation: number
  degreesOfFreedom: number
  rSquared: number
  repeatability: { ratioRsd: number; degreesOfFreedom: number } | null
  calibratedRange: { x1: [number, number]; signal: [number, number] }
  residuals?: { x1: number; [k: string]: unknown }[]
  warnings: string[]
}

export type Calibration = CalibrationDto<string, CalibrationResult>

export interface CalibrationStandard {
  id: string
  label: string
  basis: 'mole' | 'mass'
  fraction1: number
  x1: number
  injections: { injection: number; area1: number; area2: number; row: number }[]
}

export interface GcMethodInput {
  name: string
  detector: 'FID' | 'TCD'
  columnDescription: string | null
  conditions: string | null
}

/** One check standard of a run, read with the run's calibration (x1 of component 1, mole fractions). */
export interface CheckStandardResult {
  id: string
  label: string
  knownX1: number
  measuredX1: number
  x1Uncertainty: number
  replicateRsd: number | null
  deviation: number
  measuredAt: string
  dataSetId: string | null
  uploadId: string
  calibrationId: string
  rowRefs: number[]
  /** the run rules this result broke, in words (empty when in control) */
  rules: string[]
  outOfControl: boolean
}

/** A GC method's check standards in time order, with the server's chart (null with fewer than two results). */
export interface CheckStandardSeries {
  gcMethodId: string
  gcMethodName: string
  items: CheckStandardResult[]
  chart: { centre: number; sigma: number; baselineCount: number; outOfControl: string[] } | null
  note: string | null
}

export const gcApi = {
  /** Check standards of a GC method; centre and σ from the first `baseline` results (default 20). */
  checkStandards: (id: string, baseline = 20) =>
    api.get<CheckStandardSeries>(`/api/gc-methods/${encodeURIComponent(id)}/check-standards` + query({ baseline })),
  methods: () => api.get<{ items: GcMethod[] }>('/api/gc-methods'),
  createMethod: (body: GcMethodInput) => api.post<GcMethod>('/api/gc-methods', body, { quiet: true }),
  calibrations: (f: { gcMethodId?: string; systemId?: string; status?: 'active' | 'retired' } = {}) =>
    api.get<{ items: Calibration[] }>('/api/calibrations' + query(f)),
  calibration: (id: string) =>
    api.get<Calibration & { standards: CalibrationStandard[]; replicateRsdLimit: number }>(`/api/calibrations/${id}`),
  retire: (id: string) => api.post<{ ok: true }>(`/api/calibrations/${id}/retire`),
  /** Retire a GC method and, with it, its active calibrations. */
  retireMethod: (id: string) => api.post<GcMethod>(`/api/gc-methods/${encodeURIComponent(id)}/retire`),
  /** System names for the calibration table (first 200 systems). */
  systems: () => api.get<{ items: { id: string; name: string }[] }>('/api/systems' + query({ page: 1, pageSize: 200 })),
  /** The uploaded calibration file as received (server names it). */
  uploadUrl: (uploadId: string) => `/api/uploads/${uploadId}/content`,
}
