import { compileSystem } from '../equilibrium/system.js'
import { res, solveBubbleT } from '../equilibrium/kernel.js'
import { fitTemperatureOnly } from '../fitting/fit-binary.js'
import type { BinaryPoint } from '../fitting/fit-input.js'
import type { FittableModel, UniquacStructure } from '../fitting/parameters.js'
import { spanWarnings } from '../vapor-pressure/compiled.js'
import { twoLayerWarnings, withoutTwoLayerPoints } from './area-integrand.js'
import type { ActivityModel, VaporPressureModel } from '../types.js'

/** Options of {@link pointTest}: the model fitted to T–x, with its extra inputs as in fitBinary. */
export interface PointTestOptions {
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  model: FittableModel
  V1?: number
  V2?: number
  alpha?: number
  uniquac?: UniquacStructure
}

/** Result of {@link pointTest}: Δy = y_meas − y_calc per point (NaN for points not tested), passed when mean |Δy| < 0.01. */
export interface PointTestResult {
  meanAbsDeltaY: number
  residuals: { x1: number; y1: number; yCalculated: number; dy: number }[]
  passed: boolean
  activity: ActivityModel
  warnings: string[]
}

/**
 * Point test of Van Ness, Byer and Gibbs (H. C. Van Ness, S. M. Byer, R. E. Gibbs, AIChE J. 19 (1973) 238),
 * isobaric form: fit the model to T–x alone (each point at its own P), predict y from it, and compare with
 * the measured y. Passes when the mean |Δy| over the mixture points is below 0.01.
 * @param points T in K, P in Pa, mole fractions; excluded points are neither fitted nor averaged.
 */
export function pointTest(allPoints: BinaryPoint[], options: PointTestOptions): PointTestResult {
  const points = withoutTwoLayerPoints(allPoints)
  const fit = fitTemperatureOnly({ points, ...options })
  const c = compileSystem({ vaporPressure: options.vaporPressure, activity: fit.activity })
  const tested = new Set(fit.index)
  const residuals = points.map((p, i) => {
    const ok = tested.has(i) && solveBubbleT(c.act, c.vp1, c.vp2, Math.log(p.P), p.x1, p.T)
    const yCalculated = ok ? res[1] : NaN
    return { x1: p.x1, y1: p.y1, yCalculated, dy: p.y1 - yCalculated }
  })
  const used = residuals.filter((r) => Number.isFinite(r.dy))
  const meanAbsDeltaY = used.reduce((s, r) => s + Math.abs(r.dy), 0) / used.length
  const temps = fit.index.map((i) => points[i].T)
  const warnings = [
    ...twoLayerWarnings(allPoints),
    ...spanWarnings(options.vaporPressure, Math.min(...temps), Math.max(...temps)),
  ]
  if (!fit.converged) warnings.push('The T–x fit stopped before it fully converged.')
  return { meanAbsDeltaY, residuals, passed: meanAbsDeltaY < 0.01, activity: fit.activity, warnings }
}
