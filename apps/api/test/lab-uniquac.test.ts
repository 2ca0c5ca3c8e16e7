/**
 * UNIQUAC as a fitted model of a data set, over HTTP: r and q from the components (refused, naming what is missing,
 * when a component lacks them), the fit equal to the engine's for the same inputs, stored with its r and q, in the
 * parameters export, the consistency tests and the printed report.
 *
 * Points: INVENTED, T–x–y at 1 atm from the demo's acetone (1)/methanol (2) Wilson model (SVNA 7th ed. Table 12.5
 * parameters, Table B.2 Antoine constants) with seeded noise. UNIQUAC r and q of acetone (2.5735, 2.336) and
 * methanol (1.4311, 1.432): the usual tabulated values (from memory).
 */
import { bubbleTemperature, fitBinary, type ActivityModel } from '@ebullio/thermo'
import { seededRandom } from '@ebullio/thermo/random'
import { PDFParse } from 'pdf-parse'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { ACETONE_METHANOL, buildLab, type Lab } from './lab-fixture.js'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
let lab: Lab
const VP = [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as [
  ReturnType<typeof demoVaporPressure>,
  ReturnType<typeof demoVaporPressure>,
]
const RQ = { acetone: { uniquacR: 2.5735, uniquacQ: 2.336 }, methanol: { uniquacR: 1.4311, uniquacQ: 1.432 } }
const STRUCTURE = { r1: 2.5735, r2: 1.4311, q1: 2.336, q2: 1.432 }
const rnd = seededRandom(71)
const POINTS = [0.05, 0.15, 0.25, 0.35, 0.5, 0.6, 0.7, 0.8, 0.9].map((x1, i) => {
  const b = bubbleTemperature(
    { vaporPressure: VP, activity: ACETONE_METHANOL.activity as ActivityModel },
    { P: 101325, x1 },
  )
  return {
    sampleLabel: `U${i + 1}`,
    temperatureK: Math.round((b.T + 0.05 * rnd.gaussian()) * 100) / 100,
    pressurePa: 101325,
    x1,
    y1: Math.round((b.y1 + 0.003 * rnd.gaussian()) * 1e4) / 1e4,
    x1Uncertainty: 0.002,
    y1Uncertainty: 0.003,
  }
})
let id = ''
let rowVersion = 0

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await lab.analyst.post('/api/data-sets').send({
    systemId: lab.systemId,
    title: 'UNIQUAC check',
    nominalPressurePa: 101325,
    origin: 'other-method',
    originMethod: 'ebulliometer',
  })
  expect(d.status, JSON.stringify(d.body)).toBe(201)
  id = d.body.id
  const r = await lab.analyst
    .post(`/api/data-sets/${id}/points`)
    .send({ rowVersion: d.body.rowVersion, points: POINTS })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  rowVersion = r.body.rowVersion
}, 60_000)
afterAll(() => t.close())

async function setRq(name: 'acetone' | 'methanol') {
  const c = (await lab.admin.get('/api/components?pageSize=100')).body.items.find(
    (x: { name: string }) => x.name === name,
  )
  const u = await lab.admin.patch(`/api/components/${c.id}`).send({
    rowVersion: c.rowVersion,
    properties: { ...(c.properties ?? {}), ...RQ[name], source: 'UNIQUAC r, q: usual tabulated values (from memory)' },
  })
  expect(u.status, JSON.stringify(u.body)).toBe(200)
}

describe('UNIQUAC fits', () => {
  it('is refused, naming each component and what it lacks, and nothing is stored', async () => {
    const r = await lab.analyst.post(`/api/data-sets/${id}/fits`).send({ models: ['wilson', 'uniquac'] })
    expect(r.status).toBe(422)
    expect(r.body.error.code).toBe('missing_uniquac_data')
    expect(r.body.error.message).toBe(
      "A UNIQUAC fit needs each component's r and q; missing — acetone: UNIQUAC r, UNIQUAC q; methanol: UNIQUAC r, UNIQUAC q. Enter them on the components screen (with their source).",
    )
    const d = (await lab.analyst.get(`/api/data-sets/${id}`).expect(200)).body
    expect(d.fits).toEqual([])
    expect(d.rowVersion).toBe(rowVersion)
  })

  it("fits with the components' r and q: the engine's parameters for the same inputs, stored with r and q", async () => {
    await setRq('acetone')
    await setRq('methanol')
    const r = await lab.analyst.post(`/api/data-sets/${id}/fits`).send({ models: ['uniquac'] })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const fit = r.body.fits[0]
    expect(fit.model).toBe('uniquac')
    expect(fit.options.uniquac).toEqual(STRUCTURE)
    expect(fit.activity).toMatchObject({ kind: 'uniquac', ...STRUCTURE })
    const e = fitBinary({
      model: 'uniquac',
      uniquac: STRUCTURE,
      vaporPressure: VP,
      points: POINTS.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1 })),
    })
    expect(fit.parameters.map((p: { name: string }) => p.name)).toEqual(['a12', 'a21'])
    fit.parameters.forEach((p: { value: number; standardError: number }, i: number) => {
      expect(p.value).toBeCloseTo(e.parameters[i].value, 4)
      expect(p.standardError).toBeCloseTo(e.parameters[i].standardError!, 4)
    })
    expect(fit.statistics.rmsT).toBeCloseTo(e.rmsT, 9)
    // the data came from a Wilson model: UNIQUAC reproduces them within the noise
    expect(fit.statistics.rmsT).toBeLessThan(0.15)
    expect(fit.statistics.rmsY).toBeLessThan(0.006)
    // its band runs on the stored fit (r and q kept with it)
    const band = (await lab.analyst.get(`/api/data-sets/${id}/fits/${fit.id}/band`).query({ points: 5 }).expect(200))
      .body
    expect(band).toMatchObject({ model: 'uniquac', kind: 'isobaric', P: 101325 })
    expect(band.T[2]).toBeCloseTo(bubbleTemperature(e.system, { P: 101325, x1: band.x1[2] }).T, 6)
  })

  it('is a model of the consistency tests too', async () => {
    const r = await lab.analyst.post(`/api/data-sets/${id}/consistency`).send({ model: 'uniquac' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const d = (await lab.analyst.get(`/api/data-sets/${id}`).expect(200)).body
    const point = d.consistency.find((c: { test: string }) => c.test === 'point')
    expect(point.result.model).toBe('uniquac')
    expect(point.result.meanAbsDeltaY).toBeLessThan(0.01)
  })

  it('exports its equation, parameters and r, q, and the report prints them', async () => {
    const d = (await lab.analyst.get(`/api/data-sets/${id}`).expect(200)).body
    const fit = d.fits.find((f: { model: string }) => f.model === 'uniquac')
    const json = (await lab.analyst.get(`/api/data-sets/${id}/export/parameters.json`).expect(200)).body
    const f = json.fits.find((x: { id: string }) => x.id === fit.id)
    expect(f.label).toBe('UNIQUAC')
    expect(f.equation).toMatch(/^UNIQUAC \(z = 10\): tau12 = exp\(-a12\/\(R T\)\)/)
    expect(f.parameters.map((p: { name: string; unit: string }) => [p.name, p.unit])).toEqual([
      ['a12', 'J/mol'],
      ['a21', 'J/mol'],
    ])
    // (jsonb keeps object keys in its own order: compare by name)
    expect([...f.held].sort((a: { name: string }, b: { name: string }) => a.name.localeCompare(b.name))).toEqual([
      { name: 'q1', value: 2.336, unit: '1' },
      { name: 'q2', value: 1.432, unit: '1' },
      { name: 'r1', value: 2.5735, unit: '1' },
      { name: 'r2', value: 1.4311, unit: '1' },
    ])
    const res = await lab.analyst.get(`/api/data-sets/${id}/report.pdf`).responseType('blob').expect(200)
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) })
    const text = (await parser.getText()).text.replace(/\s+/g, ' ')
    await parser.destroy()
    const a12 = fit.parameters[0]
    expect(text).toContain(
      `a12 = ${a12.value.toPrecision(6).replace(/^-/, '−')} ± ${a12.standardError.toPrecision(3)} J/mol`,
    )
    expect(text).toContain('r1 = 2.574, r2 = 1.431, q1 = 2.336, q2 = 1.432 (components)')
    expect(text).toContain('mean |Δy₁| =')
    expect(text).toContain('(UNIQUAC)')
  })
})
