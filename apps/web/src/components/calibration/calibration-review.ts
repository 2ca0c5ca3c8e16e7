/**
 * The numbers of a calibration review (pure; tests beside): the calibration plot with its ±2σ band, each
 * standard's residual and replicate RSD against the lab's limit, the calibrated range, and the uncertainty
 * budget of a typical sample computed by the engine (thermo's `compositionFromAreas`).
 */
import { compositionFromAreas, type Calibration, type CompositionResult } from '@ebullio/thermo'

export interface CalibrationCurvePoint {
  /** abscissa: mole ratio n1/n2 (response factor) or area fraction (linear, quadratic) */
  x: number
  /** ordinate: area ratio A1/A2 (response factor) or x1 (linear, quadratic) */
  y: number
}

export interface CalibrationPlotData {
  xName: string
  yName: string
  standards: (CalibrationCurvePoint & { label: string })[]
  line: CalibrationCurvePoint[]
  /** the line ± 2σ from the coefficients' covariance */
  lower: CalibrationCurvePoint[]
  upper: CalibrationCurvePoint[]
  /** both axes logarithmic (response factor: mole ratios span decades) */
  logScale: boolean
}

const isRatio = (c: Calibration) => c.model === 'response-factor'

/**
 * Response factor: the area ratio A1/A2 against the mole ratio n1/n2 (standards made up by mass are converted
 * with the molar masses before the fit), line r = k·n, band ±2·u(k)·n. Linear and quadratic: x1 against the
 * area fraction, x1 = Σ bj·f^j, band ±2·√(gᵀΣg) with g = [1, f, f²].
 */
export function calibrationPlotData(c: Calibration, steps = 40): CalibrationPlotData {
  if (isRatio(c)) {
    const k = c.coefficients[0]
    const uk = Math.sqrt(Math.max(c.covariance?.[0]?.[0] ?? c.standardErrors[0] ** 2, 0))
    const standards = c.residuals.map((r) => ({ label: r.label, x: r.x1 / (1 - r.x1), y: r.signal }))
    const xs = standards.map((s) => s.x).filter((x) => x > 0)
    const lo = Math.min(...xs) / 1.25
    const hi = Math.max(...xs) * 1.25
    // geometric steps: evenly spaced on the log axis
    const grid = Array.from({ length: steps + 1 }, (_, i) => lo * (hi / lo) ** (i / steps))
    return {
      xName: 'mole ratio n₁/n₂',
      yName: 'area ratio A₁/A₂',
      standards,
      line: grid.map((x) => ({ x, y: k * x })),
      lower: grid.map((x) => ({ x, y: (k - 2 * uk) * x })),
      upper: grid.map((x) => ({ x, y: (k + 2 * uk) * x })),
      logScale: true,
    }
  }
  const standards = c.residuals.map((r) => ({ label: r.label, x: r.signal, y: r.x1 }))
  const [lo, hi] = c.calibratedRange.signal
  const a = Math.max(0, lo - 0.05 * (hi - lo))
  const b = Math.min(1, hi + 0.05 * (hi - lo))
  const grid = Array.from({ length: steps + 1 }, (_, i) => a + ((b - a) * i) / steps)
  const at = (f: number) => {
    const g = c.coefficients.map((_, j) => f ** j)
    const y = c.coefficients.reduce((s, bj, j) => s + bj * g[j], 0)
    const v = g.reduce((s, gi, i) => s + g.reduce((t, gj, j) => t + gi * (c.covariance?.[i]?.[j] ?? 0) * gj, 0), 0)
    return { y, u: Math.sqrt(Math.max(v, 0)) }
  }
  return {
    xName: 'area fraction A₁/(A₁+A₂)',
    yName: 'x₁ (mole fraction)',
    standards,
    line: grid.map((x) => ({ x, y: at(x).y })),
    lower: grid.map((x) => ({ x, y: at(x).y - 2 * at(x).u })),
    upper: grid.map((x) => ({ x, y: at(x).y + 2 * at(x).u })),
    logScale: false,
  }
}

export interface StandardReview {
  label: string
  x1: number
  injections: number
  /** x1 read back − x1 made up */
  residual: number
  replicateRsd: number | null
  /** null when the standard was injected once (no RSD) */
  withinLimit: boolean | null
}

export function standardReviews(c: Calibration, rsdLimit: number): StandardReview[] {
  return c.residuals.map((r) => ({
    label: r.label,
    x1: r.x1,
    injections: r.injections,
    residual: r.residual,
    replicateRsd: r.replicateRsd,
    withinLimit: r.replicateRsd === null ? null : r.replicateRsd <= rsdLimit,
  }))
}

export interface TypicalSample {
  /** mean signal used (middle of the calibrated signal range) */
  signal: number
  injections: { area1: number; area2: number }[]
  /** the RSD the two injections were given: the method repeatability (null: none known) */
  assumedRsd: number | null
  result: CompositionResult
}

/**
 * A typical sample: the middle of the calibrated range, injected twice with the scatter of the method's own
 * repeatability (two area ratios r(1 ± δ) with δ = RSD/√2 have exactly that RSD), read by the engine.
 */
export function typicalSample(c: Calibration): TypicalSample {
  const [lo, hi] = c.calibratedRange.signal
  const signal = (lo + hi) / 2
  const ratio = isRatio(c) ? signal : signal / (1 - signal)
  const rsd = c.repeatability?.ratioRsd ?? null
  const d = (rsd ?? 0) / Math.SQRT2
  const injections =
    rsd === null
      ? [{ area1: ratio, area2: 1 }]
      : [
          { area1: ratio * (1 + d), area2: 1 },
          { area1: ratio * (1 - d), area2: 1 },
        ]
  return { signal, injections, assumedRsd: rsd, result: compositionFromAreas(c, { injections }) }
}
