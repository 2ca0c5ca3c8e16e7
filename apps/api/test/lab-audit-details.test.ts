/**
 * The audit trail says what was done: a fit names its model (NRTL with its α) and the number of points,
 * an exclusion names the sample and the reason. Runs on the demo scenario's open methanol/water draft (INVENTED points).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { seedLab } from '../../../db/seeds/lab.js'
import { DEMO_PASSWORD, seedUsers } from '../../../db/seeds/users.js'
import { createTestContext, resetDatabase, signedInAgent, type TestContext } from './helpers.js'

let t: TestContext
let analyst: Awaited<ReturnType<typeof signedInAgent>>
let id: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  await seedLab(t.db, await seedUsers(t.db))
  analyst = await signedInAgent(t.app, 'analyst@demo.ebullio.test', DEMO_PASSWORD)
  id = (
    await t.db
      .selectFrom('data_set')
      .select('id')
      .where('title', '=', 'Column feed: methanol/water at 1 atm')
      .executeTakeFirstOrThrow()
  ).id
})
afterAll(() => t.close())

type Line = { action: string; entity: string; after: Record<string, unknown> | null }
const trail = async (): Promise<Line[]> => (await analyst.get(`/api/data-sets/${id}/audit`).expect(200)).body.items

describe('audit details', () => {
  it('an exclusion names the sample and the reason', async () => {
    const ex = (await trail()).find((a) => a.action === 'exclude point')!
    expect(ex.after).toMatchObject({
      excluded: true,
      reason: 'Septum leak suspected on this injection series.',
      sample: expect.stringMatching(/^MW-/),
    })
  })

  it('a fit names its model, NRTL its α held or fitted, and the number of points used', async () => {
    await analyst
      .post(`/api/data-sets/${id}/fits`)
      .send({ models: ['wilson', 'nrtl'], alpha: 0.3 })
      .expect(201)
    await analyst
      .post(`/api/data-sets/${id}/fits`)
      .send({ models: ['nrtl'], alpha: 0.3, fitAlpha: true })
      .expect(201)
    const fits = (await trail()).filter((a) => a.action === 'run fit').map((a) => a.after!)
    // 11 samples in the draft, one excluded by the seed
    expect(fits.map((f) => [f.model, f.alpha, f.fitAlpha, f.points])).toEqual([
      ['wilson', undefined, undefined, 10],
      ['nrtl', 0.3, false, 10],
      ['nrtl', 0.3, true, 10],
    ])
  })

  it('the area test answers with the boiling range behind J (Tmin, Tmax in K, and where the span came from)', async () => {
    const r = await analyst.post(`/api/data-sets/${id}/consistency`).send({ model: 'wilson' }).expect(201)
    const area = r.body.items.find((i: { test: string }) => i.test === 'herington-area').result
    // methanol/water at 1 atm boils between about 337.7 K and 373.1 K (SVNA 7th ed. Table B.2 normal boiling points, from memory)
    expect(area.Tmin).toBeGreaterThan(336)
    expect(area.Tmin).toBeLessThan(339)
    expect(area.Tmax).toBeGreaterThan(372)
    expect(area.Tmax).toBeLessThan(374.5)
    expect(area.temperatureSpan).toMatch(/^measured points and both pure boiling points at the mean pressure/)
  })
})
