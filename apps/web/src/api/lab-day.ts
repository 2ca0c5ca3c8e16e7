/**
 * Systems from components, deleting drafts, points entered directly (grid or point sheet), the origin mark of
 * literature data, pure-component boiling points and thermometer / barometer checks. T in K, P in Pa.
 */
import type { Citation, DataLayout, DataOrigin, DirectPoint } from '@ebullio/schemas'
import { api, query } from './client'
import type { DataSet, LabSystem } from './datasets'

export interface ProblemRow {
  row: number | null
  column: string | null
  value: string | null
  message: string
  severity: 'error' | 'warning'
}

export interface SheetPreview {
  file: { name: string; sizeBytes: number; sha256: string }
  points: (DirectPoint & { row: number })[]
  problems: ProblemRow[]
  errorCount: number
  warningCount: number
  extraColumns: string[]
}

export interface CheckResult {
  id: string
  kind: 'thermometer' | 'barometer'
  instrument: string
  componentId: string
  componentName: string
  temperatureK: number
  pressurePa: number
  measuredAt: string
  note: string | null
  reference: number | null
  deviation: number | null
  unit: 'K' | 'Pa'
  correlationSource?: string
}

export interface NewCheck {
  kind: 'thermometer' | 'barometer'
  instrument: string
  componentId: string
  temperatureK: number
  pressurePa: number
  measuredAt: string
  note: string | null
}

export interface NewPureMeasurement {
  temperatureK: number
  pressurePa: number
  thermometer: string | null
  still: string | null
  measuredOn: string | null
  note: string | null
}

export interface OriginFields {
  origin: DataOrigin
  originMethod: string | null
  citation: Citation | null
  layout: DataLayout
}

function sheetForm(file: File, rowVersion?: number): FormData {
  const f = new FormData()
  if (rowVersion !== undefined) f.append('rowVersion', String(rowVersion))
  f.append('file', file, file.name)
  return f
}

export const labDayApi = {
  createSystem: (body: { component1Id: string; component2Id: string; notes: string | null }) =>
    api.post<LabSystem>('/api/systems', body, { quiet: true }),
  deleteDraft: (id: string) => api.del<void>(`/api/data-sets/${id}`, { quiet: true }),
  changeSystem: (id: string, rowVersion: number, systemId: string) =>
    api.patch<DataSet>(`/api/data-sets/${id}`, { rowVersion, systemId }, { quiet: true }),
  addPoints: (id: string, rowVersion: number, points: DirectPoint[]) =>
    api.post<{ pointIds: string[]; rowVersion: number }>(
      `/api/data-sets/${id}/points`,
      { rowVersion, points },
      {
        quiet: true,
      },
    ),
  previewSheet: (id: string, file: File) =>
    api.post<SheetPreview>(`/api/data-sets/${id}/point-sheets/preview`, sheetForm(file), { quiet: true }),
  commitSheet: (id: string, file: File, rowVersion: number) =>
    api.post<{ pointIds: string[]; rowVersion: number; uploadId: string }>(
      `/api/data-sets/${id}/point-sheets`,
      sheetForm(file, rowVersion),
      { quiet: true },
    ),
  setOwn: (id: string, rowVersion: number, countsAsOwn: boolean, reason: string) =>
    api.post<DataSet>(`/api/data-sets/${id}/own-measurement`, { rowVersion, countsAsOwn, reason }, { quiet: true }),
  addPureMeasurement: (componentId: string, m: NewPureMeasurement) =>
    api.post<{ id: string }>(`/api/components/${componentId}/pure-measurements`, m, { quiet: true }),
  checks: (o: { kind?: string; instrument?: string } = {}) =>
    api.get<{ items: CheckResult[] }>('/api/check-measurements' + query(o)),
  addCheck: (c: NewCheck) => api.post<CheckResult>('/api/check-measurements', c, { quiet: true }),
}
