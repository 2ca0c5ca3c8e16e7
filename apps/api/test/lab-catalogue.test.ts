/** The engineers' catalogue pages in SQL, over the demo scenario (invented data, db/seeds), and its fits carry their uncertainty. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { seedLab } from '../../../db/seeds/lab.js'
import { DEMO_PASSWORD, seedUsers } from '../../../db/seeds/users.js'
import { createTestContext, resetDatabase, signedInAgent, type TestContext } from './helpers.js'

let t: TestContext
let engineer: Awaited<ReturnType<typeof signedInAgent>>
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  await seedLab(t.db, await seedUsers(t.db))
  engineer = await signedInAgent(t.app, 'engineer@demo.ebullio.test', DEMO_PASSWORD)
})
afterAll(() => t.close())

describe('catalogue', () => {
  it('lists only systems with approved or superseded versions, one page at a time', async () => {
    // demo: acetone/methanol (1 atm and 55 °C, with a recommended parameter set over both), methanol/water (1 atm and
    // 40 kPa, with a recommended parameter set; 60 kPa under a Hayden–O'Connell vapour) and water/1-butanol approved; n-hexane/n-heptane v2 approved superseding v1; the other two systems unapproved
    const all = await engineer.get('/api/catalogue').expect(200)
    expect(all.body.total).toBe(4)
    expect(all.body.items.map((i: { system: { name: string } }) => i.system.name)).toEqual([
      'acetone / methanol',
      'methanol / water',
      'n-hexane / n-heptane',
      'water / 1-butanol',
    ])
    expect(
      all.body.items.map((i: { recommendedSet: { label: string } | null }) => i.recommendedSet?.label ?? null),
    ).toEqual(['Wilson (joint, 2 data sets)', 'NRTL (joint, 2 data sets)', null, null])
    // two v1 lineages of acetone/methanol: the newest signed first (the version the engineer's page opens at)
    expect(all.body.items[0].approved.map((v: { title: string }) => v.title)).toEqual([
      'Static cell at 55 °C: acetone + methanol',
      'Kestrel acetone recycle: acetone/methanol at 1 atm',
    ])
    const p1 = await engineer.get('/api/catalogue').query({ pageSize: 1 }).expect(200)
    const p2 = await engineer.get('/api/catalogue').query({ pageSize: 1, page: 2 }).expect(200)
    expect([p1.body.total, p2.body.total]).toEqual([4, 4])
    expect([...p1.body.items, ...p2.body.items].map((i: { system: { name: string } }) => i.system.name)).toEqual([
      'acetone / methanol',
      'methanol / water',
    ])
    const hex = await engineer.get('/api/catalogue').query({ q: 'heptane' }).expect(200)
    expect(hex.body.total).toBe(1)
    expect(hex.body.items[0].approved.map((v: { version: number }) => v.version)).toEqual([2])
    expect(hex.body.items[0].superseded.map((v: { version: number }) => v.version)).toEqual([1])
    expect((await engineer.get('/api/catalogue').query({ q: 'propanol' })).body).toMatchObject({ items: [], total: 0 })
  })

  it('gives an engineer the band of an approved recommended fit', async () => {
    const cat = await engineer.get('/api/catalogue').query({ q: 'methanol' }).expect(200)
    const v = cat.body.items[0].approved[0]
    const band = await engineer
      .get(`/api/data-sets/${v.dataSetId}/fits/${v.recommendedFit.id}/band`)
      .query({ pressure: 1, unit: 'atm', points: 5 })
    expect(band.status, JSON.stringify(band.body)).toBe(200)
    expect(band.body.P).toBeCloseTo(101325, 6)
    expect(band.body.sigmaT.every((s: number) => Number.isFinite(s) && s >= 0)).toBe(true)
  })
})
