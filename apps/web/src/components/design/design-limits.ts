/**
 * What the engineer's screens may compute at a chosen pressure: the limits of the pressure field, which
 * component boils first there, and whether the pure components' boiling temperatures lie so far outside
 * their vapour-pressure correlations' stated ranges that a column or batch design must not be offered.
 */
import { saturationTemperature, type BinarySystem, type VaporPressureModel } from '@ebullio/thermo'

/**
 * Limits of the design pressure field, Pa: the same plausible range the run-file upload accepts
 * (0.5 kPa to 5 MPa, apps/api/src/uploads/run-file.ts), so a design never asks for more than a measurement could.
 */
export const DESIGN_PRESSURE_PA: Readonly<{ min: number; max: number }> = { min: 500, max: 5e6 }

/**
 * How far (K) a pure component's boiling temperature may lie beyond its correlation's stated range before
 * column and batch designs are blocked. Our rule (common practice, no source): an Antoine fit extrapolated by
 * a few tens of kelvin still gives vapour pressures within a few per cent for ordinary solvents, but the error
 * grows quickly beyond, and far above the range the liquid may be near or past its critical point, which the
 * stored correlations cannot tell (critical constants are not stored). 20 K keeps routine cases (a mixture's
 * bubble points a little past one end of a range) open and stops designs at, e.g., acetone at 50 bar (Tb ≈ 247 °C
 * against a range ending at 77 °C); at the field's lowest 0.5 kPa acetone (≈ −44 °C, range from −26 °C) is
 * still within it and only flagged as extrapolated.
 */
export const RANGE_MARGIN_K = 20

/** One pure component at the chosen pressure. T and the range in K; `beyondK` is 0 inside the range (or with no range). */
export interface PureAtPressure {
  name: string
  T: number
  range: [number, number] | null
  beyondK: number
  side: 'above' | 'below' | null
}

/** The verdict at one pressure (Pa). `lighter` is the index (0 or 1) of the component that boils lower there. */
export interface PressureVerdict {
  P: number
  pure: [PureAtPressure, PureAtPressure]
  lighter: 0 | 1
  /** True when a pure boiling temperature lies more than RANGE_MARGIN_K beyond its correlation's range. */
  designBlocked: boolean
}

/** The stated range of a vapour-pressure model in K, or null when none is stated. */
export function rangeKelvin(model: VaporPressureModel): [number, number] | null {
  const r = model.range
  if (!r) return null
  const shift = model.kind === 'antoine' && model.temperatureUnit === 'C' ? 273.15 : 0
  return [r[0] + shift, r[1] + shift]
}

function pureAt(model: VaporPressureModel, name: string, P: number): PureAtPressure {
  const T = saturationTemperature(model, P)
  const range = rangeKelvin(model)
  if (!range || (T >= range[0] && T <= range[1])) return { name, T, range, beyondK: 0, side: null }
  return T > range[1]
    ? { name, T, range, beyondK: T - range[1], side: 'above' }
    : { name, T, range, beyondK: range[0] - T, side: 'below' }
}

/** Pure boiling temperatures at P (Pa), which component is the lighter there, and whether designs are blocked. */
export function pressureVerdict(system: BinarySystem, P: number, names: [string, string]): PressureVerdict {
  const pure: [PureAtPressure, PureAtPressure] = [
    pureAt(system.vaporPressure[0], names[0], P),
    pureAt(system.vaporPressure[1], names[1], P),
  ]
  return {
    P,
    pure,
    lighter: pure[0].T <= pure[1].T ? 0 : 1,
    designBlocked: pure.some((p) => p.beyondK > RANGE_MARGIN_K),
  }
}

/** Display helpers from the preferences store (K in, the chosen unit out; differences in K or °F). */
export interface TemperatureDisplay {
  fmtT: (T: number, decimals?: number) => string
  tFromK: (T: number) => number
  dT: (d: number) => number
  dTLabel: () => string
}

/** "−26 to 77 °C" in the display unit. */
function rangeText(range: [number, number], u: TemperatureDisplay): string {
  return `${u.tFromK(range[0]).toFixed(0)} to ${u.fmtT(range[1], 0)}`
}

/**
 * Plain words for the components whose boiling temperature at P lies outside their correlation's range,
 * e.g. "acetone boils at 262.81 °C, 185.8 K above its vapour-pressure equation's range (−26 to 77 °C)".
 * Empty when both are inside.
 */
export function outOfRangeLines(v: PressureVerdict, u: TemperatureDisplay): string[] {
  return v.pure
    .filter((p) => p.side && p.range)
    .map(
      (p) =>
        `${p.name} boils at ${u.fmtT(p.T)}, ${u.dT(p.beyondK).toFixed(1)} ${u.dTLabel()} ${p.side} its vapour-pressure equation's range (${rangeText(p.range!, u)})`,
    )
}

/** True for the engine's vapour-pressure range warnings, which the screen summarises in one banner instead. */
export function isRangeWarning(w: string): boolean {
  return w.includes('the range of its vapour-pressure correlation')
}

/**
 * Everything extrapolated at this pressure, one item per cause, for the one banner of the screen:
 * pure boiling points outside a range, a component's vapour pressure evaluated outside its range somewhere
 * between the two boiling points (Tmin–Tmax of the diagram, K), and the activity model far from the
 * measured pressure (`farFromMeasured` names that pressure, or null).
 */
export function extrapolationItems(
  system: BinarySystem,
  v: PressureVerdict,
  span: { Tmin: number; Tmax: number } | null,
  farFromMeasured: string | null,
  u: TemperatureDisplay,
): string[] {
  const items = outOfRangeLines(v, u)
  if (span) {
    v.pure.forEach((p, i) => {
      const r = rangeKelvin(system.vaporPressure[i])
      if (p.side || !r) return
      const beyond = [
        span.Tmax > r[1] ? `above ${u.fmtT(r[1], 0)}` : '',
        span.Tmin < r[0] ? `below ${u.fmtT(r[0], 0)}` : '',
      ].filter(Boolean)
      if (beyond.length)
        items.push(
          `${p.name}'s vapour pressure ${beyond.join(' and ')} in part of the diagram (its equation covers ${rangeText(r, u)})`,
        )
    })
  }
  if (farFromMeasured)
    items.push(
      `the activity model, which was fitted to data measured at ${farFromMeasured} and is used here far from that pressure`,
    )
  return items
}

/** Which component is the more volatile, from the α12 range: "reverses" only when the range straddles 1. */
export function volatilityNote(min: number, max: number, names: [string, string]): string {
  if (min < 1 && max > 1) return 'Crosses 1: the order of volatility reverses across composition (an azeotrope).'
  if (min >= 1) return `Above 1 across the whole range: ${names[0]} is the more volatile throughout.`
  return `Below 1 across the whole range: ${names[1]} is the more volatile throughout.`
}
