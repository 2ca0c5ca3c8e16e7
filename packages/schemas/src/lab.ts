import { componentPropertiesSchema } from './component-properties.js'
import { z } from 'zod'
import { checkOrigin, citationSchema, DATA_LAYOUTS, DATA_ORIGINS, originFields } from './direct-data.js'
import { dataKindOf, vaporModelChoiceSchema } from './data-kind.js'

/**
 * Request bodies of the lab API (issue 5), shared by the API (which parses with them) and the web app
 * (which can check a form with the same rules and messages before sending it). Units are the engine's:
 * Pa, K, mole fractions, g/mol, cm³/mol. The API's query-string, path and multipart schemas stay in
 * apps/api/src/routes/lab-schemas.ts.
 */

/** A lab entity id (UUID); `what` names it in the message, e.g. `labId('data set')` → "Not a data set id". */
export const labId = (what: string) => z.string().uuid(`Not a ${what} id`)

const text = (max: number) => z.string().trim().max(max)
const optionalText = (max: number) =>
  text(max)
    .nullable()
    .optional()
    .transform((v) => (v === '' ? null : (v ?? null)))
const rowVersion = z.number().int().min(1)

/** The states of a data set version, in workflow order. */
export const DATA_SET_STATES = ['draft', 'submitted', 'approved', 'returned', 'superseded'] as const
export type DataSetStateName = (typeof DATA_SET_STATES)[number]

/** The activity models a data set can be fitted with. */
export const FIT_MODELS = ['margules', 'van-laar', 'wilson', 'nrtl', 'uniquac'] as const
export type FitModel = (typeof FIT_MODELS)[number]

/** Pressure units accepted wherever a pressure is given with its unit (converted to Pa by the API). */
export const PRESSURE_UNITS = ['Pa', 'kPa', 'MPa', 'bar', 'mbar', 'atm', 'mmHg', 'torr', 'psi'] as const
export type PressureUnit = (typeof PRESSURE_UNITS)[number]
/** Temperature units accepted with a temperature (C = degrees Celsius). */
export const TEMPERATURE_UNITS = ['K', 'C'] as const
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number]

/** A pressure as typed, with its unit. */
export const pressureWithUnitSchema = z.object({
  value: z.number().positive('Pressure must be positive'),
  unit: z.enum(PRESSURE_UNITS),
})
/** A temperature as typed, with its unit; the absolute-zero check needs the unit, so it is made on the pair. */
export const temperatureWithUnitSchema = z
  .object({ value: z.number(), unit: z.enum(TEMPERATURE_UNITS) })
  .refine((t) => (t.unit === 'K' ? t.value : t.value + 273.15) > 0, {
    message: 'Temperature must be above absolute zero',
    path: ['value'],
  })

const casNumber = z
  .string()
  .trim()
  .regex(/^\d{2,7}-\d{2}-\d$/, 'Write the CAS number as digits in three groups, e.g. 67-64-1')
  .nullable()

/** POST /api/components. molarMass in g/mol, liquidMolarVolume in cm³/mol. */
export const componentSchema = z.object({
  name: text(120).min(1, 'Enter a name'),
  casNumber: casNumber.optional().transform((v) => v ?? null),
  formula: optionalText(60),
  molarMass: z.number().positive('Molar mass must be positive (g/mol)'),
  liquidMolarVolume: z
    .number()
    .positive('Liquid molar volume must be positive (cm³/mol)')
    .nullable()
    .optional()
    .transform((v) => v ?? null),
  properties: componentPropertiesSchema
    .nullable()
    .optional()
    .transform((v) => v ?? null),
})
/** PATCH /api/components/:id (send the rowVersion you loaded). */
export const componentPatchSchema = z.object({
  rowVersion,
  name: text(120).min(1).optional(),
  casNumber: casNumber.optional(),
  formula: text(60).nullable().optional(),
  molarMass: z.number().positive().optional(),
  liquidMolarVolume: z.number().positive().nullable().optional(),
  properties: componentPropertiesSchema.nullable().optional(),
})

const range = z
  .tuple([z.number(), z.number()])
  .refine(([a, b]) => a < b, 'The range must run from low to high')
  .optional()
/** A vapour-pressure correlation in the form and units it was published in (range in its temperature unit). */
export const vaporPressureModelSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('antoine'),
    A: z.number(),
    B: z.number(),
    C: z.number(),
    log: z.enum(['log10', 'ln']),
    pressureUnit: z.enum(['Pa', 'kPa', 'bar', 'mmHg', 'atm']),
    temperatureUnit: z.enum(['C', 'K']),
    range,
  }),
  z.object({
    kind: z.literal('clausius-clapeyron'),
    Tref: z.number().positive(),
    Pref: z.number().positive(),
    dHvap: z.number().positive(),
    range,
  }),
])
/** POST /api/components/:id/vapor-pressure-sets. */
export const vaporPressureSetSchema = z.object({
  model: vaporPressureModelSchema,
  source: text(400).min(1, 'Name the source (book, edition, table) of the constants'),
  preferred: z.boolean().default(true),
})
/** POST /api/components/:id/pure-measurements: a measured boiling point (K) at a measured pressure (Pa). */
export const pureMeasurementSchema = z.object({
  temperatureK: z.number().positive('Temperature must be positive (K)'),
  pressurePa: z.number().positive('Pressure must be positive (Pa)'),
  note: optionalText(400),
  thermometer: optionalText(120),
  still: optionalText(120),
  /** the day it was measured (YYYY-MM-DD) */
  measuredOn: z.iso.date('Enter the date as YYYY-MM-DD').nullable().optional(),
})

/** POST /api/systems (component 1 is the lighter one by convention). */
export const systemSchema = z.object({
  component1Id: labId('component'),
  component2Id: labId('component'),
  notes: optionalText(1000),
})

/** POST /api/gc-methods. */
export const gcMethodSchema = z.object({
  name: text(120).min(1, 'Enter a name'),
  detector: z.enum(['FID', 'TCD']),
  columnDescription: optionalText(400),
  conditions: optionalText(2000),
})

const nominalPressure = z.number().positive('Pressure must be positive (Pa)').max(1e8, 'Pressure above 100 MPa')
const nominalTemperature = z.number().positive('Temperature must be positive (K)').max(2000, 'Temperature above 2000 K')
/**
 * POST /api/data-sets. Isobaric layouts (txy, tx) need nominalPressurePa (Pa); isothermal ones (pxy, px) need
 * nominalTemperatureK (K). vaporModel: ideal (default) or virial (Tsonopoulos, optional Poynting factor).
 */
export const dataSetSchema = z.object({
  systemId: labId('system'),
  title: text(200).min(1, 'Enter a title'),
  nominalPressurePa: nominalPressure.nullable().optional().default(null),
  nominalTemperatureK: nominalTemperature.nullable().optional().default(null),
  vaporModel: vaporModelChoiceSchema.optional().default({ kind: 'ideal' }),
  apparatusNotes: optionalText(4000),
  projectRef: optionalText(200),
  ...originFields,
})

/** Isobaric data need their pressure, isothermal data their temperature. */
export function checkNominal(
  d: { layout?: string; nominalPressurePa?: number | null; nominalTemperatureK?: number | null },
  ctx: z.RefinementCtx,
) {
  const kind = dataKindOf(d.layout ?? 'txy')
  if (kind === 'isobaric' && (d.nominalPressurePa === null || d.nominalPressurePa === undefined))
    ctx.addIssue({
      code: 'custom',
      path: ['nominalPressurePa'],
      message: 'Isobaric data need the nominal pressure.',
    })
  if (kind === 'isothermal' && (d.nominalTemperatureK === null || d.nominalTemperatureK === undefined))
    ctx.addIssue({
      code: 'custom',
      path: ['nominalTemperatureK'],
      message: 'Isothermal data need the temperature they were measured at.',
    })
}
/** POST /api/data-sets: the fields above plus the origin rules (literature needs a citation …) and the nominal condition. */
export const dataSetCreateSchema = dataSetSchema.superRefine((d, ctx) => {
  checkOrigin(d, ctx)
  checkNominal(d, ctx)
})
/** PATCH /api/data-sets/:id (draft or returned; send the rowVersion you loaded). */
export const dataSetPatchSchema = z.object({
  rowVersion,
  title: text(200).min(1).optional(),
  nominalPressurePa: nominalPressure.nullable().optional(),
  nominalTemperatureK: nominalTemperature.nullable().optional(),
  vaporModel: vaporModelChoiceSchema.optional(),
  /** only while the data set has no points */
  layout: z.enum(DATA_LAYOUTS).optional(),
  apparatusNotes: text(4000).nullable().optional(),
  projectRef: text(200).nullable().optional(),
  /** only while the data set has no points */
  systemId: labId('system').optional(),
  origin: z.enum(DATA_ORIGINS).optional(),
  originMethod: text(1000).nullable().optional(),
  citation: citationSchema.nullable().optional(),
})

/** PATCH /api/data-sets/:id/points/:pointId: exclude (a reason is required) or include a point. */
export const exclusionSchema = z
  .object({
    rowVersion,
    excluded: z.boolean(),
    reason: z.string().trim().max(1000).nullable().optional(),
  })
  .refine((v) => !v.excluded || (v.reason && v.reason.length > 0), {
    message: 'Give a reason for excluding this point',
    path: ['reason'],
  })

/**
 * NRTL's non-randomness α when none is given: 0.3, the usual choice when nothing better is known
 * (common practice, no source; tabulated values mostly lie between 0.2 and 0.5).
 */
export const DEFAULT_NRTL_ALPHA = 0.3
const ALPHA_RANGE = 'NRTL α must be above 0 and at most 1'
/**
 * POST /api/data-sets/:id/fits. alpha: NRTL non-randomness (dimensionless, default DEFAULT_NRTL_ALPHA), held
 * fixed, or the starting value when fitAlpha asks for α to be fitted with b12, b21. Wilson takes the
 * components' liquid molar volumes (cm³/mol) from the component records; nothing to send for it.
 */
export const fitRequestSchema = z.object({
  models: z.array(z.enum(FIT_MODELS)).min(1, 'Choose at least one model').max(FIT_MODELS.length),
  /** default: 'bubble-pressure' for isothermal data, 'bubble-point' for isobaric data */
  objective: z.enum(['bubble-point', 'bubble-pressure', 'activity']).optional(),
  alpha: z.number({ message: 'Enter α as a number' }).gt(0, ALPHA_RANGE).max(1, ALPHA_RANGE).optional(),
  fitAlpha: z.boolean().optional(),
})
/** POST /api/data-sets/:id/recommended-fit. */
export const recommendedFitSchema = z.object({ fitId: labId('fit') })
/** POST /api/data-sets/:id/consistency: the activity model the point test uses. */
export const consistencyRequestSchema = z.object({ model: z.enum(FIT_MODELS).default('nrtl') })

/** POST /api/data-sets/:id/comments: on the data set, pinned to a point, or a reply (parentId). */
export const commentSchema = z.object({
  body: text(4000).min(1, 'Write a comment'),
  pointId: labId('point').nullable().optional(),
  parentId: labId('comment').nullable().optional(),
})

/** POST /api/data-sets/:id/submit and other writes that only need the version the user saw. */
export const rowVersionSchema = z.object({ rowVersion })
/** POST /api/data-sets/:id/approve and /return: an e-signature (password re-entered) with its reason. */
export const signatureSchema = z.object({
  password: z.string().min(1, 'Re-enter your password to sign').max(200),
  reason: text(2000).min(1, 'Give the reason for your signature'),
  rowVersion,
  overrideReason: text(2000).nullable().optional(),
})

const queryPressure = {
  pressure: z.coerce.number().positive('Pressure must be positive'),
  unit: z.enum(PRESSURE_UNITS).default('kPa'),
}
/** GET /api/data-sets/:id/curve query: pressure in `unit` (default kPa), grid points, optional fit. */
export const curveQuerySchema = z.object({
  ...queryPressure,
  points: z.coerce.number().int().min(3).max(1001).default(101),
  fitId: labId('fit').optional(),
})
/** GET /api/data-sets/:id/fits/:fitId/band query: pressure in `unit` (default: the data set's nominal pressure). */
export const bandQuerySchema = z.object({
  pressure: queryPressure.pressure.optional(),
  unit: queryPressure.unit,
  points: z.coerce.number().int().min(3).max(1001).default(51),
})
/** How the next compositions are ranked: largest predicted σy, or the largest gain in parameter information (D-optimal). */
export const SUGGESTION_CRITERIA = ['sigma-y', 'd-optimal'] as const
/** One of {@link SUGGESTION_CRITERIA}. */
export type SuggestionCriterionName = (typeof SUGGESTION_CRITERIA)[number]
/**
 * GET /api/data-sets/:id/fits/:fitId/next-compositions query: how many suggestions (1–20, default 5) at which
 * pressure, by which criterion (default 'sigma-y'), in which x1 range (`from`–`to`, default 0–1, at least 0.01
 * wide) and at least `exclusion` (0–0.5, default 0.02) from every measured point.
 */
export const nextCompositionsQuerySchema = z
  .object({
    pressure: queryPressure.pressure.optional(),
    unit: queryPressure.unit,
    count: z.coerce.number().int().min(1).max(20).default(5),
    criterion: z
      .enum(SUGGESTION_CRITERIA, { error: "The criterion must be 'sigma-y' or 'd-optimal'" })
      .default('sigma-y'),
    from: z.coerce.number().min(0, 'from must be 0–1 (x1)').max(1, 'from must be 0–1 (x1)').default(0),
    to: z.coerce.number().min(0, 'to must be 0–1 (x1)').max(1, 'to must be 0–1 (x1)').default(1),
    exclusion: z.coerce
      .number()
      .min(0, 'exclusion must be 0–0.5 (x1)')
      .max(0.5, 'exclusion must be 0–0.5 (x1)')
      .default(0.02),
  })
  .refine((q) => q.to - q.from >= 0.01 - 1e-12, {
    path: ['to'],
    message: 'The composition range must be at least 0.01 wide (to − from ≥ 0.01)',
  })
/** GET /api/data-sets/:id/pure-component-check query: agreement asked of a pure boiling point, K (default 0.3 K). */
export const pureComponentCheckQuerySchema = z.object({
  toleranceK: z.coerce
    .number()
    .positive('The tolerance must be positive (K)')
    .max(10, 'Use a tolerance of at most 10 K')
    .optional(),
})
