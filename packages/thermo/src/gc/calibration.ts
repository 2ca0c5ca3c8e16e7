/**
 * GC calibration on gravimetric standards. Three models:
 * - 'response-factor': A1/A2 = k·(n1/n2), one relative response factor through the origin;
 * - 'linear': x1 = b0 + b1·f, f = A1/(A1 + A2) the area fraction;
 * - 'quadratic': x1 = b0 + b1·f + b2·f².
 */
import { ThermoError } from '../errors.js'
import type { Calibration, CalibrationModel, CalibrationStandard, Injection, StandardResidual } from './gc-types.js'
import { studentT975 } from '../fitting/student-t.js'
import { leastSquares, meanAndSd, type LeastSquaresFit } from './least-squares.js'
import { checkInjections, checkMolarMasses, standardMoleFraction } from './validate.js'

/** Replicate injections should agree within about 2 % RSD (common practice, no source). */
export const REPLICATE_RSD_LIMIT = 0.02

const MIN_STANDARDS: Record<CalibrationModel, number> = { 'response-factor': 2, linear: 3, quadratic: 4 }

/** Options of `fitCalibration`. */
export interface FitCalibrationOptions {
  standards: CalibrationStandard[]
  /** [M1, M2] in g/mol; required when any standard is given as a mass fraction w1. */
  molarMasses?: [number, number]
  model: CalibrationModel
}

/** Mean area ratio A1/A2, mean area fraction A1/(A1+A2) and the RSD of the ratios for a set of injections. */
export function summarizeInjections(injections: Injection[]): {
  ratio: number
  fraction: number
  ratioSd: number
  fractionSd: number
  rsd: number | null
} {
  const ratios = meanAndSd(injections.map((i) => i.area1 / i.area2))
  const fractions = meanAndSd(injections.map((i) => i.area1 / (i.area1 + i.area2)))
  const rsd = injections.length > 1 ? ratios.sd / ratios.mean : null
  return { ratio: ratios.mean, fraction: fractions.mean, ratioSd: ratios.sd, fractionSd: fractions.sd, rsd }
}

/** x1 from a signal with the given coefficients (area ratio for response-factor, area fraction otherwise). */
export function calibrationValue(model: CalibrationModel, c: number[], signal: number): number {
  if (model === 'response-factor') return signal / (c[0] + signal)
  return c[0] + c[1] * signal + (model === 'quadratic' ? c[2] * signal * signal : 0)
}

function rSquared(observed: number[], predicted: number[]): number {
  const mean = observed.reduce((s, v) => s + v, 0) / observed.length
  const ssTot = observed.reduce((s, v) => s + (v - mean) ** 2, 0)
  const ssRes = observed.reduce((s, v, i) => s + (v - predicted[i]) ** 2, 0)
  return ssTot > 0 ? 1 - ssRes / ssTot : NaN
}

/**
 * Fit of one model. The response factor is fitted with weights 1/(n1/n2)², i.e. it is the mean of the
 * standards' own factors (A1/A2)/(n1/n2), because area ratios scatter in proportion to their size.
 * `extraTerm` adds the next power (m² or f²) for the curvature test.
 */
function fitModel(model: CalibrationModel, x1: number[], signal: number[], extraTerm = false): LeastSquaresFit {
  if (model === 'response-factor') {
    const molarRatio = x1.map((x) => x / (1 - x))
    return leastSquares(
      molarRatio.map((m) => (extraTerm ? [1, m] : [1])),
      signal.map((r, i) => r / molarRatio[i]),
    )
  }
  const degree = (model === 'quadratic' ? 2 : 1) + (extraTerm ? 1 : 0)
  return leastSquares(
    signal.map((f) => Array.from({ length: degree + 1 }, (_, j) => f ** j)),
    x1,
  )
}

/** Significance test of the next power term; a warning string when it matters or cannot be tested. */
function curvatureWarning(model: CalibrationModel, x1: number[], signal: number[]): string | null {
  if (model === 'quadratic') return null
  const name = model === 'linear' ? 'linear model' : 'single response factor'
  if (x1.length < MIN_STANDARDS[model] + 1) {
    return `With ${x1.length} standards the curvature of the ${name} cannot be tested; ${MIN_STANDARDS[model] + 1} or more are needed.`
  }
  const fit = fitModel(model, x1, signal, true)
  const last = fit.coefficients.length - 1
  const t = fit.coefficients[last] / fit.standardErrors[last]
  const tCrit = studentT975(fit.degreesOfFreedom)
  if (Math.abs(t) <= tCrit) return null
  return `Curvature: an extra squared term is significant (t = ${t.toFixed(2)}, 95 % limit ${tCrit.toFixed(2)} with ${fit.degreesOfFreedom} degrees of freedom); the ${name} may be inadequate, try 'quadratic'.`
}

/**
 * Calibrate a GC method for a binary on gravimetric standards.
 *
 * Replicate injections of a standard are averaged first (mean area ratio, or mean area fraction);
 * the standards then enter an ordinary least-squares fit whose covariance is s²·(XᵀX)⁻¹.
 * Mass fractions are converted with `molarMasses` (g/mol). Warnings: a standard whose replicate
 * area ratios exceed 2 % RSD (common practice, no source), and a significant squared term
 * (t-test at 95 %) suggesting that the linear model or the single response factor is inadequate.
 *
 * @param options.standards at least 2 (response-factor), 3 (linear) or 4 (quadratic) standards, x1 strictly in (0, 1)
 * @param options.molarMasses [M1, M2] in g/mol, needed for standards given as w1
 * @param options.model 'response-factor' | 'linear' | 'quadratic'
 * @returns coefficients with standard errors and covariance, residuals per standard (in x1), calibrated range, R², warnings
 * @throws ThermoError for a missing/zero/negative area, a composition outside (0, 1), too few standards, an unknown model
 */
export function fitCalibration(options: FitCalibrationOptions): Calibration {
  const { standards, molarMasses, model } = options
  if (!(model in MIN_STANDARDS)) {
    throw new ThermoError(
      'unknown-model',
      `Unknown calibration model '${String(model)}'; use 'response-factor', 'linear' or 'quadratic'.`,
    )
  }
  const n = Array.isArray(standards) ? standards.length : 0
  if (n < MIN_STANDARDS[model]) {
    throw new ThermoError(
      'too-few-standards',
      `A ${model} calibration needs at least ${MIN_STANDARDS[model]} standards; got ${n}.`,
    )
  }
  if (molarMasses !== undefined) checkMolarMasses(molarMasses)
  const x1 = standards.map((s, i) => {
    const x = standardMoleFraction(s, i, molarMasses)
    checkInjections(`Standard ${i + 1}`, s.injections, `Standard ${i + 1}, `)
    return x
  })
  const summaries = standards.map((s) => summarizeInjections(s.injections))
  const signal = summaries.map((s) => (model === 'response-factor' ? s.ratio : s.fraction))
  const fit = fitModel(model, x1, signal)
  const c = fit.coefficients
  if (model === 'response-factor' && !(c[0] > 0)) {
    throw new ThermoError(
      'singular-fit',
      'The fitted response factor is not positive; check that area1 and area2 belong to components 1 and 2.',
    )
  }
  const warnings: string[] = []
  const residuals: StandardResidual[] = standards.map((s, i) => {
    const x1Predicted = calibrationValue(model, c, signal[i])
    const label = s.label ?? `Standard ${i + 1}`
    const rsd = summaries[i].rsd
    if (rsd !== null && rsd > REPLICATE_RSD_LIMIT) {
      warnings.push(
        `${label} (x1 = ${x1[i].toFixed(3)}): replicate area ratios scatter by ${(rsd * 100).toFixed(1)} % RSD, above the usual 2 %; re-inject or check the integration.`,
      )
    }
    return {
      label,
      x1: x1[i],
      signal: signal[i],
      x1Predicted,
      residual: x1Predicted - x1[i],
      replicateRsd: rsd,
      injections: s.injections.length,
    }
  })
  const curvature = curvatureWarning(model, x1, signal)
  if (curvature) warnings.push(curvature)
  const r2 =
    model === 'response-factor'
      ? rSquared(
          signal,
          x1.map((x) => (c[0] * x) / (1 - x)),
        )
      : rSquared(
          x1,
          signal.map((f) => calibrationValue(model, c, f)),
        )
  const dof = summaries.reduce((s, m, i) => s + (m.rsd === null ? 0 : standards[i].injections.length - 1), 0)
  const pooledVariance = summaries.reduce(
    (s, m, i) => s + (m.rsd === null ? 0 : (standards[i].injections.length - 1) * m.rsd ** 2),
    0,
  )
  const repeatability = dof > 0 ? { ratioRsd: Math.sqrt(pooledVariance / dof), degreesOfFreedom: dof } : null
  const names = model === 'response-factor' ? ['k'] : model === 'linear' ? ['b0', 'b1'] : ['b0', 'b1', 'b2']
  return {
    model,
    signalKind: model === 'response-factor' ? 'area-ratio' : 'area-fraction',
    coefficients: c,
    coefficientNames: names,
    standardErrors: fit.standardErrors,
    covariance: fit.covariance,
    residualStandardDeviation: Math.sqrt(fit.residualVariance),
    degreesOfFreedom: fit.degreesOfFreedom,
    rSquared: r2,
    residuals,
    repeatability,
    calibratedRange: { x1: [Math.min(...x1), Math.max(...x1)], signal: [Math.min(...signal), Math.max(...signal)] },
    warnings,
  }
}
