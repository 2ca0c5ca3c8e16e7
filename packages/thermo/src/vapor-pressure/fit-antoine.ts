import { ThermoError } from '../errors.js'
import { invertSymmetric, normalEquations } from '../fitting/linear-algebra.js'
import { levenbergMarquardt } from '../fitting/lm.js'
import { PASCALS_PER } from '../units.js'
import type { PressureUnit, VaporPressureModel } from '../types.js'

/** A measured vapour pressure: T in K, P in Pa. */
export interface VaporPressurePoint {
  T: number
  P: number
}

/** Options of {@link fitAntoine}: the units the constants are reported in (default ln, kPa, °C, as in most handbooks). */
export interface FitAntoineOptions {
  log?: 'ln' | 'log10'
  pressureUnit?: PressureUnit
  temperatureUnit?: 'C' | 'K'
}

/** Result of {@link fitAntoine}; standard errors and covariance refer to A, B, C in the reported units. */
export interface FitAntoineResult {
  model: Extract<VaporPressureModel, { kind: 'antoine' }>
  standardErrors: { A: number; B: number; C: number }
  /** 3×3 covariance of [A, B, C], scaled by the residual variance of ln P. */
  covariance: number[][]
  /** Root-mean-square of (Pcalc − P)/P. */
  rmsRelative: number
  residuals: { T: number; P: number; Pcalc: number; relative: number }[]
  converged: boolean
  warnings: string[]
}

/** Check and sort the points; throw for too few, bad or non-monotonic data. */
export function checkVaporPressurePoints(
  points: VaporPressurePoint[],
  minimum: number,
  what: string,
): VaporPressurePoint[] {
  if (!Array.isArray(points) || points.length < minimum) {
    throw new ThermoError(
      'insufficient-data',
      `${what} needs at least ${minimum} points (T, P); got ${Array.isArray(points) ? points.length : 0}.`,
    )
  }
  points.forEach((pt, i) => {
    if (!(Number.isFinite(pt?.T) && pt.T > 0)) {
      throw new ThermoError(
        'invalid-input',
        `Point ${i + 1}: temperature must be a positive number of kelvins; got ${pt?.T}.`,
      )
    }
    if (!(Number.isFinite(pt.P) && pt.P > 0)) {
      throw new ThermoError(
        'invalid-input',
        `Point ${i + 1}: pressure must be a positive number of pascals; got ${pt.P}.`,
      )
    }
  })
  const sorted = [...points].sort((a, b) => a.T - b.T)
  for (let i = 1; i < sorted.length; i++) {
    const lo = sorted[i - 1]
    const hi = sorted[i]
    if (!(hi.T > lo.T && hi.P > lo.P)) {
      throw new ThermoError(
        'non-monotonic-data',
        `Vapour pressure must rise with temperature, but the point at ${hi.T} K (${hi.P} Pa) is not above the point at ${lo.T} K (${lo.P} Pa).`,
      )
    }
  }
  return sorted
}

/** Best (a, b) of ln P = a − b/(T + c) for a fixed c, by linear least squares; returns [a, b, Σr²]. */
function linearForC(pts: VaporPressurePoint[], c: number): [number, number, number] {
  let su = 0,
    sy = 0,
    suu = 0,
    suy = 0
  const n = pts.length
  for (const { T, P } of pts) {
    const u = -1 / (T + c)
    const y = Math.log(P)
    su += u
    sy += y
    suu += u * u
    suy += u * y
  }
  const b = (n * suy - su * sy) / (n * suu - su * su)
  const a = (sy - b * su) / n
  let ss = 0
  for (const { T, P } of pts) ss += (a - b / (T + c) - Math.log(P)) ** 2
  return [a, b, ss]
}

/**
 * Fit Antoine constants to measured vapour pressures by Levenberg–Marquardt on ln P.
 * @param points at least 3 points, T in K, P in Pa, pressure rising with temperature.
 * @param options reporting units: log 'ln' (default) or 'log10', pressureUnit (default 'kPa'), temperatureUnit (default 'C').
 * @returns the model (range = the measured temperatures), standard errors and covariance of A, B, C
 *   (residual variance of ln P times (JᵀJ)⁻¹; NaN with exactly 3 points, where the fit is exact).
 */
export function fitAntoine(points: VaporPressurePoint[], options: FitAntoineOptions = {}): FitAntoineResult {
  const pts = checkVaporPressurePoints(points, 3, 'Fitting Antoine constants')
  const log = options.log ?? 'ln'
  const pressureUnit = options.pressureUnit ?? 'kPa'
  const temperatureUnit = options.temperatureUnit ?? 'C'
  const n = pts.length
  // Start from the best c on a grid (c is the only nonlinear constant), so LM begins in the right valley.
  const Tmin = pts[0].T
  let start: [number, number, number] = [0, 0, 0]
  let best = Infinity
  for (let c = -0.9 * Tmin; c <= 100; c += Tmin / 100) {
    const [a, b, ss] = linearForC(pts, c)
    if (ss < best && b > 0) {
      best = ss
      start = [a, b, c]
    }
  }
  const problem = {
    nResiduals: n,
    nParams: 3,
    residuals(p: Float64Array, r: Float64Array): boolean {
      for (let i = 0; i < n; i++) {
        const d = pts[i].T + p[2]
        if (!(d > 0)) return false
        r[i] = p[0] - p[1] / d - Math.log(pts[i].P)
      }
      return true
    },
    jacobian(p: Float64Array, r: Float64Array, J: Float64Array): boolean {
      if (!this.residuals(p, r)) return false
      for (let i = 0; i < n; i++) {
        const d = pts[i].T + p[2]
        J[i * 3] = 1
        J[i * 3 + 1] = -1 / d
        J[i * 3 + 2] = p[1] / (d * d)
      }
      return true
    },
  }
  const fit = levenbergMarquardt(problem, start)
  if (!fit) throw new ThermoError('no-convergence', 'The Antoine fit could not start from these points.')
  return antoineResult(pts, fit, { log, pressureUnit, temperatureUnit })
}

function antoineResult(
  pts: VaporPressurePoint[],
  fit: NonNullable<ReturnType<typeof levenbergMarquardt>>,
  units: Required<FitAntoineOptions>,
): FitAntoineResult {
  const n = pts.length
  const [a, b, c] = fit.p
  const k = units.log === 'ln' ? 1 : Math.LN10
  const shift = units.temperatureUnit === 'C' ? 273.15 : 0
  const A = (a - Math.log(PASCALS_PER[units.pressureUnit])) / k
  const warnings: string[] = []
  const JtJ = new Float64Array(9)
  normalEquations(fit.J, fit.r, n, 3, JtJ, new Float64Array(3))
  const inv = invertSymmetric(JtJ, 3)
  const dof = n - 3
  const s2 = dof > 0 ? fit.cost / dof : NaN
  if (dof === 0)
    warnings.push('With exactly 3 points the Antoine fit is exact; standard errors need at least 4 points.')
  if (!inv) warnings.push('The Antoine constants are not separately determined by these points (singular fit).')
  const scale = [1 / k, 1 / k, 1]
  const covariance = [0, 1, 2].map((i) => [0, 1, 2].map((j) => (inv ? inv[i * 3 + j] * s2 * scale[i] * scale[j] : NaN)))
  const residuals = pts.map(({ T, P }) => {
    const Pcalc = Math.exp(a - b / (T + c))
    return { T, P, Pcalc, relative: (Pcalc - P) / P }
  })
  const rmsRelative = Math.sqrt(residuals.reduce((s, r) => s + r.relative ** 2, 0) / n)
  const range: [number, number] = [pts[0].T - shift, pts[n - 1].T - shift]
  return {
    model: {
      kind: 'antoine',
      A,
      B: b / k,
      C: c + shift,
      log: units.log,
      pressureUnit: units.pressureUnit,
      temperatureUnit: units.temperatureUnit,
      range,
    },
    standardErrors: { A: Math.sqrt(covariance[0][0]), B: Math.sqrt(covariance[1][1]), C: Math.sqrt(covariance[2][2]) },
    covariance,
    rmsRelative,
    residuals,
    converged: fit.converged,
    warnings,
  }
}
