/**
 * The engineer's curve of a published data set is served from a per-process cache with a strong ETag. These checks
 * fail when the cache answers with a wrong or stale curve, when a draft is cached, or when a 304 skips the sign-in
 * and access checks. Data: the documented example run file (invented data, SVNA Table 12.5 Wilson parameters).
 */
import { createHash } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { cachedCurveCount } from '../src/services/catalogue.service.js'
import { agent, createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { ACETONE_METHANOL, buildLab, draftWithPoints, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let approved: { id: string; wilson: string; nrtl: string }
let underReview: string

/** Fit Wilson and NRTL, recommend Wilson; with `approve`, approve it. */
async function publish(id: string, approve = true) {
  const fits = await lab.analyst.post(`/api/data-sets/${id}/fits`).send({ models: ['wilson', 'nrtl'] })
  expect(fits.status, JSON.stringify(fits.body)).toBe(201)
  const [wilson, nrtl] = ['wilson', 'nrtl'].map((m) => fits.body.fits.find((f: { model: string }) => f.model === m).id)
  await lab.analyst.post(`/api/data-sets/${id}/submit`).send({ rowVersion: fits.body.rowVersion }).expect(200)
  const rec = await lab.lead.post(`/api/data-sets/${id}/recommended-fit`).send({ fitId: wilson }).expect(200)
  if (approve)
    await lab.lead
      .post(`/api/data-sets/${id}/approve`)
      .send({ password: PASSWORD, reason: 'Fit and points checked.', rowVersion: rec.body.rowVersion })
      .expect(200)
  return { id, wilson, nrtl }
}

const curveUrl = (id: string, query = 'pressure=101.325&unit=kPa') => `/api/data-sets/${id}/curve?${query}`
const sha256Tag = (body: string) => `"${createHash('sha256').update(body).digest('base64url')}"`

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  approved = await publish((await draftWithPoints(t, lab, 'Published')).id)
  underReview = (await publish((await draftWithPoints(t, lab, 'Under review')).id, false)).id
})
afterAll(() => t.close())

describe('curves of published data sets', () => {
  it('answers the same bytes from the cache as computed, with a strong ETag of those bytes', async () => {
    const first = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    const second = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    expect(first.headers['cache-control']).toBe('private, no-cache')
    expect(first.headers['content-type']).toMatch(/^application\/json/)
    expect(first.headers.etag).toBe(sha256Tag(first.text))
    expect(second.text).toBe(first.text)
    expect(second.headers.etag).toBe(first.headers.etag)
    expect(first.body).toMatchObject({ dataSetId: approved.id, fitId: approved.wilson, model: 'wilson' })
    expect(first.body.P).toBeCloseTo(101325, 6)
  })

  it('answers 304 without a body to a matching If-None-Match, 200 to another tag', async () => {
    const first = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    const same = await lab.engineer.get(curveUrl(approved.id)).set('If-None-Match', first.headers.etag)
    expect(same.status).toBe(304)
    expect(same.text ?? '').toBe('')
    expect(same.headers.etag).toBe(first.headers.etag)
    const other = await lab.engineer.get(curveUrl(approved.id)).set('If-None-Match', '"something-else"')
    expect(other.status).toBe(200)
    expect(other.text).toBe(first.text)
  })

  it('keys the cache by pressure, point count and fit: each gives its own body and ETag', async () => {
    const atm = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    const half = await lab.engineer.get(curveUrl(approved.id, 'pressure=50&unit=kPa')).expect(200)
    const halfAgain = await lab.engineer.get(curveUrl(approved.id, 'pressure=50&unit=kPa')).expect(200)
    expect(half.body.P).toBeCloseTo(50000, 6)
    expect(half.headers.etag).not.toBe(atm.headers.etag)
    expect(halfAgain.text).toBe(half.text)
    // lower pressure, lower boiling temperatures: the pure heavy component's end of the T–x–y curve
    const tEnd = (b: { diagram: { x1: number[]; T: number[] } }) => b.diagram.T[b.diagram.x1.indexOf(0)]
    expect(tEnd(half.body)).toBeLessThan(tEnd(atm.body) - 10)
    // a pressure asked for with the old pressure's tag is not "not modified"
    const stale = await lab.engineer
      .get(curveUrl(approved.id, 'pressure=50&unit=kPa'))
      .set('If-None-Match', atm.headers.etag)
    expect(stale.status).toBe(200)
    expect(stale.body.P).toBeCloseTo(50000, 6)

    const coarse = await lab.engineer.get(curveUrl(approved.id, 'pressure=101.325&unit=kPa&points=11')).expect(200)
    expect(coarse.body.diagram.x1).toHaveLength(11)
    expect(atm.body.diagram.x1).toHaveLength(101)
    expect(coarse.headers.etag).not.toBe(atm.headers.etag)

    const nrtl = await lab.engineer
      .get(curveUrl(approved.id, `pressure=101.325&unit=kPa&fitId=${approved.nrtl}`))
      .expect(200)
    expect(nrtl.body).toMatchObject({ fitId: approved.nrtl, model: 'nrtl' })
    expect(nrtl.headers.etag).not.toBe(atm.headers.etag)
    const again = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    expect(again.body).toMatchObject({ fitId: approved.wilson, model: 'wilson' })
  })

  it('runs the sign-in and access checks before a 304', async () => {
    const ok = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    const tag = ok.headers.etag
    const anonymous = await agent(t.app).get(curveUrl(approved.id)).set('If-None-Match', tag)
    expect(anonymous.status).toBe(401)
    expect(anonymous.body.error.code).toBe('unauthorized')
    // an engineer may not see a version under review: 404, even with the tag the analyst's answer carried
    const seen = await lab.analyst.get(curveUrl(underReview)).expect(200)
    const hidden = await lab.engineer.get(curveUrl(underReview)).set('If-None-Match', seen.headers.etag ?? tag)
    expect(hidden.status).toBe(404)
    expect(hidden.body.error.message).toBe('There is no such data set.')
    // a deactivated engineer's session ends: 401, not 304, though the tag is current and the curve is cached
    await lab.admin.post(`/api/admin/users/${lab.ids.engineer}/deactivate`).expect(200)
    const gone = await lab.engineer.get(curveUrl(approved.id)).set('If-None-Match', tag)
    expect(gone.status).toBe(401)
    await lab.admin.post(`/api/admin/users/${lab.ids.engineer}/activate`).expect(200)
    lab.engineer = agent(t.app)
    await lab.engineer.post('/api/auth/sign-in').send({ email: 'engineer@lab.test', password: PASSWORD }).expect(200)
    expect((await lab.engineer.get(curveUrl(approved.id)).set('If-None-Match', tag)).status).toBe(304)
  })
})

describe('curves that are not final', () => {
  it('computes a version under review every time, marks it no-store and keeps it out of the cache', async () => {
    const before = cachedCurveCount()
    const r = await lab.analyst.get(curveUrl(underReview, 'pressure=80&unit=kPa')).expect(200)
    expect(r.headers['cache-control']).toBe('no-store')
    // no strong validator of ours (Express may add its own weak one)
    expect(r.headers.etag ?? '').not.toMatch(/^"/)
    expect(cachedCurveCount()).toBe(before)
    await lab.analyst.get(curveUrl(underReview, 'pressure=80&unit=kPa')).expect(200)
    expect(cachedCurveCount()).toBe(before)
    const published = await lab.engineer.get(curveUrl(approved.id, 'pressure=80&unit=kPa')).expect(200)
    expect(published.headers.etag).toMatch(/^"/)
    expect(cachedCurveCount()).toBe(before + 1)
  })
})

describe('when what a published curve depends on changes', () => {
  it('keeps a superseded version’s own curve and gives the new version its own', async () => {
    const v1 = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    const rev = await lab.analyst.post(`/api/data-sets/${approved.id}/revise`).expect(201)
    const v2 = await publish(rev.body.id)
    expect((await lab.reviewer.get(`/api/data-sets/${approved.id}`).expect(200)).body.state).toBe('superseded')
    const old = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    expect(old.text).toBe(v1.text) // its fit is frozen: the same curve, the same tag
    expect((await lab.engineer.get(curveUrl(approved.id)).set('If-None-Match', v1.headers.etag)).status).toBe(304)
    const next = await lab.engineer.get(curveUrl(v2.id)).expect(200)
    expect(next.body).toMatchObject({ dataSetId: v2.id, fitId: v2.wilson })
    expect(next.headers.etag).not.toBe(v1.headers.etag)
  })

  it('recomputes after a new preferred vapour-pressure set: the old tag is no longer current', async () => {
    const before = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    const system = await lab.engineer.get(`/api/systems/${lab.systemId}`).expect(200)
    const light = demoVaporPressure(ACETONE_METHANOL.light)
    if (light.kind !== 'antoine') throw new Error('expected an Antoine set')
    // ln(P/kPa) raised by 0.05: every vapour pressure of the light component about 5 % higher
    await lab.lead
      .post(`/api/components/${system.body.component1.id}/vapor-pressure-sets`)
      .send({ model: { ...light, A: light.A + 0.05 }, source: 'Test: Antoine A raised by 0.05', preferred: true })
      .expect(201)
    const after = await lab.engineer.get(curveUrl(approved.id)).set('If-None-Match', before.headers.etag)
    expect(after.status).toBe(200)
    expect(after.headers.etag).not.toBe(before.headers.etag)
    expect(after.headers.etag).toBe(sha256Tag(after.text))
    // a more volatile light component boils the mixtures lower: the bubble temperature at x1 = 0.5 drops
    const mid = (b: { diagram: { x1: number[]; T: number[] } }) =>
      b.diagram.T[b.diagram.x1.findIndex((x) => Math.abs(x - 0.5) < 1e-9)]
    expect(mid(after.body)).toBeLessThan(mid(before.body) - 0.3)
  })

  it('shows a renamed component’s new name', async () => {
    const system = await lab.engineer.get(`/api/systems/${lab.systemId}`).expect(200)
    const c2 = system.body.component2
    const before = await lab.engineer.get(curveUrl(approved.id)).expect(200)
    const comp = await lab.admin.get(`/api/components/${c2.id}`).expect(200)
    await lab.admin
      .patch(`/api/components/${c2.id}`)
      .send({ rowVersion: comp.body.rowVersion, name: 'methanol <b>renamed</b>' })
      .expect(200)
    const after = await lab.engineer.get(curveUrl(approved.id)).set('If-None-Match', before.headers.etag)
    expect(after.status).toBe(200)
    expect(after.body.components).toEqual([before.body.components[0], 'methanol <b>renamed</b>'])
  })
})
