/**
 * Every vapour-pressure model reduces to one internal form, ln(P/Pa) = a − b/(T/K + c),
 * so the solvers evaluate a single exp per component and never branch on units.
 * Clausius–Clapeyron is the same form with c = 0.
 */
import { ThermoError } from '../errors.js'
import { PASCALS_PER } from '../units.js'
import { R, type VaporPressureModel } from '../types.js'

/** ln(pascals per unit) for the units an Antoine model may be stored in. */
const LN_PASCALS: Readonly<Record<string, number>> = Object.fromEntries(
  (['Pa', 'kPa', 'bar', 'mmHg', 'atm'] as const).map((u) => [u, Math.log(PASCALS_PER[u])]),
)

/** ln(P/Pa) = a − b/(T + c), T in K; tMin/tMax the correlation's range in K (±Infinity when none). */
export interface LnPsat {
  a: number
  b: number
  c: number
  tMin: number
  tMax: number
}

function checkRange(range: [number, number] | undefined | null): void {
  // Stored models may carry `range: null` (no range), which means the same as leaving it out.
  if (range === undefined || range === null) return
  if (!Array.isArray(range) || range.length !== 2 || !range.every(Number.isFinite) || range[0] >= range[1]) {
    throw new ThermoError(
      'invalid-model',
      'A vapour-pressure range must be two finite numbers [min, max] with min < max.',
    )
  }
}

/** Validate a vapour-pressure model and reduce it to the internal form. */
export function compileVaporPressure(model: VaporPressureModel): LnPsat {
  if (model === null || typeof model !== 'object') {
    throw new ThermoError('invalid-model', 'A vapour-pressure model is required.')
  }
  if (model.kind === 'antoine') {
    const { A, B, C, log, pressureUnit, temperatureUnit, range } = model
    if (!(Number.isFinite(A) && Number.isFinite(B) && Number.isFinite(C))) {
      throw new ThermoError('invalid-model', 'Antoine constants A, B and C must be finite numbers.')
    }
    if (log !== 'ln' && log !== 'log10') {
      throw new ThermoError('invalid-model', `Unknown Antoine logarithm "${log}"; use "ln" or "log10".`)
    }
    const lnPerUnit = Object.hasOwn(LN_PASCALS, pressureUnit) ? LN_PASCALS[pressureUnit] : undefined
    if (lnPerUnit === undefined) {
      throw new ThermoError(
        'invalid-model',
        `Unknown Antoine pressure unit "${pressureUnit}"; use Pa, kPa, bar, mmHg or atm.`,
      )
    }
    if (temperatureUnit !== 'C' && temperatureUnit !== 'K') {
      throw new ThermoError('invalid-model', `Unknown Antoine temperature unit "${temperatureUnit}"; use "C" or "K".`)
    }
    checkRange(range)
    const k = log === 'ln' ? 1 : Math.LN10
    const shift = temperatureUnit === 'C' ? 273.15 : 0
    return {
      a: A * k + lnPerUnit,
      b: B * k,
      c: C - shift,
      tMin: range ? range[0] + shift : -Infinity,
      tMax: range ? range[1] + shift : Infinity,
    }
  }
  if (model.kind === 'clausius-clapeyron') {
    const { Tref, Pref, dHvap, range } = model
    if (
      !(Tref > 0 && Number.isFinite(Tref)) ||
      !(Pref > 0 && Number.isFinite(Pref)) ||
      !(dHvap > 0 && Number.isFinite(dHvap))
    ) {
      throw new ThermoError(
        'invalid-model',
        'Clausius–Clapeyron needs a positive Tref (K), Pref (Pa) and enthalpy of vaporization (J/mol).',
      )
    }
    checkRange(range)
    const b = dHvap / R
    return {
      a: Math.log(Pref) + b / Tref,
      b,
      c: 0,
      tMin: range ? range[0] : -Infinity,
      tMax: range ? range[1] : Infinity,
    }
  }
  throw new ThermoError('invalid-model', `Unknown vapour-pressure model kind "${(model as { kind: unknown }).kind}".`)
}

/** Saturation temperature (K) of the internal form at ln(P/Pa) = lnP, or NaN when the form cannot reach it. */
export function lnPsatInverse(vp: LnPsat, lnP: number): number {
  const d = vp.a - lnP
  return d > 0 ? vp.b / d - vp.c : NaN
}

/** Range text in the model's own unit, for warnings. */
export function describeRange(model: VaporPressureModel): string {
  const range = model.range as [number, number]
  const unit = model.kind === 'antoine' && model.temperatureUnit === 'C' ? '°C' : 'K'
  return `${range[0]} to ${range[1]} ${unit}`
}

/** Warning when T (K) lies outside the model's stated range; empty list otherwise. */
export function rangeWarnings(model: VaporPressureModel, vp: LnPsat, T: number, label: string): string[] {
  if (T >= vp.tMin && T <= vp.tMax) return []
  const tC = (T - 273.15).toFixed(2)
  return [
    `${label}: ${T.toFixed(2)} K (${tC} °C) is outside the range of its vapour-pressure correlation (${describeRange(model)}); the value is extrapolated.`,
  ]
}

/**
 * One warning per component whose vapour-pressure range does not cover the temperatures [Tmin, Tmax] (K)
 * that a data set or curve spans; empty when both are covered.
 */
export function spanWarnings(
  models: [VaporPressureModel, VaporPressureModel],
  Tmin: number,
  Tmax: number,
  names?: [string, string],
): string[] {
  const out: string[] = []
  models.forEach((model, i) => {
    const vp = compileVaporPressure(model)
    if (Tmin >= vp.tMin && Tmax <= vp.tMax) return
    const label = names?.[i] ?? `Component ${i + 1}`
    out.push(
      `${label}: temperatures from ${(Tmin - 273.15).toFixed(2)} to ${(Tmax - 273.15).toFixed(2)} °C reach outside the range of its vapour-pressure correlation (${describeRange(model)}); values there are extrapolated.`,
    )
  })
  return out
}
