/**
 * The public bubble and dew solvers. An ideal vapour (no `vapor`, or `{ kind: 'ideal' }`) goes straight to the
 * modified-Raoult's-law solvers of bubble-dew.ts (the ideal path costs one property test more); a virial vapour
 * goes to the γ–φ solvers of ../virial/gamma-phi.ts, whose results add `phi` = [φ̂1, φ̂2].
 */
import { checkMoleFraction, checkPressure, checkTemperature } from '../errors.js'
import {
  bubblePressureGammaPhiCompiled,
  bubbleTemperatureGammaPhiCompiled,
  dewPressureGammaPhiCompiled,
  dewTemperatureGammaPhiCompiled,
  type GammaPhiResult,
  type VirialVapor,
} from '../virial/gamma-phi.js'
import type {
  BinarySystem,
  BubblePressureResult,
  BubbleTemperatureResult,
  DewPressureResult,
  DewTemperatureResult,
} from '../types.js'
import {
  bubblePressureCompiled,
  bubbleTemperatureCompiled,
  dewPressureCompiled,
  dewTemperatureCompiled,
} from './bubble-dew.js'
import { compileSystem, type CompiledSystem } from './system.js'

/** The virial vapour of a compiled system that has one. */
const virial = (c: CompiledSystem) => c.source.vapor as VirialVapor

/** A γ–φ result in the shape of the ideal solvers' results (plus `phi`). */
function asTemperatureResult(r: GammaPhiResult, composition: 'y1' | 'x1') {
  return {
    converged: true as const,
    T: r.T,
    [composition]: r[composition],
    gamma: r.gamma,
    iterations: r.iterations,
    warnings: r.warnings,
    phi: r.phi,
  }
}

/**
 * Bubble temperature of a binary liquid.
 * @param at P in Pa, x1 liquid mole fraction (0–1, ends included).
 * Ideal vapour (modified Raoult's law): when the liquid splits into two layers at its boiling point (x1 on the
 * three-phase tie line at P), the answer is the heterogeneous bubble point: the three-phase temperature and vapour,
 * with `liquidPhases` and `gammaPhases`. Virial vapour (`system.vapor.kind === 'virial'`): γ–φ, with `phi`; a liquid
 * inside a two-liquid gap is refused ('liquid-split').
 * @returns T in K (converged to better than 1e-6 K), vapour y1, γ = [γ1, γ2] (one liquid), iterations, range warnings.
 * @throws ThermoError 'liquid-split' when a split liquid's three-phase point cannot be resolved,
 *   'no-convergence' when no bubble point is found.
 */
export function bubbleTemperature(system: BinarySystem, at: { P: number; x1: number }): BubbleTemperatureResult {
  const c = compileSystem(system)
  const { P, x1 } = at
  checkPressure(P)
  checkMoleFraction(x1, 'x1')
  if (c.gv) {
    const r = bubbleTemperatureGammaPhiCompiled(c, virial(c), P, x1)
    return { ...asTemperatureResult(r, 'y1'), y1: r.y1 }
  }
  return bubbleTemperatureCompiled(c, P, x1)
}

/**
 * Bubble pressure of a binary liquid: ideal vapour P = Σ xi·γi·Pi_sat(T), no iteration; virial vapour by
 * substitution on P and y (γ–φ, with `phi`).
 * @param at T in K, x1 liquid mole fraction (0–1).
 * @returns P in Pa, vapour y1, γ = [γ1, γ2], range warnings; ideal vapour: for a liquid inside the two-liquid gap at
 *   T, the three-phase pressure and vapour with `liquidPhases` and `gammaPhases` instead of `gamma`.
 * @throws ThermoError 'out-of-domain' when a vapour-pressure equation has no value at T.
 */
export function bubblePressure(system: BinarySystem, at: { T: number; x1: number }): BubblePressureResult {
  const c = compileSystem(system)
  const { T, x1 } = at
  checkTemperature(T)
  checkMoleFraction(x1, 'x1')
  if (c.gv) {
    const r = bubblePressureGammaPhiCompiled(c, virial(c), T, x1)
    return { P: r.P, y1: r.y1, gamma: r.gamma, warnings: r.warnings, phi: r.phi }
  }
  return bubblePressureCompiled(c, T, x1)
}

/**
 * Dew temperature of a binary vapour (γ–φ with `phi` for a virial vapour).
 * @param at P in Pa, y1 vapour mole fraction (0–1, ends included).
 * @returns T in K, the liquid x1 in equilibrium, γ at that liquid, iterations, range warnings.
 */
export function dewTemperature(system: BinarySystem, at: { P: number; y1: number }): DewTemperatureResult {
  const c = compileSystem(system)
  const { P, y1 } = at
  checkPressure(P)
  checkMoleFraction(y1, 'y1')
  if (c.gv) {
    const r = dewTemperatureGammaPhiCompiled(c, virial(c), P, y1)
    return { ...asTemperatureResult(r, 'x1'), x1: r.x1 }
  }
  return dewTemperatureCompiled(c, P, y1)
}

/**
 * Dew pressure of a binary vapour: the lowest pressure at which a stable liquid appears (γ–φ with `phi` for a
 * virial vapour). Ideal vapour: a vapour at exactly the three-phase composition gives the three-phase pressure with
 * `liquidPhases`.
 * @param at T in K, y1 vapour mole fraction (0–1).
 * @returns P in Pa, the liquid x1 in equilibrium, γ at that liquid, iterations, range warnings.
 * @throws ThermoError 'out-of-domain' when a vapour-pressure equation has no value at T.
 */
export function dewPressure(system: BinarySystem, at: { T: number; y1: number }): DewPressureResult {
  const c = compileSystem(system)
  const { T, y1 } = at
  checkTemperature(T)
  checkMoleFraction(y1, 'y1')
  if (c.gv) {
    const r = dewPressureGammaPhiCompiled(c, virial(c), T, y1)
    return {
      converged: true,
      P: r.P,
      x1: r.x1,
      gamma: r.gamma,
      iterations: r.iterations,
      warnings: r.warnings,
      phi: r.phi,
    }
  }
  return dewPressureCompiled(c, T, y1)
}
