/**
 * The demo's mixed joint fit (INVENTED measurements): one Wilson parameter set with temperature-dependent energies
 * fitted jointly over an isobaric and an isothermal data set of acetone (1)/methanol (2) — the approved 1 atm series
 * "Kestrel acetone recycle" (lab-scenario.ts) and the static-cell P–x–y series at 55 °C (lab-scenario-vapour.ts),
 * both generated from the published Wilson parameters of SVNA 7th ed. Table 12.5 (demo-systems.ts) plus simulated
 * noise, both under an ideal vapour. Run by the second lead chemist and submitted for signature; it cannot be signed
 * until the static-cell series is approved (a recommended set rests on approved data only), so the system's
 * engineers still compute with the 1 atm version's own fit. Skipped when the system has a joint fit.
 */
import { runJointFit, submitJointFit } from '../../apps/api/src/services/joint-fits.service.js'
import { ISOTHERMAL_TITLE } from './lab-scenario-vapour.js'
import type { SeedContext } from './lab.js'

export const MIXED_ISOBARIC_TITLE = 'Kestrel acetone recycle: acetone/methanol at 1 atm'

export async function mixedJointScenario(ctx: SeedContext): Promise<void> {
  const { db, config, users } = ctx
  const systemId = ctx.systemIds['acetone-methanol']
  if (await db.selectFrom('joint_fit').select('id').where('system_id', '=', systemId).executeTakeFirst()) return
  const id = async (title: string, state: string) =>
    (
      await db
        .selectFrom('data_set')
        .select('id')
        .where('title', '=', title)
        .where('state', '=', state as never)
        .executeTakeFirst()
    )?.id
  const isobaric = await id(MIXED_ISOBARIC_TITLE, 'approved')
  const isothermal = await id(ISOTHERMAL_TITLE, 'draft')
  if (!isobaric || !isothermal) return
  const fit = await runJointFit(db, users.lead2, systemId, {
    dataSetIds: [isobaric, isothermal],
    model: 'wilson',
    temperatureDependent: true,
  })
  await submitJointFit(db, config, users.lead2, fit.id, fit.rowVersion)
}
