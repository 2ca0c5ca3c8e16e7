/** Assumptions and the caution every design result carries to the UI. */
import { ThermoError } from '../errors.js'
import type { EquilibriumCurve } from './equilibrium-curve.js'

/** Shown with every design number: these are screening estimates, not an engineered design. */
export const DESIGN_CAUTION =
  'Preliminary estimate from equilibrium data only. Column sizing, flammable-solvent handling and pressure equipment must follow local codes and be reviewed by a licensed engineer.'

/** The assumptions behind a design result, ending with where the equilibrium came from. */
export function designAssumptions(curve: EquilibriumCurve, extra: string[] = []): string[] {
  return [
    'theoretical (equilibrium) stages',
    'constant molar overflow',
    'ideal vapour phase',
    'no heat losses',
    ...extra,
    `equilibrium: ${curve.description}`,
  ]
}

/** Throw unless v is a mole fraction strictly between 0 and 1; `name` is the input's name (xD, xB, xF...). */
export function checkOpenFraction(v: unknown, name: string): asserts v is number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0 || v >= 1) {
    throw new ThermoError(
      'invalid-input',
      `${name} must be a mole fraction strictly between 0 and 1; got ${String(v)}.`,
    )
  }
}

/** Throw when an azeotrope of the curve lies between the two compositions: no column can cross it. */
export function checkNoAzeotropeBetween(
  curve: EquilibriumCurve,
  low: number,
  high: number,
  lowName: string,
  highName: string,
): void {
  const az = curve.azeotropes.find((a) => a > low && a < high)
  if (az === undefined) return
  const two = curve.twoLiquid
  if (two?.heterogeneousAzeotrope && Math.abs(az - two.y1) < 1e-12) {
    throw new ThermoError(
      'azeotrope-in-the-way',
      `The heterogeneous azeotrope at x1 = ${az.toFixed(4)} (vapour over two liquid layers, x1 = ${two.x1I.toFixed(4)} and ${two.x1II.toFixed(4)}, ${(two.T - 273.15).toFixed(2)} °C) lies between ${lowName} = ${low} and ${highName} = ${high}: a single column cannot cross it; a decanter is needed to cross it (condense the vapour, let it separate into its two layers and take each layer to its own column).`,
      { azeotropeX1: az, heterogeneous: true, liquidPhases: [two.x1I, two.x1II] },
    )
  }
  throw new ThermoError(
    'azeotrope-in-the-way',
    `The azeotrope at x1 = ${az.toFixed(4)} lies between ${lowName} = ${low} and ${highName} = ${high}: distillation at this pressure cannot cross it.`,
    { azeotropeX1: az },
  )
}
