/**
 * A dimerising vapour through the product: acetic acid (1) + water (2) at 1 atm under a Hayden–O'Connell virial
 * vapour, where the engine switches to the chemical theory of dimerisation (η = 4.5, packages/thermo/src/virial).
 * Components with their critical and HOC data, a data set, an NRTL fit and the consistency tests, submission and
 * approval by someone else, the engineer's curve at another pressure, the exports and the signed report.
 *
 * Points: INVENTED. Bubble temperatures and vapour compositions of an invented NRTL model (b12 = 1800, b21 = 700
 * J/mol, α = 0.3; no published system) solved by @ebullio/thermo's γ–φ bubble point under the same vapour, with
 * seeded noise (σT = 0.03 K, σy = 0.002). The fit is checked against the invented parameters and against the engine's
 * own answers for the same inputs; the engine is checked against the world in chemical-theory.test.ts and
 * hayden-oconnell.test.ts.
 */
import {
  bubbleTemperature,
  type ActivityModel,
  type BinarySystem,
  type VaporModel,
  type VaporPressureModel,
} from '@ebullio/thermo'
import { seededRandom } from '@ebullio/thermo/random'
import { PDFParse } from 'pdf-parse'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_COMPONENTS, demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { ACETIC_ACID, ACETIC_ACID_ANTOINE } from '../../../db/seeds/acid-scenario.js'
import { DEMO_PROPERTIES } from '../../../db/seeds/demo-properties.js'
import { buildLab, labCounts, type Lab } from './lab-fixture.js'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
let lab: Lab

// Acetic acid as the demo carries it (db/seeds/acid-scenario.ts: Tc, Pc, ω, Vc, dipole from memory; HOC RD 2.595 Å,
// η 4.5 from the HOC tables, from memory; the values of the engine's acid-water.fixture.ts). Its Antoine set:
// log10(P/mmHg) = 7.38782 − 1533.313/(t/°C + 222.309) (Lange's Handbook of Chemistry; from memory). Water: the demo's
// SVNA 7th ed. Table B.2 set.
const ACID_PROPERTIES = ACETIC_ACID.properties
const ACID_ANTOINE: VaporPressureModel = ACETIC_ACID_ANTOINE
const VP: [VaporPressureModel, VaporPressureModel] = [ACID_ANTOINE, demoVaporPressure('water')]
// Water: the demo's record (critical data from chemicals 1.5.2; RD 0.615 Å, η 1.7 from the HOC tables, from memory).
const WATER_PROPERTIES = DEMO_PROPERTIES['7732-18-5']

/** The vapour as the API builds it from the components (checked against the stored fit's options below). */
const VAPOR: VaporModel = {
  kind: 'virial',
  correlation: 'hayden-oconnell',
  eta12: 0,
  components: [
    { Tc: 591.95, Pc: 5.786e6, omega: 0.467, Vc: 177.6, RD: 2.595, dipole: 1.74, eta: 4.5 },
    {
      Tc: WATER_PROPERTIES.Tc!,
      Pc: WATER_PROPERTIES.Pc!,
      omega: WATER_PROPERTIES.omega!,
      Vc: WATER_PROPERTIES.Vc!,
      RD: 0.615,
      dipole: WATER_PROPERTIES.dipole!,
      eta: 1.7,
    },
  ],
}
const INVENTED = { b12: 1800, b21: 700, alpha: 0.3 }
const MODEL: BinarySystem = {
  vaporPressure: VP,
  activity: { kind: 'nrtl', ...INVENTED },
  vapor: VAPOR,
}
const rnd = seededRandom(4519)
const POINTS = [0.03, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.97].map((x1, i) => {
  const b = bubbleTemperature(MODEL, { P: 101325, x1 })
  return {
    sampleLabel: `AW-${String(i + 1).padStart(2, '0')}`,
    temperatureK: Math.round((b.T + 0.03 * rnd.gaussian()) * 100) / 100,
    pressurePa: 101325,
    x1,
    y1: Math.round((b.y1 + 0.002 * rnd.gaussian()) * 1e4) / 1e4,
    x1Uncertainty: 0.002,
    y1Uncertainty: 0.003,
  }
})
const CHEMICAL_THEORY =
  'The vapour dimerises (η ≥ 4.5 for component 1: carboxylic acid). Its fugacity coefficients come from the chemical theory of dimerisation'

let acidId = ''
let systemId = ''
let dataSetId = ''
let nrtlFit: {
  id: string
  parameters: { name: string; value: number; standardError: number }[]
  activity: ActivityModel
  options: { vapor: VaporModel }
  statistics: { rmsT: number; rmsY: number; warnings: string[] }
}

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
}, 60_000)
afterAll(() => t.close())

describe('acetic acid + water under a dimerising vapour', () => {
  it('refuses an η above the maximum, naming the field, and stores nothing', async () => {
    const before = await labCounts(t)
    const r = await lab.admin.post('/api/components').send({
      name: 'acetic acid',
      casNumber: '64-19-7',
      formula: 'C2H4O2',
      molarMass: 60.052,
      properties: { ...ACID_PROPERTIES, associationEta: 10.5 },
    })
    expect(r.status).toBe(422)
    expect(r.body.error.details).toContainEqual({
      path: 'properties.associationEta',
      message: 'The association parameter η must be at most 10',
    })
    expect(await labCounts(t)).toEqual(before)
    expect((await lab.admin.get('/api/components?q=acetic').expect(200)).body.items).toEqual([])
  })

  it('creates the components, the system and a 1 atm data set under the HOC vapour', async () => {
    // molar volume of acetic acid 57.5 cm³/mol: 60.05 g/mol over 1.045 g/cm³ at 25 °C (from memory)
    const acid = await lab.admin.post('/api/components').send({
      name: 'acetic acid',
      casNumber: '64-19-7',
      formula: 'C2H4O2',
      molarMass: 60.052,
      liquidMolarVolume: 57.5,
      properties: ACID_PROPERTIES,
    })
    expect(acid.status, JSON.stringify(acid.body)).toBe(201)
    acidId = acid.body.id
    await lab.lead
      .post(`/api/components/${acidId}/vapor-pressure-sets`)
      .send({ model: ACID_ANTOINE, source: "Lange's Handbook of Chemistry, Antoine table (from memory)" })
      .expect(201)
    const w = DEMO_COMPONENTS.water
    const water = await lab.admin.post('/api/components').send({
      name: w.name,
      casNumber: w.cas,
      formula: w.formula,
      molarMass: w.molarMass,
      liquidMolarVolume: w.molarVolume,
      properties: WATER_PROPERTIES,
    })
    expect(water.status, JSON.stringify(water.body)).toBe(201)
    await lab.lead
      .post(`/api/components/${water.body.id}/vapor-pressure-sets`)
      .send({ model: demoVaporPressure('water'), source: w.source })
      .expect(201)
    const sys = await lab.analyst.post('/api/systems').send({ component1Id: acidId, component2Id: water.body.id })
    expect(sys.status, JSON.stringify(sys.body)).toBe(201)
    systemId = sys.body.id
    const d = await lab.analyst.post('/api/data-sets').send({
      systemId,
      title: 'Acetic acid/water at 1 atm, HOC vapour',
      nominalPressurePa: 101325,
      origin: 'other-method',
      originMethod: 'recirculating still, liquid and condensate by titration',
      vaporModel: { kind: 'virial', correlation: 'hayden-oconnell' },
    })
    expect(d.status, JSON.stringify(d.body)).toBe(201)
    dataSetId = d.body.id
    const added = await lab.analyst
      .post(`/api/data-sets/${dataSetId}/points`)
      .send({ rowVersion: d.body.rowVersion, points: POINTS })
    expect(added.status, JSON.stringify(added.body)).toBe(201)
  })

  it('fits NRTL under the chemical theory, says so, and recovers the invented energies', async () => {
    const r = await lab.analyst.post(`/api/data-sets/${dataSetId}/fits`).send({ models: ['nrtl'], alpha: 0.3 })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    nrtlFit = r.body.fits[0]
    expect(nrtlFit.options.vapor).toMatchObject(VAPOR)
    expect(nrtlFit.statistics.warnings.some((w) => w.startsWith(CHEMICAL_THEORY))).toBe(true)
    const p = (n: string) => nrtlFit.parameters.find((x) => x.name === n)!
    for (const n of ['b12', 'b21'] as const) {
      // within three standard errors of the invented value, and the standard error below 150 J/mol
      expect(Math.abs(p(n).value - INVENTED[n])).toBeLessThan(3 * p(n).standardError)
      expect(p(n).standardError).toBeLessThan(150)
    }
    // the residuals are the noise put in (σT = 0.03 K, σy = 0.002, then rounded)
    expect(nrtlFit.statistics.rmsT).toBeLessThan(0.06)
    expect(nrtlFit.statistics.rmsY).toBeLessThan(0.004)
  })

  it('runs the consistency tests under the same vapour', async () => {
    const r = await lab.analyst.post(`/api/data-sets/${dataSetId}/consistency`).send({ model: 'nrtl' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const d = (await lab.analyst.get(`/api/data-sets/${dataSetId}`).expect(200)).body
    const point = d.consistency.find((c: { test: string }) => c.test === 'point')
    expect(point.result.model).toBe('nrtl')
    expect(point.result.vaporModel).toEqual({ kind: 'virial', correlation: 'hayden-oconnell', poynting: false })
    // the point test's own NRTL fit lands near the invented energies too, and its |Δy| is the noise put in
    expect(Math.abs(point.result.activity.b12 - INVENTED.b12)).toBeLessThan(100)
    expect(Math.abs(point.result.activity.b21 - INVENTED.b21)).toBeLessThan(100)
    expect(point.result.meanAbsDeltaY).toBeLessThan(0.003)
    // Herington's area test passes under the dimerising vapour (D below the usual limit of 10; common practice)
    const area = d.consistency.find((c: { test: string }) => c.test === 'herington-area')
    expect(area.passed).toBe(true)
    expect(area.result.D).toBeLessThan(10)
  })

  it('is submitted, approved by a lead who did not make it, and the engineer’s curve at 50 kPa is the engine’s', async () => {
    const before = (await lab.analyst.get(`/api/data-sets/${dataSetId}`).expect(200)).body
    await lab.analyst.post(`/api/data-sets/${dataSetId}/submit`).send({ rowVersion: before.rowVersion }).expect(200)
    const rec = await lab.lead
      .post(`/api/data-sets/${dataSetId}/recommended-fit`)
      .send({ fitId: nrtlFit.id })
      .expect(200)
    const ok = await lab.lead
      .post(`/api/data-sets/${dataSetId}/approve`)
      .send({ password: PASSWORD, reason: 'NRTL under the dimerising vapour.', rowVersion: rec.body.rowVersion })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    const r = await lab.engineer
      .get(`/api/data-sets/${dataSetId}/curve`)
      .query({ pressure: 50, unit: 'kPa', points: 21 })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    const { diagram } = r.body as { diagram: { x1: number[]; T: number[]; y1: number[] } }
    const engine: BinarySystem = { vaporPressure: VP, activity: nrtlFit.activity, vapor: nrtlFit.options.vapor }
    let compared = 0
    diagram.x1.forEach((x1, i) => {
      if (x1 <= 0 || x1 >= 1) return
      const b = bubbleTemperature(engine, { P: 50000, x1 })
      expect(Math.abs(diagram.T[i] - b.T)).toBeLessThan(1e-6)
      expect(Math.abs(diagram.y1[i] - b.y1)).toBeLessThan(1e-6)
      compared++
    })
    expect(compared).toBeGreaterThan(10)
    expect(r.body.caution).toContain("γ–φ, virial vapour (Hayden–O'Connell)")
  })

  it('names Hayden–O’Connell and the chemical theory in the parameters export and the signed report', async () => {
    const json = (await lab.engineer.get(`/api/data-sets/${dataSetId}/export/parameters.json`).expect(200)).body
    const relation: string = json.dataSet?.vleRelation ?? json.vleRelation
    expect(relation).toContain("Hayden-O'Connell second virial coefficients")
    expect(relation).toContain('the chemical theory of dimerisation')
    const f = json.fits.find((x: { id: string }) => x.id === nrtlFit.id)
    expect(f.parameters.find((p: { name: string }) => p.name === 'b12').value).toBe(nrtlFit.parameters[0].value)
    const csv = (await lab.engineer.get(`/api/data-sets/${dataSetId}/export/parameters.csv`).expect(200)).text
    expect(csv).toContain('virial hayden-oconnell; poynting=false')
    expect(csv).toContain('RD1=2.595 A; mu1=1.74 D; eta1=4.5')
    expect(csv).toContain('the chemical theory of dimerisation')
    const res = await lab.engineer.get(`/api/data-sets/${dataSetId}/report.pdf`).responseType('blob').expect(200)
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) })
    const text = (await parser.getText()).text.replace(/\s+/g, ' ')
    await parser.destroy()
    expect(text).toContain('Vapour model virial gas, Hayden–O’Connell second virial coefficients')
    // the fit's line says which treatment of the vapour ran (its vapour carries the components' η)
    expect(text).toContain(
      'Vapour: virial gas, Hayden–O’Connell second virial coefficients; carboxylic acid (η ≥ 4.5): fugacity coefficients by the chemical theory of dimerisation.',
    )
    // the signature: approved by the lead, who neither made nor submitted the data set
    expect(text).toContain('Tobias Lead Approved')
    expect(text).toContain('NRTL under the dimerising vapour.')
  })
})
