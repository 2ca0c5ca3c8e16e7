/** Fits, consistency, comments, lists and exports on the documented example data (invented, SVNA Table 12.5 Wilson). */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, draftWithPoints, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let ds: { id: string; rowVersion: number }
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  ds = await draftWithPoints(t, lab, 'Fits and friends')
})
afterAll(() => t.close())

describe('fits and consistency', () => {
  it('fits every model, stores parameters with standard errors and residuals per point', async () => {
    const r = await lab.analyst
      .post(`/api/data-sets/${ds.id}/fits`)
      .send({ models: ['margules', 'van-laar', 'wilson', 'nrtl'] })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    ds.rowVersion = r.body.rowVersion
    for (const f of r.body.fits) {
      expect(f.statistics.converged).toBe(true)
      expect(f.residuals).toHaveLength(12)
      for (const p of f.parameters) expect(p.standardError).toBeGreaterThan(0)
    }
    const list = await lab.engineer.get(`/api/data-sets/${ds.id}/fits`)
    expect(list.status).toBe(404)
  })

  it('runs the area and point tests and attaches them to the version', async () => {
    const r = await lab.analyst.post(`/api/data-sets/${ds.id}/consistency`).send({ model: 'wilson' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    ds.rowVersion = r.body.rowVersion
    const [area, point] = r.body.items
    expect(area.test).toBe('herington-area')
    expect(area.result.J).toBeGreaterThan(0)
    // generated from a thermodynamically consistent model with ~0.6 % GC scatter: the point test
    // (mean |Δy| < 0.01, Van Ness–Byer–Gibbs, AIChE J. 19 (1973) 238) should pass
    expect(point.test).toBe('point')
    expect(point.result.meanAbsDeltaY).toBeLessThan(0.01)
    expect(point.passed).toBe(true)
  })

  it('refuses the recommended-fit choice for a fit of another data set', async () => {
    const r = await lab.lead
      .post(`/api/data-sets/${ds.id}/recommended-fit`)
      .send({ fitId: '00000000-0000-4000-8000-000000000000' })
    expect(r.status).toBe(404)
    expect(r.body.error.message).toBe('There is no such fit in this data set.')
  })
})

describe('comments', () => {
  it('threads replies under the root, resolves and reopens, and respects mail preferences', async () => {
    const d = await lab.reviewer.get(`/api/data-sets/${ds.id}`).expect(200)
    const root = await lab.reviewer
      .post(`/api/data-sets/${ds.id}/comments`)
      .send({ body: 'Odd point', pointId: d.body.points[1].id })
      .expect(201)
    const r1 = await lab.analyst
      .post(`/api/data-sets/${ds.id}/comments`)
      .send({ body: 'Checking', parentId: root.body.id })
      .expect(201)
    const r2 = await lab.lead
      .post(`/api/data-sets/${ds.id}/comments`)
      .send({ body: 'Reply to the reply', parentId: r1.body.id })
      .expect(201)
    expect(r2.body).toEqual({ id: r2.body.id, parentId: root.body.id, pointId: d.body.points[1].id })
    const resolveReply = await lab.reviewer.post(`/api/data-sets/${ds.id}/comments/${r1.body.id}/resolve`)
    expect(resolveReply.body.error.message).toBe('Resolve the thread from its first comment, not from a reply.')
    await lab.lead.post(`/api/data-sets/${ds.id}/comments/${root.body.id}/resolve`).expect(200)
    expect((await lab.reviewer.get('/api/comments/mine').expect(200)).body.items).toEqual([])
    await lab.reviewer.post(`/api/data-sets/${ds.id}/comments/${root.body.id}/reopen`).expect(200)
    expect((await lab.reviewer.get('/api/comments/mine').expect(200)).body.items).toHaveLength(1)

    // the reply to the reply told both the thread's author and the replied-to analyst
    const told = (await t.mail()).map((m) => `${m.envelope_to} ${m.subject}`)
    expect(told).toContain('reviewer@lab.test Ebullio: Tobias Lead replied to your comment on "Fits and friends"')
    expect(told).toContain('analyst@lab.test Ebullio: Tobias Lead replied to your comment on "Fits and friends"')
    await lab.reviewer.patch('/api/auth/me/preferences').send({ notifyMail: false }).expect(200)
    const before = (await t.mail()).length
    await lab.analyst
      .post(`/api/data-sets/${ds.id}/comments`)
      .send({ body: 'Muted reply', parentId: root.body.id })
      .expect(201)
    expect((await t.mail()).length).toBe(before)
  })
})

describe('lists and exports', () => {
  it('paginates, sorts and filters data sets on the server', async () => {
    await draftWithPoints(t, lab, 'Second set')
    const page = await lab.analyst.get('/api/data-sets?pageSize=1&page=2&sort=title&order=asc').expect(200)
    expect(page.body).toMatchObject({ total: 2, page: 2, pageSize: 1 })
    expect(page.body.items[0]).toMatchObject({
      title: 'Second set',
      pointCount: 12,
      systemName: 'acetone / methanol',
      authorName: 'Mira Analyst',
    })
    const filtered = await lab.analyst.get(`/api/data-sets?state=submitted&systemId=${lab.systemId}`).expect(200)
    expect(filtered.body.total).toBe(0)
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString()
    expect((await lab.analyst.get(`/api/data-sets?createdAfter=${tomorrow}`).expect(200)).body.total).toBe(0)
    expect(
      (await lab.analyst.get(`/api/data-sets?createdBefore=${tomorrow}&createdBy=${lab.ids.analyst}`).expect(200)).body
        .total,
    ).toBe(2)
    const bad = await lab.analyst.get('/api/data-sets?state=finished')
    expect(bad.status).toBe(422)
  })

  it('exports the points in the documented CSV layout', async () => {
    const r = await lab.analyst.get(`/api/data-sets/${ds.id}/export/points.csv`).expect(200)
    expect(r.headers['content-type']).toBe('text/csv; charset=utf-8')
    const lines = r.text.trim().split('\n')
    expect(lines[0]).toBe(
      'seq,sample,t_k,p_kpa,x1,u_x1,y1,u_y1,excluded,exclusion_reason,liquid_layers,x1_layer_i,u_x1_layer_i,x1_layer_ii,u_x1_layer_ii,u_p_kpa',
    )
    expect(lines).toHaveLength(13)
    expect(lines[1]).toMatch(/^1,AM-01,3\d\d\.\d{3},101\.\d{4},0\.\d{5},[\d.e+-]+,0\.\d{5},[\d.e+-]+,false,,1,,,,,$/)
  })

  it('computes the curve with a fit chosen by id and rejects a bad pressure', async () => {
    const fits = await lab.analyst.get(`/api/data-sets/${ds.id}/fits`).expect(200)
    const nrtl = fits.body.items.find((f: { model: string }) => f.model === 'nrtl')
    const r = await lab.analyst
      .get(`/api/data-sets/${ds.id}/curve?pressure=760&unit=mmHg&points=11&fitId=${nrtl.id}`)
      .expect(200)
    expect(r.body.diagram.x1).toHaveLength(11)
    expect(r.body.caution).toMatch(/licensed engineer/)
    const noFit = await lab.analyst.get(`/api/data-sets/${ds.id}/curve?pressure=1`)
    expect(noFit.body.error.message).toBe('This data set has no recommended fit yet; choose a fit.')
    const bad = await lab.analyst.get(`/api/data-sets/${ds.id}/curve?pressure=-3`)
    expect(bad.body.error.details).toEqual([{ path: 'pressure', message: 'Pressure must be positive' }])
  })
})

describe('recommended fit', () => {
  it('refuses a fit that did not converge', async () => {
    const r = await lab.analyst.post(`/api/data-sets/${ds.id}/fits`).send({ models: ['margules'] })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const fitId = r.body.fits[0].id
    // Mark the stored result as unconverged, as the solver reports when it stops short of an optimum.
    const row = await t.db.selectFrom('fit').select('statistics').where('id', '=', fitId).executeTakeFirstOrThrow()
    const stats = { ...(row.statistics as Record<string, unknown>), converged: false }
    await t.db
      .updateTable('fit')
      .set({ statistics: JSON.stringify(stats) } as never)
      .where('id', '=', fitId)
      .execute()
    const refused = await lab.lead.post(`/api/data-sets/${ds.id}/recommended-fit`).send({ fitId })
    expect(refused.status).toBe(409)
    expect(refused.body.error.message).toBe(
      'This fit did not converge, so it cannot be the recommended fit. Run the model again or choose another fit.',
    )
  })
})
