import { api } from './client'

/** The verify page's answer for one printed report (GET /api/reports/:id/verify). */
export interface ReportVerification {
  report: {
    id: string
    number: number
    generatedAt: string
    generatedBy: string
    dataSetVersion: number
    /** the data set's state when the report was generated */
    dataSetState: string
    /** SHA-256 printed on the report */
    digest: string
  }
  dataSet: { id: string; title: string; version: number; state: string }
  /** SHA-256 of the stored record now */
  currentDigest: string
  matches: boolean
  signatures: { signerName: string; meaning: string; signedAt: string; digest: string; matches: boolean }[]
}

export const reportsApi = {
  verify: (id: string) => api.get<ReportVerification>(`/api/reports/${encodeURIComponent(id)}/verify`, { quiet: true }),
}
