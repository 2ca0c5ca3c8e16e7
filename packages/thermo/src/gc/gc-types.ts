/** Shapes shared by the GC calibration and composition functions. Areas are in the integrator's counts (any unit, only ratios matter). */

/** The calibration models: see `fitCalibration`. */
export type CalibrationModel = 'response-factor' | 'linear' | 'quadratic'

/** One GC injection: the integrated peak areas of component 1 and component 2 (same arbitrary unit, both > 0). */
export interface Injection {
  area1: number
  area2: number
}

/** A gravimetric standard: its known composition (mole fraction x1 or mass fraction w1) and its replicate injections. */
export interface CalibrationStandard {
  composition: { x1: number } | { w1: number }
  injections: Injection[]
  /** Optional label shown in warnings, e.g. the vial name. */
  label?: string
}

/** What the calibration fits against: the area ratio A1/A2 (response-factor) or the area fraction A1/(A1+A2) (linear, quadratic). */
export type SignalKind = 'area-ratio' | 'area-fraction'

/** How one standard sits on the fitted calibration. */
export interface StandardResidual {
  label: string
  /** Gravimetric mole fraction of component 1. */
  x1: number
  /** Mean signal of the replicate injections (area ratio or area fraction, see `signalKind`). */
  signal: number
  /** x1 read back from the calibration at the mean signal. */
  x1Predicted: number
  /** x1Predicted − x1 (mole fraction). */
  residual: number
  /** Relative standard deviation of the replicate area ratios (fraction, 0.01 = 1 %); null with one injection. */
  replicateRsd: number | null
  injections: number
}

/** A fitted GC calibration, ready for `compositionFromAreas`. */
export interface Calibration {
  model: CalibrationModel
  signalKind: SignalKind
  /** response-factor: [k] with A1/A2 = k·n1/n2; linear: [b0, b1]; quadratic: [b0, b1, b2] with x1 = b0 + b1·f + b2·f². */
  coefficients: number[]
  coefficientNames: string[]
  standardErrors: number[]
  /** Covariance matrix of the coefficients (same order). */
  covariance: number[][]
  /** Residual standard deviation of the fit, in the fitted quantity (response factor for 'response-factor', x1 otherwise). */
  residualStandardDeviation: number
  degreesOfFreedom: number
  /** R² of the fitted relation: area ratio vs molar ratio (response-factor) or x1 vs area fraction (linear, quadratic). */
  rSquared: number
  residuals: StandardResidual[]
  /**
   * Method repeatability from the standards' replicates: the pooled relative standard deviation of the area
   * ratio, Σ(nᵢ − 1)·RSDᵢ² / Σ(nᵢ − 1), with its degrees of freedom; null when no standard was injected twice.
   */
  repeatability: { ratioRsd: number; degreesOfFreedom: number } | null
  /** Range covered by the standards, in x1 and in the signal. */
  calibratedRange: { x1: [number, number]; signal: [number, number] }
  warnings: string[]
}

/** A sample's composition from its injections. */
export interface CompositionResult {
  /** Mole fraction of component 1. */
  x1: number
  /** Standard uncertainty u(x1) (k = 1): replicate scatter, calibration covariance and between-standards scatter combined. */
  standardUncertainty: number
  /**
   * The parts of u(x1) before combining in quadrature: the sample's replicate scatter, the calibration
   * coefficients' covariance, and the standards' scatter about the curve beyond their own replicates.
   */
  uncertaintyBudget: { replicate: number; calibration: number; betweenStandards: number }
  /** Mean signal (area ratio or area fraction, as the calibration's `signalKind`). */
  signal: number
  /** Relative standard deviation of the sample's replicate area ratios (fraction); null with one injection. */
  replicateRsd: number | null
  /** RSD of the area ratio actually used in u(x1): the sample's own pooled with the method repeatability. */
  pooledRsd: number | null
  outsideCalibratedRange: boolean
  warnings: string[]
}
