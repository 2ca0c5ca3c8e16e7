/** Vapour-pressure correlations written out the way they were published, for reading and checking. */
import type { VaporPressureSet } from '../../api/components'

const num = (v: unknown) => (typeof v === 'number' ? String(v) : '?')

/** The equation in its own units, e.g. "ln(P/kPa) = 16.3872 − 3885.7 / (t/°C + 230.17)". */
export function equationText(set: Pick<VaporPressureSet, 'parameters'>): string {
  const p = set.parameters as Record<string, unknown>
  if (p.kind === 'antoine') {
    const log = p.log === 'ln' ? 'ln' : 'log₁₀'
    const t = p.temperatureUnit === 'K' ? 'T/K' : 't/°C'
    const c = Number(p.C)
    const cText = c === 0 ? '' : c > 0 ? ` + ${num(p.C)}` : ` − ${num(Math.abs(c))}`
    return `${log}(P/${String(p.pressureUnit)}) = ${num(p.A)} − ${num(p.B)} / (${t}${cText})`
  }
  if (p.kind === 'clausius-clapeyron') {
    return `ln(P/${num(p.Pref)} Pa) = −(${num(p.dHvap)} J/mol / R)·(1/T − 1/${num(p.Tref)} K)`
  }
  return JSON.stringify(p)
}

/** "−26 to 77 °C", or "not stated". */
export function rangeText(set: Pick<VaporPressureSet, 'rangeMin' | 'rangeMax' | 'rangeUnit'>): string {
  if (set.rangeMin === null || set.rangeMax === null) return 'not stated'
  return `${set.rangeMin} to ${set.rangeMax} ${set.rangeUnit === 'K' ? 'K' : '°C'}`
}
