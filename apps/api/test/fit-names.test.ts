/**
 * One name per fit everywhere: the lab's data-set detail, the engineer's parameters (legend and curve table take
 * it from there), the parameters CSV and the catalogue all name a fit with the shared rule of
 * packages/schemas/src/fit-label.ts, so "NRTL #2 (α = 0.2)" on the lab screen is "NRTL #2 (α = 0.2)" for the
 * engineer and in the file. Data: the documented example run file (invented).
 */
import { fitLabel } from '@ebullio/schemas'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, draftWithPoints, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let id: string
let nrtl2: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await draftWithPoints(t, lab, 'Acetone/methanol, two NRTL fits')
  id = d.id
  await lab.analyst
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['nrtl'], alpha: 0.3 })
    .expect(201)
  const second = await lab.analyst
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['nrtl'], alpha: 0.2 })
    .expect(201)
  nrtl2 = second.body.fits[0].id
  const w = await lab.analyst
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['wilson'] })
    .expect(201)
  await lab.analyst.post(`/api/data-sets/${id}/submit`).send({ rowVersion: w.body.rowVersion }).expect(200)
  const rec = await lab.lead.post(`/api/data-sets/${id}/recommended-fit`).send({ fitId: nrtl2 }).expect(200)
  await lab.lead
    .post(`/api/data-sets/${id}/approve`)
    .send({ password: PASSWORD, reason: 'NRTL with α = 0.2 recommended.', rowVersion: rec.body.rowVersion })
    .expect(200)
})
afterAll(() => t.close())

describe('fit names', () => {
  it('the lab detail and the engineer parameters name each fit alike, numbering repeated models in run order', async () => {
    const detail = (await lab.lead.get(`/api/data-sets/${id}`).expect(200)).body
    const labLabels = new Map<string, string>(
      detail.fits.map((f: { id: string }) => [f.id, fitLabel(f as never, detail.fits)]),
    )
    expect([...labLabels.values()].sort()).toEqual(['NRTL #1 (α = 0.3)', 'NRTL #2 (α = 0.2)', 'Wilson'])
    const p = (await lab.engineer.get(`/api/data-sets/${id}/export/parameters.json`).expect(200)).body
    expect(p.fits).toHaveLength(3)
    for (const f of p.fits) expect(f.label).toBe(labLabels.get(f.id))
    expect(p.fits.find((f: { id: string }) => f.id === nrtl2).label).toBe('NRTL #2 (α = 0.2)')
  })

  it('the parameters CSV starts each fit with its label row, and the catalogue names the recommended fit the same', async () => {
    const res = await lab.engineer.get(`/api/data-sets/${id}/export/parameters.csv`).expect(200)
    const labelRows = res.text.split('\n').filter((l) => l.split(',')[3] === 'label')
    expect(labelRows).toHaveLength(3)
    expect(labelRows.find((l) => l.startsWith(nrtl2))).toContain(',NRTL #2 (α = 0.2),')
    const cat = (await lab.engineer.get('/api/catalogue').expect(200)).body
    const version = cat.items
      .flatMap((s: { approved: { dataSetId: string }[] }) => s.approved)
      .find((v: { dataSetId: string }) => v.dataSetId === id)
    expect(version.recommendedFit).toMatchObject({ id: nrtl2, label: 'NRTL #2 (α = 0.2)' })
  })
})
