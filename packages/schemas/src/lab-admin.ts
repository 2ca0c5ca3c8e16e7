import { z } from 'zod'

/** The forms of the admin screens, with the same rules and messages as the API's component and GC-method bodies. */

const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters`)
const optionalText = (max: number) =>
  text(max)
    .nullable()
    .optional()
    .transform((v) => (v ? v : null))

/** CAS registry number as digits in three groups; the database also checks the check digit. */
export const casNumberSchema = z
  .string()
  .trim()
  .regex(/^\d{2,7}-\d{2}-\d$/, 'Write the CAS number as digits in three groups, e.g. 67-64-1')

/** The CAS check digit: Σ(position × digit) of the other digits, counted from the right, mod 10 (common practice, no source). */
export function casCheckDigitOk(cas: string): boolean {
  const digits = cas.replace(/-/g, '')
  const body = digits.slice(0, -1).split('').reverse()
  const sum = body.reduce((s, d, i) => s + (i + 1) * Number(d), 0)
  return sum % 10 === Number(digits.at(-1))
}

export const componentFormSchema = z.object({
  name: text(120).min(1, 'Enter a name'),
  casNumber: z
    .union([
      casNumberSchema.refine(casCheckDigitOk, 'The CAS number is not valid (its check digit does not match).'),
      z.literal(''),
    ])
    .nullable()
    .transform((v) => (v ? v : null)),
  formula: optionalText(60),
  molarMass: z.number({ error: 'Enter the molar mass (g/mol)' }).positive('Molar mass must be positive (g/mol)'),
  liquidMolarVolume: z.number().positive('Liquid molar volume must be positive (cm³/mol)').nullable(),
})
export type ComponentForm = z.output<typeof componentFormSchema>

/** An Antoine set as published: log(P/unit) = A − B/(T/unit + C), with its validity range and source. */
export const antoineFormSchema = z
  .object({
    A: z.number({ error: 'Enter A' }),
    B: z.number({ error: 'Enter B' }),
    C: z.number({ error: 'Enter C' }),
    log: z.enum(['log10', 'ln']),
    pressureUnit: z.enum(['Pa', 'kPa', 'bar', 'mmHg', 'atm']),
    temperatureUnit: z.enum(['C', 'K']),
    rangeMin: z.number().nullable(),
    rangeMax: z.number().nullable(),
    source: text(400).min(1, 'Name the source (book, edition, table) of the constants'),
    preferred: z.boolean(),
  })
  .superRefine((v, ctx) => {
    if ((v.rangeMin === null) !== (v.rangeMax === null))
      ctx.addIssue({ code: 'custom', path: ['rangeMax'], message: 'Give both ends of the range, or neither' })
    else if (v.rangeMin !== null && v.rangeMax !== null && !(v.rangeMin < v.rangeMax))
      ctx.addIssue({ code: 'custom', path: ['rangeMax'], message: 'The range must run from low to high' })
  })
export type AntoineForm = z.output<typeof antoineFormSchema>

export const gcMethodFormSchema = z.object({
  name: text(120).min(1, 'Enter a name'),
  detector: z.enum(['FID', 'TCD']),
  columnDescription: optionalText(400),
  conditions: optionalText(2000),
})
export type GcMethodForm = z.output<typeof gcMethodFormSchema>
