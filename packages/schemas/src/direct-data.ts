import { z } from 'zod'

/**
 * Where a data set's numbers come from, and points entered directly (without GC peak areas): typed into
 * the grid or read from Ebullio's point sheet. Units: K, Pa, mole fractions of component 1.
 */

/** gc: measured here, compositions by GC · other-method: measured here another way · literature: published. */
export const DATA_ORIGINS = ['gc', 'other-method', 'literature'] as const
export type DataOrigin = (typeof DATA_ORIGINS)[number]

/** txy: isobaric T–x–y · tx: isobaric T–x (no vapour analysed) · pxy: isothermal P–x–y · px: isothermal P–x. */
export const DATA_LAYOUTS = ['txy', 'tx', 'pxy', 'px'] as const
export type DataLayout = (typeof DATA_LAYOUTS)[number]

const t = (max: number) => z.string().trim().max(max)
const opt = (max: number) =>
  t(max)
    .nullable()
    .optional()
    .transform((v) => (v === '' ? null : (v ?? null)))

/** A full literature citation. */
export const citationSchema = z.object({
  authors: t(1000).min(1, 'Enter the authors'),
  title: t(1000).min(1, 'Enter the title of the article or book'),
  source: t(500).min(1, 'Enter the journal or book'),
  year: z.number().int('The year is a whole number').min(1700, 'The year is before 1700').max(2100),
  volume: opt(40),
  pages: opt(40),
  doi: opt(200),
  /** table or figure the numbers were taken from */
  table: opt(200),
})
export type Citation = z.output<typeof citationSchema>

/** Origin fields of a data set (create and patch). */
export const originFields = {
  origin: z.enum(DATA_ORIGINS).default('gc'),
  /** how it was measured, when not by GC here (e.g. refractive index, density) */
  originMethod: opt(1000),
  citation: citationSchema.nullable().optional().default(null),
  layout: z.enum(DATA_LAYOUTS).default('txy'),
}

/** The origin rules that span fields: literature needs a citation, another method needs its description. */
export function checkOrigin(
  d: { origin?: DataOrigin; citation?: Citation | null; originMethod?: string | null },
  ctx: z.RefinementCtx,
) {
  if (d.origin === 'literature' && !d.citation)
    ctx.addIssue({ code: 'custom', path: ['citation'], message: 'Literature data needs its full citation.' })
  if (d.origin === 'other-method' && !d.originMethod)
    ctx.addIssue({
      code: 'custom',
      path: ['originMethod'],
      message: 'Say how the compositions were measured (the method other than GC).',
    })
}

/** One point typed or imported directly. y1 is null for a T–x point. Uncertainties are standard (k = 1). */
export const directPointSchema = z.object({
  sampleLabel: t(80).min(1, 'Enter a sample label'),
  temperatureK: z.number().positive('Temperature must be positive (K)').max(2000, 'Temperature above 2000 K'),
  pressurePa: z.number().positive('Pressure must be positive (Pa)').max(1e8, 'Pressure above 100 MPa'),
  x1: z.number().min(0, 'x1 must be between 0 and 1').max(1, 'x1 must be between 0 and 1'),
  y1: z.number().min(0, 'y1 must be between 0 and 1').max(1, 'y1 must be between 0 and 1').nullable(),
  x1Uncertainty: z.number().min(0, 'u(x1) cannot be negative').max(0.5),
  y1Uncertainty: z.number().min(0, 'u(y1) cannot be negative').max(0.5).nullable(),
  /** σP, the standard uncertainty of the measured pressure (Pa); null or absent = the engine's default */
  pressureUncertaintyPa: z
    .number()
    .positive('σP must be positive (Pa)')
    .max(1e6, 'σP above 1 MPa')
    .nullable()
    .optional()
    .transform((v) => v ?? null),
})
export type DirectPoint = z.output<typeof directPointSchema>

/** POST /api/data-sets/:id/points (typed in the grid): all or nothing. */
export const directPointsSchema = z.object({
  rowVersion: z.number().int().min(1),
  points: z.array(directPointSchema).min(1, 'Enter at least one point').max(2000),
})

/** POST /api/data-sets/:id/own-measurement (lead chemist): a literature set counts as the lab's own, or not. */
export const ownMeasurementSchema = z.object({
  rowVersion: z.number().int().min(1),
  countsAsOwn: z.boolean(),
  reason: t(1000).min(1, 'Say why this literature set counts as the lab’s own measurement'),
})

/** POST /api/check-measurements: a thermometer or barometer check with a reference liquid. */
export const checkMeasurementSchema = z.object({
  kind: z.enum(['thermometer', 'barometer']),
  instrument: t(120).min(1, 'Name the thermometer or barometer checked'),
  componentId: z.string().uuid('Not a component id'),
  temperatureK: z.number().positive('Temperature must be positive (K)'),
  pressurePa: z.number().positive('Pressure must be positive (Pa)'),
  measuredAt: z.coerce.date({ error: 'Enter when it was measured' }),
  note: opt(400),
})
