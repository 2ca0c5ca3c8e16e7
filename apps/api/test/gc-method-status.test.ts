/** GC methods are active or retired; a retired method's calibrations cannot be made active or used for new uploads (API and database). */
import { sql } from 'kysely'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { buildLab, csv, example, type Lab } from './lab-fixture.js'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'

const RETIRED = 'This GC method is retired: its calibrations cannot be made active or used for new uploads.'
let t: TestContext
let lab: Lab
let dataSet: { id: string; rowVersion: number }
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({
      systemId: lab.systemId,
      title: 'Retired method check',
      nominalPressurePa: 101325,
      apparatusNotes: null,
      projectRef: null,
    })
    .expect(201)
  dataSet = { id: d.body.id, rowVersion: d.body.rowVersion }
})
afterAll(() => t.close())

const calibrationCommit = (gcMethodId: string) =>
  csv(lab.analyst.post('/api/calibrations'), example('calibration-acetone-methanol.csv'), 'calibration.csv')
    .field('gcMethodId', gcMethodId)
    .field('systemId', lab.systemId)
    .field('model', 'response-factor')
    .field('acceptWarnings', 'true')

describe('GC method status', () => {
  it('lists a new method as active and filters by status', async () => {
    const all = await lab.analyst.get('/api/gc-methods').expect(200)
    expect(all.body.items).toHaveLength(1)
    expect(all.body.items[0]).toMatchObject({ id: lab.gcMethodId, status: 'active', retiredAt: null })
    expect((await lab.analyst.get('/api/gc-methods').query({ status: 'retired' }).expect(200)).body.total).toBe(0)
  })

  it('lets only a lead chemist or an admin retire a method', async () => {
    const r = await lab.analyst.post(`/api/gc-methods/${lab.gcMethodId}/retire`).expect(403)
    expect(r.body.error.code).toBe('forbidden')
  })

  it('retires the method together with its active calibrations, audited, once', async () => {
    const r = await lab.lead.post(`/api/gc-methods/${lab.gcMethodId}/retire`).expect(200)
    expect(r.body).toMatchObject({ id: lab.gcMethodId, status: 'retired' })
    expect(r.body.retiredAt).not.toBeNull()
    const cal = await lab.analyst.get(`/api/calibrations/${lab.calibrationId}`).expect(200)
    expect(cal.body.status).toBe('retired')
    const again = await lab.lead.post(`/api/gc-methods/${lab.gcMethodId}/retire`).expect(409)
    expect(again.body.error.message).toBe('This GC method is already retired.')
    const audit = await lab.admin.get('/api/audit').query({ entity: 'gc_method', entityId: lab.gcMethodId }).expect(200)
    expect(audit.body.items.map((a: { action: string }) => a.action)).toEqual(['retire', 'create'])
    expect((await lab.analyst.get('/api/gc-methods').query({ status: 'retired' }).expect(200)).body.total).toBe(1)
  })

  it('refuses a new calibration on the retired method, in preview and commit', async () => {
    const preview = await csv(
      lab.analyst.post('/api/calibrations/preview'),
      example('calibration-acetone-methanol.csv'),
      'cal.csv',
    )
      .field('gcMethodId', lab.gcMethodId)
      .field('systemId', lab.systemId)
      .field('model', 'response-factor')
      .expect(409)
    expect(preview.body.error.message).toBe(RETIRED)
    const commit = await calibrationCommit(lab.gcMethodId).expect(409)
    expect(commit.body.error.message).toBe(RETIRED)
  })

  it("refuses a run upload with the retired method's calibration", async () => {
    const r = await csv(
      lab.analyst.post(`/api/data-sets/${dataSet.id}/uploads/preview`),
      example('run-acetone-methanol.csv'),
    )
      .field('calibrationId', lab.calibrationId)
      .expect(409)
    expect(r.body.error.message).toBe(RETIRED)
    const c = await csv(lab.analyst.post(`/api/data-sets/${dataSet.id}/uploads`), example('run-acetone-methanol.csv'))
      .field('calibrationId', lab.calibrationId)
      .field('rowVersion', String(dataSet.rowVersion))
      .field('acceptWarnings', 'true')
      .expect(409)
    expect(c.body.error.message).toBe(RETIRED)
  })

  it('keeps the rule in the database whatever the app does', async () => {
    await expect(
      sql`update calibration set status = 'active', retired_at = null where id = ${lab.calibrationId}`.execute(t.db),
    ).rejects.toThrow('a calibration of a retired GC method cannot be active')
    const other = await lab.analyst
      .post('/api/gc-methods')
      .send({ name: 'TCD-molsieve', detector: 'TCD', columnDescription: null, conditions: null })
      .expect(201)
    await calibrationCommit(other.body.id).expect(201)
    await expect(
      sql`update gc_method set status = 'retired' where id = ${other.body.id}`.execute(t.db),
    ).rejects.toThrow('retire the active calibrations of a GC method before the method')
  })
})
