/**
 * Fit options over the API on the demo scenario's 1-propanol/water series (INVENTED points, db/seeds,
 * generated from SVNA 7th ed. Table 12.5's NRTL parameters with α = 0.5081 plus simulated GC noise).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { seedLab } from '../../../db/seeds/lab.js'
import { DEMO_PASSWORD, seedUsers } from '../../../db/seeds/users.js'
import { createTestContext, resetDatabase, signedInAgent, type TestContext } from './helpers.js'

let t: TestContext
let lead: Awaited<ReturnType<typeof signedInAgent>>
let id: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  await seedLab(t.db, await seedUsers(t.db))
  // The series is submitted, so only a lead chemist may add fits.
  lead = await signedInAgent(t.app, 'lead@demo.ebullio.test', DEMO_PASSWORD)
  id = (
    await t.db
      .selectFrom('data_set')
      .select('id')
      .where('title', '=', 'SR-24 mother liquor: 1-propanol/water at 1 atm')
      .executeTakeFirstOrThrow()
  ).id
})
afterAll(() => t.close())

type FitOut = {
  model: string
  options: Record<string, unknown>
  parameters: { name: string; value: number }[]
  statistics: { objective: number; rmsT: number; rmsY: number; converged: boolean }
}
async function fit(body: Record<string, unknown>): Promise<FitOut[]> {
  const r = await lead.post(`/api/data-sets/${id}/fits`).send(body)
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return r.body.fits
}

describe('NRTL α and Wilson volumes', () => {
  it("stores the default α = 0.3 (common practice, no source) with the fit, and Wilson the components' liquid molar volumes", async () => {
    const [nrtl, wilson] = await fit({ models: ['nrtl', 'wilson'] })
    expect(nrtl.options).toMatchObject({ model: 'nrtl', alpha: 0.3, fitAlpha: false })
    expect(nrtl.parameters.map((p) => p.name)).toEqual(['b12', 'b21'])
    // SVNA 7th ed. Table 12.5: V(1-propanol) = 75.14, V(water) = 18.07 cm³/mol (the demo's component records)
    expect(wilson.options).toMatchObject({ model: 'wilson', V1: 75.14, V2: 18.07 })
  })

  it('fits the series at least as well as Wilson with the α it was generated with (0.5081) or with α fitted', async () => {
    const [wilson] = await fit({ models: ['wilson'] })
    const [given] = await fit({ models: ['nrtl'], alpha: 0.5081 })
    const [fitted] = await fit({ models: ['nrtl'], fitAlpha: true, alpha: 0.3 })
    for (const f of [wilson, given, fitted]) expect(f.statistics.converged).toBe(true)
    expect(given.options).toMatchObject({ alpha: 0.5081, fitAlpha: false })
    expect(given.statistics.objective).toBeLessThanOrEqual(wilson.statistics.objective)
    expect(fitted.parameters.map((p) => p.name)).toEqual(['b12', 'b21', 'alpha'])
    expect(fitted.statistics.objective).toBeLessThanOrEqual(wilson.statistics.objective)
    // A fitted α can only do as well as or better than the α it could have kept (same data, one more parameter).
    expect(fitted.statistics.objective).toBeLessThanOrEqual(given.statistics.objective * 1.0001)
    const alpha = fitted.parameters.find((p) => p.name === 'alpha')!.value
    expect(alpha).toBeGreaterThan(0.2)
    expect(alpha).toBeLessThanOrEqual(1)
  })

  it('refuses an α outside (0, 1] with the shared message', async () => {
    const r = await lead.post(`/api/data-sets/${id}/fits`).send({ models: ['nrtl'], alpha: 1.5 })
    expect(r.status).toBe(422)
    expect(r.body.error.details).toEqual([expect.objectContaining({ message: 'NRTL α must be above 0 and at most 1' })])
  })
})
