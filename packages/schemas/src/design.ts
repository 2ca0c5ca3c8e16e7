import { z } from 'zod'

/** A mole fraction strictly inside (0, 1): design targets of exactly 0 or 1 need infinitely many stages. */
const openFraction = (what: string) =>
  z.number({ error: `Enter the ${what} as a mole fraction` }).gt(0, `The ${what} must be above 0`).lt(1, `The ${what} must be below 1`)

/**
 * A column estimate: feed, distillate and bottoms as mole fractions of component 1, q the liquid fraction of
 * the feed (1 saturated liquid, 0 saturated vapour), reflux as a multiple of the minimum.
 */
export const columnEstimateSchema = z
  .object({
    xF: openFraction('feed composition'),
    q: z.number({ error: 'Enter q (1 for a feed at its bubble point)' }).min(-2, 'q below −2 is not a realistic feed').max(3, 'q above 3 is not a realistic feed'),
    xD: openFraction('distillate target'),
    xB: openFraction('bottoms target'),
    rFactor: z.number({ error: 'Enter R as a multiple of Rmin' }).gt(1, 'R must be more than the minimum (a multiple above 1)').max(20, 'Use at most 20 × Rmin'),
  })
  .superRefine((v, ctx) => {
    if (!(v.xF < v.xD)) ctx.addIssue({ code: 'custom', path: ['xD'], message: 'The distillate must be richer than the feed' })
    if (!(v.xB < v.xF)) ctx.addIssue({ code: 'custom', path: ['xB'], message: 'The bottoms must be leaner than the feed' })
  })
export type ColumnEstimateInput = z.infer<typeof columnEstimateSchema>

/** A batch-still run: charge in mol, stages above the pot (0 = simple still), reflux L/D, stop at a fraction distilled. */
export const batchStillSchema = z.object({
  moles: z.number({ error: 'Enter the charge in mol' }).gt(0, 'The charge must be more than 0 mol').max(1e7, 'Use at most 10 000 000 mol'),
  x1: openFraction('charge composition'),
  stagesAbovePot: z.number({ error: 'Enter the number of stages' }).int('Use a whole number of stages').min(0, 'Use 0 for a simple still').max(60, 'Use at most 60 stages'),
  R: z.number({ error: 'Enter the reflux ratio' }).gt(0, 'The reflux ratio must be above 0').max(100, 'Use a reflux ratio of at most 100'),
  distilledFraction: z.number({ error: 'Enter how much to distil' }).gt(0, 'Distil more than 0 %').lt(1, 'Stop before the pot runs dry (below 100 %)'),
})
export type BatchStillInput = z.infer<typeof batchStillSchema>
