/**
 * Unit conversion at the edges of the engine. Inside, everything is SI (K, Pa, J/mol).
 *
 * This is the one table of conversion factors in Ebullio: the API converts uploads and queries with it and
 * the web app's display units import it (through `@ebullio/thermo/units`, which pulls nothing else in).
 * Every factor is an exact definition, written as the product that defines it (section numbers from memory):
 * - bar = 10⁵ Pa, and the prefixes k, M, m: BIPM, The International System of Units (SI Brochure), 9th ed.,
 *   2019, Table 8 and the table of SI prefixes.
 * - standard atmosphere = 101 325 Pa exactly (10th CGPM, 1954); NIST SP 811 (2008 ed.), App. B.8.
 * - torr = 1/760 of the standard atmosphere, exactly: NIST SP 811 (2008 ed.), App. B.8.
 * - conventional millimetre of mercury = 13.5951 g/cm³ · 9.806 65 m/s² · 1 mm = 133.322 387 415 Pa exactly
 *   (SI Brochure, 9th ed., Table 8 gives 133.322 Pa, rounded; NIST SP 811, App. B.8, 1.333 224 E+02).
 * - pound-force per square inch = 0.453 592 37 kg · 9.806 65 m/s² / (0.0254 m)² = 6894.757 293 168… Pa
 *   (the international pound and inch of 1959 and standard gravity; NIST SP 811, App. B.8, 6.894 757 E+03).
 * - temperatures: T/K = t/°C + 273.15 (SI Brochure, 9th ed., §2.3.1); t/°F = 1.8 · t/°C + 32
 *   (NIST SP 811 (2008 ed.), App. B.8).
 */
import { ThermoError } from './errors.js'
import type { PressureUnit } from './types.js'

/** Temperature units accepted at the edges. */
export type TemperatureUnitName = 'K' | 'C' | 'F'
/** Pressure units accepted at the edges. */
export type PressureUnitName = PressureUnit | 'torr' | 'psi' | 'MPa' | 'mbar'

/** Standard acceleration of gravity, m/s² (3rd CGPM, 1901; exact). */
const STANDARD_GRAVITY = 9.80665
/** The international avoirdupois pound, kg (1959 agreement; exact). */
const POUND_KG = 0.45359237
/** The international inch, m (1959 agreement; exact). */
const INCH_M = 0.0254
/** Conventional density of mercury for the mmHg, kg/m³ (exact by convention). */
const MERCURY_DENSITY = 13595.1
/** The standard atmosphere, Pa (exact). */
const STANDARD_ATMOSPHERE = 101325

/** Pascals per unit: the one table of pressure factors (sources in the header of this file). */
export const PASCALS_PER: Readonly<Record<PressureUnitName, number>> = Object.freeze({
  Pa: 1,
  kPa: 1e3,
  MPa: 1e6,
  bar: 1e5,
  mbar: 1e2,
  atm: STANDARD_ATMOSPHERE,
  mmHg: (MERCURY_DENSITY * STANDARD_GRAVITY) / 1000,
  torr: STANDARD_ATMOSPHERE / 760,
  psi: (POUND_KG * STANDARD_GRAVITY) / (INCH_M * INCH_M),
})

/** The pressure units, in the order they are offered and listed in messages. */
export const PRESSURE_UNITS: readonly PressureUnitName[] = Object.freeze(Object.keys(PASCALS_PER) as PressureUnitName[])
/** The temperature units: K, C (°C) and F (°F). */
export const TEMPERATURE_UNITS: readonly TemperatureUnitName[] = Object.freeze(['K', 'C', 'F'] as const)

/** Kelvin at 0 °C (exact). */
const ICE_POINT_K = 273.15

function checkTemperatureUnit(unit: string): asserts unit is TemperatureUnitName {
  if (!(TEMPERATURE_UNITS as readonly string[]).includes(unit)) {
    throw new ThermoError('invalid-unit', `Unknown temperature unit "${unit}"; use K, C or F.`)
  }
}

function pascalsPer(unit: string): number {
  if (!Object.hasOwn(PASCALS_PER, unit)) {
    throw new ThermoError('invalid-unit', `Unknown pressure unit "${unit}"; use ${PRESSURE_UNITS.join(', ')}.`)
  }
  return PASCALS_PER[unit as PressureUnitName]
}

/** Convert a temperature in `unit` ('K', 'C' for °C, 'F' for °F) to kelvin. */
export function toKelvin(value: number, unit: TemperatureUnitName): number {
  checkTemperatureUnit(unit)
  if (unit === 'C') return value + ICE_POINT_K
  if (unit === 'F') return ((value - 32) * 5) / 9 + ICE_POINT_K
  return value
}

/** Convert a temperature in kelvin to `unit` ('K', 'C' for °C, 'F' for °F). */
export function fromKelvin(T: number, unit: TemperatureUnitName): number {
  checkTemperatureUnit(unit)
  if (unit === 'C') return T - ICE_POINT_K
  if (unit === 'F') return ((T - ICE_POINT_K) * 9) / 5 + 32
  return T
}

/** Convert a temperature difference in kelvin to `unit` (the same number in K and °C, × 1.8 in °F). */
export function temperatureDifferenceFromKelvin(dT: number, unit: TemperatureUnitName): number {
  checkTemperatureUnit(unit)
  return unit === 'F' ? (dT * 9) / 5 : dT
}

/** Convert a pressure in `unit` (Pa, kPa, MPa, bar, mbar, atm, mmHg, torr, psi) to pascals. */
export function toPascal(value: number, unit: PressureUnitName): number {
  return value * pascalsPer(unit)
}

/** Convert a pressure in pascals to `unit` (Pa, kPa, MPa, bar, mbar, atm, mmHg, torr, psi). */
export function fromPascal(P: number, unit: PressureUnitName): number {
  return P / pascalsPer(unit)
}
