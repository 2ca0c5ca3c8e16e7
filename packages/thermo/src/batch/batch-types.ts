/** Shapes shared by the batch-still simulations. Amounts in mol, temperatures in K, compositions as mole fractions of component 1. */

/** The still charge. */
export interface BatchCharge {
  moles: number
  x1: number
}

/** When to stop: pot amount left, pot composition, distillate amount, or fraction of component 1 recovered overhead. */
export type BatchUntil = { potMoles: number } | { potX1: number } | { distillateMoles: number } | { recovery1: number }

/** One frame of the still "movie". */
export interface BatchFrame {
  /** Distillate collected so far / charge. */
  distilledFraction: number
  potMoles: number
  potX1: number
  /** Pot bubble temperature, K (null for constant α). */
  potT: number | null
  /** Composition of the distillate leaving at this instant. */
  instantaneousDistillateY1: number
  /** Average composition of all distillate collected so far (the instantaneous value at the start). */
  cumulativeDistillateX1: number
}

/** The still at the end of the run. */
export interface BatchEndState {
  potMoles: number
  potX1: number
  potT: number | null
  distillateMoles: number
  distillateX1: number
  /** Fraction of the charged component 1 now in the distillate. */
  recovery1: number
  distilledFraction: number
}

/** Integration settings reported with every run. */
export interface BatchIntegration {
  method: 'Dormand–Prince 5(4), adaptive'
  absoluteTolerance: number
  relativeTolerance: number
  steps: number
  rejectedSteps: number
}
