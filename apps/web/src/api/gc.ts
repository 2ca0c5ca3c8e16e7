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

export const gcApi = {
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
