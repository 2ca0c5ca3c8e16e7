/** A system's joint parameter sets (db/migrations/20261204_13j_joint_parameter_set.ts). SI units: K, Pa. */
import type { ColumnType, Generated } from 'kysely'

type DefaultTimestamp = ColumnType<Date, Date | string | undefined, Date | string>
type Json<T> = ColumnType<T, T | string, T | string>

export type JointFitState = 'draft' | 'submitted' | 'returned' | 'approved' | 'superseded'

export type MemberDigestFormat = 'ebullio-point-set/1' | 'ebullio-joint-member/2'

export interface JointFitTable {
  id: Generated<string>
  system_id: string
  model: 'nrtl' | 'wilson' | 'uniquac'
  options: Json<Record<string, unknown>>
  /** thermo's ActivityModel with its temperature terms */
  activity: Json<Record<string, unknown>>
  parameters: Json<Record<string, unknown>[]>
  statistics: Json<Record<string, unknown>>
  t_min_k: number
  t_max_k: number
  p_min_pa: number
  p_max_pa: number
  state: Generated<JointFitState>
  run_by: string
  run_at: DefaultTimestamp
  submitted_by: string | null
  submitted_at: Date | null
  approved_at: Date | null
  superseded_at: Date | null
  superseded_by: string | null
  row_version: Generated<number>
}

export interface JointFitMemberTable {
  joint_fit_id: string
  data_set_id: string
  position: number
  point_set_digest: string
  /** how point_set_digest was computed (db/migrations/20261204_jt2_joint_rework_member_format.ts) */
  digest_format: ColumnType<MemberDigestFormat, MemberDigestFormat | undefined, never>
  point_count: number
  statistics: Json<Record<string, unknown>>
}

export interface JointFitApprovalTable {
  id: Generated<string>
  joint_fit_id: string
  signer_id: string
  meaning: 'approved' | 'returned for rework'
  reason: string
  digest: string
  digest_algorithm: string
  changes: Json<{ userId: string; name: string; changes: string[] }[]>
  self_approval: Generated<boolean>
  signed_at: DefaultTimestamp
}

export interface JointFitTables {
  joint_fit: JointFitTable
  joint_fit_member: JointFitMemberTable
  joint_fit_approval: JointFitApprovalTable
}
