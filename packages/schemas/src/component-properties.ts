import { z } from 'zod'

const positive = (what: string, unit: string) =>
  z.number({ error: `${what} must be a number (${unit})` }).positive(`${what} must be positive (${unit})`)

/**
 * Critical constants and structure parameters of a pure component, as entered from a cited source: what a
 * non-ideal vapour (second virial coefficients by Tsonopoulos) and UNIQUAC need. Units: Tc in K, Pc in Pa,
 * Vc in cm³/mol, dipole moment in debye; ω, Tsonopoulos a and b, UNIQUAC r and q are dimensionless.
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

export type ComponentProperties = z.output<typeof componentPropertiesSchema>

/** What a virial vapour needs of a component, or the names of what is missing. */
export function virialInputsOf(
  p: ComponentProperties | null | undefined,
):
  | { ok: true; Tc: number; Pc: number; omega: number; Vc: number; a: number; b: number }
  | { ok: false; missing: string[] } {
  const missing = (['Tc', 'Pc', 'omega', 'Vc'] as const).filter((k) => p?.[k] === null || p?.[k] === undefined)
  if (!p || missing.length) return { ok: false, missing: p ? missing : ['Tc', 'Pc', 'omega', 'Vc'] }
  return {
    ok: true,
    Tc: p.Tc!,
    Pc: p.Pc!,
    omega: p.omega!,
    Vc: p.Vc!,
    a: p.tsonopoulosA ?? 0,
    b: p.tsonopoulosB ?? 0,
  }
}
