/**
 * Request schemas of the lab routes (zod). Kept in one file so the web app can share them later
 * (a candidate for packages/schemas). Units: Pa, K, mole fractions, J/mol, as in the engine.
 */
import { z } from 'zod'

export const uuid = (what: string) => z.string().uuid(`Not a ${what} id`)
export const idParams = z.object({ id: uuid('data set') })

const text = (max: number) => z.string().trim().max(max)
const optionalText = (max: number) => text(max).nullable().optional().transform((v) => (v === '' ? null : v ?? null))

export const pageQuery = {
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  order: z.enum(['asc', 'desc']).default('desc'),
}

const casNumber = z.string().trim().regex(/^\d{2,7}-\d{2}-\d$/, 'Write the CAS number as digits in three groups, e.g. 67-64-1').nullable()

export const componentSchema = z.object({
  name: text(120).min(1, 'Enter a name'),
  casNumber: casNumber.optional().transform((v) => v ?? null),
  formula: optionalText(60),
  molarMass: z.number().positive('Molar mass must be positive (g/mol)'),
  liquidMolarVolume: z.number().positive('Liquid molar volume must be positive (cm³/mol)').nullable().optional().transform((v) => v ?? null),
})
export const componentPatchSchema = z.object({
  rowVersion: z.number().int().min(1),
  name: text(120).min(1).optional(),
  casNumber: casNumber.optional(),
  formula: text(60).nullable().optional(),
  molarMass: z.number().positive().optional(),
  liquidMolarVolume: z.number().positive().nullable().optional(),
})
export const componentQuery = z.object({
  q: z.string().trim().max(100).optional(),
  sort: z.enum(['name', 'created_at', 'molar_mass']).default('name'),
  ...pageQuery,
  order: z.enum(['asc', 'desc']).default('asc'),
})

const range = z.tuple([z.number(), z.number()]).refine(([a, b]) => a < b, 'The range must run from low to high').optional()
export const vaporPressureModelSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('antoine'), A: z.number(), B: z.number(), C: z.number(), log: z.enum(['log10', 'ln']),
    pressureUnit: z.enum(['Pa', 'kPa', 'bar', 'mmHg', 'atm']), temperatureUnit: z.enum(['C', 'K']), range,
  }),
  z.object({ kind: z.literal('clausius-clapeyron'), Tref: z.number().positive(), Pref: z.number().positive(), dHvap: z.number().positive(), range }),
])
export const vaporPressureSetSchema = z.object({
  model: vaporPressureModelSchema,
  source: text(400).min(1, 'Name the source (book, edition, table) of the constants'),
  preferred: z.boolean().default(true),
})
export const pureMeasurementSchema = z.object({
  temperatureK: z.number().positive('Temperature must be positive (K)'),
  pressurePa: z.number().positive('Pressure must be positive (Pa)'),
  note: optionalText(400),
})

export const systemSchema = z.object({ component1Id: uuid('component'), component2Id: uuid('component'), notes: optionalText(1000) })
export const systemQuery = z.object({ q: z.string().trim().max(100).optional(), ...pageQuery })

export const gcMethodSchema = z.object({
  name: text(120).min(1, 'Enter a name'),
  detector: z.enum(['FID', 'TCD']),
  columnDescription: optionalText(400),
  conditions: optionalText(2000),
})
export const calibrationQuery = z.object({
  gcMethodId: uuid('GC method').optional(), systemId: uuid('system').optional(), status: z.enum(['active', 'retired']).optional(),
})
const formBool = z.enum(['true', 'false']).default('false').transform((v) => v === 'true')
export const calibrationForm = z.object({
  gcMethodId: uuid('GC method'), systemId: uuid('system'), model: z.enum(['response-factor', 'linear', 'quadratic']).default('response-factor'),
  acceptWarnings: formBool,
})
export const runForm = z.object({
  calibrationId: uuid('calibration').optional(),
  acceptWarnings: formBool,
  rowVersion: z.coerce.number().int().min(1).optional(),
})

const STATES = ['draft', 'submitted', 'approved', 'returned', 'superseded'] as const
export const dataSetSchema = z.object({
  systemId: uuid('system'),
  title: text(200).min(1, 'Enter a title'),
  nominalPressurePa: z.number().positive('Pressure must be positive (Pa)').max(1e8),
  apparatusNotes: optionalText(4000),
  projectRef: optionalText(200),
})
export const dataSetPatchSchema = z.object({
  rowVersion: z.number().int().min(1),
  title: text(200).min(1).optional(),
  nominalPressurePa: z.number().positive().max(1e8).optional(),
  apparatusNotes: text(4000).nullable().optional(),
  projectRef: text(200).nullable().optional(),
})
export const dataSetQuery = z.object({
  state: z.union([z.enum(STATES), z.array(z.enum(STATES))]).optional()
    .transform((v) => (v === undefined ? undefined : Array.isArray(v) ? v : [v])),
  systemId: uuid('system').optional(),
  createdBy: z.string().max(100).optional(),
  q: z.string().trim().max(100).optional(),
  pressureMinPa: z.coerce.number().positive().optional(),
  pressureMaxPa: z.coerce.number().positive().optional(),
  createdAfter: z.coerce.date().optional(),
  createdBefore: z.coerce.date().optional(),
  sort: z.enum(['created_at', 'updated_at', 'nominal_pressure_pa', 'state', 'title', 'submitted_at']).default('updated_at'),
  ...pageQuery,
})
export const pointParams = z.object({ id: uuid('data set'), pointId: uuid('point') })
export const exclusionSchema = z.object({
  rowVersion: z.number().int().min(1),
  excluded: z.boolean(),
  reason: z.string().trim().max(1000).nullable().optional(),
}).refine((v) => !v.excluded || (v.reason && v.reason.length > 0), { message: 'Give a reason for excluding this point', path: ['reason'] })

const MODELS = ['margules', 'van-laar', 'wilson', 'nrtl'] as const
export const fitSchema = z.object({
  models: z.array(z.enum(MODELS)).min(1, 'Choose at least one model').max(4),
  objective: z.enum(['bubble-point', 'activity']).default('bubble-point'),
  alpha: z.number().positive().max(1).optional(),
  fitAlpha: z.boolean().optional(),
})
export const recommendedSchema = z.object({ fitId: uuid('fit') })
export const consistencySchema = z.object({ model: z.enum(MODELS).default('nrtl') })

export const commentSchema = z.object({
  body: text(4000).min(1, 'Write a comment'),
  pointId: uuid('point').nullable().optional(),
  parentId: uuid('comment').nullable().optional(),
})
export const commentParams = z.object({ id: uuid('data set'), commentId: uuid('comment') })

export const rowVersionSchema = z.object({ rowVersion: z.number().int().min(1) })
export const signatureSchema = z.object({
  password: z.string().min(1, 'Re-enter your password to sign').max(200),
  reason: text(2000).min(1, 'Give the reason for your signature'),
  rowVersion: z.number().int().min(1),
  overrideReason: text(2000).nullable().optional(),
})

export const curveQuery = z.object({
  pressure: z.coerce.number().positive('Pressure must be positive'),
  unit: z.enum(['Pa', 'kPa', 'MPa', 'bar', 'mbar', 'atm', 'mmHg', 'torr', 'psi']).default('kPa'),
  points: z.coerce.number().int().min(3).max(1001).default(101),
  fitId: uuid('fit').optional(),
})
export const catalogueQuery = z.object({ q: z.string().trim().max(100).optional(), ...pageQuery })
