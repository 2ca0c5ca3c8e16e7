import { sql } from 'kysely'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { bubbleTemperature, type ActivityModel, type VaporPressureModel } from '@ebullio/thermo'
import { DEMO_SYSTEMS, demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { seedLab } from '../../../db/seeds/lab.js'
import { seedUsers } from '../../../db/seeds/users.js'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'
import { labCounts } from './lab-fixture.js'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
})
afterAll(() => t.close())

describe('demo scenario (invented data)', () => {
  it('loads data sets in every state through the upload code, and a second run changes nothing', async () => {
    const ids = await seedUsers(t.db)
    await seedLab(t.db, ids)
    const states = await sql<{
      state: string
      n: number
    }>`select state, count(*)::int as n from data_set group by state order by state`.execute(t.db)
    expect(Object.fromEntries(states.rows.map((r) => [r.state, r.n]))).toEqual({
      approved: 7,
      draft: 3,
      returned: 1,
      submitted: 3,
      superseded: 1,
    })
    expect((await sql<{ n: number }>`select count(*)::int as n from binary_system`.execute(t.db)).rows[0].n).toBe(7)
    expect((await sql<{ n: number }>`select count(*)::int as n from approval`.execute(t.db)).rows[0].n).toBe(9)
    expect(
      (await sql<{ n: number }>`select count(*)::int as n from upload where kind = 'run'`.execute(t.db)).rows[0].n,
    ).toBe(11)
    // the recommended parameter set of methanol/water: run by one lead chemist, signed by the other (joint-scenario.ts)
    const joint = await sql<{ state: string; signer: string; runner: string }>`
      select j.state, s.display_name as signer, r.display_name as runner from joint_fit j
      join joint_fit_approval a on a.joint_fit_id = j.id join app_user s on s.id = a.signer_id
      join app_user r on r.id = j.run_by`.execute(t.db)
    expect(joint.rows).toEqual([
      { state: 'approved', signer: 'Dr. Tobias Lindqvist', runner: 'Dr. Amara Nwosu' },
      { state: 'approved', signer: 'Dr. Tobias Lindqvist', runner: 'Dr. Amara Nwosu' },
    ])
    // the static-cell (55 °C) and Hayden–O'Connell (60 kPa) series (lab-scenario-vapour.ts): analyst uploads, fits and
    // submits, the lead chemist (who changed no content) signs with the fit the series was generated from recommended
    const signed = await sql<{ title: string; state: string; model: string; signer: string; submitter: string }>`
      select d.title, d.state, f.model, s.display_name as signer, u.display_name as submitter from data_set d
      join fit f on f.id = d.recommended_fit_id join approval a on a.data_set_id = d.id
      join app_user s on s.id = a.signer_id
      join audit_log l on l.entity_id = d.id::text and l.action = 'submit' join app_user u on u.id = l.actor_id
      where d.title like 'Static cell at 55 °C%' or d.title like 'Vacuum recovery trial%' order by d.title`.execute(
      t.db,
    )
    expect(signed.rows).toEqual([
      {
        title: 'Static cell at 55 °C: acetone + methanol',
        state: 'approved',
        model: 'wilson',
        signer: 'Dr. Tobias Lindqvist',
        submitter: 'Mira Okonkwo',
      },
      {
        title: 'Vacuum recovery trial, associating vapour (Hayden–O’Connell): methanol + water at 60 kPa',
        state: 'approved',
        model: 'nrtl',
        signer: 'Dr. Tobias Lindqvist',
        submitter: 'Mira Okonkwo',
      },
    ])
    // the mixed joint fit of acetone/methanol (joint-mixed-scenario.ts): 1 atm isobaric + 55 °C isothermal, run by
    // the second lead chemist and signed by the first as the system's recommended set
    const mixed = await sql<{ id: string; state: string; activity: Record<string, number> }>`
      select j.id, j.state, j.activity from joint_fit j join binary_system b on b.id = j.system_id
      join component c on c.id = b.component1_id where c.name = 'acetone'`.execute(t.db)
    expect(mixed.rows.map((r) => r.state)).toEqual(['approved'])
    const members = await sql<{ layout: string; p: number | null; tk: number | null; n: number }>`
      select d.layout, d.nominal_pressure_pa::float8 as p, d.nominal_temperature_k::float8 as tk, m.point_count as n
      from joint_fit_member m join data_set d on d.id = m.data_set_id
      where m.joint_fit_id = ${mixed.rows[0].id} order by m.position`.execute(t.db)
    expect(members.rows.map((m) => [m.layout, m.p, m.tk])).toEqual([
      ['txy', 101325, null],
      ['pxy', null, 328.15],
    ])
    // generated from SVNA 7th ed. Table 12.5's Wilson energies (a12 = −161.88 cal/mol, a21 = 583.11 cal/mol) plus
    // noise: at 55 °C the fitted temperature-dependent energies come back near them (within 250 J/mol)
    const a = mixed.rows[0].activity
    const at = (k: 'a12' | 'a21') => a[k] + a[`${k}T`] * (328.15 - 298.15)
    expect(Math.abs(at('a12') - -161.88 * 4.184)).toBeLessThan(250)
    expect(Math.abs(at('a21') - 583.11 * 4.184)).toBeLessThan(250)
    // the FID runs carry a check standard prepared at x1 = 0.500 (gc-generator.ts): read back with the generated
    // calibration it lies within a few thousandths of 0.5 (the generated injections scatter by 0.6 % RSD); the TCD method has none
    const checks = await sql<{ method: string; label: string; known: number; measured: number }>`
      select m.name as method, r.label, r.known_x1 as known, r.measured_x1 as measured from check_standard_result r
      join gc_method m on m.id = r.gc_method_id order by r.label`.execute(t.db)
    expect(checks.rows.map((r) => [r.method, r.label])).toEqual([
      ['FID-A, wax capillary', 'HH-CHECK'],
      ['FID-A, wax capillary', 'KA-CHECK'],
      ['FID-A, wax capillary', 'KR-CHECK'],
    ])
    for (const r of checks.rows) {
      expect(r.known).toBe(0.5)
      expect(Math.abs(r.measured - 0.5)).toBeLessThan(0.01)
    }
    // the Hayden–O'Connell demo (lab-scenario-vapour.ts): methanol/water at 60 kPa generated from SVNA 7th ed.
    // Table 12.5's NRTL (b12 = −253.88, b21 = 845.21 cal/mol, α = 0.2994) with a HOC vapour plus noise; its NRTL fit,
    // under the same vapour, comes back near those energies (within 300 J/mol) and names the correlation it used
    const hoc = await sql<{ options: { vapor?: { correlation?: string } }; activity: Record<string, number> }>`
      select f.options, f.activity from fit f join data_set d on d.id = f.data_set_id
      where d.title like 'Vacuum recovery trial, associating vapour%' and f.model = 'nrtl'`.execute(t.db)
    expect(hoc.rows).toHaveLength(1)
    expect(hoc.rows[0].options.vapor?.correlation).toBe('hayden-oconnell')
    expect(Math.abs(hoc.rows[0].activity.b12 - -253.88 * 4.184)).toBeLessThan(300)
    expect(Math.abs(hoc.rows[0].activity.b21 - 845.21 * 4.184)).toBeLessThan(300)
    // the approved acetone/methanol series carries a UNIQUAC fit (lab-scenario.ts) with the demo components' r and q,
    // sums of UNIFAC group R, Q (Hansen et al., Ind. Eng. Chem. Res. 30 (1991) 2352; from memory): acetone CH3 + CH3CO,
    // methanol CH3OH. Its points came from SVNA 7th ed. Table 12.5's Wilson model: at 1 atm and x1 = 0.5 the UNIQUAC
    // bubble point lies within 0.2 K of that model's
    const uq = await sql<{ activity: Record<string, number> }>`
      select f.activity from fit f join data_set d on d.id = f.data_set_id
      where d.title like 'Kestrel acetone recycle%' and d.state = 'approved' and f.model = 'uniquac'`.execute(t.db)
    expect(uq.rows).toHaveLength(1)
    const u = uq.rows[0].activity
    expect([u.r1, u.q1, u.r2, u.q2]).toEqual([
      expect.closeTo(0.9011 + 1.6724, 12),
      expect.closeTo(0.848 + 1.488, 12),
      1.4311,
      1.432,
    ])
    const vp = [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as [VaporPressureModel, VaporPressureModel]
    const at05 = (activity: ActivityModel) =>
      bubbleTemperature({ vaporPressure: vp, activity }, { P: 101325, x1: 0.5 }).T
    const wilson = DEMO_SYSTEMS.find((x) => x.key === 'acetone-methanol')!.activity
    expect(Math.abs(at05(u as unknown as ActivityModel) - at05(wilson))).toBeLessThan(0.2)
    // the dimerising-vapour demo (acid-scenario.ts): acetic acid (η = 4.5) + water at 1 atm under HOC, points from
    // INVENTED NRTL energies (b12 = 1800, b21 = 700 J/mol, α = 0.3) plus noise; a draft whose NRTL fit ran the
    // chemical theory of dimerisation, says so, and comes back near the invented energies (within 250 J/mol)
    const acid = await sql<{
      state: string
      options: { vapor?: { correlation?: string; components?: { eta?: number }[] } }
      activity: Record<string, number>
      statistics: { warnings: string[] }
    }>`
      select d.state, f.options, f.activity, f.statistics from fit f join data_set d on d.id = f.data_set_id
      where d.title like '%acetic acid + water at 1 atm' and f.model = 'nrtl'`.execute(t.db)
    expect(acid.rows).toHaveLength(1)
    expect(acid.rows[0].state).toBe('draft')
    expect(acid.rows[0].options.vapor?.correlation).toBe('hayden-oconnell')
    expect(acid.rows[0].options.vapor?.components?.map((c) => c.eta)).toEqual([4.5, 1.7])
    expect(acid.rows[0].statistics.warnings.filter((w) => w.includes('chemical theory of dimerisation'))).toHaveLength(
      1,
    )
    expect(Math.abs(acid.rows[0].activity.b12 - 1800)).toBeLessThan(250)
    expect(Math.abs(acid.rows[0].activity.b21 - 700)).toBeLessThan(250)
    const before = await labCounts(t)
    const catalogue = async () =>
      (
        await sql<{ c: number; s: number }>`
          select (select count(*)::int from component) as c, (select count(*)::int from binary_system) as s`.execute(
          t.db,
        )
      ).rows[0]
    const listed = await catalogue()
    await seedLab(t.db, await seedUsers(t.db))
    expect(await labCounts(t)).toEqual(before)
    expect(await catalogue()).toEqual(listed)
  })
})
