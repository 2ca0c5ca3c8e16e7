import { z } from 'zod'

/** A mole fraction strictly inside (0, 1): design targets of exactly 0 or 1 need infinitely many stages. */
const openFraction = (what: string) =>
  z
    .number({ error: `Enter the ${what} as a mole fraction` })
    .gt(0, `The ${what} must be above 0`)
    .lt(1, `The ${what} must be below 1`)

/**
 * A column estimate: feed, distillate and bottoms as mole fractions of component 1, q the liquid fraction of
 * the feed (1 saturated liquid, 0 saturated vapour), reflux as a multiple of the minimum.
 */
export const columnEstimateSchema = z
  .object({
    xF: openFraction('feed composition'),
    q: z
      .number({ error: 'Enter q (1 for a feed at its bubble point)' })
      .min(-2, 'q below −2 is not a realistic feed')
      .max(3, 'q above 3 is not a realistic feed'),
    xD: openFraction('distillate target'),
    xB: openFraction('bottoms target'),
    rFactor: z
      .number({ error: 'Enter R as a multiple of Rmin' })
      .gt(1, 'R must be more than the minimum (a multiple above 1)')
      .max(20, 'Use at most 20 × Rmin'),
  })
  .superRefine((v, ctx) => {
    if (!(v.xF < v.xD))
      ctx.addIssue({ code: 'custom', path: ['xD'], message: 'The distillate must be richer than the feed' })
    if (!(v.xB < v.xF))
      ctx.addIssue({ code: 'custom', path: ['xB'], message: 'The bottoms must be leaner than the feed' })
  })
export type ColumnEstimateInput = z.infer<typeof columnEstimateSchema>

/** Where a batch still stops: fraction of the charge distilled, mol left in the pot, pot x1, mol distilled, or fraction of component 1 recovered overhead. */
export const BATCH_STOPS = ['distilledFraction', 'potMoles', 'potX1', 'distillateMoles', 'recovery1'] as const
export type BatchStop = (typeof BATCH_STOPS)[number]

/**
 * A batch-still run: charge in mol, stages above the pot (0 = simple still), reflux L/D, and one stop:
 * `stopBy` names it, `stopValue` gives it (a fraction 0–1, a mole fraction of component 1, or mol).
 */
export const batchStillSchema = z
  .object({
    moles: z
      .number({ error: 'Enter the charge in mol' })
      .gt(0, 'The charge must be more than 0 mol')
      .max(1e7, 'Use at most 10 000 000 mol'),
    x1: openFraction('charge composition'),
    stagesAbovePot: z
      .number({ error: 'Enter the number of stages' })
      .int('Use a whole number of stages')
      .min(0, 'Use 0 for a simple still')
      .max(60, 'Use at most 60 stages'),
    R: z
      .number({ error: 'Enter the reflux ratio' })
      .gt(0, 'The reflux ratio must be above 0')
      .max(100, 'Use a reflux ratio of at most 100'),
    stopBy: z.enum(BATCH_STOPS, { error: 'Choose when to stop' }),
    stopValue: z.number({ error: 'Enter where to stop' }),
  })
  .superRefine((v, ctx) => {
    const bad = (message: string) => ctx.addIssue({ code: 'custom', path: ['stopValue'], message })
    const s = v.stopValue
    switch (v.stopBy) {
      case 'distilledFraction':
        if (!(s > 0)) bad('Distil more than 0 %')
        else if (!(s < 1)) bad('Stop before the pot runs dry (below 100 %)')
        break
      case 'recovery1':
        if (!(s > 0)) bad('The recovery must be above 0')
        else if (!(s < 1)) bad('The recovery must be below 1 (all of component 1 needs the pot run dry)')
        break
      case 'potMoles':
      case 'distillateMoles':
        if (!(s > 0)) bad('The amount must be more than 0 mol')
        else if (typeof v.moles === 'number' && !(s < v.moles))
          bad(`The amount must be less than the charge (${v.moles} mol)`)
        break
      case 'potX1':
        if (!(s > 0)) bad('The pot composition must be above 0')
        else if (!(s < 1)) bad('The pot composition must be below 1')
        else if (s === v.x1) bad('The pot starts at this composition; choose another one')
        break
    }
  })
export type BatchStillInput = z.infer<typeof batchStillSchema>
