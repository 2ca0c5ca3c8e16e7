/**
 * Two demo data sets beyond isobaric data under an ideal vapour. INVENTED measurements, generated from published
 * parameters plus simulated noise (seeded, so every seed run gives the same numbers):
 * - an isothermal P–x–y series of acetone (1)/methanol (2) at 55 °C from a static cell: bubble pressures and vapour
 *   compositions of the Wilson model of SVNA 7th ed. Table 12.5 (demo-systems.ts) with 0.15 kPa pressure noise and
 *   0.003 vapour-composition noise, entered as points (origin: measured here by another method), σP per point;
 * - methanol (1)/water (2) at 1 atm under a virial vapour: T and y from the γ–φ bubble point of the NRTL model of
 *   SVNA 7th ed. Table 12.5 with Tsonopoulos second virial coefficients (critical data in demo-properties.ts:
 *   the `chemicals` 1.5.2 library's values and the published polar classes), plus simulated GC noise;
 * - methanol (1)/water (2) at 60 kPa under a Hayden–O'Connell vapour (both associate): T and y from the γ–φ bubble
 *   point of the same NRTL model with HOC second virial coefficients (RD and η of demo-properties.ts; η12 = 0, no
 *   published solvation value at hand), plus 0.05 K and 0.004 noise, typed in as points (another method).
 * Each is fitted by the analyst, with its consistency tests and data-quality score run. The virial series at 1 atm
 * stays a draft. The static-cell series (Wilson recommended) and the Hayden–O'Connell series (NRTL recommended) are
 * signed: the lead chemist chooses the recommended fit, the analyst submits, and the lead chemist, who changed no
 * content, approves with an e-signature, so the engineer's catalogue has an isothermal version and a version under an
 * associating vapour. A data set left a draft by an older seed is signed on the next run (idempotent).
 */
import { bubblePressure, bubbleTemperature } from '@ebullio/thermo'
import { seededRandom } from '@ebullio/thermo/random'
import * as datasets from '../../apps/api/src/services/datasets.service.js'
import { addTypedPoints } from '../../apps/api/src/services/direct-points.service.js'
import * as fits from '../../apps/api/src/services/fits.service.js'
import type { FitModelName } from '../../apps/api/src/services/fits.service.js'
import { engineVapor, getSystem } from '../../apps/api/src/services/systems.service.js'
import { commitRun } from '../../apps/api/src/services/uploads.service.js'
import * as workflow from '../../apps/api/src/services/workflow.service.js'
import { DEMO_SYSTEMS, demoVaporPressure } from './demo-systems.js'
import { runCsv } from './gc-generator.js'
import type { SeedContext } from './lab.js'
import { DEMO_PASSWORD } from './users.js'

export const ISOTHERMAL_TITLE = 'Static cell at 55 °C: acetone + methanol'
export const VIRIAL_TITLE = 'Recovery column feed with a virial vapour: methanol + water at 1 atm'
export const HOC_TITLE = 'Vacuum recovery trial, associating vapour (Hayden–O’Connell): methanol + water at 60 kPa'

const exists = async (ctx: SeedContext, title: string) =>
  !!(await ctx.db.selectFrom('data_set').select('id').where('title', '=', title).executeTakeFirst())

async function isothermalSeries(ctx: SeedContext): Promise<void> {
  if (await exists(ctx, ISOTHERMAL_TITLE)) return
  const system = DEMO_SYSTEMS.find((s) => s.key === 'acetone-methanol')!
  const model = {
    vaporPressure: [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as const,
    activity: system.activity,
  }
  const T = 328.15
  const rand = seededRandom(131)
  const points = [0.04, 0.1, 0.18, 0.27, 0.36, 0.45, 0.55, 0.64, 0.73, 0.82, 0.9, 0.96].map((x1, i) => {
    const b = bubblePressure({ vaporPressure: [...model.vaporPressure], activity: model.activity }, { T, x1 })
    return {
      sampleLabel: `SC-${String(i + 1).padStart(2, '0')}`,
      temperatureK: Math.round((T + 0.02 * rand.gaussian()) * 100) / 100,
      pressurePa: Math.round(b.P + 150 * rand.gaussian()),
      x1,
      y1: Math.round(Math.min(1, Math.max(0, b.y1 + 0.003 * rand.gaussian())) * 1e4) / 1e4,
      x1Uncertainty: 0.002,
      y1Uncertainty: 0.003,
      pressureUncertaintyPa: 150,
    }
  })
  const d = await datasets.createDataSet(ctx.db, ctx.users.analyst.id, {
    systemId: ctx.systemIds['acetone-methanol'],
    title: ISOTHERMAL_TITLE,
    layout: 'pxy',
    nominalPressurePa: null,
    nominalTemperatureK: T,
    apparatusNotes:
      'Static equilibrium cell no. 1 in the thermostat bath; pressure by quartz gauge, vapour sampled to GC.',
    projectRef: 'KES-2026-03',
    origin: 'other-method',
    originMethod: 'Static cell: liquid made up by weighing, vapour composition by GC of a small withdrawn sample',
  })
  await addTypedPoints(ctx.db, ctx.users.analyst, d.id, { rowVersion: d.rowVersion, points })
  await fits.runFits(ctx.db, ctx.users.analyst, d.id, { models: ['wilson', 'nrtl'] })
  await fits.runConsistency(ctx.db, ctx.users.analyst, d.id, 'wilson')
}

async function virialSeries(ctx: SeedContext): Promise<void> {
  if (await exists(ctx, VIRIAL_TITLE)) return
  const demo = DEMO_SYSTEMS.find((s) => s.key === 'methanol-water')!
  const choice = { kind: 'virial' as const, correlation: 'tsonopoulos' as const, poynting: false }
  const vapor = engineVapor(await getSystem(ctx.db, ctx.systemIds['methanol-water']), choice)
  const d = await datasets.createDataSet(ctx.db, ctx.users.analyst.id, {
    systemId: ctx.systemIds['methanol-water'],
    title: VIRIAL_TITLE,
    nominalPressurePa: 101325,
    vaporModel: choice,
    apparatusNotes: 'Still no. 1; water by TCD. Alcohol and water vapours are not ideal: reduced with a virial vapour.',
    projectRef: 'KES-2026-03',
  })
  const { csv } = runCsv(demo, { seed: 141, pressurePa: 101325, samples: 12, prefix: 'MV', vapor })
  const r = await commitRun(
    ctx.db,
    ctx.config,
    ctx.users.analyst,
    d.id,
    { originalName: 'mv-run.csv', contentType: 'text/csv', content: Buffer.from(csv) },
    { acceptWarnings: true, rowVersion: d.rowVersion },
  )
  void r
  await fits.runFits(ctx.db, ctx.users.analyst, d.id, { models: ['nrtl', 'wilson'] })
  await fits.runConsistency(ctx.db, ctx.users.analyst, d.id, 'nrtl')
}

async function haydenOConnellSeries(ctx: SeedContext): Promise<void> {
  if (await exists(ctx, HOC_TITLE)) return
  const demo = DEMO_SYSTEMS.find((s) => s.key === 'methanol-water')!
  const choice = { kind: 'virial' as const, correlation: 'hayden-oconnell' as const, poynting: false }
  const vapor = engineVapor(await getSystem(ctx.db, ctx.systemIds['methanol-water']), choice)
  const P = 60000
  const rand = seededRandom(151)
  const system = {
    vaporPressure: [demoVaporPressure('methanol'), demoVaporPressure('water')] as [
      ReturnType<typeof demoVaporPressure>,
      ReturnType<typeof demoVaporPressure>,
    ],
    activity: demo.activity,
    vapor,
  }
  const points = [0.03, 0.08, 0.15, 0.25, 0.35, 0.5, 0.65, 0.8, 0.92].map((x1, i) => {
    const b = bubbleTemperature(system, { P, x1 })
    return {
      sampleLabel: `HO-${String(i + 1).padStart(2, '0')}`,
      temperatureK: Math.round((b.T + 0.05 * rand.gaussian()) * 100) / 100,
      pressurePa: P,
      x1,
      y1: Math.round(Math.min(1, Math.max(0, b.y1 + 0.004 * rand.gaussian())) * 1e4) / 1e4,
      x1Uncertainty: 0.002,
      y1Uncertainty: 0.004,
      pressureUncertaintyPa: null,
    }
  })
  const d = await datasets.createDataSet(ctx.db, ctx.users.analyst.id, {
    systemId: ctx.systemIds['methanol-water'],
    title: HOC_TITLE,
    nominalPressurePa: P,
    vaporModel: choice,
    apparatusNotes: 'Recirculating still no. 2 under vacuum; both vapours associate, so a Hayden–O’Connell vapour.',
    projectRef: 'KES-2026-03',
    origin: 'other-method',
    originMethod: 'Recirculating still; liquid and condensed vapour by refractive index',
  })
  await addTypedPoints(ctx.db, ctx.users.analyst, d.id, { rowVersion: d.rowVersion, points })
  await fits.runFits(ctx.db, ctx.users.analyst, d.id, { models: ['nrtl', 'wilson'] })
  await fits.runConsistency(ctx.db, ctx.users.analyst, d.id, 'nrtl')
}

/**
 * Sign the draft with this title through the workflow: the lead chemist marks the fit of `model` recommended (not a
 * change of content, so the four-eyes rule still lets them sign), the analyst submits, the lead chemist approves.
 * Nothing happens when no draft has the title (already signed).
 */
async function approveDraft(ctx: SeedContext, title: string, model: FitModelName, reason: string): Promise<void> {
  const { db, config, users } = ctx
  const row = await db
    .selectFrom('data_set')
    .select('id')
    .where('title', '=', title)
    .where('state', '=', 'draft')
    .executeTakeFirst()
  if (!row) return
  const detail = await datasets.getDataSetDetail(db, users.lead, row.id)
  const fit = detail.fits.find((f) => f.model === model)
  if (!fit) throw new Error(`The demo data set "${title}" has no ${model} fit to recommend.`)
  const marked = await fits.markRecommended(db, users.lead, row.id, fit.id)
  const submitted = await workflow.submit(db, config, users.analyst, row.id, marked.rowVersion)
  await workflow.approve(db, config, users.lead, row.id, {
    password: DEMO_PASSWORD,
    reason,
    rowVersion: submitted.rowVersion,
  })
}

/**
 * The isothermal and the virial-vapour demo series (idempotent: each is created only when its title is missing, and
 * the two signed ones are signed only while they are drafts).
 */
export async function vapourAndIsothermalDataSets(ctx: SeedContext): Promise<void> {
  await isothermalSeries(ctx)
  await virialSeries(ctx)
  await haydenOConnellSeries(ctx)
  await approveDraft(
    ctx,
    ISOTHERMAL_TITLE,
    'wilson',
    'Pressures and vapour compositions within their noise at 55 °C; Wilson recommended for the recycle study.',
  )
  await approveDraft(
    ctx,
    HOC_TITLE,
    'nrtl',
    'Consistent under the Hayden–O’Connell vapour at 60 kPa; NRTL recommended for the vacuum recovery trial.',
  )
}
