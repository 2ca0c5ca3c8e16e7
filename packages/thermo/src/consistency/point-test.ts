import { fitTemperatureOnly } from '../fitting/fit-binary.js'
import { compiledVapor } from '../fitting/fit-input.js'
import { point, solvePoint } from '../fitting/model-point.js'
import { compileVaporPressure } from '../vapor-pressure/compiled.js'
import { associationWarnings } from '../virial/model.js'
import type { VaporModel } from '../virial/virial-types.js'
import type { BinaryPoint } from '../fitting/fit-input.js'
import type { FittableModel, UniquacStructure } from '../fitting/parameters.js'
import { spanWarnings } from '../vapor-pressure/compiled.js'
import { requireVapourCompositions, twoLayerWarnings, withoutTwoLayerPoints } from './area-integrand.js'
import type { ActivityModel, VaporPressureModel } from '../types.js'

/** Options of {@link pointTest}: the model fitted to T–x, with its extra inputs as in fitBinary. */
export interface PointTestOptions {
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  model: FittableModel
  V1?: number
  V2?: number
  alpha?: number
  uniquac?: UniquacStructure
  /** The vapour model (absent: ideal); a virial vapour fits and predicts γ–φ. */
  vapor?: VaporModel
  /** Isothermal data: fit P–x (bubble pressures at each point's T) instead of T–x. */
  isothermal?: boolean
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
 * Point test of Van Ness, Byer and Gibbs (H. C. Van Ness, S. M. Byer, R. E. Gibbs, AIChE J. 19 (1973) 238):
 * fit the model to T–x alone (each point at its own P; isothermal data: P–x at each point's T), predict y from it,
 * and compare with the measured y. Passes when the mean |Δy| over the mixture points is below 0.01.
 * @param points T in K, P in Pa, mole fractions; excluded points are neither fitted nor averaged.
 * @throws ThermoError 'needs-vapour-composition' when a mixture point has no y.
 */
export function pointTest(allPoints: BinaryPoint[], options: PointTestOptions): PointTestResult {
  const points = withoutTwoLayerPoints(allPoints)
  requireVapourCompositions(points, 'point test')
  const { isothermal, ...fitOptions } = options
  const fit = fitTemperatureOnly({
    points,
    ...fitOptions,
    ...(isothermal ? { objective: 'bubble-pressure' as const } : {}),
  })
  const ctx = {
    vp1: compileVaporPressure(options.vaporPressure[0]),
    vp2: compileVaporPressure(options.vaporPressure[1]),
    gv: compiledVapor(options.vapor),
    isothermal: isothermal === true,
  }
  const tested = new Set(fit.index)
  const residuals = points.map((p, i) => {
    const ok = tested.has(i) && solvePoint(fit.activity, ctx, p.x1, p.T, Math.log(p.P), p.T)
    const yCalculated = ok ? point[1] : NaN
    const y1 = p.y1 ?? NaN
    return { x1: p.x1, y1, yCalculated, dy: y1 - yCalculated }
  })
  const used = residuals.filter((r) => Number.isFinite(r.dy))
  const meanAbsDeltaY = used.reduce((s, r) => s + Math.abs(r.dy), 0) / used.length
  const temps = fit.index.map((i) => points[i].T)
  const warnings = [
    ...(options.vapor ? associationWarnings(options.vapor) : []),
    ...twoLayerWarnings(allPoints),
    ...spanWarnings(options.vaporPressure, Math.min(...temps), Math.max(...temps)),
  ]
  if (!fit.converged) warnings.push(`The ${isothermal ? 'P–x' : 'T–x'} fit stopped before it fully converged.`)
  return { meanAbsDeltaY, residuals, passed: meanAbsDeltaY < 0.01, activity: fit.activity, warnings }
}
