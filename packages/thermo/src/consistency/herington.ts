import type { BinaryPoint } from '../fitting/fit-input.js'
import { spanWarnings } from '../vapor-pressure/compiled.js'
import { saturationTemperature } from '../vapor-pressure/index.js'
import type { VaporPressureModel } from '../types.js'
import { associationWarnings } from '../virial/model.js'
import type { VaporModel } from '../virial/virial-types.js'
import { areaIntegrals, twoLayerWarnings, withoutTwoLayerPoints } from './area-integrand.js'

/** Result of {@link heringtonAreaTest}. */
export interface HeringtonResult {
  /** Which test ran: Herington's isobaric area test. */
  test: 'herington'
  /** D = 100·|∫ln(γ1/γ2)dx1| / ∫|ln(γ1/γ2)|dx1 (per cent). */
  D: number
  /** J = 150·(Tmax − Tmin)/Tmin, temperatures in K. */
  J: number
  /** The boiling range behind J, in K, and where it came from. */
  Tmax: number
  Tmin: number
  temperatureSpan: string
  passed: boolean
  integrand: { x1: number; lnGammaRatio: number }[]
  rule: string
  warnings: string[]
}

/**
 * Herington's area test for isobaric data (E. F. G. Herington, J. Inst. Petrol. 37 (1951) 457):
 * passes when D − J < 10. ln(γ1/γ2) = ln(y1·x2/(y2·x1)) + ln(P2sat/P1sat) at each measured T.
 * Integration: trapezoidal rule over the measured compositions, sorted by x1, without extrapolation to
 * the pure ends. Points with x1 or y1 equal to 0 or 1, and excluded points, are not in the integrand;
 * Tmax and Tmin span the boiling range of the system: every point that is not excluded, and the pure-component
 * boiling points at the mean pressure from the vapour-pressure models (measured points rarely reach both ends,
 * and a range taken from the points alone understates J).
 * Under a virial vapour (`vapor`) γ includes Φ from the measured T, P and y.
 * @param points T in K, P in Pa, mole fractions; at least 3 mixture points, each with y.
 * @throws ThermoError 'needs-vapour-composition' when a mixture point has no y.
 */
export function heringtonAreaTest(
  points: BinaryPoint[],
  options: { vaporPressure: [VaporPressureModel, VaporPressureModel]; vapor?: VaporModel },
): HeringtonResult {
  const { integrand, D } = areaIntegrals(points, options.vaporPressure, options.vapor)
  const kept = withoutTwoLayerPoints(points).filter((p) => !p.excluded)
  const meanP = kept.reduce((sum, p) => sum + p.P, 0) / kept.length
  const pureBoiling = options.vaporPressure.map((m) => saturationTemperature(m, meanP))
  const temps = [...kept.map((p) => p.T), ...pureBoiling]
  const Tmin = Math.min(...temps)
  const Tmax = Math.max(...temps)
  const J = (150 * (Tmax - Tmin)) / Tmin
  const warnings: string[] = [
    ...(options.vapor ? associationWarnings(options.vapor) : []),
    ...twoLayerWarnings(points),
    ...spanWarnings(options.vaporPressure, Tmin, Tmax),
  ]
  const pressures = kept.map((p) => p.P)
  if (Math.max(...pressures) > 1.01 * Math.min(...pressures)) {
    warnings.push('The pressures differ by more than 1 %; the area test is meant for isobaric data.')
  }
  return {
    test: 'herington',
    D,
    J,
    passed: D - J < 10,
    Tmax,
    Tmin,
    temperatureSpan: `measured points and both pure boiling points at the mean pressure (${(meanP / 1000).toFixed(2)} kPa)`,
    integrand,
    rule: 'trapezoidal rule over the measured compositions (no extrapolation to the pure ends)',
    warnings,
  }
}
