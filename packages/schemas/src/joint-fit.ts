import { z } from 'zod'
import type { FitParameterDto, FitStatisticsDto, SetVapourCorrectionDto } from './dto.js'
import { FIT_MODEL_LABELS, labelWithNote } from './fit-label.js'
import { labId, PRESSURE_UNITS } from './lab.js'
import type { DataKind, VaporModelChoice } from './data-kind.js'

/**
 * A system's joint parameter sets: one NRTL, Wilson or UNIQUAC parameter set fitted over several data sets of one system
 * (thermo's fitJoint), signed by a lead chemist as the system's recommended parameter set. Units: T in K, P in Pa,
 * energies J/mol, their temperature terms J/(mol·K) about 298.15 K.
 */

/** The models a joint fit offers: those with temperature-dependent energies in thermo. */
export const JOINT_FIT_MODELS = ['nrtl', 'wilson', 'uniquac'] as const
export type JointFitModel = (typeof JOINT_FIT_MODELS)[number]
export const JOINT_FIT_STATES = ['draft', 'submitted', 'returned', 'approved', 'superseded'] as const
export type JointFitStateName = (typeof JOINT_FIT_STATES)[number]

/** POST /api/systems/:id/joint-fits: the data sets (2–12, no repeats), the model, NRTL α (held). */
export const jointFitRequestSchema = z.object({
  dataSetIds: z
    .array(labId('data set'))
    .min(2, 'Choose at least two data sets for a joint fit')
    .max(12, 'Choose at most 12 data sets for a joint fit')
    .refine((ids) => new Set(ids).size === ids.length, 'A data set is chosen twice'),
  model: z.enum(JOINT_FIT_MODELS, { message: 'The model must be NRTL, Wilson or UNIQUAC' }),
  alpha: z
    .number()
    .gt(0, 'NRTL α must be above 0 and at most 1')
    .max(1, 'NRTL α must be above 0 and at most 1')
    .optional(),
  temperatureDependent: z.boolean().default(true),
})
export type JointFitRequest = z.input<typeof jointFitRequestSchema>

/** POST /api/joint-fits/:id/submit */
export const jointFitSubmitSchema = z.object({ rowVersion: z.number().int().min(1) })

/** POST /api/joint-fits/:id/approve: the e-signature (password re-entered) with its reason. */
export const jointFitSignatureSchema = z.object({
  password: z.string().min(1, 'Re-enter your password to sign').max(200),
  reason: z.string().trim().max(2000).min(1, 'Give the reason for your signature'),
  rowVersion: z.number().int().min(1),
})

/**
 * POST /api/joint-fits/:id/return: a lead chemist returns a submitted joint fit for rework, signed (password
 * re-entered) with the reason its author reads in the mail.
 */
export const jointFitReturnSchema = z.object({
  password: z.string().min(1, 'Re-enter your password to sign').max(200),
  reason: z
    .string()
    .trim()
    .max(2000, 'Say what must be reworked in at most 2000 characters')
    .min(1, 'Say what must be reworked'),
  rowVersion: z.number().int().min(1),
})

/** GET /api/systems/:id/recommended-parameters/curve query: pressure in `unit` (default kPa), grid points. */
export const recommendedCurveQuerySchema = z.object({
  pressure: z.coerce.number().positive('Pressure must be positive'),
  unit: z.enum(PRESSURE_UNITS).default('kPa'),
  points: z.coerce.number().int().min(3).max(1001).default(101),
})

/**
 * One data set's statistics under the joint parameters (dT, dP, dy = measured − calculated; fitted points only). An
 * isothermal member has dP (Pa) and no dT (rmsT, biasT null); joint fits run before isothermal members have no kind.
 */
export interface JointFitDataSetStatsDto {
  kind?: 'isobaric' | 'isothermal'
  n: number
  rmsT: number | null
  rmsY: number | null
  biasT: number | null
  biasY: number | null
  /** Pa, isothermal members only */
  rmsP?: number
  biasP?: number
  Tmin: number
  Tmax: number
  Pmin: number
  Pmax: number
}

/** A contributing data set of a joint fit, with the point set it was fitted on and whether it has changed since. */
export interface JointFitMemberDto {
  dataSetId: string
  title: string
  version: number
  state: string
  nominalPressurePa: number | null
  /** isobaric (txy, tx) or isothermal (pxy, px) */
  kind: 'isobaric' | 'isothermal'
  /** K, isothermal members */
  nominalTemperatureK: number | null
  /** the data set's vapour model now */
  vaporModel: { kind: string } & Record<string, unknown>
  pointSetDigest: string
  /** how pointSetDigest was computed: 'ebullio-point-set/1' (the points alone) or 'ebullio-joint-member/2' */
  digestFormat: string
  pointCount: number
  /** true when the data set's points (or, format 2, its kind, temperature or vapour model) changed since the run */
  stale: boolean
  statistics: JointFitDataSetStatsDto
}

/** The range the parameters were fitted over (K, Pa): use them inside it only. */
export interface JointFitRangeDto {
  Tmin: number
  Tmax: number
  Pmin: number
  Pmax: number
}

export interface JointFitSignatureDto<D = string> {
  id: string
  signerId: string
  signerName: string
  meaning: 'approved' | 'returned for rework'
  reason: string
  digest: string
  digestAlgorithm: string
  changes: { userId: string; name: string; changes: string[] }[]
  selfApproval: boolean
  signedAt: D
}

/** A joint fit as the API answers it. */
export interface JointFitDto<D = string> {
  id: string
  systemId: string
  model: JointFitModel
  options: Record<string, unknown>
  /** thermo's ActivityModel with b12T, b21T (NRTL) or a12T, a21T (Wilson, UNIQUAC; UNIQUAC with r1, r2, q1, q2) */
  activity: Record<string, unknown> & { kind: string }
  parameters: FitParameterDto[]
  statistics: FitStatisticsDto & { covariance?: number[][]; correlation?: number[][] }
  range: JointFitRangeDto
  state: JointFitStateName
  runBy: string
  runByName: string
  runAt: D
  submittedAt: D | null
  approvedAt: D | null
  supersededAt: D | null
  supersededBy: string | null
  rowVersion: number
  members: JointFitMemberDto[]
  /** true when any contributing data set's points changed since the run */
  stale: boolean
  signatures: JointFitSignatureDto<D>[]
}

/** The system's signed recommended parameter set as the engineers read it (no draft data set named). */
export interface RecommendedParameterSetDto<D = string> {
  id: string
  systemId: string
  model: JointFitModel
  /** {@link jointFitLabel} of the set, e.g. "NRTL (joint, 2 data sets)" */
  label: string
  activity: Record<string, unknown> & { kind: string }
  parameters: FitParameterDto[]
  range: JointFitRangeDto
  approvedAt: D | null
  signedBy: string | null
  digest: string | null
  /** the vapour model the set was fitted under (and its curves are computed with) */
  vaporModel: VaporModelChoice
  /** thermo's vapour as the fit used it (a virial vapour with the components' critical data it read), for clients that compute with the set */
  vapor: { kind: string } & Record<string, unknown>
  /** the contributing data sets in fit order, each with its kind and the condition it was measured at */
  dataSets: {
    dataSetId: string
    title: string
    version: number
    /** isobaric (T–x–y, T–x) or isothermal (P–x–y, P–x) */
    kind: DataKind
    /** Pa: the nominal pressure (isobaric; an isothermal set may record one too) */
    nominalPressurePa: number | null
    /** K: the temperature of an isothermal set, else null */
    nominalTemperatureK: number | null
    pointCount: number
  }[]
  /**
   * How far a virial vapour moves each member's bubble points under the set's model (answered where an engineer
   * computes with the set: the parameters export and the recommended-parameters route); null when it cannot be had.
   */
  vapourCorrection?: SetVapourCorrectionDto | null
}

/**
 * Name of a joint parameter set for legends, tables and exports, in the style of the lab screens' fit names
 * (fitLabel: "NRTL #2 (α = 0.3)"): "NRTL (joint, 2 data sets)", "Wilson (joint, constant energies, 3 data sets)".
 * Notes are merged into the parentheses: "NRTL (joint, 2 data sets; recommended for the system)".
 */
export function jointFitLabel(
  f: { model: JointFitModel; dataSetCount: number; temperatureDependent?: boolean },
  note?: string,
) {
  const words = ['joint', ...(f.temperatureDependent === false ? ['constant energies'] : [])]
  words.push(`${f.dataSetCount} data set${f.dataSetCount === 1 ? '' : 's'}`)
  const label = `${FIT_MODEL_LABELS[f.model] ?? f.model} (${words.join(', ')})`
  return note ? labelWithNote(label, note) : label
}

/**
 * Slack on the fitted pressure range: the points of one "1 atm" data set scatter with the barometer, so a pressure
 * within 0.5 % of the range's ends counts as inside (common practice, no source).
 */
export const PRESSURE_RANGE_SLACK = 0.005

/** Whether P (Pa) lies inside the pressure range a parameter set was fitted on, else below or above it. */
export function pressureAgainstRange(P: number, range: { Pmin: number; Pmax: number }): 'inside' | 'below' | 'above' {
  if (P < range.Pmin * (1 - PRESSURE_RANGE_SLACK)) return 'below'
  if (P > range.Pmax * (1 + PRESSURE_RANGE_SLACK)) return 'above'
  return 'inside'
}

/**
 * A contributing data set's kind and the condition it was measured at, in SI words for records and exports:
 * "isobaric at 101.325 kPa", "isothermal at 328.15 K (55.00 °C)".
 */
export function memberConditionText(m: {
  kind: 'isobaric' | 'isothermal'
  nominalPressurePa: number | null
  nominalTemperatureK: number | null
}): string {
  if (m.kind === 'isothermal')
    return m.nominalTemperatureK === null
      ? 'isothermal (temperature not recorded)'
      : `isothermal at ${m.nominalTemperatureK.toFixed(2)} K (${(m.nominalTemperatureK - 273.15).toFixed(2)} °C)`
  return m.nominalPressurePa === null
    ? 'isobaric (pressure not recorded)'
    : `isobaric at ${(m.nominalPressurePa / 1000).toFixed(3)} kPa`
}
