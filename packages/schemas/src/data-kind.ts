import { z } from 'zod'
import {
  MAX_ASSOCIATION_ETA,
  virialInputsOf,
  type ComponentProperties,
  type VirialCorrelationChoice,
} from './component-properties.js'

/**
 * What kind of measurement a data set holds and which vapour model its computations use.
 * - Isobaric data (layouts 'txy', 'tx') are taken at a nominal pressure; isothermal data ('pxy', 'px') at a nominal
 *   temperature, with the measured pressure per point. 'tx' and 'px' have no vapour composition.
 * - The vapour is ideal (modified Raoult's law) or a virial gas (second virial coefficients by Tsonopoulos or by
 *   Hayden–O'Connell, from the components' properties), optionally with the Poynting factor of the liquid. Under
 *   Hayden–O'Connell the choice also carries the unlike pair's solvation parameter η12 (default 0) and its source.
 */

/** Layouts measured at a fixed temperature. */
export const ISOTHERMAL_LAYOUTS = ['pxy', 'px'] as const
/** Layouts without a vapour composition. */
export const LIQUID_ONLY_LAYOUTS = ['tx', 'px'] as const

export type DataKind = 'isobaric' | 'isothermal'

/** 'isothermal' for P–x–y and P–x, else 'isobaric'. */
export function dataKindOf(layout: string): DataKind {
  return (ISOTHERMAL_LAYOUTS as readonly string[]).includes(layout) ? 'isothermal' : 'isobaric'
}

/** True when the layout carries vapour compositions. */
export const hasVapour = (layout: string) => !(LIQUID_ONLY_LAYOUTS as readonly string[]).includes(layout)

/** The layout's name in words. */
export function layoutLabel(layout: string): string {
  return (
    {
      txy: 'T–x–y at constant pressure',
      tx: 'T–x at constant pressure',
      pxy: 'P–x–y at constant temperature',
      px: 'P–x at constant temperature',
    }[layout] ?? layout
  )
}

/** The vapour model a data set chooses (the critical data come from the components when a computation runs). */
export const vaporModelChoiceSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('ideal') }).strict(),
    z
      .object({
        kind: z.literal('virial'),
        correlation: z
          .enum(['tsonopoulos', 'hayden-oconnell'], {
            error: "The virial correlation must be 'tsonopoulos' or 'hayden-oconnell'",
          })
          .default('tsonopoulos'),
        poynting: z.boolean({ error: 'Say whether the Poynting factor is applied (true or false)' }).default(false),
        eta12: z
          .number({ error: 'The solvation parameter η12 must be a number' })
          .min(0, 'The solvation parameter η12 cannot be negative (0 means no solvation)')
          .max(MAX_ASSOCIATION_ETA, `The solvation parameter η12 must be at most ${MAX_ASSOCIATION_ETA}`)
          .optional(),
        eta12Source: z
          .string({ error: 'The source of η12 must be text' })
          .trim()
          .min(1, 'Name the source of η12 (paper and table), or leave it out')
          .max(500, 'Keep the source of η12 under 500 characters')
          .optional(),
      })
      .strict()
      .refine((v) => v.correlation === 'hayden-oconnell' || (v.eta12 === undefined && v.eta12Source === undefined), {
        path: ['eta12'],
        message: "The solvation parameter η12 belongs to Hayden–O'Connell; Tsonopoulos does not use it",
      })
      .refine((v) => v.correlation !== 'hayden-oconnell' || !v.eta12 || !!v.eta12Source, {
        path: ['eta12Source'],
        message: 'Name the source of the solvation parameter η12 (paper and table)',
      }),
  ],
  { error: "The vapour model must be 'ideal' or 'virial'" },
)
export type VaporModelChoice = z.output<typeof vaporModelChoiceSchema>

export const IDEAL_VAPOR: VaporModelChoice = { kind: 'ideal' }

/** The correlation's name in words. */
export function virialCorrelationLabel(c: string | null | undefined): string {
  return c === 'hayden-oconnell' ? 'Hayden–O’Connell' : 'Tsonopoulos'
}

/**
 * "ideal gas" · "virial gas, Tsonopoulos second virial coefficients" · "virial gas, Hayden–O’Connell second virial
 * coefficients (η12 = 1.5)" · "…, with the Poynting factor".
 */
export function vaporModelLabel(v: VaporModelChoice | null | undefined): string {
  if (!v || v.kind === 'ideal') return 'ideal gas (modified Raoult’s law)'
  const hoc = v.correlation === 'hayden-oconnell'
  return `virial gas, ${virialCorrelationLabel(v.correlation)} second virial coefficients${hoc && v.eta12 ? ` (η12 = ${v.eta12})` : ''}${v.poynting ? ', with the Poynting factor' : ''}`
}

/** The objective's name in words. */
export function objectiveLabel(o: string | null | undefined): string {
  return (
    {
      'bubble-point': 'bubble temperature and vapour composition (ΔT, Δy)',
      'bubble-pressure': 'bubble pressure and vapour composition (ΔP, Δy)',
      activity: 'activity coefficients (Δ ln γ)',
    }[o ?? 'bubble-point'] ?? String(o)
  )
}

/** Property names as a chemist reads them. */
const PROPERTY_WORDS: Record<string, string> = {
  Tc: 'critical temperature Tc',
  Pc: 'critical pressure Pc',
  omega: 'acentric factor ω',
  Vc: 'critical volume Vc',
  radiusOfGyration: 'mean radius of gyration RD',
}

/**
 * Why a virial vapour cannot be used for these components, naming each missing property and its component, or
 * null when both have what it needs.
 */
export function missingVirialData(
  components: { name: string; properties: ComponentProperties | null | undefined }[],
  correlation: VirialCorrelationChoice = 'tsonopoulos',
): string | null {
  const gaps = components.flatMap((c) => {
    const r = virialInputsOf(c.properties, correlation)
    return r.ok ? [] : [`${c.name}: ${r.missing.map((m) => PROPERTY_WORDS[m] ?? m).join(', ')}`]
  })
  if (!gaps.length) return null
  const what =
    correlation === 'hayden-oconnell'
      ? "A Hayden–O'Connell virial vapour needs each component's critical data and mean radius of gyration"
      : "A virial vapour needs each component's critical data"
  return `${what}; missing — ${gaps.join('; ')}. Enter them on the components screen (with their source) or choose the ideal vapour.`
}

/**
 * The choice (as a data set states it) behind thermo's vapour as a fit or joint fit stored it (`options.vapor`, with
 * the critical data it read): ideal unless virial; the correlation, the Poynting switch and Hayden–O'Connell's η12.
 */
export function vaporChoiceOfEngine(vapor: unknown): VaporModelChoice {
  const v = vapor as { kind?: string; correlation?: string; poynting?: boolean; eta12?: number } | null | undefined
  if (v?.kind !== 'virial') return { kind: 'ideal' }
  const hoc = v.correlation === 'hayden-oconnell'
  return {
    kind: 'virial',
    correlation: hoc ? 'hayden-oconnell' : 'tsonopoulos',
    poynting: v.poynting === true,
    ...(hoc && typeof v.eta12 === 'number' ? { eta12: v.eta12 } : {}),
  }
}

/**
 * η (a component's association or the unlike pair's solvation) at or above which the engine's Hayden–O'Connell
 * vapour is treated by the chemical theory of dimerisation (carboxylic acids); HOC_ACID_ETA of @ebullio/thermo.
 */
export const HOC_ACID_ETA = 4.5

/** Whether a stored engine vapour runs the chemical theory of dimerisation (HOC with an η or η12 ≥ 4.5). */
export function engineVaporDimerises(vapor: unknown): boolean {
  const v = vapor as
    { kind?: string; correlation?: string; eta12?: number; components?: { eta?: number }[] } | null | undefined
  if (v?.kind !== 'virial' || v.correlation !== 'hayden-oconnell') return false
  return (
    (v.eta12 ?? 0) >= HOC_ACID_ETA ||
    (Array.isArray(v.components) && v.components.some((c) => (c?.eta ?? 0) >= HOC_ACID_ETA))
  )
}

/**
 * A stored engine vapour (a fit's or a joint fit's `options.vapor`, an export's `vapor`) in words, as every result
 * states it: {@link vaporModelLabel} of {@link vaporChoiceOfEngine}; a Hayden–O'Connell vapour with a carboxylic
 * acid (it carries the components' η) adds that its fugacity coefficients come from the chemical theory of
 * dimerisation. One function for the API and the web.
 */
export function engineVaporLabel(vapor: unknown): string {
  const label = vaporModelLabel(vaporChoiceOfEngine(vapor))
  return engineVaporDimerises(vapor)
    ? `${label}; carboxylic acid (η ≥ ${HOC_ACID_ETA}): fugacity coefficients by the chemical theory of dimerisation`
    : label
}
