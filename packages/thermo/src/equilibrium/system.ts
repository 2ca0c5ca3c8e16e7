import { checkActivityModel, thermodynamicFactor } from '../activity/activity.js'
import { ThermoError } from '../errors.js'
import { compileVaporPressure, rangeWarnings, type LnPsat } from '../vapor-pressure/compiled.js'
import type { ActivityModel, BinarySystem } from '../types.js'

/** A validated binary system in the solvers' internal form. */
export interface CompiledSystem {
  act: ActivityModel
  vp1: LnPsat
  vp2: LnPsat
  source: BinarySystem
}

/** Check a BinarySystem once and reduce its vapour-pressure models to the internal form. */
export function compileSystem(system: BinarySystem): CompiledSystem {
  if (
    system === null ||
    typeof system !== 'object' ||
    !Array.isArray(system.vaporPressure) ||
    system.vaporPressure.length !== 2
  ) {
    throw new ThermoError('invalid-model', 'A binary system needs two vapour-pressure models and an activity model.')
  }
  checkActivityModel(system.activity)
  return {
    act: system.activity,
    vp1: compileVaporPressure(system.vaporPressure[0]),
    vp2: compileVaporPressure(system.vaporPressure[1]),
    source: system,
  }
}

/** Range warnings for the components present (z1 = mole fraction of 1 in the phase that sets the pressure). */
export function systemWarnings(c: CompiledSystem, T: number, z1: number): string[] {
  const out1 = z1 > 0 && (T < c.vp1.tMin || T > c.vp1.tMax)
  const out2 = z1 < 1 && (T < c.vp2.tMin || T > c.vp2.tMax)
  if (!out1 && !out2) return []
  const names = c.source.names
  return [
    ...(out1 ? rangeWarnings(c.source.vaporPressure[0], c.vp1, T, names?.[0] ?? 'Component 1') : []),
    ...(out2 ? rangeWarnings(c.source.vaporPressure[1], c.vp2, T, names?.[1] ?? 'Component 2') : []),
  ]
}

/** Throw when the model says a single liquid of this composition would split in two at T (K). */
export function assertOneLiquid(c: CompiledSystem, x1: number, T: number): void {
  if (thermodynamicFactor(c.act, x1, T) <= 0) {
    throw new ThermoError(
      'liquid-split',
      `The activity model predicts two liquid phases at x1 = ${x1} and ${T.toFixed(2)} K, so this liquid has no single-phase bubble or dew point; Ebullio does not compute liquid–liquid–vapour equilibrium.`,
    )
  }
}

/** The error for a solver that did not converge, with the conditions a chemist would check. */
export function noConvergence(what: string, condition: string): ThermoError {
  return new ThermoError(
    'no-convergence',
    `The ${what} calculation did not converge at ${condition}; check the vapour-pressure constants and activity parameters.`,
  )
}
