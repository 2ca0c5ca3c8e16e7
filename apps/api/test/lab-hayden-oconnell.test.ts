/**
 * The Hayden–O'Connell virial vapour over HTTP: the components' radius of gyration and association parameter (with
 * its source), the data set's correlation choice with the unlike pair's η12, fits computed with it, and every
 * refusal naming what is wrong. Points are INVENTED (bubble pressures of the demo's acetone (1)/methanol (2) Wilson
 * model at 55 °C, SVNA 7th ed. Table 12.5 parameters, computed by @ebullio/thermo and rounded); expected fit results
 * are the engine's own answers for the same inputs, so the API is checked against the engine and the engine against
 * the world in packages/thermo/src/virial/hayden-oconnell.test.ts.
 */
import { bubblePressure, fitBinary, type VaporModel } from '@ebullio/thermo'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_COMPONENTS, demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { DEMO_PROPERTIES } from '../../../db/seeds/demo-properties.js'
import { ACETONE_METHANOL, buildLab, labCounts, type Lab } from './lab-fixture.js'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
let lab: Lab
const comp: Record<string, { id: string; rowVersion: number }> = {}
const T = 328.15
const VP = [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as const
const XS = [0.05, 0.2, 0.4, 0.6, 0.8, 0.95]

// HOC parameters: mean radius of gyration (Å) and association η of acetone (2.740, 0.9) and methanol (1.536, 1.63),
// the tables of Hayden & O'Connell, Ind. Eng. Chem. Process Des. Dev. 14 (1975) 209 (from memory). The dipoles are
// the demo's (chemicals 1.5.2).
const HOC_SOURCE = 'Hayden & O’Connell, Ind. Eng. Chem. Process Des. Dev. 14 (1975) 209 (from memory)'
const acetoneHoc = { ...DEMO_PROPERTIES['67-64-1'], radiusOfGyration: 2.74, associationEta: 0.9 }
// methanol's critical data without the HOC fields (the demo's own record carries them)
const {
  radiusOfGyration: _rd,
  associationEta: _eta,
  associationSource: _src,
  ...methanolCritical
} = DEMO_PROPERTIES['67-56-1']
const methanolHoc = { ...methanolCritical, radiusOfGyration: 1.536, associationEta: 1.63 }

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  for (const c of (await lab.admin.get('/api/components?pageSize=100')).body.items)
    comp[c.name] = { id: c.id, rowVersion: c.rowVersion }
})
afterAll(() => t.close())

async function setProperties(name: string, properties: Record<string, unknown>) {
  const r = await lab.admin
    .patch(`/api/components/${comp[name].id}`)
    .send({ rowVersion: comp[name].rowVersion, properties })
  if (r.status === 200) comp[name].rowVersion = r.body.rowVersion
  return r
}

function modelPoints() {
  return XS.map((x1, i) => {
    const b = bubblePressure({ vaporPressure: [...VP], activity: ACETONE_METHANOL.activity }, { T, x1 })
    return {
      sampleLabel: `H-${i + 1}`,
      temperatureK: T,
      pressurePa: Math.round(b.P),
      x1,
      y1: Math.round(b.y1 * 1e4) / 1e4,
      x1Uncertainty: 0.002,
      y1Uncertainty: 0.003,
    }
  })
}

const newSet = (title: string, vaporModel: unknown) =>
  lab.analyst.post('/api/data-sets').send({
    systemId: lab.systemId,
    title,
    layout: 'pxy',
    nominalTemperatureK: T,
    origin: 'other-method',
    originMethod: 'static cell, liquid by refractive index, vapour by GC',
    vaporModel,
  })

describe("component properties for Hayden–O'Connell", () => {
  it('stores the radius of gyration, η and its source as entered; markup and formulas in the source stay text', async () => {
    const hostile = `${HOC_SOURCE} <img src=x onerror=alert(1)> =HYPERLINK("http://x")`
    const r = await setProperties('acetone', { ...acetoneHoc, associationSource: hostile })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    const read = (await lab.analyst.get(`/api/components/${comp.acetone.id}`).expect(200)).body
    const props = (read.component ?? read).properties
    expect(props).toMatchObject({ radiusOfGyration: 2.74, associationEta: 0.9, associationSource: hostile })
  })

  it('refuses bad numbers, η without a source, NUL and overlong text, naming the field, and changes nothing', async () => {
    const before = comp.methanol.rowVersion
    const cases: [Record<string, unknown>, number, string, string][] = [
      [
        { radiusOfGyration: -1 },
        422,
        'properties.radiusOfGyration',
        'The mean radius of gyration cannot be negative (Å)',
      ],
      [
        { radiusOfGyration: '1.5' },
        422,
        'properties.radiusOfGyration',
        'The mean radius of gyration must be a number (Å)',
      ],
      [
        { associationEta: 1.63 },
        422,
        'properties.associationSource',
        'Name the source of the association parameter η (paper and table)',
      ],
      [
        { associationEta: 12, associationSource: 's' },
        422,
        'properties.associationEta',
        'The association parameter η must be at most 10',
      ],
      [
        { associationEta: 1, associationSource: 'z'.repeat(5000) },
        422,
        'properties.associationSource',
        'Keep the source of η under 500 characters',
      ],
    ]
    for (const [extra, status, path, message] of cases) {
      const r = await setProperties('methanol', { ...methanolCritical, ...extra })
      expect(r.status).toBe(status)
      expect(r.body.error.details).toContainEqual({ path, message })
    }
    const nul = await setProperties('methanol', { ...methanolHoc, associationSource: 'table\u00002' })
    expect(nul.status).toBe(400)
    expect(nul.body.error.code).toBe('invalid_text')
    expect(nul.body.error.message).toContain('body.properties.associationSource')
    const read = (await lab.analyst.get(`/api/components/${comp.methanol.id}`).expect(200)).body
    expect((read.component ?? read).rowVersion).toBe(before)
    expect((read.component ?? read).properties?.radiusOfGyration).toBeUndefined()
  })
})

describe("a data set with a Hayden–O'Connell vapour", () => {
  it('is refused while a component lacks its radius of gyration, naming it, and nothing is stored', async () => {
    expect((await setProperties('methanol', methanolCritical)).status).toBe(200)
    const before = await labCounts(t)
    const r = await newSet('HOC too early', { kind: 'virial', correlation: 'hayden-oconnell' })
    expect(r.status).toBe(422)
    expect(r.body.error.code).toBe('missing_critical_data')
    expect(r.body.error.message).toBe(
      "A Hayden–O'Connell virial vapour needs each component's critical data and mean radius of gyration; missing — methanol: mean radius of gyration RD. Enter them on the components screen (with their source) or choose the ideal vapour.",
    )
    expect(await labCounts(t)).toEqual(before)
  })

  it('refuses η12 under Tsonopoulos, η12 without a source, and a correlation it does not know', async () => {
    for (const [vaporModel, path, message] of [
      [
        { kind: 'virial', eta12: 1.2, eta12Source: 's' },
        'vaporModel.eta12',
        "The solvation parameter η12 belongs to Hayden–O'Connell; Tsonopoulos does not use it",
      ],
      [
        { kind: 'virial', correlation: 'hayden-oconnell', eta12: 1.2 },
        'vaporModel.eta12Source',
        'Name the source of the solvation parameter η12 (paper and table)',
      ],
      [
        { kind: 'virial', correlation: '=cmd|"/c calc"!A1' },
        'vaporModel.correlation',
        "The virial correlation must be 'tsonopoulos' or 'hayden-oconnell'",
      ],
    ] as const) {
      const r = await newSet('Bad vapour', vaporModel)
      expect(r.status).toBe(422)
      expect(r.body.error.details).toContainEqual({ path, message })
    }
  })

  it('is refused by the engine when an η is too large for the molecule (ε/k < 0), with its reason', async () => {
    expect(
      (
        await setProperties('methanol', {
          ...methanolHoc,
          radiusOfGyration: 0.3,
          associationEta: 4.5,
          associationSource: HOC_SOURCE,
        })
      ).status,
    ).toBe(200)
    const r = await newSet('HOC with a bad η', { kind: 'virial', correlation: 'hayden-oconnell' })
    expect(r.status).toBe(422)
    expect(r.body.error.code).toBe('invalid_vapour_model')
    expect(r.body.error.message).toBe(
      "Hayden–O'Connell gives component 2 no positive energy parameter ε/k from RD 0.3 Å and η 4.5: an association parameter this large needs a larger molecule; check RD and η.",
    )
  })

  it('fits with the correlation, η and η12 it was given, as the engine does, and says so in the exports', async () => {
    expect((await setProperties('methanol', { ...methanolHoc, associationSource: HOC_SOURCE })).status).toBe(200)
    const eta12Source = 'invented for this test <b>not published</b>'
    const choice = { kind: 'virial', correlation: 'hayden-oconnell', eta12: 1.2, eta12Source }
    const d = await newSet('Acetone/methanol, HOC vapour', choice)
    expect(d.status, JSON.stringify(d.body)).toBe(201)
    const pts = modelPoints()
    const added = await lab.analyst
      .post(`/api/data-sets/${d.body.id}/points`)
      .send({ rowVersion: d.body.rowVersion, points: pts })
    expect(added.status, JSON.stringify(added.body)).toBe(201)
    const detail = (await lab.analyst.get(`/api/data-sets/${d.body.id}`).expect(200)).body
    expect(detail.vaporModel).toEqual({ ...choice, poynting: false })
    const fit = (
      await lab.analyst
        .post(`/api/data-sets/${d.body.id}/fits`)
        .send({ models: ['wilson'] })
        .expect(201)
    ).body.fits[0]
    const vapor = fit.options.vapor as VaporModel
    expect(vapor).toMatchObject({
      kind: 'virial',
      correlation: 'hayden-oconnell',
      eta12: 1.2,
      components: [
        { Tc: 508.1, RD: 2.74, dipole: 2.88, eta: 0.9 },
        { Tc: 513.38, RD: 1.536, dipole: 1.7, eta: 1.63 },
      ],
    })
    const engine = fitBinary({
      model: 'wilson',
      objective: 'bubble-pressure',
      V1: DEMO_COMPONENTS.acetone.molarVolume!,
      V2: DEMO_COMPONENTS.methanol.molarVolume!,
      vaporPressure: [...VP],
      vapor,
      points: pts.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1 })),
    })
    expect(engine.vaporModel).toBe('virial-hayden-oconnell')
    const value = (ps: { name: string; value: number }[], n: string) => ps.find((p) => p.name === n)!.value
    for (const n of ['a12', 'a21']) expect(value(fit.parameters, n)).toBeCloseTo(value(engine.parameters, n), 3)
    // the same data under Tsonopoulos give other energies: the choice reaches the computation
    const tso = fitBinary({
      model: 'wilson',
      objective: 'bubble-pressure',
      V1: DEMO_COMPONENTS.acetone.molarVolume!,
      V2: DEMO_COMPONENTS.methanol.molarVolume!,
      vaporPressure: [...VP],
      vapor: {
        kind: 'virial',
        correlation: 'tsonopoulos',
        components: vapor.kind === 'virial' ? vapor.components : ([] as never),
      },
      points: pts.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1 })),
    })
    expect(Math.abs(value(fit.parameters, 'a12') - value(tso.parameters, 'a12'))).toBeGreaterThan(0.5)
    // the exports name the correlation and every number it used; the hostile η12 source stays text in the detail
    const csv = (await lab.analyst.get(`/api/data-sets/${d.body.id}/export/parameters.csv`).expect(200)).text
    expect(csv).toContain('virial hayden-oconnell; poynting=false')
    expect(csv).toContain('RD1=2.74 A; mu1=2.88 D; eta1=0.9')
    expect(csv).toContain('eta12=1.2')
    const json = (await lab.analyst.get(`/api/data-sets/${d.body.id}/export/parameters.json`).expect(200)).body
    expect(json.dataSet?.vleRelation ?? json.vleRelation).toContain("Hayden-O'Connell second virial coefficients")
    expect(detail.vaporModel.eta12Source).toBe(eta12Source)
  })
})
