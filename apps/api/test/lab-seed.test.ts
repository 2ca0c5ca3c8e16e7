import { sql } from 'kysely'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
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
      approved: 5,
      draft: 3,
      returned: 1,
      submitted: 3,
      superseded: 1,
    })
    expect((await sql<{ n: number }>`select count(*)::int as n from binary_system`.execute(t.db)).rows[0].n).toBe(6)
    expect((await sql<{ n: number }>`select count(*)::int as n from approval`.execute(t.db)).rows[0].n).toBe(7)
    expect(
      (await sql<{ n: number }>`select count(*)::int as n from upload where kind = 'run'`.execute(t.db)).rows[0].n,
    ).toBe(11)
    // the recommended parameter set of methanol/water: run by one lead chemist, signed by the other (joint-scenario.ts)
    const joint = await sql<{ state: string; signer: string; runner: string }>`
      select j.state, s.display_name as signer, r.display_name as runner from joint_fit j
      join joint_fit_approval a on a.joint_fit_id = j.id join app_user s on s.id = a.signer_id
      join app_user r on r.id = j.run_by`.execute(t.db)
    expect(joint.rows).toEqual([{ state: 'approved', signer: 'Dr. Tobias Lindqvist', runner: 'Dr. Amara Nwosu' }])
    const before = await labCounts(t)
    await seedLab(t.db, await seedUsers(t.db))
    expect(await labCounts(t)).toEqual(before)
  })
})
