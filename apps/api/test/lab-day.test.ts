/**
 * A lab's day without API calls (issue 11): systems from components, whose drafts may be deleted, data that
 * did not come through the GC (typed points, point sheets, literature with its citation), pure-component
 * boiling points and thermometer / barometer checks.
 * Points of the "literature" sets are INVENTED: bubble points of the demo's acetone/methanol Wilson model
 * (SVNA 7th ed. Table 12.5 parameters) computed by @ebullio/thermo, rounded as a table would print them.
 */
import { bubbleTemperature } from '@ebullio/thermo'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { contentDigest, signedContentV2 as signedContent } from '../src/services/digest.js'
import { ACETONE_METHANOL, buildLab, csv, draftWithPoints, labCounts, type Lab } from './lab-fixture.js'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
let lab: Lab
const comp: Record<string, string> = {}
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  for (const c of (await lab.admin.get('/api/components?pageSize=100')).body.items) comp[c.name] = c.id
  // ethanol: CAS 64-17-5, C2H6O, 46.07 g/mol (CRC Handbook, from memory); water is added for the systems
  for (const [name, cas, formula, M] of [
    ['ethanol', '64-17-5', 'C2H6O', 46.07],
    ['water', '7732-18-5', 'H2O', 18.015],
    ['2-methoxyethanol', '109-86-4', 'C3H8O2', 76.09],
  ] as const) {
    const r = await lab.admin
      .post('/api/components')
      .send({ name, casNumber: cas, formula, molarMass: M, liquidMolarVolume: null })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    comp[name] = r.body.id
  }
  await lab.lead
    .post(`/api/components/${comp.water}/vapor-pressure-sets`)
    .send({ model: demoVaporPressure('water'), source: 'SVNA 7th ed. Table B.2', preferred: true })
    .expect(201)
})
afterAll(() => t.close())

const names = (items: { name: string }[]) => items.map((i) => i.name)

describe('finding components and creating systems', () => {
  it('ranks the exact name first, then names starting with it, then names containing it', async () => {
    const r = await lab.analyst.get('/api/components?q=ethanol').expect(200)
    // "methanol" and "2-methoxyethanol" contain "ethanol"; "ethanol" itself must come first
    expect(names(r.body.items)).toEqual(['ethanol', '2-methoxyethanol', 'methanol'])
    const partial = await lab.analyst.get('/api/components?q=eth').expect(200)
    expect(names(partial.body.items)[0]).toBe('ethanol')
  })

  it('finds a component by CAS number and by formula', async () => {
    expect(names((await lab.analyst.get('/api/components?q=64-17-5')).body.items)).toEqual(['ethanol'])
    expect(names((await lab.analyst.get('/api/components?q=c2h6o')).body.items)).toEqual(['ethanol'])
    // a LIKE wildcard typed by the user matches itself only
    expect((await lab.analyst.get('/api/components?q=%25')).body.items).toEqual([])
  })

  it('creates a system in the chosen order with a note, and finds it first for "ethanol" or "water / ethanol"', async () => {
    const r = await lab.analyst
      .post('/api/systems')
      .send({ component1Id: comp.ethanol, component2Id: comp.water, notes: 'Campaign 14 feed' })
      .expect(201)
    expect(r.body.name).toBe('ethanol / water')
    expect(r.body.component1.id).toBe(comp.ethanol)
    expect(r.body.notes).toBe('Campaign 14 feed')
    const again = await lab.analyst.post('/api/systems').send({ component1Id: comp.water, component2Id: comp.ethanol })
    expect(again.status).toBe(409)
    expect(again.body.error.message).toBe('The system ethanol / water already exists.')
    const q = await lab.analyst.get('/api/systems?q=ethanol').expect(200)
    expect(q.body.items.map((s: { name: string }) => s.name)).toEqual(['ethanol / water', 'acetone / methanol'])
    const pair = await lab.analyst.get(`/api/systems?q=${encodeURIComponent('water / ethanol')}`).expect(200)
    expect(pair.body.items.map((s: { name: string }) => s.name)).toEqual(['ethanol / water'])
  })
})

describe('drafts: who may delete them, and changing the system of an empty draft', () => {
  async function draft(agent = lab.analyst2, systemId = lab.systemId) {
    const r = await agent
      .post('/api/data-sets')
      .send({ systemId, title: 'Scratch series', nominalPressurePa: 101325 })
      .expect(201)
    return r.body as { id: string; rowVersion: number }
  }

  it("refuses another analyst deleting someone's draft, and lets a lead chemist delete it (audited)", async () => {
    const d = await draft()
    const r = await lab.analyst.delete(`/api/data-sets/${d.id}`)
    expect(r.status).toBe(403)
    expect(r.body.error.message).toBe('Only the author of this draft or a lead chemist may delete it.')
    await lab.analyst2.get(`/api/data-sets/${d.id}`).expect(200)
    await lab.lead.delete(`/api/data-sets/${d.id}`).expect(204)
    await lab.analyst2.get(`/api/data-sets/${d.id}`).expect(404)
    const audit = await t.db
      .selectFrom('audit_log')
      .selectAll()
      .where('entity_id', '=', d.id)
      .where('action', '=', 'delete draft')
      .executeTakeFirstOrThrow()
    expect(audit.actor_id).toBe(lab.ids.lead)
    expect(audit.before).toMatchObject({ title: 'Scratch series', createdBy: lab.ids.analyst2 })
  })

  it('lets the author delete her own never-submitted draft', async () => {
    const d = await draft()
    await lab.analyst2.delete(`/api/data-sets/${d.id}`).expect(204)
  })

  it('moves a draft without points to another system, and refuses once it has points', async () => {
    const ethanolWater = (await lab.analyst.get('/api/systems?q=ethanol%20%2F%20water')).body.items[0].id
    const d = await draft(lab.analyst)
    const r = await lab.analyst
      .patch(`/api/data-sets/${d.id}`)
      .send({ rowVersion: d.rowVersion, systemId: ethanolWater })
      .expect(200)
    expect(r.body.systemId).toBe(ethanolWater)
    const full = await draftWithPoints(t, lab, 'Has points')
    const refused = await lab.analyst
      .patch(`/api/data-sets/${full.id}`)
      .send({ rowVersion: full.rowVersion, systemId: ethanolWater })
    expect(refused.status).toBe(409)
    expect(refused.body.error.message).toBe(
      'This data set already has points; its system can no longer change. Start a new data set instead.',
    )
  })
})

const citation = {
  authors: 'A. Author, B. Author',
  title: 'Vapour-liquid equilibrium of acetone and methanol at atmospheric pressure',
  source: 'Journal of Invented Data',
  year: 1987,
  volume: '12',
  pages: '101-109',
  doi: '10.0000/invented.1987.12',
  table: 'Table 2',
}
/** Invented literature table: the demo Wilson model's bubble points, rounded to 0.01 K and 0.001. */
function literaturePoints(xs = [0.1, 0.3, 0.5, 0.7, 0.9]) {
  const system = {
    vaporPressure: [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as [never, never],
    activity: ACETONE_METHANOL.activity as never,
  }
  return xs.map((x1, i) => {
    const b = bubbleTemperature(system, { P: 101325, x1 })
    return {
      sampleLabel: `L${i + 1}`,
      temperatureK: Math.round(b.T * 100) / 100,
      pressurePa: 101325,
      x1,
      y1: Math.round(b.y1 * 1000) / 1000,
      x1Uncertainty: 0.002,
      y1Uncertainty: 0.003,
    }
  })
}

async function literatureSet(agent = lab.analyst) {
  const r = await agent.post('/api/data-sets').send({
    systemId: lab.systemId,
    title: 'Literature comparison',
    nominalPressurePa: 101325,
    origin: 'literature',
    citation,
  })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return r.body as { id: string; rowVersion: number; origin: string }
}

describe('data sets that did not come through the GC', () => {
  it('needs a full citation for literature data and a method for "another method"', async () => {
    const noCitation = await lab.analyst
      .post('/api/data-sets')
      .send({ systemId: lab.systemId, title: 'Lit', nominalPressurePa: 101325, origin: 'literature' })
    expect(noCitation.status).toBe(422)
    expect(noCitation.body.error.details).toEqual([
      { path: 'citation', message: 'Literature data needs its full citation.' },
    ])
    const noMethod = await lab.analyst
      .post('/api/data-sets')
      .send({ systemId: lab.systemId, title: 'RI', nominalPressurePa: 101325, origin: 'other-method' })
    expect(noMethod.body.error.details[0].message).toBe(
      'Say how the compositions were measured (the method other than GC).',
    )
  })

  it('stores typed points exactly as typed, refuses them on a GC data set, and refuses a bad batch whole', async () => {
    const d = await literatureSet()
    expect(d.origin).toBe('literature')
    const pts = literaturePoints()
    const r = await lab.analyst.post(`/api/data-sets/${d.id}/points`).send({ rowVersion: d.rowVersion, points: pts })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const detail = (await lab.analyst.get(`/api/data-sets/${d.id}`)).body
    expect(detail.points.map((p: { temperatureK: number }) => p.temperatureK)).toEqual(pts.map((p) => p.temperatureK))
    expect(detail.points.map((p: { y1: number }) => p.y1)).toEqual(pts.map((p) => p.y1))
    expect(detail.points.every((p: { uploadId: null; calibrationId: null }) => !p.uploadId && !p.calibrationId)).toBe(
      true,
    )

    const before = await labCounts(t)
    const dup = await lab.analyst
      .post(`/api/data-sets/${d.id}/points`)
      .send({ rowVersion: r.body.rowVersion, points: [{ ...pts[0], sampleLabel: 'L9' }, pts[1]] })
    expect(dup.status).toBe(422)
    expect(dup.body.error.details).toEqual([
      expect.objectContaining({ row: 2, column: 'sample', message: 'Sample "L2" is already used in this data set.' }),
    ])
    const outOfRange = await lab.analyst
      .post(`/api/data-sets/${d.id}/points`)
      .send({ rowVersion: r.body.rowVersion, points: [{ ...pts[0], sampleLabel: 'L10', x1: 1.2 }] })
    expect(outOfRange.status).toBe(422)
    expect(outOfRange.body.error.details).toEqual([{ path: 'points.0.x1', message: 'x1 must be between 0 and 1' }])
    expect(await labCounts(t)).toEqual(before)

    const gc = await draftWithPoints(t, lab, 'GC series')
    const refused = await lab.analyst
      .post(`/api/data-sets/${gc.id}/points`)
      .send({ rowVersion: gc.rowVersion, points: pts })
    expect(refused.status).toBe(409)
    expect(refused.body.error.message).toMatch(/^This data set is measured here by GC/)
  })

  it('imports a point sheet: units converted, bad cells named by line and column, all or nothing', async () => {
    const d = await literatureSet()
    const bad =
      'sample,t,t_unit,p,p_unit,x1,y1\nA1,60.10,C,101.325,kPa,0.2,0.3\nA2,abc,C,101.325,kPa,1.3,0.5\nA3,58,C,101.325,bar?,0.5,\n'
    const preview = await csv(lab.analyst.post(`/api/data-sets/${d.id}/point-sheets/preview`), bad, 'lit.csv').expect(
      200,
    )
    expect(preview.body.errorCount).toBe(4)
    expect(
      preview.body.problems.map((p: { row: number; column: string; message: string }) => [p.row, p.column, p.message]),
    ).toEqual([
      [3, 't', '"abc" is not a number.'],
      [3, 'x1', 'x1 must be between 0 and 1.'],
      [4, 'p_unit', 'Unknown pressure unit "bar?"; use Pa, kPa, MPa, bar, mbar, atm, mmHg, torr or psi.'],
      [4, 'y1', 'y1 is missing.'],
    ])
    const before = await labCounts(t)
    const commitBad = await csv(lab.analyst.post(`/api/data-sets/${d.id}/point-sheets`), bad, 'lit.csv').field(
      'rowVersion',
      String(d.rowVersion),
    )
    expect(commitBad.status).toBe(422)
    expect(commitBad.body.error.code).toBe('upload_rejected')
    expect(await labCounts(t)).toEqual(before)

    const good =
      'Sample;T;T_unit;P;P_unit;x1;y1;u_x1\nA1;60,10;C;760;mmHg;0,2;0,3;0,004\nA2;330.0;K;101.325;kPa;0,6;0,65;\n'
    const ok = await csv(lab.analyst.post(`/api/data-sets/${d.id}/point-sheets`), good, 'lit.csv').field(
      'rowVersion',
      String(d.rowVersion),
    )
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    const pts = (await lab.analyst.get(`/api/data-sets/${d.id}`)).body.points
    expect(pts[0].temperatureK).toBeCloseTo(333.25, 10) // 60.10 °C + 273.15
    // 1 mmHg = 133.322 387 415 Pa (conventional, NIST SP 811 Appendix B.8 gives 133.3224), so 760 mmHg ≠ 1 atm exactly
    expect(pts[0].pressurePa).toBeCloseTo(760 * 133.322387415, 6)
    expect(pts[0].x1Uncertainty).toBe(0.004)
    expect(pts[1].x1Uncertainty).toBe(0.005) // the sheet's default when u_x1 is empty
    expect(pts[1].uploadId).toBe(ok.body.uploadId)
    expect(pts[1].rowRefs).toEqual([3])
  })
})

describe('literature data in the signed record and in approval', () => {
  it('puts the origin and citation into the signed content, so changing the citation changes the digest', async () => {
    const d = await literatureSet()
    const content = await signedContent(t.db, d.id)
    expect(content!.dataSet).toMatchObject({ origin: 'literature', citation, countsAsOwn: false })
    const before = await contentDigest(t.db, d.id)
    await lab.analyst
      .patch(`/api/data-sets/${d.id}`)
      .send({ rowVersion: d.rowVersion, citation: { ...citation, pages: '101-110' } })
      .expect(200)
    expect(await contentDigest(t.db, d.id)).not.toBe(before)
  })

  it('cannot be approved until a lead chemist marks it as the lab’s own measurement', async () => {
    const d = await literatureSet()
    let r = await lab.analyst
      .post(`/api/data-sets/${d.id}/points`)
      .send({ rowVersion: d.rowVersion, points: literaturePoints() })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const fits = await lab.analyst.post(`/api/data-sets/${d.id}/fits`).send({ models: ['wilson'] })
    expect(fits.status, JSON.stringify(fits.body)).toBe(201)
    let v = (await lab.analyst.get(`/api/data-sets/${d.id}`)).body
    r = await lab.lead
      .post(`/api/data-sets/${d.id}/recommended-fit`)
      .send({ fitId: v.fits[0].id, rowVersion: v.rowVersion })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    v = (await lab.analyst.get(`/api/data-sets/${d.id}`)).body
    await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: v.rowVersion }).expect(200)
    v = (await lab.lead.get(`/api/data-sets/${d.id}`)).body
    const sign = { rowVersion: v.rowVersion, password: 'correct-horse-battery', reason: 'Checked against the source' }
    const refused = await lab.lead.post(`/api/data-sets/${d.id}/approve`).send(sign)
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('literature_not_own')
    // an analyst may not mark it
    await lab.analyst
      .post(`/api/data-sets/${d.id}/own-measurement`)
      .send({ rowVersion: v.rowVersion, countsAsOwn: true, reason: 'x' })
      .expect(403)
    const marked = await lab.lead
      .post(`/api/data-sets/${d.id}/own-measurement`)
      .send({ rowVersion: v.rowVersion, countsAsOwn: true, reason: 'Measured in this lab in 1987; the paper is ours' })
      .expect(200)
    expect(marked.body).toMatchObject({ countsAsOwn: true, countsAsOwnBy: lab.ids.lead })
    const ok = await lab.lead
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ ...sign, rowVersion: marked.body.rowVersion })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    const verify = await lab.lead.get(`/api/data-sets/${d.id}/signatures/verify`).expect(200)
    expect(JSON.stringify(verify.body)).toContain('"matches":true')
    // the exports carry the origin and the citation
    const json = await lab.engineer.get(`/api/data-sets/${d.id}/export/parameters.json`).expect(200)
    expect(json.body.dataSet).toMatchObject({ origin: 'literature', citation, countsAsOwn: true })
    const csvText = (await lab.engineer.get(`/api/data-sets/${d.id}/export/parameters.csv`).expect(200)).text
    expect(csvText).toContain(',data-set,,origin,literature,')
    expect(csvText).toContain('A. Author, B. Author (1987). Vapour-liquid equilibrium of acetone and methanol')
  })
})

describe('pure-component boiling points and instrument checks', () => {
  it('stores a boiling point with thermometer, still and date, beside the correlated temperature', async () => {
    // acetone boils at 56.05 °C = 329.20 K at 101.325 kPa (CRC Handbook, normal boiling point, from memory)
    const r = await lab.analyst.post(`/api/components/${comp.acetone}/pure-measurements`).send({
      temperatureK: 329.5,
      pressurePa: 101325,
      thermometer: 'Pt100 T-3',
      still: 'Still B',
      measuredOn: '2026-12-02',
      note: 'fresh bottle',
    })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const c = (await lab.analyst.get(`/api/components/${comp.acetone}`)).body
    const m = c.pureMeasurements.find((x: { id: string }) => x.id === r.body.id)
    expect(m).toMatchObject({
      thermometer: 'Pt100 T-3',
      still: 'Still B',
      measuredOn: '2026-12-02',
      note: 'fresh bottle',
    })
    expect(m.correlatedK).toBeGreaterThan(329.2 - 0.3)
    expect(m.correlatedK).toBeLessThan(329.2 + 0.3)
    expect(m.dT).toBeCloseTo(329.5 - m.correlatedK, 12)
    const bad = await lab.analyst
      .post(`/api/components/${comp.acetone}/pure-measurements`)
      .send({ temperatureK: 329.5, pressurePa: 101325, measuredOn: '2.12.2026' })
    expect(bad.status).toBe(422)
    expect(bad.body.error.details).toEqual([{ path: 'measuredOn', message: 'Enter the date as YYYY-MM-DD' }])
  })

  it('judges thermometer and barometer checks against the reference liquid', async () => {
    // water boils at 99.97 °C at 101.325 kPa and its vapour pressure at 99.00 °C is 97.76 kPa (IAPWS-IF97, from memory)
    const th = await lab.analyst.post('/api/check-measurements').send({
      kind: 'thermometer',
      instrument: 'T-3',
      componentId: comp.water,
      temperatureK: 373.55,
      pressurePa: 101325,
      measuredAt: '2026-12-01T08:00:00Z',
    })
    expect(th.status, JSON.stringify(th.body)).toBe(201)
    expect(th.body.deviation).toBeGreaterThan(0.43 - 0.1)
    expect(th.body.deviation).toBeLessThan(0.43 + 0.1)
    const baro = await lab.analyst.post('/api/check-measurements').send({
      kind: 'barometer',
      instrument: 'B-1',
      componentId: comp.water,
      temperatureK: 372.15,
      pressurePa: 100000,
      measuredAt: '2026-12-01T08:05:00Z',
    })
    expect(baro.status).toBe(201)
    expect(baro.body.deviation / 1000).toBeGreaterThan(2.24 - 0.15)
    expect(baro.body.deviation / 1000).toBeLessThan(2.24 + 0.15)
    const list = await lab.reviewer.get('/api/check-measurements?kind=thermometer&instrument=T-3').expect(200)
    expect(list.body.items.map((i: { id: string }) => i.id)).toEqual([th.body.id])
    const none = await lab.analyst.post('/api/check-measurements').send({
      kind: 'thermometer',
      instrument: 'T-3',
      componentId: comp.ethanol,
      temperatureK: 351,
      pressurePa: 101325,
      measuredAt: '2026-12-01',
    })
    expect(none.status).toBe(409)
    expect(none.body.error.message).toBe(
      'The reference liquid has no vapour-pressure correlation; add one before recording checks with it.',
    )
  })
})
