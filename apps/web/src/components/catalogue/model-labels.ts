import { FIT_MODEL_LABELS } from '@ebullio/schemas'

/** Display names of activity models as chemists write them (one table, packages/schemas/src/fit-label.ts). */
export const MODEL_LABELS: Readonly<Record<string, string>> = FIT_MODEL_LABELS

/** Units of activity-model parameters as Ebullio stores them (energies in J/mol; Margules and Van Laar dimensionless). */
export const PARAMETER_UNITS: Record<string, string> = {
  a12: 'J/mol',
  a21: 'J/mol',
  b12: 'J/mol',
  b21: 'J/mol',
  A12: '',
  A21: '',
  alpha: '',
}

/** Significant figures given to the largest parameter of a unit within one model (common practice, no source). */
const PARAMETER_SIG_FIGS = 4

/** Decimals for all parameters sharing a unit in one model: 4 significant figures on the largest, at least 1 decimal. */
function sharedDecimals(values: number[]): number {
  const big = Math.max(...values.map((v) => Math.abs(v)).filter((v) => Number.isFinite(v) && v > 0), 0)
  if (big === 0) return PARAMETER_SIG_FIGS
  return Math.max(1, PARAMETER_SIG_FIGS - Math.floor(Math.log10(big)) - 1)
}

/** A signed number with the true minus sign "−" (U+2212), as the lab screens write negatives. */
function signed(v: number, decimals: number): string {
  const s = v.toFixed(decimals)
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s.replace(/^-/, '−')
}

/**
 * "a12 = −670.1 J/mol, a21 = 2448.0 J/mol" (NRTL's alpha as α): the parameters of one model, those sharing a unit written with the same
 * decimals (4 significant figures on the largest, so a pair reads alike), negatives with "−".
 */
export function parameterText(ps: { name: string; value: number }[]): string {
  const unitOf = (name: string) => PARAMETER_UNITS[name] ?? ''
  const decimals = new Map<string, number>()
  for (const u of new Set(ps.map((p) => unitOf(p.name))))
    decimals.set(u, sharedDecimals(ps.filter((p) => unitOf(p.name) === u).map((p) => p.value)))
  return ps
    .map(
      (p) =>
        `${p.name === 'alpha' ? 'α' : p.name} = ${signed(p.value, decimals.get(unitOf(p.name))!)}${unitOf(p.name) ? ' ' + unitOf(p.name) : ''}`,
    )
    .join(', ')
}
