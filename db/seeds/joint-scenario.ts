/**
 * The demo's recommended parameter set (INVENTED measurements: generated from the published NRTL parameters of
 * methanol/water, Smith, Van Ness & Abbott 7th ed. Table 12.5, in demo-systems.ts, plus simulated GC noise):
 * two approved methanol/water data sets at 1 atm and at 40 kPa, one NRTL parameter set with temperature-dependent
 * energies fitted jointly over both by the second lead chemist, and signed by the first as the system's
 * recommended parameter set. Skipped when the 40 kPa data set exists.
 */
import * as datasets from '../../apps/api/src/services/datasets.service.js'
import * as fits from '../../apps/api/src/services/fits.service.js'
import { approveJointFit } from '../../apps/api/src/services/joint-fit-signing.js'
import { runJointFit, submitJointFit } from '../../apps/api/src/services/joint-fits.service.js'
import { commitRun } from '../../apps/api/src/services/uploads.service.js'
import * as workflow from '../../apps/api/src/services/workflow.service.js'
import { DEMO_SYSTEMS } from './demo-systems.js'
import { runCsv } from './gc-generator.js'
import type { SeedContext } from './lab.js'
import { DEMO_PASSWORD } from './users.js'

export const JOINT_TITLES = {
  atm: 'Vacuum column study: methanol/water at 1 atm',
  vacuum: 'Vacuum column study: methanol/water at 40 kPa',
} as const

/** An approved methanol/water data set at P (Pa): the analyst uploads and fits, the lead chemist signs. */
async function approvedAt(ctx: SeedContext, title: string, P: number, seed: number, prefix: string) {
  const { db, config, users } = ctx
  const system = DEMO_SYSTEMS.find((s) => s.key === 'methanol-water')!
  const d = await datasets.createDataSet(db, users.analyst.id, {
    systemId: ctx.systemIds['methanol-water'],
    title,
    nominalPressurePa: P,
    apparatusNotes: 'Recirculating still no. 2 with a vacuum regulator; water by TCD.',
    projectRef: 'KES-2026-03',
  })
  const { csv } = runCsv(system, { seed, pressurePa: P, samples: 11, prefix })
  await commitRun(
    db,
    config,
    users.analyst,
    d.id,
    { originalName: `${prefix.toLowerCase()}-run.csv`, contentType: 'text/csv', content: Buffer.from(csv) },
    { acceptWarnings: true, rowVersion: d.rowVersion },
  )
  const run = await fits.runFits(db, users.analyst, d.id, { models: ['nrtl'] })
  const marked = await fits.markRecommended(db, users.lead, d.id, run.fits[0].id)
  const submitted = await workflow.submit(db, config, users.analyst, d.id, marked.rowVersion)
  await workflow.approve(db, config, users.lead, d.id, {
    password: DEMO_PASSWORD,
    reason: `Points consistent at ${P === 101325 ? '1 atm' : '40 kPa'}; NRTL recommended.`,
    rowVersion: submitted.rowVersion,
  })
  return d.id
}

export async function jointScenario(ctx: SeedContext): Promise<void> {
  const { db, config, users } = ctx
  if (await db.selectFrom('data_set').select('id').where('title', '=', JOINT_TITLES.vacuum).executeTakeFirst()) return
  const atm = await approvedAt(ctx, JOINT_TITLES.atm, 101325, 91, 'WR')
  const vacuum = await approvedAt(ctx, JOINT_TITLES.vacuum, 40000, 92, 'WV')
  const fit = await runJointFit(db, users.lead2, ctx.systemIds['methanol-water'], {
    dataSetIds: [atm, vacuum],
    model: 'nrtl',
    temperatureDependent: true,
  })
  const submitted = await submitJointFit(db, config, users.lead2, fit.id, fit.rowVersion)
  await approveJointFit(db, config, users.lead, fit.id, {
    password: DEMO_PASSWORD,
    reason: 'Both pressures fitted within their noise; recommended for the wash-water and vacuum column studies.',
    rowVersion: submitted.rowVersion,
  })
}
