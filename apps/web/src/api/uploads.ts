/** GC file uploads: preview (nothing stored) and commit (all or nothing). */
import type { CalibrationSummaryDto, UploadProblemDto } from '@ebullio/schemas'
import { api, ApiError, query } from './client'

/** One thing wrong with an uploaded file (line, column, value, message, severity): the shared wire type. */
export type UploadProblem = UploadProblemDto

/** A stored calibration as a person recognises it: file, date, model, coefficients ± u, calibrated range, use. */
export type CalibrationSummary = CalibrationSummaryDto

/** Which injections of a sample its compositions rest on (a file with errors drops lines). */
export interface SampleCoverage {
  liquid: { used: number; of: number }
  vapour: { used: number; of: number }
  /** lines whose phase could not be read */
  unreadRows: number[]
}

/** A sample's composition computed from its areas: mole fractions with standard uncertainties. */
export interface PreviewSample {
  label: string
  rows: number[]
  temperatureK?: number | null
  pressurePa?: number | null
  x1?: number | null
  x1Uncertainty?: number | null
  y1?: number | null
  y1Uncertainty?: number | null
  coverage?: SampleCoverage
  /** lines of this sample with an error */
  errorRows?: number[]
  /** some line of the sample was not used or has an error */
  partial?: boolean
  /** the analyst saw two liquid layers: x1 is the overall liquid */
  heterogeneous?: boolean
  /** both layers when analysed, x1 ascending */
  liquidPhases?: { x1: number; uncertainty: number; layer: 'upper' | 'lower' }[] | null
  /** a sample of one pure component: x1 = y1 = 1 or 0 exactly, not read through the calibration */
  pureComponent?: 1 | 2 | null
  [k: string]: unknown
}

/** A check standard of a run file read with the run's calibration (stored for the GC method's control chart). */
export interface PreviewCheck {
  label: string
  rows: number[]
  knownX1: number
  measuredX1: number
  x1Uncertainty: number
  replicateRsd: number | null
  deviation: number
}

/** Which page of a bounded preview is shown; counts cover the whole file. */
export interface PreviewPaging {
  page: number
  pageSize: number
  pages: number
  rowCount: number
  problemCount: number
}

export interface UploadPreview {
  kind: 'calibration' | 'run' | 'points'
  /** run and calibration previews answer one page of rows and samples (or standards) at a time */
  paging?: PreviewPaging
  sampleCount?: number
  standardCount?: number
  /** the token the commit call refers to (the server keeps the bytes until then), when the server uses one */
  previewId?: string
  fileName?: string
  header: string[]
  rows: { line: number; cells: string[] }[]
  mapping: Record<string, string>
  extraColumns: string[]
  samples?: PreviewSample[]
  /** run preview: the check standards of the file (phase `check`) */
  checks?: PreviewCheck[]
  standards?: {
    label: string
    basis?: string
    fraction1?: number
    injections?: { injection: number; area1: number; area2: number; row: number }[]
    [k: string]: unknown
  }[]
  calibration?: {
    model: string
    coefficients: number[]
    coefficientNames: string[]
    standardErrors: number[]
    rSquared: number
    calibratedRange: { x1: [number, number] }
    [k: string]: unknown
  } | null
  file?: { name: string; sizeBytes: number; sha256: string }
  format?: { delimiter: string; decimalComma: boolean; byteOrderMark: boolean }
  /** counts over the whole file (the `problems` listed may be the first ones only) */
  errorCount?: number
  warningCount?: number
  calibrationId?: string
  /** run preview: the calibration the compositions are computed with */
  calibrationUsed?: CalibrationSummary
  /** calibration preview: the active calibration committing would replace (null: none) */
  replaces?: CalibrationSummary | null
  /** calibration preview: the lab's replicate RSD limit (fraction) the standards are judged against */
  replicateRsdLimit?: number
  problems: UploadProblem[]
}

export type UploadKind = 'calibration' | 'run'

/**
 * POST a file with progress. fetch() cannot report upload progress, so this one call uses XMLHttpRequest;
 * errors become ApiError exactly as in client.ts.
 */
function send<T>(url: string, form: FormData, onProgress?: (fraction: number) => void): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open('POST', url)
    xhr.withCredentials = true
    xhr.setRequestHeader('Accept', 'application/json')
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress?.(e.loaded / e.total)
    xhr.onerror = () =>
      reject(new ApiError(0, 'network', 'The server cannot be reached. Check your connection and try again.'))
    xhr.onload = () => {
      let data: unknown
      try {
        data = JSON.parse(xhr.responseText)
      } catch {
        data = null
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(data as T)
      const e = (data as { error?: { code: string; message: string; details: unknown } } | null)?.error
      reject(
        new ApiError(
          xhr.status,
          e?.code ?? 'http_' + xhr.status,
          e?.message ?? `The server answered ${xhr.status}.`,
          e?.details ?? null,
        ),
      )
    }
    xhr.send(form)
  })
}

function form(file: File, fields: Record<string, string | undefined>): FormData {
  const f = new FormData()
  for (const [k, v] of Object.entries(fields)) if (v !== undefined) f.set(k, v)
  f.set('file', file, file.name)
  return f
}

export interface GcMethodOption {
  id: string
  name: string
  detector: 'FID' | 'TCD'
}

export interface ActiveCalibration {
  id: string
  gcMethodId: string
  model: string
  rangeMin: number
  rangeMax: number
  status: 'active' | 'retired'
  createdAt: string
}

/** Where a preview or commit of each kind goes (issue 5: run sheets belong to a data set, calibrations to a system and GC method). */
const target = (dataSetId: string, kind: UploadKind) =>
  kind === 'run' ? `/api/data-sets/${dataSetId}/uploads` : '/api/calibrations'

export const uploadsApi = {
  /** Parse and check a file; nothing is stored. */
  preview: (
    dataSetId: string,
    kind: UploadKind,
    file: File,
    fields: Record<string, string | undefined>,
    onProgress?: (f: number) => void,
  ) => send<UploadPreview>(`${target(dataSetId, kind)}/preview`, form(file, fields), onProgress),
  /** Store the file and everything parsed from it, in one transaction. */
  commit: (
    dataSetId: string,
    kind: UploadKind,
    file: File,
    fields: Record<string, string | undefined>,
    onProgress?: (f: number) => void,
  ) =>
    send<{ uploadId?: string; pointCount?: number; id?: string; [k: string]: unknown }>(
      target(dataSetId, kind),
      form(file, fields),
      onProgress,
    ),
  gcMethods: () => api.get<{ items: GcMethodOption[] }>('/api/gc-methods'),
  calibrations: (systemId: string) =>
    api.get<{ items: ActiveCalibration[] }>(`/api/calibrations${query({ systemId, status: 'active' })}`),
  originalUrl: (uploadId: string) => `/api/uploads/${uploadId}/file`,
}
