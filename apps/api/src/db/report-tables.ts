/** Printed reports of data set versions (db/migrations/20261203_11r_report.ts). */
import type { ColumnType, Generated } from 'kysely'

export interface LabReportTable {
  id: Generated<string>
  /** bigserial, read as a string */
  number: Generated<string>
  data_set_id: string
  data_set_version: number
  /** the data set's state when the report was generated */
  data_set_state: string
  /** SHA-256 (hex) of the canonical signed content when the report was generated */
  content_digest: string
  /** the approval the report carries (the latest one of the version), if any */
  approval_id: string | null
  generated_by: string
  generated_at: ColumnType<Date, Date | string | undefined, never>
}

export interface ReportTables {
  lab_report: LabReportTable
}
