import { checkMoleFraction, checkTemperature, ThermoError } from '../errors.js'
import type { ActivityModel } from '../types.js'
import { lnGammaT } from './kernel.js'

const buf = new Float64Array(4)

function finite(a: number, b: number): boolean {
  return Number.isFinite(a) && Number.isFinite(b)
}

/** Validate an activity model once at the boundary; throws a ThermoError naming the bad field. */
export function checkActivityModel(model: ActivityModel): void {
  if (model === null || typeof model !== 'object')
    throw new ThermoError('invalid-model', 'An activity-coefficient model is required.')
  switch (model.kind) {
    case 'ideal':
      return
    case 'margules':
      if (!finite(model.A12, model.A21))
        throw new ThermoError('invalid-model', 'Margules parameters A12 and A21 must be finite numbers.')
      return
    case 'van-laar':
      if (!finite(model.A12, model.A21))
        throw new ThermoError('invalid-model', 'Van Laar parameters A12 and A21 must be finite numbers.')
      if (model.A12 * model.A21 < 0)
        throw new ThermoError('invalid-model', 'Van Laar parameters A12 and A21 must have the same sign.')
      return
    case 'wilson':
      if (!finite(model.a12, model.a21))
        throw new ThermoError('invalid-model', 'Wilson parameters a12 and a21 must be finite numbers (J/mol).')
      if (!finite(model.a12T ?? 0, model.a21T ?? 0))
        throw new ThermoError('invalid-model', 'Wilson parameters a12T and a21T must be finite numbers (J/(mol·K)).')
      if (!(model.V1 > 0 && model.V2 > 0 && finite(model.V1, model.V2))) {
        throw new ThermoError('invalid-model', 'Wilson needs positive liquid molar volumes V1 and V2 (cm³/mol).')
      }
      return
    case 'nrtl':
      if (!finite(model.b12, model.b21))
        throw new ThermoError('invalid-model', 'NRTL parameters b12 and b21 must be finite numbers (J/mol).')
      if (!finite(model.b12T ?? 0, model.b21T ?? 0))
        throw new ThermoError('invalid-model', 'NRTL parameters b12T and b21T must be finite numbers (J/(mol·K)).')
      if (!(model.alpha > 0 && model.alpha <= 1)) {
        throw new ThermoError(
          'invalid-model',
          `The NRTL non-randomness parameter alpha must be between 0 and 1; got ${model.alpha}.`,
        )
      }
      return
    case 'uniquac':
      if (!finite(model.a12, model.a21))
        throw new ThermoError('invalid-model', 'UNIQUAC parameters a12 and a21 must be finite numbers (J/mol).')
      if (!finite(model.a12T ?? 0, model.a21T ?? 0))
        throw new ThermoError('invalid-model', 'UNIQUAC parameters a12T and a21T must be finite numbers (J/(mol·K)).')
      if (![model.r1, model.r2, model.q1, model.q2].every((v) => Number.isFinite(v) && v > 0)) {
        throw new ThermoError('invalid-model', 'UNIQUAC needs positive structural parameters r1, r2, q1 and q2.')
      }
      return
    default:
      throw new ThermoError('invalid-model', `Unknown activity model kind "${(model as { kind: unknown }).kind}".`)
  }
}

/**
 * Activity coefficients of a binary liquid.
 * @param model activity-coefficient model (energies in J/mol, volumes in cm³/mol).
 * @param at x1 liquid mole fraction of component 1 (0–1), T in K.
 * @returns [γ1, γ2] (dimensionless); at x1 = 0, γ1 is the infinite-dilution value.
 */
export function activityCoefficients(model: ActivityModel, at: { x1: number; T: number }): [number, number] {
  checkActivityModel(model)
  checkMoleFraction(at.x1, 'x1')
  checkTemperature(at.T)
  lnGammaT(model, at.x1, at.T, buf)
  return [Math.exp(buf[0]), Math.exp(buf[1])]
}

/**
 * Dimensionless excess Gibbs energy gE/(RT) = x1·ln γ1 + x2·ln γ2 of a binary liquid.
 * @param at x1 liquid mole fraction (0–1), T in K. Multiply by R·T for J/mol.
 */
export function excessGibbsOverRT(model: ActivityModel, at: { x1: number; T: number }): number {
  checkActivityModel(model)
  checkMoleFraction(at.x1, 'x1')
  checkTemperature(at.T)
  lnGammaT(model, at.x1, at.T, buf)
  return at.x1 * buf[0] + (1 - at.x1) * buf[1]
}

/**
 * Thermodynamic factor Γ = 1 + x1·∂ln γ1/∂x1 at constant T. A single liquid is (locally) stable
 * only while Γ > 0; Γ ≤ 0 means the model predicts two liquid phases (inside the spinodal).
 * Central difference with step 1e-6 (one-sided at the ends). No input checks: internal use.
 */
export function thermodynamicFactor(model: ActivityModel, x1: number, T: number): number {
  if (model.kind === 'ideal' || model.kind === 'wilson') return 1 // neither can split into two liquids
  const h = 1e-6
  const lo = Math.max(0, x1 - h)
  const hi = Math.min(1, x1 + h)
  lnGammaT(model, hi, T, buf)
  const up = buf[0]
  lnGammaT(model, lo, T, buf)
  return 1 + (x1 * (up - buf[0])) / (hi - lo)
}

/**
 * Scan the composition range at T (K) for liquid–liquid instability.
 * @returns null when one liquid is stable everywhere, else the unstable interval [x1 low, x1 high] (spinodal, on a grid of `steps` intervals, default 100).
 */
export function unstableRange(model: ActivityModel, T: number, steps = 100): [number, number] | null {
  if (model.kind === 'ideal' || model.kind === 'wilson') return null
  let lo = NaN
  let hi = NaN
  for (let i = 1; i < steps; i++) {
    const x = i / steps
    if (thermodynamicFactor(model, x, T) <= 0) {
      if (Number.isNaN(lo)) lo = x
      hi = x
    }
  }
  return Number.isNaN(lo) ? null : [lo, hi]
}
