/**
 * A fitted NRTL α over the API stays within 0.1–0.7 (common practice, no source); at a bound it comes
 * back held (atBound, standardError null, a warning), and the next-composition list of one stored fit
 * is the same on every call. Runs on the demo scenario's submitted acetone/methanol repeat series (INVENTED points), as a lead chemist.
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
  lead = await signedInAgent(t.app, 'lead@demo.ebullio.test', DEMO_PASSWORD)
  id = (
    await t.db
      .selectFrom('data_set')
      .select('id')
      .where('title', '=', 'Kestrel recycle repeat: acetone/methanol at 1 atm')
      .executeTakeFirstOrThrow()
  ).id
})
afterAll(() => t.close())

type Param = { name: string; value: number; standardError: number | null; atBound?: boolean }

describe('fitted NRTL α over the API', () => {
  it('keeps α within 0.1–0.7 and passes a held α through with its warning; suggestions are stable', async () => {
    const r = await lead.post(`/api/data-sets/${id}/fits`).send({ models: ['nrtl'], alpha: 0.3, fitAlpha: true })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const [fit] = r.body.fits as {
      id: string
      parameters: Param[]
      statistics: { warnings: string[]; covariance: number[][] }
    }[]
    const alpha = fit.parameters.find((p) => p.name === 'alpha')!
    expect(alpha.value).toBeGreaterThanOrEqual(0.1)
    expect(alpha.value).toBeLessThanOrEqual(0.7)
    if (alpha.atBound) {
      expect(alpha.standardError).toBeNull()
      expect(fit.statistics.warnings).toContain(
        `α reached its bound ${alpha.value}: the data do not determine α; hold it at a fixed value.`,
      )
      expect(fit.statistics.covariance.length).toBe(2)
    }
    const url = `/api/data-sets/${id}/fits/${fit.id}/next-compositions`
    const a = await lead.get(url).query({ count: 5 }).expect(200)
    const b = await lead.get(url).query({ count: 5 }).expect(200)
    expect(b.body.items).toEqual(a.body.items)
    expect(a.body.criterion).toBe('sigma-y')
  })
})
