/** Words for what a signature covers: fit parameters with their units, and the outlier flags kept with it. */
import type { Fit } from '../../api/datasets'

/**
 * Units of the activity-model parameters as stored (thermo's names): Wilson a12, a21 and NRTL b12, b21 are
 * energies in J/mol; Margules and Van Laar A12, A21 and NRTL α are dimensionless.
 */
export const PARAMETER_UNITS: Record<string, string> = {
  a12: 'J/mol',
  a21: 'J/mol',
  b12: 'J/mol',
  b21: 'J/mol',
  A12: 'dimensionless',
  A21: 'dimensionless',
  alpha: 'dimensionless',
}

const symbol = (name: string) => (name === 'alpha' ? 'α' : name)
const withUnit = (text: string, unit: string | undefined) =>
  !unit ? text : unit === 'dimensionless' ? `${text} (dimensionless)` : `${text} ${unit}`

/** "a12 = -686.482 ± 65.3 J/mol" (value to 6 significant digits, standard error to 3). */
export function parameterText(p: {
  name: string
  value: number
  standardError?: number | null
  atBound?: boolean
  unit?: string
}): string {
  const se = p.atBound
    ? ' (at bound)'
    : typeof p.standardError === 'number' && Number.isFinite(p.standardError)
      ? ` ± ${p.standardError.toPrecision(3)}`
      : ''
  return withUnit(`${symbol(p.name)} = ${p.value.toPrecision(6)}${se}`, p.unit ?? PARAMETER_UNITS[p.name])
}

/** Every parameter of a fit with its unit, plus NRTL's α when it was held rather than fitted. */
export function fitParametersText(f: Pick<Fit, 'model' | 'parameters' | 'options'>): string {
  const parts = f.parameters.map(parameterText)
  const alpha = f.options?.alpha
  if (f.model === 'nrtl' && typeof alpha === 'number' && !f.parameters.some((p) => p.name === 'alpha'))
    parts.push(`α = ${alpha} held (dimensionless)`)
  return parts.join(', ') || 'no parameters'
}
