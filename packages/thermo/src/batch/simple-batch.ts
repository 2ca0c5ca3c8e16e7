/** Simple (Rayleigh) batch distillation: one equilibrium stage, the pot, vapour condensed and removed at once. */
import { DESIGN_CAUTION, designAssumptions } from '../columns/design-notes.js'
import { equilibriumCurve, type EquilibriumSource } from '../columns/equilibrium-curve.js'
import type { BatchCharge, BatchEndState, BatchFrame, BatchIntegration, BatchUntil } from './batch-types.js'
import { checkCharge, checkFrames, runRayleigh } from './rayleigh.js'

/** Options of `simpleBatchDistillation`. */
export interface SimpleBatchOptions {
  charge: BatchCharge
  until: BatchUntil
  /** Number of frames for the animation, evenly spaced in distilled fraction (default 101, 2–5000). */
  frames?: number
}

/** Result of `simpleBatchDistillation`. */
export interface SimpleBatchResult {
  frames: BatchFrame[]
  end: BatchEndState
  integration: BatchIntegration
  warnings: string[]
  assumptions: string[]
  caution: string
}

/**
 * Simple batch distillation by the Rayleigh equation, ln(L/L0) = ∫ dx/(y − x) from x0 to x, integrated
 * numerically (adaptive Dormand–Prince 5(4), local error ≤ 1e-11 + 1e-9·x in the pot mole fraction).
 * The pot liquid is always at its bubble point and the vapour leaving it is in equilibrium with it.
 * @param source `{ system, P }` (P in Pa), `{ alpha }` or `{ table }`
 * @param options.charge moles charged and their x1; options.until one of potMoles, potX1, distillateMoles (mol) or recovery1 (fraction of component 1 recovered overhead)
 * @returns frames for an animation (distilled fraction, pot moles, pot x1, pot T in K, instantaneous and cumulative distillate), the end state
 * @throws ThermoError for a bad charge or stopping condition, or a pot composition that cannot be reached (azeotrope or wrong direction)
 */
export function simpleBatchDistillation(source: EquilibriumSource, options: SimpleBatchOptions): SimpleBatchResult {
  const curve = equilibriumCurve(source)
  checkCharge(options?.charge)
  const frameCount = options.frames ?? 101
  checkFrames(frameCount)
  const run = runRayleigh(curve, curve.y, options.charge, options.until, frameCount)
  return {
    frames: run.frames.map(({ tau: _tau, ...frame }) => frame),
    end: run.end,
    integration: run.integration,
    warnings: [...curve.warnings],
    assumptions: designAssumptions(curve, [
      'one equilibrium stage (the pot), no column',
      'vapour removed as soon as it forms',
      'no holdup outside the pot',
    ]),
    caution: DESIGN_CAUTION,
  }
}
