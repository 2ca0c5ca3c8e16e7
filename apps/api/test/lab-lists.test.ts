/** Server-side paging, sorting and filtering of the calibration, GC-method and my-threads lists. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, csv, example, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let tcdId: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  // A second calibration of the same method retires the first; a TCD method gets one of its own.
  const calibrate = async (gcMethodId: string, model: string) => {
    const r = await csv(
      lab.analyst.post('/api/calibrations'),
      example('calibration-acetone-methanol.csv'),
      'calibration.csv',
    )
      .field('gcMethodId', gcMethodId)
      .field('systemId', lab.systemId)
      .field('model', model)
      .field('acceptWarnings', 'true')
      .field('replaceActive', 'true')
    if (r.status !== 201) throw new Error(JSON.stringify(r.body))
  }
  await calibrate(lab.gcMethodId, 'linear')
  const tcd = await lab.analyst
    .post('/api/gc-methods')
    .send({ name: 'TCD-packed', detector: 'TCD', columnDescription: 'packed, 2 m', conditions: null })
    .expect(201)
  tcdId = tcd.body.id
  await calibrate(tcdId, 'response-factor')
})
afterAll(() => t.close())

describe('calibrations list', () => {
  it('pages with a total and names the GC method and system', async () => {
    const first = await lab.reviewer.get('/api/calibrations').query({ pageSize: 2 })
    expect(first.status, JSON.stringify(first.body)).toBe(200)
    expect(first.body).toMatchObject({ total: 3, page: 1, pageSize: 2 })
    expect(first.body.items).toHaveLength(2)
    expect(first.body.items[0].systemName).toBe('acetone / methanol')
    const second = await lab.reviewer.get('/api/calibrations').query({ pageSize: 2, page: 2 })
    expect(second.body.items).toHaveLength(1)
    const ids = [...first.body.items, ...second.body.items].map((c: { id: string }) => c.id)
    expect(new Set(ids).size).toBe(3)
  })

  it('defaults to 100 a page, newest first, so an unpaged caller still gets every item', async () => {
    const r = await lab.admin.get('/api/calibrations')
    expect(r.body.pageSize).toBe(100)
    const times = r.body.items.map((c: { createdAt: string }) => Date.parse(c.createdAt))
    expect(times).toEqual([...times].sort((a, b) => b - a))
  })

  it('filters by status, method, model and text, and sorts by method name', async () => {
    const retired = await lab.analyst.get('/api/calibrations').query({ status: 'retired' })
    expect(retired.body.total).toBe(1)
    expect(retired.body.items[0].model).toBe('response-factor')
    expect((await lab.analyst.get('/api/calibrations').query({ gcMethodId: tcdId })).body.total).toBe(1)
    expect((await lab.analyst.get('/api/calibrations').query({ model: 'linear' })).body.total).toBe(1)
    const text = await lab.analyst.get('/api/calibrations').query({ q: 'tcd' })
    expect(text.body.items.map((c: { gcMethodName: string }) => c.gcMethodName)).toEqual(['TCD-packed'])
    const sorted = await lab.analyst.get('/api/calibrations').query({ sort: 'gc_method', order: 'asc' })
    expect(sorted.body.items.map((c: { gcMethodName: string }) => c.gcMethodName)).toEqual([
      'FID-PoraBOND',
      'FID-PoraBOND',
      'TCD-packed',
    ])
    const later = await lab.analyst
      .get('/api/calibrations')
      .query({ createdAfter: new Date(Date.now() + 60_000).toISOString() })
    expect(later.body.total).toBe(0)
  })

  it('rejects an unknown sort column and a page size above 200', async () => {
    const r = await lab.analyst.get('/api/calibrations').query({ sort: 'upload_id', pageSize: 500 })
    expect(r.status).toBe(422)
    expect(r.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['pageSize', 'sort'])
  })
})

describe('GC methods list', () => {
  it('pages, filters by detector and text, sorts', async () => {
    const all = await lab.analyst.get('/api/gc-methods')
    expect(all.body).toMatchObject({ total: 2, page: 1, pageSize: 100 })
    expect(all.body.items.map((m: { name: string }) => m.name)).toEqual(['FID-PoraBOND', 'TCD-packed'])
    expect(
      (await lab.analyst.get('/api/gc-methods').query({ detector: 'TCD' })).body.items.map(
        (m: { name: string }) => m.name,
      ),
    ).toEqual(['TCD-packed'])
    expect((await lab.analyst.get('/api/gc-methods').query({ q: 'porous' })).body.total).toBe(1)
    const desc = await lab.analyst.get('/api/gc-methods').query({ order: 'desc', pageSize: 1 })
    expect(desc.body.items.map((m: { name: string }) => m.name)).toEqual(['TCD-packed'])
    expect(desc.body.total).toBe(2)
  })
})

describe('my open threads', () => {
  it('pages with a total', async () => {
    const ds = (
      await lab.analyst
        .post('/api/data-sets')
        .send({ systemId: lab.systemId, title: 'Threads', nominalPressurePa: 101325 })
        .expect(201)
    ).body
    for (const body of ['first', 'second', 'third'])
      await lab.reviewer.post(`/api/data-sets/${ds.id}/comments`).send({ body }).expect(201)
    const r = await lab.reviewer.get('/api/comments/mine').query({ pageSize: 2 })
    expect(r.status).toBe(200)
    expect(r.body).toMatchObject({ total: 3, page: 1, pageSize: 2 })
    expect(r.body.items.map((c: { body: string }) => c.body)).toEqual(['third', 'second'])
    // camelCase like every other answer
    expect(Object.keys(r.body.items[0]).sort()).toEqual([
      'body',
      'createdAt',
      'dataSetId',
      'id',
      'pointId',
      'title',
      'version',
    ])
    expect(r.body.items[0]).toMatchObject({ dataSetId: ds.id, pointId: null, title: 'Threads', version: 1 })
  })
})

describe('data sets by date', () => {
  it('filters by creation and by last change, server-side, the end exclusive', async () => {
    const make = async (title: string) =>
      (
        await lab.analyst
          .post('/api/data-sets')
          .send({ systemId: lab.systemId, title, nominalPressurePa: 101325 })
          .expect(201)
      ).body
    const old = await make('Dated: made in March, changed in May')
    const fresh = await make('Dated: made and changed today')
    await t.db
      .updateTable('data_set')
      .set({ created_at: new Date('2026-03-10T09:00:00Z'), updated_at: new Date('2026-05-02T09:00:00Z') })
      .where('id', '=', old.id)
      .execute()
    const titles = async (query: Record<string, string>) =>
      (
        await lab.analyst
          .get('/api/data-sets')
          .query({ q: 'Dated', sort: 'title', order: 'asc', ...query })
          .expect(200)
      ).body.items.map((d: { title: string }) => d.title)
    expect(await titles({ createdAfter: '2026-03-01', createdBefore: '2026-04-01' })).toEqual([old.title])
    expect(await titles({ updatedAfter: '2026-05-01', updatedBefore: '2026-05-03' })).toEqual([old.title])
    expect(await titles({ updatedBefore: '2026-05-02T09:00:00Z' })).toEqual([])
    expect(await titles({ createdAfter: '2026-04-01' })).toEqual([fresh.title])
    const bad = await lab.analyst
      .get('/api/data-sets')
      .query({ updatedAfter: '2026-05-03', updatedBefore: '2026-05-01' })
    expect(bad.status).toBe(422)
    expect(bad.body.error.details).toEqual(
      expect.arrayContaining([expect.objectContaining({ message: 'The changed range must end after it starts' })]),
    )
  })
})
