/**
 * The lab routes' query-string, path and multipart schemas (zod). Request bodies the web app shares live
 * in @ebullio/schemas (packages/schemas/src/lab.ts). Units: Pa, K, mole fractions, as in the engine.
 */
import { DATA_SET_STATES, labId } from '@ebullio/schemas'
import { z } from 'zod'
import { PREVIEW_PAGE_SIZE, PREVIEW_PAGE_SIZE_MAX } from '../services/preview-page.js'

export const uuid = labId
export const idParams = z.object({ id: uuid('data set') })

export const pageQuery = {
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  order: z.enum(['asc', 'desc']).default('desc'),
}

export const componentQuery = z.object({
  q: z.string().trim().max(100).optional(),
  sort: z.enum(['name', 'created_at', 'molar_mass']).default('name'),
  ...pageQuery,
  order: z.enum(['asc', 'desc']).default('asc'),
})

export const systemQuery = z.object({ q: z.string().trim().max(100).optional(), ...pageQuery })

/** Lists the web reads whole (calibrations, GC methods, my threads) page by 100 unless asked otherwise. */
const widePage = { ...pageQuery, pageSize: z.coerce.number().int().min(1).max(200).default(100) }
const dateQuery = { createdAfter: z.coerce.date().optional(), createdBefore: z.coerce.date().optional() }

export const calibrationQuery = z.object({
  gcMethodId: uuid('GC method').optional(),
  systemId: uuid('system').optional(),
  status: z.enum(['active', 'retired']).optional(),
  model: z.enum(['response-factor', 'linear', 'quadratic']).optional(),
  q: z.string().trim().max(100).optional(),
  ...dateQuery,
  sort: z.enum(['created_at', 'status', 'model', 'gc_method', 'system']).default('created_at'),
  ...widePage,
})
export const gcMethodQuery = z.object({
  q: z.string().trim().max(100).optional(),
  detector: z.enum(['FID', 'TCD']).optional(),
  status: z.enum(['active', 'retired']).optional(),
  sort: z.enum(['name', 'detector', 'created_at']).default('name'),
  ...widePage,
  order: z.enum(['asc', 'desc']).default('asc'),
})
/** GET /api/gc-methods/:id/check-standards: how many of the first results set the centre line and σ (2–100, default 20). */
export const checkStandardQuery = z.object({
  baseline: z.coerce
    .number()
    .int('baseline must be a whole number')
    .min(2, 'baseline must be 2–100 results')
    .max(100, 'baseline must be 2–100 results')
    .default(20),
})
export const myThreadsQuery = z.object({ ...widePage })
const formBool = z
  .enum(['true', 'false'])
  .default('false')
  .transform((v) => v === 'true')
/** Which page of an upload preview to answer (rows and samples or standards; PREVIEW_PAGE_SIZE_MAX at most). */
const previewPage = {
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(PREVIEW_PAGE_SIZE_MAX).default(PREVIEW_PAGE_SIZE),
}

export const calibrationForm = z.object({
  ...previewPage,
  gcMethodId: uuid('GC method'),
  systemId: uuid('system'),
  model: z.enum(['response-factor', 'linear', 'quadratic']).default('response-factor'),
  acceptWarnings: formBool,
  /** acknowledges that the active calibration of this method and system is retired by this one */
  replaceActive: formBool,
  /** the data set whose upload dialog sends it (its audit trail records the commit) */
  dataSetId: uuid('data set').optional(),
})
export const runForm = z.object({
  ...previewPage,
  calibrationId: uuid('calibration').optional(),
  acceptWarnings: formBool,
  rowVersion: z.coerce.number().int().min(1).optional(),
})

export const dataSetQuery = z
  .object({
    state: z
      .union([z.enum(DATA_SET_STATES), z.array(z.enum(DATA_SET_STATES))])
      .optional()
      .transform((v) => (v === undefined ? undefined : Array.isArray(v) ? v : [v])),
    systemId: uuid('system').optional(),
    createdBy: z.string().max(100).optional(),
    q: z.string().trim().max(100).optional(),
    pressureMinPa: z.coerce.number().positive().optional(),
    pressureMaxPa: z.coerce.number().positive().optional(),
    createdAfter: z.coerce.date().optional(),
    createdBefore: z.coerce.date().optional(),
    /** last change (any content or state change bumps updated_at) */
    updatedAfter: z.coerce.date().optional(),
    updatedBefore: z.coerce.date().optional(),
    sort: z
      .enum(['created_at', 'updated_at', 'nominal_pressure_pa', 'state', 'title', 'submitted_at'])
      .default('updated_at'),
    ...pageQuery,
  })
  .refine((q) => !(q.createdAfter && q.createdBefore && q.createdAfter >= q.createdBefore), {
    message: 'The created range must end after it starts',
    path: ['createdBefore'],
  })
  .refine((q) => !(q.updatedAfter && q.updatedBefore && q.updatedAfter >= q.updatedBefore), {
    message: 'The changed range must end after it starts',
    path: ['updatedBefore'],
  })
export const pointParams = z.object({ id: uuid('data set'), pointId: uuid('point') })
export const commentParams = z.object({ id: uuid('data set'), commentId: uuid('comment') })

export const catalogueQuery = z.object({ q: z.string().trim().max(100).optional(), ...pageQuery })
