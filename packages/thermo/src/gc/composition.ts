/** A sample's mole fraction from its GC peak areas, with a linear-propagation standard uncertainty. */
import { ThermoError } from '../errors.js'
import { calibrationValue, summarizeInjections } from './calibration.js'
import type { Calibration, CompositionResult, Injection } from './gc-types.js'
import { checkInjections } from './validate.js'

/** Options of `compositionFromAreas`. */
export interface CompositionFromAreasOptions {
  injections: Injection[]
}

/** Partial derivatives of x1 with respect to the signal s and to each coefficient, at the given signal. */
function sensitivities(cal: Calibration, s: number): { dxds: number; dxdc: number[] } {
  const c = cal.coefficients
  if (cal.model === 'response-factor') {
    const d = (c[0] + s) ** 2
    return { dxds: c[0] / d, dxdc: [-s / d] }
  }
  const powers = cal.model === 'quadratic' ? [1, s, s * s] : [1, s]
  const dxds = c[1] + (cal.model === 'quadratic' ? 2 * c[2] * s : 0)
  return { dxds, dxdc: powers }
}

/**
 * Scatter of the standards about the curve that replicate injections do not explain (preparation of the
 * standards, lack of fit), in x1: s²_between = max(0, Σ residual²/ν − mean replicate variance of a standard's mean).
 * It applies in full to every sample read on this calibration, however often the sample is injected.
 */
function betweenStandardsScatter(cal: Calibration): number {
  if (cal.degreesOfFreedom <= 0 || cal.residuals.length === 0) return 0
  const residualVar = cal.residuals.reduce((sum, r) => sum + r.residual ** 2, 0) / cal.degreesOfFreedom
  const rsd = cal.repeatability?.ratioRsd ?? 0
  const ratio = cal.model === 'response-factor'
  const replicateVar =
    cal.residuals.reduce((sum, r) => {
      const signalSd = ratio ? r.signal * rsd : r.signal * (1 - r.signal) * rsd
      return sum + (sensitivities(cal, r.signal).dxds * signalSd) ** 2 / Math.max(r.injections, 1)
    }, 0) / cal.residuals.length
  return Math.sqrt(Math.max(0, residualVar - replicateVar))
}

/** Degrees-of-freedom weighted pool of the sample's RSD and the method repeatability; null when neither exists. */
function pooledReplicateRsd(own: number | null, ownDof: number, method: Calibration['repeatability']): number | null {
  const dof = (own === null ? 0 : ownDof) + (method?.degreesOfFreedom ?? 0)
  if (dof === 0) return null
  const ss = (own === null ? 0 : ownDof * own ** 2) + (method ? method.degreesOfFreedom * method.ratioRsd ** 2 : 0)
  return Math.sqrt(ss / dof)
}

/**
 * Mole fraction x1 of a sample from its replicate injections on a fitted calibration.
 *
 * The injections are averaged (mean area ratio r̄ for 'response-factor', mean area fraction f̄ otherwise;
 * call the mean s̄). Linear propagation (GUM, first order):
 *
 *   u²(x1) = (∂x1/∂s)² · u²(s̄)  +  gᵀ · Σ · g  +  s²_between,
 *   g = ∂x1/∂b (coefficient sensitivities), Σ = calibration covariance, s_between = the scatter of the standards
 *   about the curve beyond what their replicate injections explain (standard preparation, lack of fit).
 *
 * For 'response-factor', x1 = r̄/(k + r̄), ∂x1/∂r = k/(k + r̄)², ∂x1/∂k = −r̄/(k + r̄)².
 * For 'linear'/'quadratic', x1 = Σ bj·f̄^j, ∂x1/∂f = b1 + 2·b2·f̄, g = [1, f̄, f̄²].
 *
 * Replicate scatter: two or three injections estimate a standard deviation poorly, so the sample's own RSD of the
 * area ratio (n − 1 degrees of freedom) is pooled with the method repeatability found on the standards,
 * RSD² = ((n − 1)·RSD_sample² + ν·RSD_method²) / (n − 1 + ν). Then u(r̄) = r̄·RSD/√n and, since
 * df/f = (1 − f)·dr/r, u(f̄) = f̄(1 − f̄)·RSD/√n. With one injection and no repeatability on the standards the
 * replicate term is unknown and left out (with a warning).
 *
 * @param calibration the result of `fitCalibration`
 * @param options.injections one or more injections, each with area1 > 0 and area2 > 0
 * @returns x1 (mole fraction), its standard uncertainty (k = 1) and budget, replicate RSD, range flag, warnings
 * @throws ThermoError for a zero, negative or missing area, or no injections
 */
export function compositionFromAreas(
  calibration: Calibration,
  options: CompositionFromAreasOptions,
): CompositionResult {
  if (!calibration || !Array.isArray(calibration.coefficients)) {
    throw new ThermoError('invalid-calibration', 'The calibration is missing; fit one with fitCalibration first.')
  }
  const injections = options?.injections
  checkInjections('The sample', injections, '')
  const summary = summarizeInjections(injections)
  const ratio = calibration.model === 'response-factor'
  const signal = ratio ? summary.ratio : summary.fraction
  const x1 = calibrationValue(calibration.model, calibration.coefficients, signal)
  const { dxds, dxdc } = sensitivities(calibration, signal)
  const warnings: string[] = []
  const pooledRsd = pooledReplicateRsd(summary.rsd, injections.length - 1, calibration.repeatability)
  let replicate = 0
  if (pooledRsd !== null) {
    const signalSd = ratio ? signal * pooledRsd : signal * (1 - signal) * pooledRsd
    replicate = Math.abs(dxds) * (signalSd / Math.sqrt(injections.length))
  } else warnings.push('One injection only: the replicate scatter is not in the uncertainty; inject at least twice.')
  const cov = calibration.covariance
  const calVariance = dxdc.reduce((s, gi, i) => s + dxdc.reduce((t, gj, j) => t + gi * cov[i][j] * gj, 0), 0)
  const calibrationPart = Math.sqrt(Math.max(calVariance, 0))
  if (summary.rsd !== null && summary.rsd > 0.02) {
    warnings.push(
      `Replicate area ratios scatter by ${(summary.rsd * 100).toFixed(1)} % RSD, above the usual 2 %; re-inject or check the integration.`,
    )
  }
  const [lo, hi] = calibration.calibratedRange.signal
  const span = hi - lo
  const outside = signal < lo - 1e-9 * span || signal > hi + 1e-9 * span
  if (outside) {
    const [xlo, xhi] = calibration.calibratedRange.x1
    warnings.push(
      `The sample lies outside the calibrated range (standards x1 = ${xlo.toFixed(3)}–${xhi.toFixed(3)}): the result is an extrapolation.`,
    )
  }
  if (x1 < 0 || x1 > 1)
    warnings.push(
      `The calibration gives x1 = ${x1.toFixed(4)}, outside 0–1: check the peaks and the calibration range.`,
    )
  const betweenStandards = betweenStandardsScatter(calibration)
  return {
    x1,
    standardUncertainty: Math.sqrt(replicate ** 2 + calibrationPart ** 2 + betweenStandards ** 2),
    uncertaintyBudget: { replicate, calibration: calibrationPart, betweenStandards },
    signal,
    replicateRsd: summary.rsd,
    pooledRsd,
    outsideCalibratedRange: outside,
    warnings,
  }
}
