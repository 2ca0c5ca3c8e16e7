/**
 * Exports that stand on their own: the parameters CSV holds everything needed to recompute the curve and agrees
 * with the JSON; text cells that a spreadsheet would run as formulas are neutralised; file names keep every letter.
 */
import { parse } from 'csv-parse/sync'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, csv, example, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let id: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({ systemId: lab.systemId, title: 'Éthanol =SUM(1) à 1 atm', nominalPressurePa: 101325 })
    .expect(201)
  id = d.body.id
  // the example run file with two hostile sample labels (invented data)
  const file = example('run-acetone-methanol.csv')
    .toString('utf8')
    .replaceAll('AM-01', '=1+2')
    .replaceAll('AM-02', '@SUM(A1)')
  const c = await csv(lab.analyst.post(`/api/data-sets/${id}/uploads`), file)
    .field('rowVersion', String(d.body.rowVersion))
    .field('acceptWarnings', 'true')
    .expect(201)
  const detail = await lab.analyst.get(`/api/data-sets/${id}`).expect(200)
  const third = detail.body.points[2]
  const ex = await lab.analyst
    .patch(`/api/data-sets/${id}/points/${third.id}`)
    .send({ excluded: true, reason: '-leak at the septum', rowVersion: c.body.rowVersion })
  expect(ex.status, JSON.stringify(ex.body)).toBe(200)
  await lab.analyst
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['wilson', 'nrtl'], alpha: 0.3 })
    .expect(201)
})
afterAll(() => t.close())

const rowsOf = (text: string) => parse(text) as string[][]

describe('points export', () => {
  it('neutralises formula cells in text columns, keeps numbers as numbers, keeps letters in the file name', async () => {
    const r = await lab.reviewer.get(`/api/data-sets/${id}/export/points.csv`).expect(200)
    expect(r.headers['content-disposition']).toContain(
      `filename*=UTF-8''${encodeURIComponent('éthanol-sum-1-à-1-atm-v1-points.csv')}`,
    )
    const rows = rowsOf(r.text)
    expect(rows[1][1]).toBe("'=1+2")
    expect(rows[2][1]).toBe("'@SUM(A1)")
    expect(rows[3][9]).toBe("'-leak at the septum")
    for (const row of rows.slice(1))
      for (const c of [0, 2, 3, 4, 5, 6, 7]) expect(Number.isFinite(Number(row[c]))).toBe(true)
  })
})

describe('parameters export', () => {
  it('holds every number needed to recompute the curve and agrees with the JSON', async () => {
    const json = (await lab.engineer.get(`/api/data-sets/${id}/export/parameters.json`)).body
    // an engineer cannot read a draft; the lab can
    const j = json.error
      ? (await lab.reviewer.get(`/api/data-sets/${id}/export/parameters.json`).expect(200)).body
      : json
    const res = await lab.reviewer.get(`/api/data-sets/${id}/export/parameters.csv`).expect(200)
    expect(res.headers['content-disposition']).toContain(
      `filename*=UTF-8''${encodeURIComponent('éthanol-sum-1-à-1-atm-v1-parameters.csv')}`,
    )
    const rows = rowsOf(res.text)
    expect(rows.every((r) => r.length === 10)).toBe(true)
    const byFit = (fitId: string) =>
      Object.fromEntries(rows.filter((r) => r[0] === fitId).map((r) => [r[3], { value: r[4], se: r[5], unit: r[6] }]))
    const wilson = j.fits.find((f: { model: string }) => f.model === 'wilson')
    const nrtl = j.fits.find((f: { model: string }) => f.model === 'nrtl')
    const w = byFit(wilson.id)
    const n = byFit(nrtl.id)
    expect(w.equation.value).toMatch(/^Wilson: Lambda12 = \(V2\/V1\) exp\(-a12\/\(R T\)\)/)
    expect(n.equation.value).toMatch(/^NRTL: tau12 = b12\/\(R T\)/)
    for (const f of [wilson, nrtl])
      for (const p of f.parameters) {
        const row = byFit(f.id)[p.name]
        expect(Number(row.value)).toBe(p.value)
        expect(Number(row.se)).toBe(p.standardError)
        expect(row.unit).toBe(p.unit)
      }
    // Wilson's molar volumes and NRTL's held α are in the file, equal to what the engine used (the fit's activity)
    expect(Number(w.V1.value)).toBe(wilson.activity.V1)
    expect(Number(w.V2.value)).toBe(wilson.activity.V2)
    expect(w.V1.unit).toBe('cm3/mol')
    expect(Number(n.alpha.value)).toBe(0.3)
    expect(nrtl.activity.alpha).toBe(0.3)
    expect(n.alpha_fitted.value).toBe('false')
    expect(Number(w.rms_T.value)).toBe(wilson.statistics.rmsT)
    expect(w.rms_T.unit).toBe('K')
    expect(Number(w.points.value)).toBe(11)
    // the vapour-pressure sets with their sources, and the data set's own rows
    const vp = rows.filter((r) => r[1].startsWith('vapour-pressure/'))
    expect(vp.filter((r) => r[3] === 'source')).toHaveLength(2)
    const record = Object.fromEntries(
      rows.filter((r) => r[1] === 'data-set' || r[1] === 'approval').map((r) => [r[3], r[4]]),
    )
    expect(record.title).toBe('Éthanol =SUM(1) à 1 atm')
    expect(record.nominal_pressure).toBe('101325')
    expect(record.vle_relation).toMatch(/^modified Raoult's law/)
    expect(record.signed_by).toBe('')
  })
})
