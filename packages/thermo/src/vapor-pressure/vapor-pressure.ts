import { checkPressure, checkTemperature, ThermoError } from '../errors.js'
import type { VaporPressureModel } from '../types.js'
import { compileVaporPressure, lnPsatInverse, rangeWarnings } from './compiled.js'

/**
 * Saturation (vapour) pressure of a pure component.
 * @param model Antoine or Clausius–Clapeyron model, constants as published.
 * @param T temperature in K.
 * @returns pressure in Pa. Outside the model's range the value is extrapolated; use
 *   {@link vaporPressureRangeWarnings} to tell the user.
 */
export function vaporPressure(model: VaporPressureModel, T: number): number {
  checkTemperature(T)
  const vp = compileVaporPressure(model)
  if (T + vp.c <= 0) {
    throw new ThermoError(
      'out-of-domain',
      `The Antoine equation has no value at ${T} K: T + C is zero or negative there.`,
    )
  }
  return Math.exp(vp.a - vp.b / (T + vp.c))
}

/**
 * Saturation temperature (normal boiling point at 101325 Pa) of a pure component.
 * @param model Antoine or Clausius–Clapeyron model.
 * @param P pressure in Pa.
 * @returns temperature in K.
 */
export function saturationTemperature(model: VaporPressureModel, P: number): number {
  checkPressure(P)
  const vp = compileVaporPressure(model)
  const T = lnPsatInverse(vp, Math.log(P))
  if (!(T + vp.c > 0)) {
    throw new ThermoError(
      'no-solution',
      `No saturation temperature at ${P} Pa: the pressure is beyond what this vapour-pressure correlation can reach.`,
    )
  }
  return T
}

/**
 * Warnings for a temperature (K) outside the model's stated range; an empty list when inside or when no range is given.
 * @param label how to name the component in the message, default "Vapour pressure".
 */
export function vaporPressureRangeWarnings(model: VaporPressureModel, T: number, label = 'Vapour pressure'): string[] {
  checkTemperature(T)
  return rangeWarnings(model, compileVaporPressure(model), T, label)
}
