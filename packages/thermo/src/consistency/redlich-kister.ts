import type { BinaryPoint } from '../fitting/fit-input.js'
import type { VaporPressureModel } from '../types.js'
import { associationWarnings } from '../virial/model.js'
import type { VaporModel } from '../virial/virial-types.js'
import { areaIntegrals, twoLayerWarnings, withoutTwoLayerPoints, type AreaIntegrandPoint } from './area-integrand.js'

/** Result of {@link redlichKisterAreaTest}. */
export interface RedlichKisterResult {
  /** Which test ran: the Redlich–Kister area test for isothermal data (no temperature term). */
  test: 'redlich-kister'
  /** D = 100·|∫ln(γ1/γ2)dx1| / ∫|ln(γ1/γ2)|dx1 (per cent). */
  D: number
  /** The temperature of the data, K (mean of the included points). */
  T: number
  passed: boolean
  integrand: AreaIntegrandPoint[]
  rule: string
  warnings: string[]
}

/**
 * The area test for isothermal data (O. Redlich, A. T. Kister, Ind. Eng. Chem. 40 (1948) 345): at constant T the
 * Gibbs–Duhem equation requires ∫₀¹ ln(γ1/γ2) dx1 = 0 (the pressure term is negligible for low-pressure VLE).
 * Passes when D < 10, Herington's criterion with J = 0 for isothermal data (E. F. G. Herington, J. Inst. Petrol. 37
 * (1951) 457; from memory). Same integrand and integration rule as the isobaric test.
 * Under a virial vapour (`vapor`) γ includes Φ from the measured T, P and y.
 * @param points T in K, P in Pa, mole fractions; at least 3 mixture points, each with y.
 * @throws ThermoError 'needs-vapour-composition' when a mixture point has no y.
 */
export function redlichKisterAreaTest(
  points: BinaryPoint[],
  options: { vaporPressure: [VaporPressureModel, VaporPressureModel]; vapor?: VaporModel },
): RedlichKisterResult {
  const { integrand, D } = areaIntegrals(points, options.vaporPressure, options.vapor)
  const kept = withoutTwoLayerPoints(points).filter((p) => !p.excluded)
  const temps = kept.map((p) => p.T)
  const T = temps.reduce((s, t) => s + t, 0) / temps.length
  const warnings: string[] = [...(options.vapor ? associationWarnings(options.vapor) : []), ...twoLayerWarnings(points)]
  if (Math.max(...temps) - Math.min(...temps) > 0.5) {
    warnings.push(
      'The temperatures differ by more than 0.5 K; the Redlich–Kister area test is meant for isothermal data.',
    )
  }
  return {
    test: 'redlich-kister',
    D,
    T,
    passed: D < 10,
    integrand,
    rule: 'trapezoidal rule over the measured compositions (no extrapolation to the pure ends)',
    warnings,
  }
}
