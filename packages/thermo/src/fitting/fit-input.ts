import { ThermoError } from '../errors.js'
import { compileVaporPressure } from '../vapor-pressure/compiled.js'
import type { VaporPressureModel } from '../types.js'
import type { FitData } from './objectives.js'
import { compiledVirial, lnPhiFactors, type CompiledVirial } from '../virial/kernel.js'
import { checkVaporModel } from '../virial/model.js'
import type { VaporModel } from '../virial/virial-types.js'
import type { FittableModel, UniquacStructure } from './parameters.js'

/**
 * One measured VLE point: T in K, P in Pa, mole fractions. `y1` is null when no vapour was sampled (T–x or P–x
 * data). Uncertainties: σT in K, σy, σP in Pa; defaults {@link DEFAULT_SIGMA_T}, {@link DEFAULT_SIGMA_Y},
 * {@link DEFAULT_SIGMA_P}.
 */
export interface BinaryPoint {
  T: number
  P: number
  x1: number
  y1: number | null
  sigmaT?: number
  sigmaY?: number
  /** Uncertainty of the measured pressure, Pa (isothermal fits). */
  sigmaP?: number
  excluded?: boolean
  /**
   * The analyst saw two liquid layers: x1 is the overall composition, T the three-phase temperature and y1 the
   * three-phase vapour; the fit compares the point with the model's three-phase point at P.
   */
  heterogeneous?: boolean
  /**
   * This point was measured at fixed T (true: its pressure is calculated at its T) or at fixed P (false: its
   * temperature at its P), whatever the fit's objective says; absent: as the objective says. A joint fit of
   * isobaric and isothermal data sets marks each point so.
   */
  isothermal?: boolean
}

/** Default uncertainty of a measured boiling temperature, K (common practice, no source). */
export const DEFAULT_SIGMA_T = 0.1
/** Default uncertainty of a measured vapour mole fraction (common practice, no source). */
export const DEFAULT_SIGMA_Y = 0.005
/**
 * Default uncertainty of a measured pressure, Pa: 0.1 kPa, about what a static or circulating still's pressure
 * gauge reads to near atmospheric pressure (common practice, no source). At low pressures, where a cell reads to a
 * few pascals, give each point its own `sigmaP`; this default would then underweight the pressures.
 */
export const DEFAULT_SIGMA_P = 100

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

/** The refusal of point i (0-based) of a fit's input. */
const pointError = (i: number, text: string) => new ThermoError('invalid-input', `Point ${i + 1}: ${text}`)

function checkPoint(pt: BinaryPoint, i: number): void {
  // No closure per point: a fit checks every point, joint fits many.
  const fail = (text: string) => pointError(i, text)
  if (pt === null || typeof pt !== 'object') throw fail('expected an object with T, P, x1 and y1 (y1 may be null).')
  if (!(Number.isFinite(pt.T) && pt.T > 0)) throw fail(`temperature must be a positive number of kelvins; got ${pt.T}.`)
  if (!(Number.isFinite(pt.P) && pt.P > 0)) throw fail(`pressure must be a positive number of pascals; got ${pt.P}.`)
  if (!(Number.isFinite(pt.x1) && pt.x1 >= 0 && pt.x1 <= 1))
    throw fail(`liquid mole fraction x1 must be between 0 and 1; got ${pt.x1}.`)
  if (pt.y1 !== null && !(Number.isFinite(pt.y1) && pt.y1 >= 0 && pt.y1 <= 1))
    throw fail(`vapour mole fraction y1 must be between 0 and 1, or null when no vapour was sampled; got ${pt.y1}.`)
  if (pt.heterogeneous !== undefined && typeof pt.heterogeneous !== 'boolean')
    throw fail(`heterogeneous must be true or false; got ${String(pt.heterogeneous)}.`)
  if (pt.sigmaT !== undefined && !(Number.isFinite(pt.sigmaT) && pt.sigmaT > 0))
    throw fail(`sigmaT must be a positive number; got ${pt.sigmaT}.`)
  if (pt.sigmaY !== undefined && !(Number.isFinite(pt.sigmaY) && pt.sigmaY > 0))
    throw fail(`sigmaY must be a positive number; got ${pt.sigmaY}.`)
  if (pt.sigmaP !== undefined && !(Number.isFinite(pt.sigmaP) && pt.sigmaP > 0))
    throw fail(`sigmaP must be a positive number of pascals; got ${pt.sigmaP}.`)
  if (pt.isothermal !== undefined && typeof pt.isothermal !== 'boolean')
    throw fail(`isothermal must be true or false; got ${String(pt.isothermal)}.`)
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
  if (
    o.objective !== undefined &&
    o.objective !== 'bubble-point' &&
    o.objective !== 'bubble-pressure' &&
    o.objective !== 'activity'
  ) {
    throw new ThermoError(
      'invalid-input',
      `Unknown objective "${o.objective}"; choose bubble-point, bubble-pressure or activity.`,
    )
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
  if (o.temperatureDependent && o.model !== 'nrtl' && o.model !== 'wilson' && o.model !== 'uniquac') {
    throw new ThermoError(
      'invalid-input',
      'Temperature-dependent parameters are available for NRTL, Wilson and UNIQUAC only.',
    )
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

/** How the points are compared with the model: the vapour model and whether P (isothermal) or T is calculated. */
export interface FitDataOptions {
  vapor?: VaporModel
  isothermal?: boolean
}

/** The compiled virial vapour of a fit, or null for an ideal one. @throws ThermoError 'invalid-model'. */
export function compiledVapor(vapor: VaporModel | undefined): CompiledVirial | null {
  if (vapor === undefined) return null
  if (vapor?.kind === 'virial') return compiledVirial(vapor)
  checkVaporModel(vapor)
  return null
}

/**
 * Check every point and gather the included mixture points (0 < x1 < 1, not excluded) as FitData. A point without
 * y1 (null) has one residual row (T or P), a point with y1 two (T or P, then y): `rowOf` gives each one's first row.
 * @returns the data and, for each FitData row, the index of its point in `points`.
 */
export function buildFitData(
  points: BinaryPoint[],
  vaporPressure: [VaporPressureModel, VaporPressureModel],
  model: FittableModel,
  nParams: number,
  options: FitDataOptions = {},
): { data: FitData; index: number[] } {
  if (!Array.isArray(points))
    throw new ThermoError('invalid-input', 'The points must be a list of { T, P, x1, y1 } (y1 may be null).')
  points.forEach(checkPoint)
  if (!Array.isArray(vaporPressure) || vaporPressure.length !== 2) {
    throw new ThermoError('invalid-model', 'Fitting needs the vapour-pressure models of both components.')
  }
  const vp1 = compileVaporPressure(vaporPressure[0])
  const vp2 = compileVaporPressure(vaporPressure[1])
  const gv = compiledVapor(options.vapor)
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
  const hasY = new Uint8Array(n)
  const rowOf = new Int32Array(n)
  const [T, lnP, x1, y1, wT, wY, wP] = Array.from({ length: 7 }, () => new Float64Array(n))
  let rows = 0
  for (let k = 0; k < n; k++) {
    const p = points[index[k]]
    hasY[k] = p.y1 === null ? 0 : 1
    rowOf[k] = rows
    rows += 1 + hasY[k]
    T[k] = p.T
    lnP[k] = Math.log(p.P)
    x1[k] = p.x1
    y1[k] = p.y1 ?? NaN
    wT[k] = 1 / (p.sigmaT ?? DEFAULT_SIGMA_T)
    wY[k] = 1 / (p.sigmaY ?? DEFAULT_SIGMA_Y)
    wP[k] = 1 / (p.sigmaP ?? DEFAULT_SIGMA_P)
  }
  const isothermal = options.isothermal === true
  const isoOf = (k: number) => points[index[k]].isothermal ?? isothermal
  // Points of both kinds in one fit (a joint fit over isobaric and isothermal data sets): a per-point flag.
  const mixed = index.some((_, k) => isoOf(k) !== isoOf(0))
  const data: FitData = {
    n,
    nRows: rows,
    rowOf,
    hasY,
    T,
    lnP,
    x1,
    y1,
    wT,
    wY,
    wP,
    vp1,
    vp2,
    gv,
    isothermal: mixed ? false : n > 0 && isoOf(0),
    ...(mixed ? { iso: Uint8Array.from(index, (_, k) => (isoOf(k) ? 1 : 0)) } : {}),
    ...(index.some((i) => points[i].heterogeneous)
      ? { het: Uint8Array.from(index, (i) => (points[i].heterogeneous ? 1 : 0)) }
      : {}),
  }
  if (gv) data.lnPhiExp = experimentalLnPhi(data, gv)
  return { data, index }
}

/** ln Φ1, ln Φ2 of each point at its measured T, P and y (0 where y is missing), for the activity objective. */
function experimentalLnPhi(d: FitData, gv: CompiledVirial): [Float64Array, Float64Array] {
  const l1 = new Float64Array(d.n)
  const l2 = new Float64Array(d.n)
  const out = new Float64Array(4)
  for (let i = 0; i < d.n; i++) {
    if (!d.hasY[i]) continue
    const T = d.T[i]
    const ps1 = Math.exp(d.vp1.a - d.vp1.b / (T + d.vp1.c))
    const ps2 = Math.exp(d.vp2.a - d.vp2.b / (T + d.vp2.c))
    lnPhiFactors(gv, T, Math.exp(d.lnP[i]), d.y1[i], ps1, ps2, out)
    l1[i] = out[0]
    l2[i] = out[1]
  }
  return [l1, l2]
}
