import { ThermoError } from '../errors.js'
import { compileVaporPressure } from '../vapor-pressure/compiled.js'
import type { VaporPressureModel } from '../types.js'
import type { FitData } from './objectives.js'
import type { FittableModel, UniquacStructure } from './parameters.js'

/** One measured isobaric (or not) VLE point: T in K, P in Pa, mole fractions; σT in K and σy default 0.1 K and 0.005. */
export interface BinaryPoint {
  T: number
  P: number
  x1: number
  y1: number
  sigmaT?: number
  sigmaY?: number
  excluded?: boolean
  /**
   * The analyst saw two liquid layers: x1 is the overall composition, T the three-phase temperature and y1 the
   * three-phase vapour; the fit compares the point with the model's three-phase point at P.
   */
  heterogeneous?: boolean
}

/** Default uncertainty of a measured boiling temperature, K (common practice, no source). */
export const DEFAULT_SIGMA_T = 0.1
/** Default uncertainty of a measured vapour mole fraction (common practice, no source). */
export const DEFAULT_SIGMA_Y = 0.005

const MODEL_NAMES: Record<FittableModel, string> = {
  margules: 'Margules',
  'van-laar': 'Van Laar',
  wilson: 'Wilson',
  nrtl: 'NRTL',
  uniquac: 'UNIQUAC',
}

/** Human name of a fittable model. */
export function modelName(model: FittableModel): string {
  return MODEL_NAMES[model]
}

function checkPoint(pt: BinaryPoint, i: number): void {
  const fail = (text: string) => new ThermoError('invalid-input', `Point ${i + 1}: ${text}`)
  if (pt === null || typeof pt !== 'object') throw fail('expected an object with T, P, x1 and y1.')
  if (!(Number.isFinite(pt.T) && pt.T > 0)) throw fail(`temperature must be a positive number of kelvins; got ${pt.T}.`)
  if (!(Number.isFinite(pt.P) && pt.P > 0)) throw fail(`pressure must be a positive number of pascals; got ${pt.P}.`)
  if (!(Number.isFinite(pt.x1) && pt.x1 >= 0 && pt.x1 <= 1))
    throw fail(`liquid mole fraction x1 must be between 0 and 1; got ${pt.x1}.`)
  if (!(Number.isFinite(pt.y1) && pt.y1 >= 0 && pt.y1 <= 1))
    throw fail(`vapour mole fraction y1 must be between 0 and 1; got ${pt.y1}.`)
  if (pt.heterogeneous !== undefined && typeof pt.heterogeneous !== 'boolean')
    throw fail(`heterogeneous must be true or false; got ${String(pt.heterogeneous)}.`)
  if (pt.sigmaT !== undefined && !(Number.isFinite(pt.sigmaT) && pt.sigmaT > 0))
    throw fail(`sigmaT must be a positive number; got ${pt.sigmaT}.`)
  if (pt.sigmaY !== undefined && !(Number.isFinite(pt.sigmaY) && pt.sigmaY > 0))
    throw fail(`sigmaY must be a positive number; got ${pt.sigmaY}.`)
}

/** Check the model choice and its extra inputs. */
export function checkModelOptions(o: {
  model: FittableModel
  V1?: number
  V2?: number
  alpha?: number
  fitAlpha?: boolean
  objective?: string
  uniquac?: UniquacStructure
  temperatureDependent?: boolean
}): void {
  if (!Object.hasOwn(MODEL_NAMES, o.model)) {
    throw new ThermoError(
      'invalid-input',
      `Unknown model "${o.model}"; choose margules, van-laar, wilson, nrtl or uniquac.`,
    )
  }
  if (o.objective !== undefined && o.objective !== 'bubble-point' && o.objective !== 'activity') {
    throw new ThermoError('invalid-input', `Unknown objective "${o.objective}"; choose bubble-point or activity.`)
  }
  if (
    o.model === 'wilson' &&
    !(Number(o.V1) > 0 && Number(o.V2) > 0 && Number.isFinite(o.V1) && Number.isFinite(o.V2))
  ) {
    throw new ThermoError(
      'invalid-input',
      'Wilson needs the liquid molar volumes V1 and V2 (cm³/mol) of both components.',
    )
  }
  if (o.model === 'uniquac') {
    const u = o.uniquac
    const ok = u && [u.r1, u.r2, u.q1, u.q2].every((v) => Number.isFinite(v) && v > 0)
    if (!ok) {
      throw new ThermoError(
        'invalid-input',
        'UNIQUAC needs the structure parameters r1, r2, q1 and q2 (positive numbers) of both components.',
      )
    }
  }
  if (o.temperatureDependent && o.model !== 'nrtl' && o.model !== 'wilson') {
    throw new ThermoError('invalid-input', 'Temperature-dependent parameters are available for NRTL and Wilson only.')
  }
  if (o.temperatureDependent && o.fitAlpha) {
    throw new ThermoError(
      'invalid-input',
      'With temperature-dependent parameters NRTL α is held; choose α instead of fitting it.',
    )
  }
  if (o.fitAlpha && o.model !== 'nrtl') throw new ThermoError('invalid-input', 'fitAlpha applies to NRTL only.')
  if (o.alpha !== undefined && !(o.alpha > 0 && o.alpha <= 1)) {
    throw new ThermoError(
      'invalid-input',
      `The NRTL non-randomness parameter alpha must be between 0 and 1; got ${o.alpha}.`,
    )
  }
}

/**
 * Check every point and gather the included mixture points (0 < x1 < 1, not excluded) as FitData.
 * @returns the data and, for each FitData row, the index of its point in `points`.
 */
export function buildFitData(
  points: BinaryPoint[],
  vaporPressure: [VaporPressureModel, VaporPressureModel],
  model: FittableModel,
  nParams: number,
): { data: FitData; index: number[] } {
  if (!Array.isArray(points)) throw new ThermoError('invalid-input', 'The points must be a list of { T, P, x1, y1 }.')
  points.forEach(checkPoint)
  if (!Array.isArray(vaporPressure) || vaporPressure.length !== 2) {
    throw new ThermoError('invalid-model', 'Fitting needs the vapour-pressure models of both components.')
  }
  const vp1 = compileVaporPressure(vaporPressure[0])
  const vp2 = compileVaporPressure(vaporPressure[1])
  const included = points.filter((p) => !p.excluded).length
  if (included < nParams + 1) {
    throw new ThermoError(
      'insufficient-data',
      `Fitting ${modelName(model)} needs at least ${nParams + 1} points that are not excluded (one more than its ${nParams} parameters); got ${included}.`,
    )
  }
  const index = points.flatMap((p, i) => (!p.excluded && p.x1 > 0 && p.x1 < 1 ? [i] : []))
  if (index.length < nParams) {
    throw new ThermoError(
      'insufficient-data',
      `Fitting ${modelName(model)} needs at least ${nParams} mixture points (0 < x1 < 1); got ${index.length}.`,
    )
  }
  const n = index.length
  const col = (f: (p: BinaryPoint) => number) => Float64Array.from(index, (i) => f(points[i]))
  const data: FitData = {
    n,
    T: col((p) => p.T),
    lnP: col((p) => Math.log(p.P)),
    x1: col((p) => p.x1),
    y1: col((p) => p.y1),
    wT: col((p) => 1 / (p.sigmaT ?? DEFAULT_SIGMA_T)),
    wY: col((p) => 1 / (p.sigmaY ?? DEFAULT_SIGMA_Y)),
    vp1,
    vp2,
    ...(index.some((i) => points[i].heterogeneous)
      ? { het: Uint8Array.from(index, (i) => (points[i].heterogeneous ? 1 : 0)) }
      : {}),
  }
  return { data, index }
}
