import { ThermoError } from '../errors.js'
import { compileVaporPressure, lnPsatInverse, rangeWarnings } from '../vapor-pressure/compiled.js'
import type { BinaryPoint } from '../fitting/fit-input.js'
import type { VaporPressureModel } from '../types.js'

/** Default agreement asked of a measured pure-component boiling point, K (common practice, no source). */
export const PURE_COMPONENT_TOLERANCE = 0.3

/** One pure-component comparison: dT = T measured − T from the vapour-pressure model (K). */
export interface PureComponentCheck {
  index: number
  component: 1 | 2
  T: number
  P: number
  Tmodel: number
  dT: number
  passed: boolean
}

/**
 * Compare every measured pure-component boiling point (x1 = 0 or 1) with the saturation temperature
 * the vapour-pressure model gives at the point's pressure.
 * @param options tolerance in K, default 0.3 K.
 * @returns one check per pure point, overall `passed`, and warnings (no pure points; outside a model's range).
 */
export function pureComponentCheck(
  points: { T: number; P: number; x1: number; excluded?: boolean }[] | BinaryPoint[],
  options: { vaporPressure: [VaporPressureModel, VaporPressureModel]; tolerance?: number },
): { checks: PureComponentCheck[]; passed: boolean; warnings: string[] } {
  const tolerance = options.tolerance ?? PURE_COMPONENT_TOLERANCE
  if (!(tolerance > 0 && Number.isFinite(tolerance))) {
    throw new ThermoError('invalid-input', `The tolerance must be a positive number of kelvins; got ${tolerance}.`)
  }
  const vps = options.vaporPressure.map(compileVaporPressure)
  const checks: PureComponentCheck[] = []
  const warnings: string[] = []
  points.forEach((p, index) => {
    if (p.excluded || (p.x1 !== 0 && p.x1 !== 1)) return
    if (!(p.T > 0 && Number.isFinite(p.T)) || !(p.P > 0 && Number.isFinite(p.P))) {
      throw new ThermoError(
        'invalid-input',
        `Point ${index + 1}: temperature and pressure must be positive finite numbers (K, Pa).`,
      )
    }
    const component = p.x1 === 1 ? 1 : 2
    const Tmodel = lnPsatInverse(vps[component - 1], Math.log(p.P))
    const dT = p.T - Tmodel
    checks.push({ index, component, T: p.T, P: p.P, Tmodel, dT, passed: Math.abs(dT) <= tolerance })
    warnings.push(
      ...rangeWarnings(options.vaporPressure[component - 1], vps[component - 1], Tmodel, `Component ${component}`),
    )
  })
  if (checks.length === 0)
    warnings.push('No pure-component points (x1 = 0 or 1) to compare with the vapour-pressure models.')
  return { checks, passed: checks.every((c) => c.passed), warnings }
}
