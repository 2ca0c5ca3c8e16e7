/**
 * The demo's mixed joint fit (INVENTED measurements): one Wilson parameter set with temperature-dependent energies
 * fitted jointly over an isobaric and an isothermal data set of acetone (1)/methanol (2) — the approved 1 atm series
 * "Kestrel acetone recycle" (lab-scenario.ts) and the approved static-cell P–x–y series at 55 °C
 * (lab-scenario-vapour.ts, signed there before this runs), both generated from the published Wilson parameters of
 * SVNA 7th ed. Table 12.5 (demo-systems.ts) plus simulated noise, both under an ideal vapour. Run and submitted by
 * the second lead chemist and signed by the first (who did not run it and changed neither member's content) as the
 * system's recommended parameter set, so the engineer's acetone/methanol page computes with it by default.
 * Idempotent: the fit is run only when the system has no joint fit, and signed only while it is submitted (a
 * database seeded before the static-cell series was approved gets its submitted set signed on the next run).
 */
import { listJointFits } from '../../apps/api/src/repositories/joint-fits.repository.js'
import { approveJointFit } from '../../apps/api/src/services/joint-fit-signing.js'
import { runJointFit, submitJointFit } from '../../apps/api/src/services/joint-fits.service.js'
import { ISOTHERMAL_TITLE } from './lab-scenario-vapour.js'
import type { SeedContext } from './lab.js'
import { DEMO_PASSWORD } from './users.js'

export const MIXED_ISOBARIC_TITLE = 'Kestrel acetone recycle: acetone/methanol at 1 atm'

async function approvedId(ctx: SeedContext, title: string): Promise<string | undefined> {
  const row = await ctx.db
    .selectFrom('data_set')
    .select('id')
    .where('title', '=', title)
    .where('state', '=', 'approved')
    .executeTakeFirst()
  return row?.id
}

export async function mixedJointScenario(ctx: SeedContext): Promise<void> {
  const { db, config, users } = ctx
  const systemId = ctx.systemIds['acetone-methanol']
  if (!(await listJointFits(db, systemId)).length) {
    const isobaric = await approvedId(ctx, MIXED_ISOBARIC_TITLE)
    const isothermal = await approvedId(ctx, ISOTHERMAL_TITLE)
    if (!isobaric || !isothermal) return
    const fit = await runJointFit(db, users.lead2, systemId, {
      dataSetIds: [isobaric, isothermal],
      model: 'wilson',
      temperatureDependent: true,
    })
    await submitJointFit(db, config, users.lead2, fit.id, fit.rowVersion)
  }
  const [submitted] = await listJointFits(db, systemId, ['submitted'])
  if (!submitted || (await listJointFits(db, systemId, ['approved'])).length) return
  await approveJointFit(db, config, users.lead, submitted.id, {
    password: DEMO_PASSWORD,
    reason: 'Both the 1 atm and the 55 °C series fitted within their noise; recommended for the recycle column study.',
    rowVersion: submitted.rowVersion,
  })
}
