/** Minimum number of theoretical stages at total reflux (Fenske equation). */
import { ThermoError } from '../errors.js'
import { checkNoAzeotropeBetween, checkOpenFraction, DESIGN_CAUTION, designAssumptions } from './design-notes.js'
import { equilibriumCurve, type EquilibriumSource } from './equilibrium-curve.js'

/** Result of `fenske`. */
export interface FenskeResult {
  /** Minimum theoretical stages at total reflux, counting the reboiler as one stage (fractional). */
  Nmin: number
  /** The α used: as given, or the geometric mean √(α_top·α_bottom). */
  alpha: number
  alphaTop: number
  alphaBottom: number
  includesReboiler: true
  warnings: string[]
  assumptions: string[]
  caution: string
}

/**
 * Fenske equation: Nmin = ln[(xD/(1 − xD))·((1 − xB)/xB)] / ln α, the minimum number of theoretical stages
 * at total reflux, INCLUDING the reboiler as one stage (a total condenser is not a stage).
 * With `{ system, P }` α is the geometric mean of the relative volatilities at the bubble points of xD (top)
 * and xB (bottom); the equation assumes α roughly constant between them.
 * @param source `{ alpha }` or `{ system, P }` (P in Pa) or `{ table }`
 * @param spec.xD distillate mole fraction of component 1; spec.xB bottoms mole fraction (0 < xB < xD < 1)
 * @throws ThermoError for compositions outside (0, 1), xB ≥ xD, α ≤ 1, or an azeotrope between xB and xD
 */
export function fenske(source: EquilibriumSource, spec: { xD: number; xB: number }): FenskeResult {
  const curve = equilibriumCurve(source)
  const { xD, xB } = spec ?? ({} as { xD: number; xB: number })
  checkOpenFraction(xD, 'xD')
  checkOpenFraction(xB, 'xB')
  if (xB >= xD) throw new ThermoError('invalid-input', `xD must be greater than xB; got xD = ${xD}, xB = ${xB}.`)
  checkNoAzeotropeBetween(curve, xB, xD, 'xB', 'xD')
  const alphaTop = curve.alpha(xD)
  const alphaBottom = curve.alpha(xB)
  const alpha = Math.sqrt(alphaTop * alphaBottom)
  if (!(alpha > 1)) {
    throw new ThermoError(
      'invalid-alpha',
      `The relative volatility between xB and xD is ${alpha.toFixed(4)}, not above 1: component 1 is not the more volatile there.`,
    )
  }
  const Nmin = Math.log(((xD / (1 - xD)) * (1 - xB)) / xB) / Math.log(alpha)
  const extra =
    curve.kind === 'constant-alpha'
      ? ['total reflux']
      : ['total reflux', 'α taken as the geometric mean of the top and bottom values']
  return {
    Nmin,
    alpha,
    alphaTop,
    alphaBottom,
    includesReboiler: true,
    warnings: [...curve.warnings],
    assumptions: designAssumptions(curve, extra),
    caution: DESIGN_CAUTION,
  }
}
