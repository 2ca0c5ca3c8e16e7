import { ThermoError } from '../errors.js'
import { R, type VaporPressureModel } from '../types.js'
import { checkVaporPressurePoints, type VaporPressurePoint } from './fit-antoine.js'

/** Result of {@link fitClausiusClapeyron}: the model and ΔHvap in J/mol with its standard error (NaN when not estimable). */
export interface FitClausiusClapeyronResult {
  model: Extract<VaporPressureModel, { kind: 'clausius-clapeyron' }>
  dHvap: number
  standardError: number
  warnings: string[]
}

/**
 * Integrated Clausius–Clapeyron (constant ΔHvap): ln(P/Pref) = −ΔHvap/R·(1/T − 1/Tref).
 * One point needs a known `dHvap` (J/mol); two points give ΔHvap exactly; three or more give it by
 * least squares on ln P against 1/T. T in K, P in Pa. Tref/Pref are the point nearest the middle.
 */
export function fitClausiusClapeyron(
  points: VaporPressurePoint[],
  options: { dHvap?: number } = {},
): FitClausiusClapeyronResult {
  const pts = checkVaporPressurePoints(points, 1, 'A Clausius–Clapeyron model')
  const known = options.dHvap
  if (known !== undefined && !(Number.isFinite(known) && known > 0)) {
    throw new ThermoError(
      'invalid-input',
      `The enthalpy of vaporization must be a positive number of J/mol; got ${known}.`,
    )
  }
  if (pts.length === 1 && known === undefined) {
    throw new ThermoError(
      'insufficient-data',
      'With one point, a Clausius–Clapeyron model needs a known enthalpy of vaporization (dHvap, J/mol).',
    )
  }
  const ref = pts[Math.floor((pts.length - 1) / 2)]
  const range: [number, number] = [pts[0].T, pts[pts.length - 1].T]
  const warnings: string[] = []
  let dHvap = known ?? NaN
  let standardError = NaN
  if (known === undefined) {
    // Straight line ln P = α − β/T with β = ΔHvap/R.
    const n = pts.length
    const u = pts.map((p) => -1 / p.T)
    const y = pts.map((p) => Math.log(p.P))
    const mu = u.reduce((s, v) => s + v, 0) / n
    const my = y.reduce((s, v) => s + v, 0) / n
    const suu = u.reduce((s, v) => s + (v - mu) ** 2, 0)
    const beta = u.reduce((s, v, i) => s + (v - mu) * (y[i] - my), 0) / suu
    dHvap = beta * R
    if (n > 2) {
      const ss = y.reduce((s, v, i) => s + (v - my - beta * (u[i] - mu)) ** 2, 0)
      standardError = Math.sqrt(ss / (n - 2) / suu) * R
    } else {
      warnings.push('Two points determine ΔHvap exactly; its standard error needs at least 3 points.')
    }
  }
  if (pts.length > 1 && known !== undefined) {
    warnings.push('A known enthalpy of vaporization was given, so only the reference point is used.')
  }
  return {
    model: { kind: 'clausius-clapeyron', Tref: ref.T, Pref: ref.P, dHvap, range: pts.length > 1 ? range : undefined },
    dHvap,
    standardError,
    warnings,
  }
}
