/**
 * The batch still's stops: what the screen offers (fraction distilled, mol in the pot, pot x1, mol distilled,
 * recovery of component 1), what the engine is asked for, and friendly words when a stop cannot be reached.
 */
import type { BatchStop } from '@ebullio/schemas'
import { batchRectification, simpleBatchDistillation, type BatchUntil, type BinarySystem } from '@ebullio/thermo'
import { errorText } from './design-model'

/** Inputs of a batch-still run: charge in mol, theoretical stages above the pot (0 = simple still), constant R, one stop. */
export interface BatchInputs {
  moles: number
  x1: number
  stagesAbovePot: number
  R: number
  /** Which stop: fraction distilled (0–1), mol left in the pot, pot x1, mol distilled, fraction of component 1 recovered (0–1). */
  stopBy: BatchStop
  stopValue: number
}

/** Run the still: Rayleigh for a simple still, quasi-steady rectification with stages. */
export function batchRun(system: BinarySystem, P: number, b: BatchInputs, frames = 121) {
  const source = { system, P }
  const until = untilOf(b)
  const charge = { moles: b.moles, x1: b.x1 }
  if (b.stagesAbovePot === 0) return simpleBatchDistillation(source, { charge, until, frames })
  return batchRectification(source, { charge, stages: b.stagesAbovePot + 1, R: b.R, until, frames })
}
export type BatchRun = ReturnType<typeof batchRun>

/** The stop picker's choices with the value field's label, step and decimals. */
export const STOP_CHOICES: { value: BatchStop; label: string; field: string; step: number; digits: number }[] = [
  {
    value: 'distilledFraction',
    label: 'Fraction of the charge distilled',
    field: 'Distil until (fraction of charge)',
    step: 0.05,
    digits: 2,
  },
  {
    value: 'distillateMoles',
    label: 'Distillate collected',
    field: 'Distil until (mol collected)',
    step: 5,
    digits: 1,
  },
  { value: 'potMoles', label: 'Amount left in the pot', field: 'Stop with (mol left in the pot)', step: 5, digits: 1 },
  { value: 'potX1', label: 'Pot composition', field: 'Stop at pot x₁', step: 0.01, digits: 3 },
  {
    value: 'recovery1',
    label: 'Recovery of component 1',
    field: 'Recover (fraction of component 1)',
    step: 0.05,
    digits: 2,
  },
]

/**
 * A starting value for a newly chosen stop: 60 % distilled, 40 % left, the pot at a third of the charge's x1,
 * 90 % of component 1 recovered. Charge in mol.
 */
export function defaultStopValue(stopBy: BatchStop, moles: number, x1: number): number {
  switch (stopBy) {
    case 'distilledFraction':
      return 0.6
    case 'distillateMoles':
      return Math.round(0.6 * moles * 10) / 10
    case 'potMoles':
      return Math.round(0.4 * moles * 10) / 10
    case 'potX1':
      return Math.round((x1 / 3) * 1000) / 1000
    case 'recovery1':
      return 0.9
  }
}

/** thermo's stopping condition for the screen's stop (a fraction distilled becomes mol of distillate). */
export function untilOf(b: Pick<BatchInputs, 'moles' | 'stopBy' | 'stopValue'>): BatchUntil {
  switch (b.stopBy) {
    case 'distilledFraction':
      return { distillateMoles: b.stopValue * b.moles }
    case 'potMoles':
      return { potMoles: b.stopValue }
    case 'distillateMoles':
      return { distillateMoles: b.stopValue }
    case 'potX1':
      return { potX1: b.stopValue }
    case 'recovery1':
      return { recovery1: b.stopValue }
  }
}

function limitText(limit: number, names: [string, string]): string {
  if (limit <= 0) return `pure ${names[1]} (x₁ = 0)`
  if (limit >= 1) return `pure ${names[0]} (x₁ = 1)`
  return `the azeotrope at x₁ = ${limit.toFixed(3)}`
}

/**
 * Why a batch run failed, for the engineer. A pot composition the still cannot reach is explained from the
 * still's direction (with a column the distillate is always richer in component 1 than the pot, so the pot
 * only gets leaner) with the range that can be reached; other engine errors keep the engine's words.
 */
export function batchFailureText(e: unknown, b: BatchInputs, names: [string, string]): string {
  const err = e as { code?: string; details?: { limit?: number } }
  const limit = err?.details?.limit
  if (err?.code !== 'unreachable-pot-composition' || typeof limit !== 'number') return errorText(e)
  const leaner = limit < b.x1
  const why =
    b.stagesAbovePot > 0
      ? `With ${b.stagesAbovePot} stage${b.stagesAbovePot === 1 ? '' : 's'} above the pot at R = ${b.R} the distillate is richer in ${names[0]} than the pot, so the pot only gets leaner in it`
      : `The first vapour of this charge is ${leaner ? 'richer' : 'leaner'} in ${names[0]} than the liquid, so the pot only gets ${leaner ? 'leaner' : 'richer'} in it`
  const [lo, hi] = leaner ? [limit, b.x1] : [b.x1, limit]
  return `The still cannot reach a pot x₁ of ${b.stopValue}. ${why}: from x₁ = ${b.x1} it heads towards ${limitText(limit, names)} and never passes it. Choose a pot x₁ between ${lo.toFixed(3)} and ${hi.toFixed(3)}, or stop by another condition.`
}

/** Below this fraction of the charge left in the pot, a stop counts as "only when the pot is practically dry" (common practice, no source). */
const NEARLY_DRY = 0.01

/**
 * A note when the chosen stop was met only as the pot ran practically dry, or not met at all (the engine stops
 * at 1e-12 of the charge left); null when the run ended where asked with a real amount still in the pot.
 */
export function stopNote(run: BatchRun, b: BatchInputs): string | null {
  const left = run.end.potMoles / b.moles
  const v = b.stopValue
  const reached =
    b.stopBy === 'potX1'
      ? v < b.x1
        ? run.end.potX1 <= v + 1e-9
        : run.end.potX1 >= v - 1e-9
      : b.stopBy === 'recovery1'
        ? run.end.recovery1 >= v - 1e-9
        : true
  const share = left < 1e-4 ? 'less than 0.01 %' : `${(left * 100).toFixed(2)} %`
  if (!reached)
    return `The still ran practically dry (${share} of the charge left) before reaching the chosen stop; the run ends there.`
  if (left < NEARLY_DRY)
    return `This stop is reached only when the pot is practically dry (${share} of the charge left); a real still is not run that far.`
  return null
}
