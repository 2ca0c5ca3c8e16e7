import { checkActivityModel } from '../activity/activity.js'
import { ThermoError } from '../errors.js'
import { compileVaporPressure, rangeWarnings, type LnPsat } from '../vapor-pressure/compiled.js'
import type { ActivityModel, BinarySystem } from '../types.js'
import { stabilityOf, type LiquidStability } from './stability.js'
import { compiledVirial, type CompiledVirial } from '../virial/kernel.js'
import { checkVaporModel } from '../virial/model.js'

/** A validated binary system in the solvers' internal form. */
export interface CompiledSystem {
  act: ActivityModel
  vp1: LnPsat
  vp2: LnPsat
  source: BinarySystem
  /** Remembered liquid-stability facts of the activity model. */
  stab: LiquidStability
  /** The compiled virial vapour when `source.vapor` is virial (γ–φ), null for an ideal vapour. */
  gv: CompiledVirial | null
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
  const vapor = system.vapor
  let gv: CompiledVirial | null = null
  if (vapor !== undefined) {
    if (vapor?.kind === 'virial') gv = compiledVirial(vapor)
    else checkVaporModel(vapor)
  }
  return {
    act: system.activity,
    vp1: compileVaporPressure(system.vaporPressure[0]),
    vp2: compileVaporPressure(system.vaporPressure[1]),
    source: system,
    stab: stabilityOf(system.activity),
    gv,
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

/**
 * Throw 'out-of-domain' when a vapour-pressure equation has no value at T (K): T + C ≤ 0 in the model's own
 * units (where the Antoine form turns over and returns absurd pressures), or a value that overflows.
 */
export function checkDomain(c: CompiledSystem, T: number): void {
  for (const [i, vp] of [c.vp1, c.vp2].entries()) {
    const d = T + vp.c
    const ln = vp.a - vp.b / d
    if (d > 0 && Number.isFinite(ln) && ln < 700) continue
    const label = c.source.names?.[i] ?? `Component ${i + 1}`
    const why = d > 0 ? 'its value overflows there' : 'T + C is zero or negative there'
    throw new ThermoError(
      'out-of-domain',
      `${label}: the vapour-pressure equation has no value at ${T} K (${(T - 273.15).toFixed(2)} °C): ${why}.`,
      { component: i + 1, T },
    )
  }
}

/**
 * The refusal for a liquid that splits in two where its three-phase point could not be resolved: better no
 * number than a single-liquid number that is not physical.
 */
export function liquidSplitError(c: CompiledSystem, x1: number, T: number): ThermoError {
  return new ThermoError(
    'liquid-split',
    `The activity model predicts two liquid phases at x1 = ${x1} and ${T.toFixed(2)} K, and the three-phase (vapour–liquid–liquid) point could not be resolved there; no single-liquid value is given because it would not be physical.`,
    { x1, T },
  )
}

/** The error for a solver that did not converge, with the conditions a chemist would check. */
export function noConvergence(what: string, condition: string): ThermoError {
  return new ThermoError(
    'no-convergence',
    `The ${what} calculation did not converge at ${condition}; check the vapour-pressure constants and activity parameters.`,
  )
}
