/**
 * Unit conversion at the edges of the engine. Inside, everything is SI (K, Pa, J/mol).
 * mathjs does the arithmetic; two of its definitions are tightened: mathjs rounds the
 * millimetre of mercury to 133.322 Pa, while the conventional value is 133.322387415 Pa
 * and the torr is exactly 101325/760 Pa (BIPM SI Brochure, 9th ed., 2019, Table 8).
 * Only mathjs's unit functions are created (its tree-shakable factory API): the expression
 * parser, matrices and the rest of the library stay out of the web app's bundle.
 */
import { create, createUnitDependencies, unitDependencies } from 'mathjs'
import { ThermoError } from './errors.js'
import type { PressureUnit } from './types.js'

const math = create({ unitDependencies, createUnitDependencies })
math.createUnit('mmHg', '133.322387415 Pa', { override: true })
math.createUnit('torr', { definition: `${101325 / 760} Pa` }, { override: true })

/** Temperature units accepted at the edges. */
export type TemperatureUnitName = 'K' | 'C' | 'F'
/** Pressure units accepted at the edges. */
export type PressureUnitName = PressureUnit | 'torr' | 'psi' | 'MPa' | 'mbar'

const TEMPERATURE_UNITS: Record<TemperatureUnitName, string> = { K: 'K', C: 'degC', F: 'degF' }
const PRESSURE_UNITS: readonly PressureUnitName[] = ['Pa', 'kPa', 'MPa', 'bar', 'mbar', 'atm', 'mmHg', 'torr', 'psi']

/** Pascals per unit, computed once from mathjs so the hot paths never call it. */
export const PASCALS_PER: Readonly<Record<PressureUnitName, number>> = Object.fromEntries(
  PRESSURE_UNITS.map((u) => [u, math.unit(1, u).toNumber('Pa')]),
) as Record<PressureUnitName, number>

/** Convert a Celsius temperature to kelvin. */
export function celsiusToKelvin(tC: number): number {
  return tC + 273.15
}

/** Convert a kelvin temperature to Celsius. */
export function kelvinToCelsius(T: number): number {
  return T - 273.15
}

function temperatureUnit(unit: string): string {
  const name = TEMPERATURE_UNITS[unit as TemperatureUnitName]
  if (!name) throw new ThermoError('invalid-unit', `Unknown temperature unit "${unit}"; use K, C or F.`)
  return name
}

function pressureUnit(unit: string): string {
  if (!PRESSURE_UNITS.includes(unit as PressureUnitName)) {
    throw new ThermoError('invalid-unit', `Unknown pressure unit "${unit}"; use ${PRESSURE_UNITS.join(', ')}.`)
  }
  return unit
}

/** Convert a temperature in `unit` ('K', 'C' for °C, 'F' for °F) to kelvin. */
export function toKelvin(value: number, unit: TemperatureUnitName): number {
  return math.unit(value, temperatureUnit(unit)).toNumber('K')
}

/** Convert a temperature in kelvin to `unit` ('K', 'C' for °C, 'F' for °F). */
export function fromKelvin(T: number, unit: TemperatureUnitName): number {
  return math.unit(T, 'K').toNumber(temperatureUnit(unit))
}

/** Convert a pressure in `unit` (Pa, kPa, MPa, bar, mbar, atm, mmHg, torr, psi) to pascals. */
export function toPascal(value: number, unit: PressureUnitName): number {
  return math.unit(value, pressureUnit(unit)).toNumber('Pa')
}

/** Convert a pressure in pascals to `unit` (Pa, kPa, MPa, bar, mbar, atm, mmHg, torr, psi). */
export function fromPascal(P: number, unit: PressureUnitName): number {
  return math.unit(P, 'Pa').toNumber(pressureUnit(unit))
}
