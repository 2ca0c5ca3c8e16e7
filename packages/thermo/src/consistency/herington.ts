import { ThermoError } from '../errors.js'
import { buildFitData, type BinaryPoint } from '../fitting/fit-input.js'
import { spanWarnings } from '../vapor-pressure/compiled.js'
import { saturationTemperature } from '../vapor-pressure/index.js'
import type { VaporPressureModel } from '../types.js'

/** Result of {@link heringtonAreaTest}. */
export interface HeringtonResult {
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
 * @param points T in K, P in Pa, mole fractions; at least 3 mixture points.
 */
export function heringtonAreaTest(
  points: BinaryPoint[],
  options: { vaporPressure: [VaporPressureModel, VaporPressureModel] },
): HeringtonResult {
  const usable = Array.isArray(points)
    ? points.filter((p) => p && !p.excluded && p.x1 > 0 && p.x1 < 1 && p.y1 > 0 && p.y1 < 1).length
    : 0
  if (usable < 3) throw insufficient(usable)
  const { data } = buildFitData(points, options.vaporPressure, 'margules', 0)
  const rows = Array.from({ length: data.n }, (_, i) => i).filter((i) => data.y1[i] > 0 && data.y1[i] < 1)
  if (rows.length < 3) throw insufficient(rows.length)
  const { vp1, vp2 } = data
  const integrand = rows
    .map((i) => {
      const T = data.T[i]
      const x = data.x1[i]
      const y = data.y1[i]
      const lnRatio =
        Math.log((y * (1 - x)) / ((1 - y) * x)) + (vp2.a - vp2.b / (T + vp2.c)) - (vp1.a - vp1.b / (T + vp1.c))
      return { x1: x, lnGammaRatio: lnRatio }
    })
    .sort((a, b) => a.x1 - b.x1)
  let area = 0
  let absArea = 0
  for (let k = 1; k < integrand.length; k++) {
    const a = integrand[k - 1]
    const b = integrand[k]
    const h = b.x1 - a.x1
    area += 0.5 * h * (a.lnGammaRatio + b.lnGammaRatio)
    absArea += trapezoidAbs(h, a.lnGammaRatio, b.lnGammaRatio)
  }
  const kept = points.filter((p) => !p.excluded)
  const meanP = kept.reduce((sum, p) => sum + p.P, 0) / kept.length
  const pureBoiling = options.vaporPressure.map((m) => saturationTemperature(m, meanP))
  const temps = [...kept.map((p) => p.T), ...pureBoiling]
  const Tmin = Math.min(...temps)
  const Tmax = Math.max(...temps)
  const D = absArea > 0 ? (100 * Math.abs(area)) / absArea : 0
  const J = (150 * (Tmax - Tmin)) / Tmin
  const warnings: string[] = spanWarnings(options.vaporPressure, Tmin, Tmax)
  const pressures = kept.map((p) => p.P)
  if (Math.max(...pressures) > 1.01 * Math.min(...pressures)) {
    warnings.push('The pressures differ by more than 1 %; the area test is meant for isobaric data.')
  }
  return {
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

/** ∫|f| over one trapezoid whose ends are fa and fb, splitting it where f crosses zero. */
function trapezoidAbs(h: number, fa: number, fb: number): number {
  if (fa * fb >= 0) return 0.5 * h * Math.abs(fa + fb)
  const t = fa / (fa - fb)
  return 0.5 * h * (t * Math.abs(fa) + (1 - t) * Math.abs(fb))
}

function insufficient(n: number): ThermoError {
  return new ThermoError(
    'insufficient-data',
    `The area test needs at least 3 mixture points with 0 < x1 < 1 and 0 < y1 < 1; got ${n}.`,
  )
}
