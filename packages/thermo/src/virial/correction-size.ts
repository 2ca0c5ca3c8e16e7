/**
 * How much a virial vapour changes the model at a data set's own conditions: the largest |Δy| and |ΔT| (isobaric)
 * or |ΔP| (isothermal) between the ideal-vapour and the virial-vapour bubble points of the same activity model, at
 * each point's x1 and P (or T), under the virial vapour given (Tsonopoulos or Hayden–O'Connell second virial
 * coefficients; the result names which). A product warns with it when a data set uses an ideal vapour although the
 * correction exceeds the measurement uncertainty, and states it for a data set reduced with a virial vapour.
 */
import { ThermoError } from '../errors.js'
import { bubblePressure, bubbleTemperature } from '../equilibrium/vle.js'
import { DEFAULT_SIGMA_P, DEFAULT_SIGMA_T, DEFAULT_SIGMA_Y, type BinaryPoint } from '../fitting/fit-input.js'
import type { BinarySystem } from '../types.js'
import type { VaporModel, VirialCorrelation } from './virial-types.js'

/** Result of {@link vaporCorrectionSize}; differences are virial − ideal, reported as absolute values. */
export interface VaporCorrectionSize {
  /** Which bubble point was compared: T at each point's P (isobaric) or P at each point's T (isothermal). */
  kind: 'isobaric' | 'isothermal'
  /** The correlation of the second virial coefficients the virial vapour compared took them from. */
  correlation: VirialCorrelation
  /** Largest |y1(virial) − y1(ideal)| over the points. */
  maxAbsDy: number
  /** Largest |T(virial) − T(ideal)|, K (isobaric only). */
  maxAbsDT?: number
  /** Largest |P(virial) − P(ideal)|, Pa (isothermal only). */
  maxAbsDP?: number
  /** True when at some point |Δy| exceeds its σy or |ΔT| (|ΔP|) its σT (σP), defaults as in fitBinary. */
  exceedsUncertainty: boolean
  /** How many points were compared (not excluded; points whose liquid splits are left out with a warning). */
  compared: number
  warnings: string[]
}

/** The kind of data: every pressure within 1 % ⇒ isobaric; else every temperature within 0.5 K ⇒ isothermal. */
function kindOf(points: BinaryPoint[]): 'isobaric' | 'isothermal' {
  const Ps = points.map((p) => p.P)
  const Ts = points.map((p) => p.T)
  if (Math.max(...Ps) <= 1.01 * Math.min(...Ps)) return 'isobaric'
  return Math.max(...Ts) - Math.min(...Ts) <= 0.5 ? 'isothermal' : 'isobaric'
}

/**
 * The size of the vapour-phase correction at the data's conditions.
 * @param system the activity model and vapour pressures, with the virial vapour to compare (or give `options.vapor`).
 * @param points the data set's points (T in K, P in Pa, x1; y1 and σ as in fitBinary); excluded points are skipped.
 * @param options kind (default: from the spread of P and T), vapor (default: system.vapor).
 * @throws ThermoError 'invalid-model' when no virial vapour is given; 'invalid-input' when no point can be compared.
 */
export function vaporCorrectionSize(
  system: BinarySystem,
  points: BinaryPoint[],
  options: { kind?: 'isobaric' | 'isothermal'; vapor?: VaporModel } = {},
): VaporCorrectionSize {
  const vapor = options.vapor ?? system?.vapor
  if (vapor?.kind !== 'virial') {
    throw new ThermoError(
      'invalid-model',
      'The size of the vapour correction needs a virial vapour model (the components’ critical data) to compare with.',
    )
  }
  const used = Array.isArray(points) ? points.filter((p) => p && !p.excluded) : []
  if (used.length === 0)
    throw new ThermoError('invalid-input', 'No points to compare: give at least one included point.')
  const kind = options.kind ?? kindOf(used)
  const ideal: BinarySystem = { ...system, vapor: { kind: 'ideal' } }
  const virial: BinarySystem = { ...system, vapor }
  let maxAbsDy = 0
  let maxAbsDv = 0
  let exceeds = false
  let compared = 0
  const warnings: string[] = []
  used.forEach((p) => {
    try {
      let dv: number
      let dy: number
      if (kind === 'isobaric') {
        const a = bubbleTemperature(ideal, { P: p.P, x1: p.x1 })
        const b = bubbleTemperature(virial, { P: p.P, x1: p.x1 })
        dv = Math.abs(b.T - a.T)
        dy = Math.abs(b.y1 - a.y1)
        if (dv > (p.sigmaT ?? DEFAULT_SIGMA_T)) exceeds = true
      } else {
        const a = bubblePressure(ideal, { T: p.T, x1: p.x1 })
        const b = bubblePressure(virial, { T: p.T, x1: p.x1 })
        dv = Math.abs(b.P - a.P)
        dy = Math.abs(b.y1 - a.y1)
        if (dv > (p.sigmaP ?? DEFAULT_SIGMA_P)) exceeds = true
      }
      if (dy > (p.sigmaY ?? DEFAULT_SIGMA_Y)) exceeds = true
      maxAbsDy = Math.max(maxAbsDy, dy)
      maxAbsDv = Math.max(maxAbsDv, dv)
      compared++
    } catch (e) {
      if (!(e instanceof ThermoError)) throw e
      warnings.push(`Point at x1 = ${p.x1} was not compared: ${e.message}`)
    }
  })
  if (compared === 0)
    throw new ThermoError('invalid-input', 'No point could be compared; see the warnings of the model.')
  return {
    kind,
    correlation: vapor.correlation,
    maxAbsDy,
    ...(kind === 'isobaric' ? { maxAbsDT: maxAbsDv } : { maxAbsDP: maxAbsDv }),
    exceedsUncertainty: exceeds,
    compared,
    warnings,
  }
}
