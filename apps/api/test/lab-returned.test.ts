/**
 * A returned version is reworked in place and submitted again (no separate "back to draft" step):
 * same id and version number, the signed return stays on record, the approval then signs the reworked content.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, csv, draftWithPoints, generatedRun, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let id: string
let rowVersion: number
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await draftWithPoints(t, lab, 'Returned and reworked')
  id = d.id
  const fit = await lab.analyst
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['wilson'] })
    .expect(201)
  const sub = await lab.analyst
    .post(`/api/data-sets/${id}/submit`)
    .send({ rowVersion: fit.body.rowVersion })
    .expect(200)
  const back = await lab.lead
    .post(`/api/data-sets/${id}/return`)
    .send({
      password: PASSWORD,
      reason: 'Exclude the first sample and add more points.',
      rowVersion: sub.body.rowVersion,
    })
    .expect(200)
  rowVersion = back.body.dataSet.rowVersion
})
afterAll(() => t.close())

describe('returned for rework', () => {
  it('cannot be revised or deleted: it is edited as it is', async () => {
    const revise = await lab.analyst.post(`/api/data-sets/${id}/revise`)
    expect(revise.status).toBe(409)
    expect(revise.body.error.message).toBe('This data set is returned; revising is possible only when it is approved.')
    const del = await lab.analyst.delete(`/api/data-sets/${id}`)
    expect(del.status).toBe(409)
    expect(del.body.error.message).toBe('This data set is returned; deleting is possible only when it is draft.')
  })

  it('takes metadata edits, exclusions, uploads and fits while staying returned', async () => {
    const edit = await lab.analyst
      .patch(`/api/data-sets/${id}`)
      .send({ rowVersion, apparatusNotes: 'recirculating still, new thermometer' })
      .expect(200)
    expect(edit.body.state).toBe('returned')
    const detail = await lab.analyst.get(`/api/data-sets/${id}`).expect(200)
    const first = detail.body.points[0]
    const ex = await lab.analyst
      .patch(`/api/data-sets/${id}/points/${first.id}`)
      .send({ rowVersion: edit.body.rowVersion, excluded: true, reason: 'Lead chemist asked for it.' })
      .expect(200)
    const up = await csv(lab.analyst.post(`/api/data-sets/${id}/uploads`), generatedRun(4, 91))
      .field('rowVersion', String(ex.body.rowVersion))
      .field('acceptWarnings', 'true')
    expect(up.status, JSON.stringify(up.body)).toBe(201)
    const fit = await lab.analyst
      .post(`/api/data-sets/${id}/fits`)
      .send({ models: ['wilson'] })
      .expect(201)
    rowVersion = fit.body.rowVersion
    const after = await lab.analyst.get(`/api/data-sets/${id}`).expect(200)
    expect(after.body).toMatchObject({ state: 'returned', version: 1 })
    expect(after.body.points).toHaveLength(16)
  })

  it('is submitted again, then approved; the return keeps its signature over the content as it was returned', async () => {
    const sub = await lab.analyst.post(`/api/data-sets/${id}/submit`).send({ rowVersion }).expect(200)
    expect(sub.body).toMatchObject({ id, state: 'submitted', version: 1 })
    const fits = await lab.lead.get(`/api/data-sets/${id}/fits`).expect(200)
    const rec = await lab.lead
      .post(`/api/data-sets/${id}/recommended-fit`)
      .send({ fitId: fits.body.items.at(-1).id })
      .expect(200)
    await lab.lead
      .post(`/api/data-sets/${id}/approve`)
      .send({ password: PASSWORD, reason: 'Reworked as asked.', rowVersion: rec.body.rowVersion })
      .expect(200)
    const verify = await lab.reviewer.get(`/api/data-sets/${id}/signatures/verify`).expect(200)
    expect(verify.body.signatures.map((s: { meaning: string; matches: boolean }) => [s.meaning, s.matches])).toEqual([
      ['returned for rework', false],
      ['approved', true],
    ])
    const audit = await lab.reviewer.get(`/api/data-sets/${id}/audit`).expect(200)
    const transitions = audit.body.items
      .filter((a: { action: string }) => ['submit', 'return', 'approve'].includes(a.action))
      .map((a: { action: string }) => a.action)
    expect(transitions).toEqual(['submit', 'return', 'submit', 'approve'])
  })
})
