import { z } from 'zod'

const positive = (what: string, unit: string) =>
  z.number({ error: `${what} must be a number (${unit})` }).positive(`${what} must be positive (${unit})`)

/** The largest association parameter η accepted (published values stay well below; carboxylic acids ≈ 4.5). */
export const MAX_ASSOCIATION_ETA = 10
/** The largest mean radius of gyration accepted, Å (large organic molecules stay below about 10 Å). */
export const MAX_RADIUS_OF_GYRATION = 20

/**
 * Critical constants and structure parameters of a pure component, as entered from a cited source: what a
 * non-ideal vapour (second virial coefficients by Tsonopoulos or Hayden–O'Connell) and UNIQUAC need. Units: Tc in
 * K, Pc in Pa, Vc in cm³/mol, dipole moment in debye, mean radius of gyration in Å; ω, Tsonopoulos a and b, the
 * Hayden–O'Connell association parameter η, UNIQUAC r and q are dimensionless. η often comes from another table
 * than the critical data, so it carries its own source.
 */
export const componentPropertiesSchema = z
  .object({
    Tc: positive('The critical temperature', 'K').nullable().optional(),
    Pc: positive('The critical pressure', 'Pa').nullable().optional(),
    omega: z
      .number({ error: 'The acentric factor must be a number' })
      .min(-1, 'The acentric factor must lie between −1 and 2')
      .max(2, 'The acentric factor must lie between −1 and 2')
      .nullable()
      .optional(),
    Vc: positive('The critical volume', 'cm³/mol').nullable().optional(),
    dipole: z
      .number({ error: 'The dipole moment must be a number (D)' })
      .min(0, 'The dipole moment cannot be negative (D)')
      .nullable()
      .optional(),
    radiusOfGyration: z
      .number({ error: 'The mean radius of gyration must be a number (Å)' })
      .min(0, 'The mean radius of gyration cannot be negative (Å)')
      .max(MAX_RADIUS_OF_GYRATION, `The mean radius of gyration must be at most ${MAX_RADIUS_OF_GYRATION} Å`)
      .nullable()
      .optional(),
    associationEta: z
      .number({ error: 'The association parameter η must be a number' })
      .min(0, 'The association parameter η cannot be negative (0 means no association)')
      .max(MAX_ASSOCIATION_ETA, `The association parameter η must be at most ${MAX_ASSOCIATION_ETA}`)
      .nullable()
      .optional(),
    associationSource: z
      .string({ error: 'The source of η must be text' })
      .trim()
      .min(1, 'Name the source of η (paper and table), or leave it out')
      .max(500, 'Keep the source of η under 500 characters')
      .nullable()
      .optional(),
    tsonopoulosA: z.number({ error: 'Tsonopoulos a must be a number' }).nullable().optional(),
    tsonopoulosB: z.number({ error: 'Tsonopoulos b must be a number' }).nullable().optional(),
    uniquacR: positive('UNIQUAC r', 'dimensionless').nullable().optional(),
    uniquacQ: positive('UNIQUAC q', 'dimensionless').nullable().optional(),
    source: z
      .string()
      .trim()
      .min(1, 'Name the source of these constants (book, table, or database and version)')
      .max(500, 'Keep the source under 500 characters'),
  })
  .strict()
  .refine((p) => p.associationEta == null || p.associationEta === 0 || !!p.associationSource, {
    path: ['associationSource'],
    message: 'Name the source of the association parameter η (paper and table)',
  })

export type ComponentProperties = z.output<typeof componentPropertiesSchema>

/** The virial correlations a data set may choose. */
export type VirialCorrelationChoice = 'tsonopoulos' | 'hayden-oconnell'

/** The properties each correlation needs of every component (the dipole and η default to 0 under HOC). */
export const VIRIAL_NEEDS: Record<VirialCorrelationChoice, readonly (keyof ComponentProperties)[]> = {
  tsonopoulos: ['Tc', 'Pc', 'omega', 'Vc'],
  'hayden-oconnell': ['Tc', 'Pc', 'Vc', 'radiusOfGyration'],
}

/** What a virial vapour by `correlation` (default Tsonopoulos) needs of a component, or the names of what is missing. */
export function virialInputsOf(
  p: ComponentProperties | null | undefined,
  correlation: VirialCorrelationChoice = 'tsonopoulos',
):
  | {
      ok: true
      Tc: number
      Pc: number
      omega: number
      Vc: number
      a: number
      b: number
      RD: number | undefined
      dipole: number
      eta: number
    }
  | { ok: false; missing: string[] } {
  const needs = VIRIAL_NEEDS[correlation]
  const missing = needs.filter((k) => p?.[k] === null || p?.[k] === undefined)
  if (!p || missing.length) return { ok: false, missing: p ? [...missing] : [...needs] }
  return {
    ok: true,
    Tc: p.Tc!,
    Pc: p.Pc!,
    omega: p.omega ?? 0,
    Vc: p.Vc!,
    a: p.tsonopoulosA ?? 0,
    b: p.tsonopoulosB ?? 0,
    RD: p.radiusOfGyration ?? undefined,
    dipole: p.dipole ?? 0,
    eta: p.associationEta ?? 0,
  }
}
