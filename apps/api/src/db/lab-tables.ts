import type { ComponentProperties } from '@ebullio/schemas'
/**
 * Tables of the lab workflow, typed for Kysely (see db/migrations/20261201_02_lab_data.ts).
 * Quantities in SI: temperatures in K, pressures in Pa, compositions as mole fractions of component 1.
 */
import type { ColumnType, Generated, Insertable, Selectable, Updateable } from 'kysely'

type Timestamp = ColumnType<Date, Date | string, Date | string>
/** A timestamp the database fills (default now()). */
type DefaultTimestamp = ColumnType<Date, Date | string | undefined, Date | string>
/** jsonb: written as a JSON string or value, read back parsed. */
type Json<T> = ColumnType<T, T | string, T | string>

export type DataSetState = 'draft' | 'submitted' | 'approved' | 'returned' | 'superseded'
export type SignatureMeaning = 'approved' | 'returned for rework'

export interface ComponentTable {
  id: Generated<string>
  name: string
  cas_number: string | null
  formula: string | null
  /** g/mol */
  molar_mass: number
  /** cm³/mol at about 25 °C */
  liquid_molar_volume: number | null
  /** Critical constants and structure parameters (ComponentProperties), null when not entered. */
  properties: ComponentProperties | null
  created_by: string | null
  created_at: DefaultTimestamp
  row_version: Generated<number>
}

export interface VaporPressureSetTable {
  id: Generated<string>
  component_id: string
  kind: 'antoine' | 'clausius-clapeyron'
  /** thermo's VaporPressureModel, as published */
  parameters: Json<Record<string, unknown>>
  range_min: number | null
  range_max: number | null
  range_unit: 'C' | 'K' | null
  source: string
  preferred: Generated<boolean>
  entered_by: string | null
  created_at: DefaultTimestamp
}

export interface PureMeasurementTable {
  id: Generated<string>
  component_id: string
  temperature_k: number
  pressure_pa: number
  note: string | null
  measured_by: string | null
  created_at: DefaultTimestamp
  /** 20261203_11d */
  thermometer: string | null
  still: string | null
  measured_on: ColumnType<string | null, string | null | undefined, string | null>
  upload_id: string | null
  data_set_id: string | null
  row_ref: number | null
}

/** A thermometer or barometer check: a reference liquid boiled at the day's pressure (20261203_11d). */
export interface CheckMeasurementTable {
  id: Generated<string>
  kind: 'thermometer' | 'barometer'
  instrument: string
  component_id: string
  temperature_k: number
  pressure_pa: number
  measured_at: Timestamp
  note: string | null
  measured_by: string | null
  created_at: DefaultTimestamp
}

/** A GC check standard read with a run's calibration (20261204_11d2). */
export interface CheckStandardResultTable {
  id: Generated<string>
  gc_method_id: string
  calibration_id: string
  upload_id: string
  data_set_id: string | null
  label: string
  known_x1: number
  measured_x1: number
  x1_uncertainty: number
  replicate_rsd: number | null
  injections: Json<{ injection: number; area1: number; area2: number; row: number }[]>
  row_refs: number[]
  measured_at: DefaultTimestamp
  recorded_by: string | null
}

export interface BinarySystemTable {
  id: Generated<string>
  component1_id: string
  component2_id: string
  notes: string | null
  created_by: string | null
  created_at: DefaultTimestamp
}

export interface GcMethodTable {
  id: Generated<string>
  name: string
  detector: 'FID' | 'TCD'
  column_description: string | null
  conditions: string | null
  created_by: string | null
  created_at: DefaultTimestamp
  /** 20261201_04: a retired method's calibrations are all retired and no new one can be made active. */
  status: Generated<'active' | 'retired'>
  retired_at: Timestamp | null
  retired_by: string | null
}

export interface UploadTable {
  id: Generated<string>
  kind: 'calibration' | 'run' | 'points'
  original_name: string
  content_type: string
  size_bytes: number
  sha256: string
  content: Buffer
  uploaded_by: string
  uploaded_at: DefaultTimestamp
  data_set_id: string | null
}

export interface CalibrationTable {
  id: Generated<string>
  gc_method_id: string
  system_id: string
  model: 'response-factor' | 'linear' | 'quadratic'
  /** thermo's fitCalibration result */
  result: Json<Record<string, unknown>>
  range_min: number
  range_max: number
  status: Generated<'active' | 'retired'>
  upload_id: string
  created_by: string
  created_at: DefaultTimestamp
  retired_at: Timestamp | null
}

export interface CalibrationStandardTable {
  id: Generated<string>
  calibration_id: string
  label: string
  basis: 'mole' | 'mass'
  fraction1: number
  x1: number
}

export interface CalibrationInjectionTable {
  id: Generated<string>
  standard_id: string
  injection_no: number
  area1: number
  area2: number
  row_ref: number
}

export interface DataSetTable {
  id: Generated<string>
  lineage_id: string
  version: Generated<number>
  previous_version_id: string | null
  system_id: string
  title: string
  state: Generated<DataSetState>
  /** null for isothermal data (20261204_13p) */
  nominal_pressure_pa: number | null
  apparatus_notes: string | null
  project_ref: string | null
  recommended_fit_id: string | null
  created_by: string
  created_at: DefaultTimestamp
  updated_at: DefaultTimestamp
  submitted_at: Timestamp | null
  approved_at: Timestamp | null
  superseded_at: Timestamp | null
  row_version: Generated<number>
  /** 20261203_11d: where the numbers come from, and the layout of the points */
  origin: Generated<'gc' | 'other-method' | 'literature'>
  origin_method: string | null
  citation: Json<DataSetCitation> | null
  counts_as_own: Generated<boolean>
  counts_as_own_by: string | null
  counts_as_own_reason: string | null
  layout: Generated<'txy' | 'tx' | 'pxy' | 'px'>
  /** 20261204_13p: isothermal data's temperature (K), and the vapour model chosen */
  nominal_temperature_k: number | null
  vapor_model: ColumnType<DataSetVaporModel, DataSetVaporModel | string | undefined, DataSetVaporModel | string>
}

export type DataSetVaporModel =
  | { kind: 'ideal' }
  | {
      kind: 'virial'
      correlation: 'tsonopoulos' | 'hayden-oconnell'
      poynting: boolean
      /** Hayden–O'Connell only (20261204_13h): the unlike pair's solvation parameter and its source */
      eta12?: number
      eta12Source?: string
    }

export interface DataSetCitation {
  authors: string
  title: string
  source: string
  year: number
  volume: string | null
  pages: string | null
  doi: string | null
  table: string | null
}

export interface PointTable {
  id: Generated<string>
  data_set_id: string
  seq: number
  sample_label: string
  temperature_k: number
  pressure_pa: number
  x1: number
  x1_uncertainty: number
  y1: number | null
  y1_uncertainty: number | null
  /** σP of the measured pressure, Pa (20261204_13p) */
  pressure_uncertainty_pa: ColumnType<number | null, number | null | undefined, number | null>
  excluded: Generated<boolean>
  exclusion_reason: string | null
  upload_id: string | null
  calibration_id: string | null
  /** line numbers of the raw rows in the uploaded file */
  row_refs: number[]
  created_at: DefaultTimestamp
  /** two liquid layers in the still (migration 20261203_10p) */
  heterogeneous: Generated<boolean>
  /** the layers' x1, I < II, with standard uncertainties; all null unless analysed */
  x1_phase_i: number | null
  x1_phase_i_uncertainty: number | null
  x1_phase_ii: number | null
  x1_phase_ii_uncertainty: number | null
}

export interface PointInjectionTable {
  id: Generated<string>
  point_id: string
  /** upper and lower: the separated layers of a two-layer liquid */
  phase: 'liquid' | 'vapour' | 'upper' | 'lower'
  injection_no: number
  area1: number
  area2: number
  row_ref: number
}

export interface FitTable {
  id: Generated<string>
  data_set_id: string
  model: 'margules' | 'van-laar' | 'wilson' | 'nrtl' | 'uniquac'
  options: Json<Record<string, unknown>>
  activity: Json<Record<string, unknown>>
  parameters: Json<{ name: string; value: number; standardError: number | null; atBound?: boolean }[]>
  statistics: Json<Record<string, unknown>>
  residuals: Json<Record<string, unknown>[]>
  point_ids: string[]
  run_by: string
  run_at: DefaultTimestamp
  /** SHA-256 of the point set the fit was computed on (services/point-set.ts); null before it was kept */
  point_set_digest: string | null
  /** included points of that point set */
  point_count: number | null
}

export interface ConsistencyResultTable {
  id: Generated<string>
  data_set_id: string
  test: 'herington-area' | 'redlich-kister-area' | 'point' | 'quality-score'
  passed: boolean
  result: Json<Record<string, unknown>>
  run_by: string
  run_at: DefaultTimestamp
  /** SHA-256 of the point set the tests ran on; null before it was kept */
  point_set_digest: string | null
  /** included points of that point set */
  point_count: number | null
}

export interface CommentTable {
  id: Generated<string>
  data_set_id: string
  point_id: string | null
  parent_id: string | null
  author_id: string
  body: string
  resolved: Generated<boolean>
  resolved_by: string | null
  resolved_at: Timestamp | null
  created_at: DefaultTimestamp
}

export interface ApprovalTable {
  id: Generated<string>
  data_set_id: string
  signer_id: string
  meaning: SignatureMeaning
  reason: string
  /** SHA-256 (hex) of the canonical signed content */
  digest: string
  self_approval: Generated<boolean>
  override_reason: string | null
  signed_at: DefaultTimestamp
  /** the outlier flags as signed ({ fitId, model, pointIds, sampleLabels, rule }); null before they were kept */
  outliers: Json<unknown> | null
  /** how `digest` was computed: 'ebullio-signed-content/1' (sorted-key JSON) or '/2' (RFC 8785) */
  digest_algorithm: Generated<string>
  /** the point set the signature covers (null for format 1) */
  point_set_digest: string | null
  /** who changed what in the signed version ([{ userId, name, changes }]); null for format 1 */
  changes: Json<unknown> | null
}

export interface AuditLogTable {
  id: Generated<string>
  at: DefaultTimestamp
  actor_id: string | null
  entity: string
  entity_id: string
  action: string
  data_set_id: string | null
  before: Json<unknown> | null
  after: Json<unknown> | null
}

/** Every lab table, merged into the app's Database interface. */
export interface LabTables {
  component: ComponentTable
  vapor_pressure_set: VaporPressureSetTable
  pure_measurement: PureMeasurementTable
  check_measurement: CheckMeasurementTable
  check_standard_result: CheckStandardResultTable
  binary_system: BinarySystemTable
  gc_method: GcMethodTable
  upload: UploadTable
  calibration: CalibrationTable
  calibration_standard: CalibrationStandardTable
  calibration_injection: CalibrationInjectionTable
  data_set: DataSetTable
  point: PointTable
  point_injection: PointInjectionTable
  fit: FitTable
  consistency_result: ConsistencyResultTable
  comment: CommentTable
  approval: ApprovalTable
  audit_log: AuditLogTable
}

export type Component = Selectable<ComponentTable>
export type NewComponent = Insertable<ComponentTable>
export type ComponentUpdate = Updateable<ComponentTable>
export type VaporPressureSet = Selectable<VaporPressureSetTable>
export type NewVaporPressureSet = Insertable<VaporPressureSetTable>
export type PureMeasurement = Selectable<PureMeasurementTable>
export type NewPureMeasurement = Insertable<PureMeasurementTable>
export type BinarySystemRow = Selectable<BinarySystemTable>
export type NewBinarySystem = Insertable<BinarySystemTable>
export type GcMethod = Selectable<GcMethodTable>
export type NewGcMethod = Insertable<GcMethodTable>
export type Upload = Selectable<UploadTable>
export type NewUpload = Insertable<UploadTable>
export type Calibration = Selectable<CalibrationTable>
export type NewCalibration = Insertable<CalibrationTable>
export type CalibrationUpdate = Updateable<CalibrationTable>
export type CalibrationStandard = Selectable<CalibrationStandardTable>
export type NewCalibrationStandard = Insertable<CalibrationStandardTable>
export type CalibrationInjection = Selectable<CalibrationInjectionTable>
export type NewCalibrationInjection = Insertable<CalibrationInjectionTable>
export type DataSet = Selectable<DataSetTable>
export type NewDataSet = Insertable<DataSetTable>
export type DataSetUpdate = Updateable<DataSetTable>
export type Point = Selectable<PointTable>
export type NewPoint = Insertable<PointTable>
export type PointUpdate = Updateable<PointTable>
export type PointInjection = Selectable<PointInjectionTable>
export type NewPointInjection = Insertable<PointInjectionTable>
export type Fit = Selectable<FitTable>
export type NewFit = Insertable<FitTable>
export type ConsistencyResult = Selectable<ConsistencyResultTable>
export type NewConsistencyResult = Insertable<ConsistencyResultTable>
export type Comment = Selectable<CommentTable>
export type NewComment = Insertable<CommentTable>
export type CommentUpdate = Updateable<CommentTable>
export type Approval = Selectable<ApprovalTable>
export type NewApproval = Insertable<ApprovalTable>
export type AuditEntry = Selectable<AuditLogTable>
export type NewAuditEntry = Insertable<AuditLogTable>
export type CheckMeasurement = Selectable<CheckMeasurementTable>
