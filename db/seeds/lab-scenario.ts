/**
 * The demo's data sets, one or more per workflow state (INVENTED measurements, generated from published
 * parameters plus simulated GC noise): approved, submitted with comments (three submitted series, so the
 * lead chemist's, the reviewer's and the rework browser journeys each have their own), returned with a
 * signed reason, superseded by a revised approved version, and an open draft. Each is skipped when a data
 * set with its title exists.
 */
import type { SessionUser } from '../../apps/api/src/auth/index.js'
import * as comments from '../../apps/api/src/services/comments.service.js'
import * as datasets from '../../apps/api/src/services/datasets.service.js'
import * as fits from '../../apps/api/src/services/fits.service.js'
import type { FitModelName } from '../../apps/api/src/services/fits.service.js'
import { commitRun } from '../../apps/api/src/services/uploads.service.js'
import * as workflow from '../../apps/api/src/services/workflow.service.js'
import { DEMO_SYSTEMS } from './demo-systems.js'
import { runCsv } from './gc-generator.js'
import type { SeedContext } from './lab.js'
import { DEMO_PASSWORD } from './users.js'

const ATM = 101325

async function exists(ctx: SeedContext, title: string): Promise<boolean> {
  return !!(await ctx.db.selectFrom('data_set').select('id').where('title', '=', title).executeTakeFirst())
}

/** A draft with generated points uploaded by the analyst; returns its id and row version. */
async function draftWithRun(
  ctx: SeedContext,
  key: string,
  o: { title: string; project: string; samples: number; seed: number; prefix: string; notes: string },
) {
  const system = DEMO_SYSTEMS.find((s) => s.key === key)!
  const d = await datasets.createDataSet(ctx.db, ctx.users.analyst.id, {
    systemId: ctx.systemIds[key],
    title: o.title,
    nominalPressurePa: ATM,
    apparatusNotes: o.notes,
    projectRef: o.project,
  })
  // The FID runs carry a check standard (x1 = 0.500 as prepared), so the demo's FID method has a control chart.
  // The TCD method has none: the browser journey charts its own check standards there.
  const check = system.detector === 'FID' ? { label: `${o.prefix}-CHECK`, x1: 0.5 } : undefined
  const { csv } = runCsv(system, { seed: o.seed, pressurePa: ATM, samples: o.samples, prefix: o.prefix, check })
  const r = await commitRun(
    ctx.db,
    ctx.config,
    ctx.users.analyst,
    d.id,
    { originalName: `${o.prefix.toLowerCase()}-run.csv`, contentType: 'text/csv', content: Buffer.from(csv) },
    { acceptWarnings: true, rowVersion: d.rowVersion },
  )
  return { id: d.id, rowVersion: r.rowVersion, pointIds: r.pointIds }
}

/** Fit, test, (as the lead chemist) mark the recommended fit, then submit; returns the row version to sign. */
async function fitAndSubmit(
  ctx: SeedContext,
  id: string,
  models: FitModelName[],
  recommended: FitModelName,
  by: SessionUser = ctx.users.analyst,
): Promise<number> {
  const run = await fits.runFits(ctx.db, by, id, { models })
  await safeConsistency(ctx, id, recommended)
  // Chosen before submitting: a revision's carried-over recommended fit may rest on other points (stale).
  const fit = run.fits.find((f) => f.model === recommended)!
  const marked = await fits.markRecommended(ctx.db, ctx.users.lead, id, fit.id)
  return (await workflow.submit(ctx.db, ctx.config, by, id, marked.rowVersion)).rowVersion
}

/** The area and point tests; a data set the engine cannot test (too few points) is still seeded. */
async function safeConsistency(ctx: SeedContext, id: string, model: FitModelName): Promise<number | null> {
  try {
    return (await fits.runConsistency(ctx.db, ctx.users.analyst, id, model)).rowVersion
  } catch (err) {
    if ((err as { code?: string }).code !== 'computation_refused') throw err
    return null
  }
}

const sign = (ctx: SeedContext, reason: string, rowVersion: number) => ({ password: DEMO_PASSWORD, reason, rowVersion })

/**
 * Two more submitted series (INVENTED points from the SVNA 7th ed. Table 12.5 parameters in demo-systems.ts,
 * plus GC noise): methanol/water with a reviewer's question, and a second acetone/methanol campaign.
 */
async function moreSubmitted(ctx: SeedContext): Promise<void> {
  const { users } = ctx
  const wash = 'Kestrel wash water: methanol/water at 1 atm'
  if (!(await exists(ctx, wash))) {
    const d = await draftWithRun(ctx, 'methanol-water', {
      title: wash,
      project: 'KES-2026-03',
      samples: 10,
      seed: 61,
      prefix: 'WW',
      notes: 'Still no. 2; water by TCD.',
    })
    const run = await fits.runFits(ctx.db, users.analyst, d.id, { models: ['nrtl', 'wilson'] })
    await workflow.submit(ctx.db, ctx.config, users.analyst, d.id, run.rowVersion)
    await comments.addComment(ctx.db, ctx.config, users.reviewer, d.id, {
      body: 'Which TCD calibration was used for water? Please name it in the apparatus notes.',
    })
  }
  const repeat = 'Kestrel recycle repeat: acetone/methanol at 1 atm'
  if (!(await exists(ctx, repeat))) {
    const d = await draftWithRun(ctx, 'acetone-methanol', {
      title: repeat,
      project: 'KES-2026-03',
      samples: 8,
      seed: 71,
      prefix: 'KR',
      notes: 'Still no. 1, second campaign.',
    })
    const run = await fits.runFits(ctx.db, users.analyst, d.id, { models: ['wilson', 'nrtl'] })
    await workflow.submit(ctx.db, ctx.config, users.analyst, d.id, run.rowVersion)
  }
}

/**
 * Approved: water/1-butanol, the partially miscible pair (INVENTED points from the published NRTL parameters in
 * demo-systems.ts plus GC noise). Samples whose liquid boils as two layers are marked so in the run file, with
 * both layers analysed; NRTL is recommended, so a newcomer sees the three-phase line and the heterogeneous
 * azeotrope at once.
 */
export const WATER_BUTANOL_TITLE = 'SR-31 decanter feed: water/1-butanol at 1 atm'
async function partiallyMiscible(ctx: SeedContext): Promise<void> {
  if (await exists(ctx, WATER_BUTANOL_TITLE)) return
  const d = await draftWithRun(ctx, 'water-1-butanol', {
    title: WATER_BUTANOL_TITLE,
    project: 'SR-31',
    samples: 14,
    seed: 81,
    prefix: 'WB',
    notes: 'Still no. 2, stirred; two layers seen in the still are sampled apart after settling. Water by TCD.',
  })
  const rv = await fitAndSubmit(ctx, d.id, ['nrtl'], 'nrtl')
  await workflow.approve(
    ctx.db,
    ctx.config,
    ctx.users.lead,
    d.id,
    sign(ctx, 'Two-layer samples consistent with the three-phase line; NRTL recommended for the decanter study.', rv),
  )
}

export async function scenarioDataSets(ctx: SeedContext): Promise<void> {
  const { users } = ctx
  // approved: acetone/methanol, minimum-boiling azeotrope
  const kestrel = 'Kestrel acetone recycle: acetone/methanol at 1 atm'
  if (!(await exists(ctx, kestrel))) {
    const d = await draftWithRun(ctx, 'acetone-methanol', {
      title: kestrel,
      project: 'KES-2026-03',
      samples: 14,
      seed: 11,
      prefix: 'KA',
      notes: 'Recirculating still no. 2, Pt100 in the vapour space, barometer at the bench.',
    })
    // UNIQUAC too (r and q of the demo components from demo-properties.ts), fitted before the version is signed
    const rv = await fitAndSubmit(ctx, d.id, ['wilson', 'nrtl', 'van-laar', 'uniquac'], 'wilson')
    await workflow.approve(
      ctx.db,
      ctx.config,
      users.lead,
      d.id,
      sign(ctx, 'Points consistent; Wilson recommended for the recycle column study.', rv),
    )
  }
  // submitted with comments: 1-propanol/water, minimum-boiling azeotrope
  const sr24 = 'SR-24 mother liquor: 1-propanol/water at 1 atm'
  if (!(await exists(ctx, sr24))) {
    const d = await draftWithRun(ctx, '1-propanol-water', {
      title: sr24,
      project: 'SR-24',
      samples: 12,
      seed: 21,
      prefix: 'PW',
      notes: 'Still no. 1; water by TCD.',
    })
    const run = await fits.runFits(ctx.db, users.analyst, d.id, { models: ['nrtl', 'wilson'] })
    await workflow.submit(ctx.db, ctx.config, users.analyst, d.id, run.rowVersion)
    const c = await comments.addComment(ctx.db, ctx.config, users.reviewer, d.id, {
      body: 'The vapour of this sample looks richer in 1-propanol than its neighbours; was the condensate well mixed?',
      pointId: d.pointIds[5],
    })
    await comments.addComment(ctx.db, ctx.config, users.analyst, d.id, {
      body: 'Mixed by hand; I will re-inject the retained sample.',
      parentId: c.id,
    })
    await comments.addComment(ctx.db, ctx.config, users.reviewer, d.id, {
      body: 'Please add the barometer calibration date to the apparatus notes.',
    })
  }
  await moreSubmitted(ctx)
  await partiallyMiscible(ctx)
  // returned for rework: acetone/chloroform, maximum-boiling azeotrope
  const chl = 'SR-24 acetone/chloroform cut at 1 atm'
  if (!(await exists(ctx, chl))) {
    const d = await draftWithRun(ctx, 'acetone-chloroform', {
      title: chl,
      project: 'SR-24',
      samples: 9,
      seed: 31,
      prefix: 'AC',
      notes: 'Still no. 2; chloroform by TCD.',
    })
    const rv = await fitAndSubmit(ctx, d.id, ['margules', 'van-laar'], 'margules')
    await workflow.returnForRework(
      ctx.db,
      ctx.config,
      users.lead,
      d.id,
      sign(ctx, 'Too few points near the azeotrope (x1 0.25–0.45); add three samples there.', rv),
    )
  }
  // superseded by a revised approved version: n-hexane/n-heptane, nearly ideal
  const hex = 'Wash solvent: n-hexane/n-heptane at 1 atm'
  if (!(await exists(ctx, hex))) {
    const d = await draftWithRun(ctx, 'hexane-heptane', {
      title: hex,
      project: 'SR-24',
      samples: 10,
      seed: 41,
      prefix: 'HH',
      notes: 'Still no. 1.',
    })
    const rv = await fitAndSubmit(ctx, d.id, ['margules'], 'margules')
    await workflow.approve(
      ctx.db,
      ctx.config,
      users.lead,
      d.id,
      sign(ctx, 'Nearly ideal as expected; Margules parameters small.', rv),
    )
    const v2 = await datasets.reviseDataSet(ctx.db, users.analyst, d.id)
    const ex = await datasets.getDataSetDetail(ctx.db, users.analyst, v2.id)
    await datasets.setPointExclusion(ctx.db, users.analyst, v2.id, ex.points[0].id, {
      excluded: true,
      reason: 'Heater power changed during sampling (logbook p. 41).',
      rowVersion: v2.rowVersion,
    })
    const rv2 = await fitAndSubmit(ctx, v2.id, ['margules', 'wilson'], 'margules')
    await workflow.approve(
      ctx.db,
      ctx.config,
      users.lead,
      v2.id,
      sign(ctx, 'Revision 2: first sample excluded, refitted.', rv2),
    )
  }
  // open draft: methanol/water, no azeotrope
  const mw = 'Column feed: methanol/water at 1 atm'
  if (!(await exists(ctx, mw))) {
    const d = await draftWithRun(ctx, 'methanol-water', {
      title: mw,
      project: 'KES-2026-03',
      samples: 11,
      seed: 51,
      prefix: 'MW',
      notes: 'Still no. 1; water by TCD. Work in progress.',
    })
    const detail = await datasets.getDataSetDetail(ctx.db, users.analyst, d.id)
    await datasets.setPointExclusion(ctx.db, users.analyst, d.id, detail.points[3].id, {
      excluded: true,
      reason: 'Septum leak suspected on this injection series.',
      rowVersion: d.rowVersion,
    })
  }
}
