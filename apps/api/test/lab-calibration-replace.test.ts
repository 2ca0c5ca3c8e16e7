/**
 * Replacing the active calibration of a GC method and system is deliberate: the preview names the one it
 * replaces, the commit is refused until that is acknowledged, and a data set shows the calibrations behind
 * its points (record, audit trail, run preview).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, csv, draftWithPoints, example, labCounts, type Lab } from './lab-fixture.js'

const NOT_CONFIRMED =
  'This GC method already has an active calibration for this system; confirm that the new one replaces it (replaceActive), or choose another GC method.'
let t: TestContext
let lab: Lab
let withPoints: { id: string; rowVersion: number }
let empty: { id: string; rowVersion: number }
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  withPoints = await draftWithPoints(t, lab)
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({ systemId: lab.systemId, title: 'New campaign', nominalPressurePa: 101325 })
    .expect(201)
  empty = { id: d.body.id, rowVersion: d.body.rowVersion }
})
afterAll(() => t.close())

const calibration = (path: string, fields: Record<string, string>) => {
  let r = csv(lab.analyst.post(path), example('calibration-acetone-methanol.csv'), 'calibration-2026-12-02.csv')
  for (const [k, v] of Object.entries({
    gcMethodId: lab.gcMethodId,
    systemId: lab.systemId,
    model: 'response-factor',
    acceptWarnings: 'true',
    ...fields,
  }))
    r = r.field(k, v)
  return r
}

describe('replacing the active calibration', () => {
  it('previews which calibration would be replaced: file, date, model, coefficients ± u, range, data sets using it', async () => {
    const r = await calibration('/api/calibrations/preview', {}).expect(200)
    expect(r.body.replaces).toMatchObject({
      id: lab.calibrationId,
      gcMethodId: lab.gcMethodId,
      gcMethodName: 'FID-PoraBOND',
      model: 'response-factor',
      status: 'active',
      coefficientNames: ['k'],
      originalName: 'calibration.csv',
      dataSetCount: 1,
    })
    expect(r.body.replaces.coefficients[0]).toBeCloseTo(1.32, 1)
    expect(r.body.replaces.standardErrors[0]).toBeGreaterThan(0)
    expect(r.body.replaces.rangeMin).toBeLessThan(r.body.replaces.rangeMax)
    expect(r.body.replaces.sha256).toMatch(/^[0-9a-f]{64}$/)
  })

  it('refuses the commit without the acknowledgement, storing nothing', async () => {
    const before = await labCounts(t)
    const r = await calibration('/api/calibrations', { dataSetId: empty.id }).expect(409)
    expect(r.body.error).toMatchObject({ code: 'replacement_not_confirmed', message: NOT_CONFIRMED })
    expect(r.body.error.details.replaces.id).toBe(lab.calibrationId)
    expect(await labCounts(t)).toEqual(before)
    expect((await lab.analyst.get(`/api/calibrations/${lab.calibrationId}`).expect(200)).body.status).toBe('active')
  })

  it('refuses a data set that does not exist', async () => {
    const r = await calibration('/api/calibrations', {
      dataSetId: '00000000-0000-4000-8000-000000000000',
      replaceActive: 'true',
    }).expect(404)
    expect(r.body.error.message).toBe('There is no such data set.')
  })

  let replacement: string
  it('replaces it when acknowledged and records the commit in the data set audit trail', async () => {
    const r = await calibration('/api/calibrations', { dataSetId: empty.id, replaceActive: 'true' }).expect(201)
    replacement = r.body.id
    expect((await lab.analyst.get(`/api/calibrations/${lab.calibrationId}`).expect(200)).body.status).toBe('retired')
    const audit = (await lab.analyst.get(`/api/data-sets/${empty.id}/audit`).expect(200)).body.items as {
      entity: string
      entityId: string
      action: string
      after: Record<string, unknown>
    }[]
    expect(audit.map((a) => [a.entity, a.action])).toEqual([
      ['data_set', 'create'],
      ['upload', 'upload calibration file'],
      ['calibration', 'retire'],
      ['calibration', 'create'],
    ])
    expect(audit[2]).toMatchObject({
      entityId: lab.calibrationId,
      after: { replacedBy: replacement, file: 'calibration.csv', usedByDataSets: 1 },
    })
    expect(audit[3]).toMatchObject({
      entityId: replacement,
      after: { model: 'response-factor', file: 'calibration-2026-12-02.csv', replaces: [lab.calibrationId] },
    })
  })

  it('commits without acknowledgement when nothing is active', async () => {
    const other = await lab.analyst
      .post('/api/gc-methods')
      .send({ name: 'FID-B', detector: 'FID', columnDescription: null, conditions: null })
      .expect(201)
    const r = await calibration('/api/calibrations/preview', { gcMethodId: other.body.id }).expect(200)
    expect(r.body.replaces).toBeNull()
    await calibration('/api/calibrations', { gcMethodId: other.body.id }).expect(201)
    await lab.lead.post(`/api/gc-methods/${other.body.id}/retire`).expect(200)
  })

  it('names the calibration a run upload will use before commit', async () => {
    const r = await csv(
      lab.analyst.post(`/api/data-sets/${empty.id}/uploads/preview`),
      example('run-acetone-methanol.csv'),
    ).expect(200)
    expect(r.body.calibrationId).toBe(replacement)
    expect(r.body.calibrationUsed).toMatchObject({
      id: replacement,
      originalName: 'calibration-2026-12-02.csv',
      model: 'response-factor',
      gcMethodName: 'FID-PoraBOND',
      dataSetCount: 0,
    })
  })

  it("lists the calibrations behind a data set's points in its detail", async () => {
    const d = (await lab.reviewer.get(`/api/data-sets/${withPoints.id}`).expect(200)).body
    expect(d.calibrations).toHaveLength(1)
    expect(d.calibrations[0]).toMatchObject({
      id: lab.calibrationId,
      originalName: 'calibration.csv',
      status: 'retired',
      dataSetCount: 1,
    })
    expect(d.points.every((p: { calibrationId: string }) => p.calibrationId === lab.calibrationId)).toBe(true)
    expect((await lab.reviewer.get(`/api/data-sets/${empty.id}`).expect(200)).body.calibrations).toEqual([])
  })
})

describe('run preview of a file with errors', () => {
  it('marks the samples whose compositions rest on part of their injections', async () => {
    const r = await csv(
      lab.analyst.post(`/api/data-sets/${empty.id}/uploads/preview`),
      example('run-acetone-methanol-with-errors.csv'),
    ).expect(200)
    const by = Object.fromEntries(r.body.samples.map((s: { label: string }) => [s.label, s]))
    // line 5: AM-01's second vapour injection has no phase; line 10 and 15: one liquid injection each of AM-03, AM-04
    expect(by['AM-01']).toMatchObject({
      partial: true,
      errorRows: [5],
      coverage: { liquid: { used: 2, of: 2 }, vapour: { used: 1, of: 1 }, unreadRows: [5] },
    })
    expect(by['AM-03']).toMatchObject({
      partial: true,
      errorRows: [10],
      coverage: { liquid: { used: 1, of: 2 }, vapour: { used: 2, of: 2 } },
    })
    expect(by['AM-04']).toMatchObject({ partial: true, errorRows: [15], coverage: { liquid: { used: 1, of: 2 } } })
    expect(by['AM-02']).toMatchObject({ partial: false, errorRows: [] })
  })
})
