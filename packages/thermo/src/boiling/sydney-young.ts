/**
 * Sydney Young's rule for correcting a normal boiling temperature measured off standard pressure
 * (S. Young, J. Chem. Soc. Trans. 81 (1902) 777): Δt = c·(760 − p/mmHg)·(273.15 + t/°C).
 * For display and quick checks only: the fits use each point's measured pressure.
 */
import { ThermoError } from '../errors.js'

/** c for non-associated liquids, per mmHg (reference-values §6, from memory). */
export const SYDNEY_YOUNG_C_NON_ASSOCIATED = 0.00012
/** c for water and alcohols (associated liquids), per mmHg (reference-values §6, from memory). */
export const SYDNEY_YOUNG_C_ASSOCIATED = 0.0001

/** Standard atmosphere, Pa (exact by definition). */
const P_STANDARD = 101325
/** 1 mmHg = 101325/760 Pa (conventional definition). */
const PA_PER_MMHG = 101325 / 760
/** The rule is meant for small pressure differences; beyond ~10 kPa use a vapour-pressure equation (common practice, no source). */
const LARGE_DIFFERENCE_PA = 10000

/** Result of `sydneyYoungCorrection`. */
export interface SydneyYoungResult {
  /** Boiling temperature corrected to 101.325 kPa, K. */
  T: number
  /** Correction added to the measured temperature, K. */
  deltaT: number
  /** c actually used, per mmHg. */
  c: number
  warnings: string[]
  assumptions: string[]
}

/**
 * Correct a boiling temperature measured at pressure P to 101.325 kPa with Sydney Young's rule.
 * @param options.T measured boiling temperature, K
 * @param options.P pressure during the measurement, Pa
 * @param options.c coefficient per mmHg; default 0.00012 (non-associated liquids); use 0.00010 for water and alcohols
 * @returns corrected temperature (K), the correction (K), c, warnings and assumptions
 * @throws ThermoError when T, P or c is not a positive finite number
 */
export function sydneyYoungCorrection(options: { T: number; P: number; c?: number }): SydneyYoungResult {
  const { T, P } = options ?? ({} as { T: number; P: number })
  const c = options?.c ?? SYDNEY_YOUNG_C_NON_ASSOCIATED
  if (typeof T !== 'number' || !Number.isFinite(T) || T <= 0) {
    throw new ThermoError(
      'invalid-temperature',
      `The boiling temperature must be a positive number of kelvin; got ${String(T)}.`,
    )
  }
  if (typeof P !== 'number' || !Number.isFinite(P) || P <= 0) {
    throw new ThermoError('invalid-pressure', `The pressure must be a positive number of pascals; got ${String(P)}.`)
  }
  if (typeof c !== 'number' || !Number.isFinite(c) || c <= 0) {
    throw new ThermoError(
      'invalid-coefficient',
      `The Sydney Young coefficient c must be a positive number per mmHg; got ${String(c)}.`,
    )
  }
  // 273.15 + t/°C is simply T in kelvin
  const deltaT = c * (760 - P / PA_PER_MMHG) * T
  const warnings: string[] = []
  if (Math.abs(P - P_STANDARD) > LARGE_DIFFERENCE_PA) {
    warnings.push(
      `The measurement pressure is ${(P / 1000).toFixed(1)} kPa, far from 101.325 kPa: Sydney Young's rule is meant for small differences; use a vapour-pressure equation instead.`,
    )
  }
  return {
    T: T + deltaT,
    deltaT,
    c,
    warnings,
    assumptions: [
      'Sydney Young rule: Δt proportional to the pressure difference and the absolute temperature',
      "for display and quick checks only; fits use each point's measured pressure",
    ],
  }
}
