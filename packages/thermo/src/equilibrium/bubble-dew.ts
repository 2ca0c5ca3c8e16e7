import { checkMoleFraction, checkPressure, checkTemperature } from '../errors.js'
import type {
  BinarySystem,
  BubblePressureResult,
  BubbleTemperatureResult,
  DewPressureResult,
  DewTemperatureResult,
} from '../types.js'
import { res, solveBubbleP, solveBubbleT, solveDewP, solveDewT, startTemperature } from './kernel.js'
import { brent } from './roots.js'
import { assertOneLiquid, compileSystem, noConvergence, systemWarnings, type CompiledSystem } from './system.js'

/**
 * Bubble temperature of a binary liquid under modified Raoult's law (ideal vapour).
 * @param at P in Pa, x1 liquid mole fraction (0–1, ends included).
 * @returns T in K (converged to better than 1e-6 K), vapour y1, γ = [γ1, γ2], Newton iterations, range warnings.
 * @throws ThermoError 'liquid-split' when the model predicts two liquids at x1, 'no-convergence' when no bubble point is found.
 */
export function bubbleTemperature(system: BinarySystem, at: { P: number; x1: number }): BubbleTemperatureResult {
  const c = compileSystem(system)
  const { P, x1 } = at
  checkPressure(P)
  checkMoleFraction(x1, 'x1')
  return bubbleTemperatureCompiled(c, P, x1)
}

/** {@link bubbleTemperature} on an already checked system (used by the diagram and fitting code). */
export function bubbleTemperatureCompiled(c: CompiledSystem, P: number, x1: number): BubbleTemperatureResult {
  const lnP = Math.log(P)
  if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, startTemperature(c.vp1, c.vp2, lnP, x1))) {
    throw noConvergence('bubble-temperature', `x1 = ${x1} and ${P} Pa`)
  }
  const T = res[0]
  const out: BubbleTemperatureResult = {
    converged: true,
    T,
    y1: res[1],
    gamma: [res[2], res[3]],
    iterations: res[4],
    warnings: systemWarnings(c, T, x1),
  }
  assertOneLiquid(c, x1, T)
  return out
}

/**
 * Bubble pressure of a binary liquid under modified Raoult's law: P = Σ xi·γi·Pi_sat(T), no iteration.
 * @param at T in K, x1 liquid mole fraction (0–1).
 * @returns P in Pa, vapour y1, γ = [γ1, γ2], range warnings.
 */
export function bubblePressure(system: BinarySystem, at: { T: number; x1: number }): BubblePressureResult {
  const c = compileSystem(system)
  const { T, x1 } = at
  checkTemperature(T)
  checkMoleFraction(x1, 'x1')
  return bubblePressureCompiled(c, T, x1)
}

/** {@link bubblePressure} on an already checked system. */
export function bubblePressureCompiled(c: CompiledSystem, T: number, x1: number): BubblePressureResult {
  solveBubbleP(c.act, c.vp1, c.vp2, T, x1)
  const out: BubblePressureResult = {
    P: res[5],
    y1: res[1],
    gamma: [res[2], res[3]],
    warnings: systemWarnings(c, T, x1),
  }
  assertOneLiquid(c, x1, T)
  return out
}

/**
 * Dew temperature of a binary vapour under modified Raoult's law.
 * @param at P in Pa, y1 vapour mole fraction (0–1, ends included).
 * @returns T in K, the liquid x1 in equilibrium, γ at that liquid, iterations, range warnings.
 */
export function dewTemperature(system: BinarySystem, at: { P: number; y1: number }): DewTemperatureResult {
  const c = compileSystem(system)
  const { P, y1 } = at
  checkPressure(P)
  checkMoleFraction(y1, 'y1')
  return dewTemperatureCompiled(c, P, y1)
}

/** {@link dewTemperature} on an already checked system. */
export function dewTemperatureCompiled(c: CompiledSystem, P: number, y1: number): DewTemperatureResult {
  const lnP = Math.log(P)
  let ok = solveDewT(c.act, c.vp1, c.vp2, lnP, y1, startTemperature(c.vp1, c.vp2, lnP, y1))
  let iterations = res[4]
  if (!ok) {
    // Substitution can stall near an azeotrope; y1(x1) rises monotonically for a stable liquid, so bracket x1 instead.
    let count = 0
    const x1 = brent(
      (x) => {
        count++
        return bubbleY(c, lnP, x) - y1
      },
      0,
      1,
      1e-13,
    )
    ok = Number.isFinite(x1) && solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, startTemperature(c.vp1, c.vp2, lnP, x1))
    res[1] = x1
    iterations = count
  }
  if (!ok) throw noConvergence('dew-temperature', `y1 = ${y1} and ${P} Pa`)
  const out: DewTemperatureResult = {
    converged: true,
    T: res[0],
    x1: res[1],
    gamma: [res[2], res[3]],
    iterations,
    warnings: systemWarnings(c, res[0], y1),
  }
  assertOneLiquid(c, out.x1, out.T)
  return out
}

function bubbleY(c: CompiledSystem, lnP: number, x1: number): number {
  if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, startTemperature(c.vp1, c.vp2, lnP, x1))) return NaN
  return res[1]
}

/**
 * Dew pressure of a binary vapour under modified Raoult's law.
 * @param at T in K, y1 vapour mole fraction (0–1).
 * @returns P in Pa, the liquid x1 in equilibrium, γ at that liquid, iterations, range warnings.
 */
export function dewPressure(system: BinarySystem, at: { T: number; y1: number }): DewPressureResult {
  const c = compileSystem(system)
  const { T, y1 } = at
  checkTemperature(T)
  checkMoleFraction(y1, 'y1')
  let ok = solveDewP(c.act, c.vp1, c.vp2, T, y1)
  let iterations = res[4]
  if (!ok) {
    let count = 0
    const x1 = brent(
      (x) => {
        count++
        solveBubbleP(c.act, c.vp1, c.vp2, T, x)
        return res[1] - y1
      },
      0,
      1,
      1e-13,
    )
    ok = Number.isFinite(x1)
    if (ok) solveBubbleP(c.act, c.vp1, c.vp2, T, x1)
    res[1] = x1
    iterations = count
  }
  if (!ok) throw noConvergence('dew-pressure', `y1 = ${y1} and ${T} K`)
  const out: DewPressureResult = {
    converged: true,
    P: res[5],
    x1: res[1],
    gamma: [res[2], res[3]],
    iterations,
    warnings: systemWarnings(c, T, y1),
  }
  assertOneLiquid(c, out.x1, T)
  return out
}
