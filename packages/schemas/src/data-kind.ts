import { z } from 'zod'
import { virialInputsOf, type ComponentProperties } from './component-properties.js'

/**
 * What kind of measurement a data set holds and which vapour model its computations use.
 * - Isobaric data (layouts 'txy', 'tx') are taken at a nominal pressure; isothermal data ('pxy', 'px') at a nominal
 *   temperature, with the measured pressure per point. 'tx' and 'px' have no vapour composition.
 * - The vapour is ideal (modified Raoult's law) or a virial gas (second virial coefficients by Tsonopoulos, from the
 *   components' critical data), optionally with the Poynting factor of the liquid.
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
          .literal('tsonopoulos', { error: 'The only virial correlation offered is Tsonopoulos' })
          .default('tsonopoulos'),
        poynting: z.boolean({ error: 'Say whether the Poynting factor is applied (true or false)' }).default(false),
      })
      .strict(),
  ],
  { error: "The vapour model must be 'ideal' or 'virial'" },
)
export type VaporModelChoice = z.output<typeof vaporModelChoiceSchema>

export const IDEAL_VAPOR: VaporModelChoice = { kind: 'ideal' }

/** "ideal gas" · "virial, Tsonopoulos B" · "virial, Tsonopoulos B, with Poynting factor". */
export function vaporModelLabel(v: VaporModelChoice | null | undefined): string {
  if (!v || v.kind === 'ideal') return 'ideal gas (modified Raoult’s law)'
  return `virial gas, Tsonopoulos second virial coefficients${v.poynting ? ', with the Poynting factor' : ''}`
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
}

/**
 * Why a virial vapour cannot be used for these components, naming each missing property and its component, or
 * null when both have what it needs.
 */
export function missingVirialData(
  components: { name: string; properties: ComponentProperties | null | undefined }[],
): string | null {
  const gaps = components.flatMap((c) => {
    const r = virialInputsOf(c.properties)
    return r.ok ? [] : [`${c.name}: ${r.missing.map((m) => PROPERTY_WORDS[m] ?? m).join(', ')}`]
  })
  if (!gaps.length) return null
  return `A virial vapour needs each component's critical data; missing — ${gaps.join('; ')}. Enter them on the components screen (with their source) or choose the ideal vapour.`
}
