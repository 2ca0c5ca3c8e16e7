/**
 * Isothermal data, data without vapour compositions, and the vapour model chosen per data set, over HTTP.
 * Points are INVENTED: bubble pressures of the demo's acetone (1)/methanol (2) Wilson model (SVNA 7th ed. Table 12.5
 * parameters) at 55 °C computed by @ebullio/thermo and rounded, so the model that made them is known. Expected fit
 * results are the engine's own answers for the same inputs (fitBinary called here), so the API is checked against
 * the engine, and the engine against the world in packages/thermo's reference tests.
 */
import { bubblePressure, fitBinary, predictionBandIsothermal, type VaporModel } from '@ebullio/thermo'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_COMPONENTS, demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { DEMO_PROPERTIES } from '../../../db/seeds/demo-properties.js'
import { signedContentV2 } from '../src/services/digest.js'
import { ACETONE_METHANOL, buildLab, csv, labCounts, type Lab } from './lab-fixture.js'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
let lab: Lab
const comp: Record<string, { id: string; rowVersion: number }> = {}
const T = 328.15
const WILSON = ACETONE_METHANOL.activity
const VP = [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as const
const XS = [0.05, 0.12, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95]

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  for (const c of (await lab.admin.get('/api/components?pageSize=100')).body.items)
    comp[c.name] = { id: c.id, rowVersion: c.rowVersion }
})
afterAll(() => t.close())

/** P–x–y points of the model at T, P rounded to 1 Pa and y1 to 0.0001 (a table would print about that). */
function modelPoints(raise: Record<number, number> = {}) {
  return XS.map((x1, i) => {
    const b = bubblePressure({ vaporPressure: [...VP], activity: WILSON }, { T, x1 })
    return {
      sampleLabel: `I-${String(i + 1).padStart(2, '0')}`,
      temperatureK: T,
      pressurePa: Math.round(b.P) + (raise[i] ?? 0),
      x1,
      y1: Math.round(b.y1 * 1e4) / 1e4,
      x1Uncertainty: 0.002,
      y1Uncertainty: 0.003,
    }
  })
}

async function isothermalSet(title: string, extra: Record<string, unknown> = {}) {
  const r = await lab.analyst.post('/api/data-sets').send({
    systemId: lab.systemId,
    title,
    layout: 'pxy',
    nominalTemperatureK: T,
    origin: 'other-method',
    originMethod: 'static cell, liquid by refractive index, vapour by GC',
    ...extra,
  })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return r.body as { id: string; rowVersion: number }
}

async function addPoints(d: { id: string; rowVersion: number }, points: unknown[]) {
  const r = await lab.analyst.post(`/api/data-sets/${d.id}/points`).send({ rowVersion: d.rowVersion, points })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return r.body.rowVersion as number
}

const engineFit = (points: ReturnType<typeof modelPoints>, vapor?: VaporModel) =>
  fitBinary({
    model: 'wilson',
    objective: 'bubble-pressure',
    V1: DEMO_COMPONENTS.acetone.molarVolume!,
    V2: DEMO_COMPONENTS.methanol.molarVolume!,
    vaporPressure: [...VP],
    ...(vapor ? { vapor } : {}),
    points: points.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1 })),
  })

describe('isothermal data sets', () => {
  it('needs the temperature of isothermal data and the pressure of isobaric data', async () => {
    const before = await labCounts(t)
    const noT = await lab.analyst
      .post('/api/data-sets')
      .send({ systemId: lab.systemId, title: 'Static cell', layout: 'pxy', origin: 'other-method', originMethod: 'RI' })
    expect(noT.status).toBe(422)
    expect(noT.body.error.details).toContainEqual(
      expect.objectContaining({ message: 'Isothermal data need the temperature they were measured at.' }),
    )
    const noP = await lab.analyst.post('/api/data-sets').send({ systemId: lab.systemId, title: 'Ebulliometer' })
    expect(noP.status).toBe(422)
    expect(noP.body.error.details).toContainEqual(
      expect.objectContaining({ message: 'Isobaric data need the nominal pressure.' }),
    )
    expect(await labCounts(t)).toEqual(before)
    const d = await isothermalSet('Acetone/methanol at 55 °C')
    const got = (await lab.analyst.get(`/api/data-sets/${d.id}`).expect(200)).body
    expect(got).toMatchObject({
      layout: 'pxy',
      nominalTemperatureK: T,
      nominalPressurePa: null,
      vaporModel: { kind: 'ideal' },
    })
  })

  it('a point raised by 100 Pa has a pressure residual of about +100 Pa, as the engine computes it', async () => {
    const raised = modelPoints({ 4: 100 })
    const d = await isothermalSet('Raised point')
    await addPoints(d, raised)
    const r = await lab.analyst.post(`/api/data-sets/${d.id}/fits`).send({ models: ['wilson'] })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const fit = r.body.fits[0]
    expect(fit.options.objective).toBe('bubble-pressure')
    const detail = (await lab.analyst.get(`/api/data-sets/${d.id}`).expect(200)).body
    const byLabel = new Map(detail.points.map((p: { id: string; sampleLabel: string }) => [p.id, p.sampleLabel]))
    const res = new Map((fit.residuals as { pointId: string; dP: number }[]).map((x) => [byLabel.get(x.pointId), x.dP]))
    const engine = engineFit(raised)
    // the same number as the engine's for the same inputs …
    raised.forEach((p, i) => expect(res.get(p.sampleLabel)).toBeCloseTo(engine.residuals[i].dP!, 6))
    // … and about +100 Pa for the raised point (the fit leans a little towards it), near 0 elsewhere
    expect(res.get('I-05')).toBeGreaterThan(60)
    expect(res.get('I-05')).toBeLessThan(105)
    for (const [label, dP] of res) if (label !== 'I-05') expect(Math.abs(dP!)).toBeLessThan(40)
  })

  it('a point 60 Pa off among noisy y₁ is flagged by the ±2σ rule on ΔP alone, and the signature keeps it', async () => {
    // Invented scatter: ±8–12 Pa on P and ±0.004–0.007 on y₁ (so the fit's own studentized test, which weighs ΔP and
    // Δy₁ together, does not flag the point); I-05 is raised by 60 Pa more. The rule judges each residual against its
    // own RMS over the included points (|ΔP| above 2 × RMS; common practice, no source), so I-05 is flagged.
    const dP = [10, -12, 8, -10, 60, 12, -8, 10, -12, 8, -10]
    const dy = [0.006, -0.007, 0.005, -0.006, 0.004, 0.007, -0.005, 0.006, -0.007, 0.005, -0.006]
    const pts = modelPoints().map((p, i) => ({
      ...p,
      pressurePa: p.pressurePa + dP[i],
      y1: Math.round((p.y1 + dy[i]) * 1e4) / 1e4,
    }))
    const d = await isothermalSet('Scattered, one pressure off')
    await addPoints(d, pts)
    const fits = await lab.analyst.post(`/api/data-sets/${d.id}/fits`).send({ models: ['wilson'] })
    expect(fits.status, JSON.stringify(fits.body)).toBe(201)
    const fit = fits.body.fits[0]
    const detail = (await lab.analyst.get(`/api/data-sets/${d.id}`).expect(200)).body
    const off = detail.points.find((p: { sampleLabel: string }) => p.sampleLabel === 'I-05').id
    const res = fit.residuals as { pointId: string; dP: number; dy: number; flagged?: boolean }[]
    expect(res.some((r) => r.flagged)).toBe(false) // the fit's own test is quiet
    const rms = (v: number[]) => Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length)
    const rmsP = rms(res.map((r) => r.dP))
    expect(res.filter((r) => Math.abs(r.dP) > 2 * rmsP).map((r) => r.pointId)).toEqual([off])
    expect(res.filter((r) => Math.abs(r.dy) > 2 * rms(res.map((x) => x.dy)))).toEqual([])
    await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: fits.body.rowVersion }).expect(200)
    const rec = await lab.lead.post(`/api/data-sets/${d.id}/recommended-fit`).send({ fitId: fit.id }).expect(200)
    await lab.lead
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ password: PASSWORD, reason: 'Wilson on P–x–y.', rowVersion: rec.body.rowVersion })
      .expect(200)
    const signed = (await lab.reviewer.get(`/api/data-sets/${d.id}`).expect(200)).body.approvals[0].outliers
    expect(signed.sampleLabels).toEqual(['I-05'])
    expect(signed.rule).toBe('flagged by the fit, or |ΔT|, |ΔP| or |Δy₁| above 2 × RMS of the included points')
  })

  it('reads a point sheet with σP in the row’s pressure unit and keeps it in Pa', async () => {
    const d = await isothermalSet('Sheet with σP')
    const sheet = 'sample,t,t_unit,p,p_unit,x1,y1,u_p\nS-1,55,C,80.123,kPa,0.3,0.45,0.05\nS-2,55,C,82.5,kPa,0.5,0.55,\n'
    const r = await csv(lab.analyst.post(`/api/data-sets/${d.id}/point-sheets`), sheet, 'sheet.csv').field(
      'rowVersion',
      String(d.rowVersion),
    )
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const pts = (await lab.analyst.get(`/api/data-sets/${d.id}`).expect(200)).body.points
    expect(pts.map((p: { pressureUncertaintyPa: number | null }) => p.pressureUncertaintyPa)).toEqual([50, null])
    const bad = 'sample,t,t_unit,p,p_unit,x1,y1,u_p\nS-3,55,C,80,kPa,0.3,0.45,=cmd|x\n'
    const before = await labCounts(t)
    const refused = await csv(lab.analyst.post(`/api/data-sets/${d.id}/point-sheets/preview`), bad, 'bad.csv')
    expect(refused.body.problems).toContainEqual(
      expect.objectContaining({ row: 2, column: 'u_p', message: '"=cmd|x" is not a number.' }),
    )
    expect(await labCounts(t)).toEqual(before)
  })
})

describe('data without vapour compositions', () => {
  it('accepts P–x points, fits them by Barker’s method and says why the y tests cannot run', async () => {
    const r = await lab.analyst.post('/api/data-sets').send({
      systemId: lab.systemId,
      title: 'P–x only',
      layout: 'px',
      nominalTemperatureK: T,
      origin: 'other-method',
      originMethod: 'static cell, liquid by weighing',
    })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const withY = await lab.analyst
      .post(`/api/data-sets/${r.body.id}/points`)
      .send({ rowVersion: r.body.rowVersion, points: modelPoints().slice(0, 2) })
    expect(withY.status).toBe(422)
    expect(withY.body.error.details[0].message).toBe('A P–x data set has no vapour composition; leave y1 empty.')
    const pts = modelPoints().map((p) => ({ ...p, y1: null, y1Uncertainty: null }))
    await addPoints(r.body, pts)
    const f = await lab.analyst.post(`/api/data-sets/${r.body.id}/fits`).send({ models: ['wilson'] })
    expect(f.status, JSON.stringify(f.body)).toBe(201)
    expect(f.body.fits[0].statistics.method).toBe('barker')
    expect(f.body.fits[0].residuals.every((x: { dy: number | null }) => x.dy === null)).toBe(true)
    // from P–x alone Barker's method recovers the Wilson energies the points were made with (within 5 %)
    const a12 = f.body.fits[0].parameters.find((p: { name: string }) => p.name === 'a12').value
    expect(a12).toBeCloseTo((WILSON as { a12: number }).a12, -1.5)
    const c = await lab.analyst.post(`/api/data-sets/${r.body.id}/consistency`).send({ model: 'wilson' })
    expect(c.status, JSON.stringify(c.body)).toBe(201)
    const notRun = new Map(c.body.notRun.map((n: { test: string; reason: string }) => [n.test, n.reason]))
    expect([...notRun.keys()].sort()).toEqual(expect.arrayContaining(['area', 'point']))
    for (const why of notRun.values()) expect(why).toMatch(/vapour|y1|y/i)
  })
})

describe('the vapour model of a data set', () => {
  it('refuses a virial vapour naming each missing critical property and its component, and changes nothing', async () => {
    const d = await isothermalSet('Virial wanted')
    const before = await labCounts(t)
    const r = await lab.analyst
      .patch(`/api/data-sets/${d.id}`)
      .send({ rowVersion: d.rowVersion, vaporModel: { kind: 'virial', poynting: false } })
    expect(r.status).toBe(422)
    expect(r.body.error.code).toBe('missing_critical_data')
    expect(r.body.error.message).toBe(
      "A virial vapour needs each component's critical data; missing — acetone: critical temperature Tc, critical pressure Pc, acentric factor ω, critical volume Vc; methanol: critical temperature Tc, critical pressure Pc, acentric factor ω, critical volume Vc. Enter them on the components screen (with their source) or choose the ideal vapour.",
    )
    expect(await labCounts(t)).toEqual(before)
    // acetone's constants entered: only methanol is named now, and only what it lacks
    const { Vc: _vc, ...noVc } = DEMO_PROPERTIES['67-56-1']
    for (const [name, props] of [
      ['acetone', DEMO_PROPERTIES['67-64-1']],
      ['methanol', noVc],
    ] as const) {
      const u = await lab.admin
        .patch(`/api/components/${comp[name].id}`)
        .send({ rowVersion: comp[name].rowVersion, properties: props })
      expect(u.status, JSON.stringify(u.body)).toBe(200)
      comp[name].rowVersion = u.body.rowVersion
    }
    const again = await lab.analyst
      .post('/api/data-sets')
      .send({ systemId: lab.systemId, title: 'V', nominalPressurePa: 101325, vaporModel: { kind: 'virial' } })
    expect(again.status).toBe(422)
    expect(again.body.error.message).toContain('missing — methanol: critical volume Vc.')
  })

  it('keeps hostile text out of the vapour model and the new fields', async () => {
    const base = { systemId: lab.systemId, title: 'H', nominalPressurePa: 101325 }
    for (const [vaporModel, message] of [
      [
        { kind: 'virial', correlation: '<img src=x onerror=alert(1)>' },
        "The virial correlation must be 'tsonopoulos' or 'hayden-oconnell'",
      ],
      [{ kind: '<script>' }, "The vapour model must be 'ideal' or 'virial'"],
      [{ kind: 'ideal', note: '=HYPERLINK("x")' }, 'Unrecognized key: "note"'],
    ] as const) {
      const r = await lab.analyst.post('/api/data-sets').send({ ...base, vaporModel })
      expect(r.status).toBe(422)
      expect(r.body.error.details.map((d: { message: string }) => d.message)).toContain(message)
      expect(JSON.stringify(r.body)).not.toContain('<img')
    }
    const tText = await lab.analyst
      .post('/api/data-sets')
      .send({ ...base, layout: 'pxy', nominalTemperatureK: '<b>328</b>' })
    expect(tText.status).toBe(422)
    // a hostile sample label on an isothermal point stays text, in the answer and in the export
    const d = await isothermalSet('<script>alert(1)</script> at 55 °C')
    const label = '=1+2<img onerror=x>'
    await addPoints(d, [{ ...modelPoints()[0], sampleLabel: label, pressureUncertaintyPa: 20 }])
    const got = (await lab.analyst.get(`/api/data-sets/${d.id}`).expect(200)).body
    expect(got.title).toBe('<script>alert(1)</script> at 55 °C')
    expect(got.points[0].sampleLabel).toBe(label)
    const exported = await lab.analyst.get(`/api/data-sets/${d.id}/export/points.csv`).expect(200)
    expect(exported.text).toContain(`'${label}`)
    expect(exported.text.split('\n')[0]).toMatch(/,u_p_kpa$/)
    expect(exported.text.split('\n')[1]).toMatch(/,2\.000e-2$/)
  })

  it('fits under a virial vapour differ from the ideal fit by the engine’s amount, and the old fits go stale', async () => {
    const u = await lab.admin
      .patch(`/api/components/${comp.methanol.id}`)
      .send({ rowVersion: comp.methanol.rowVersion, properties: DEMO_PROPERTIES['67-56-1'] })
    expect(u.status, JSON.stringify(u.body)).toBe(200)
    comp.methanol.rowVersion = u.body.rowVersion
    const pts = modelPoints()
    const d = await isothermalSet('Ideal then virial')
    const rv = await addPoints(d, pts)
    const ideal = (
      await lab.analyst
        .post(`/api/data-sets/${d.id}/fits`)
        .send({ models: ['wilson'] })
        .expect(201)
    ).body
    const sw = await lab.analyst
      .patch(`/api/data-sets/${d.id}`)
      .send({ rowVersion: ideal.rowVersion ?? rv, vaporModel: { kind: 'virial', poynting: true } })
    expect(sw.status, JSON.stringify(sw.body)).toBe(200)
    const detail = (await lab.analyst.get(`/api/data-sets/${d.id}`).expect(200)).body
    expect(detail.vaporModel).toEqual({ kind: 'virial', correlation: 'tsonopoulos', poynting: true })
    expect(detail.fits[0].stale).toBe(true)
    const virial = (
      await lab.analyst
        .post(`/api/data-sets/${d.id}/fits`)
        .send({ models: ['wilson'] })
        .expect(201)
    ).body.fits[0]
    expect(virial.options.vapor.kind).toBe('virial')
    expect(virial.options.vapor.components[0]).toMatchObject({ Tc: 508.1, Pc: 4692400, Vc: 212.766 })
    const vapor = virial.options.vapor as VaporModel
    const eIdeal = engineFit(pts)
    const eVirial = engineFit(pts, vapor)
    const value = (ps: { name: string; value: number }[], n: string) => ps.find((p) => p.name === n)!.value
    for (const n of ['a12', 'a21']) {
      expect(value(ideal.fits[0].parameters, n)).toBeCloseTo(value(eIdeal.parameters, n), 3)
      expect(value(virial.parameters, n)).toBeCloseTo(value(eVirial.parameters, n), 3)
    }
    // the data were made under an ideal vapour: the virial fit must move the energies, by the engine's amount
    const shift = Math.abs(value(virial.parameters, 'a12') - value(ideal.fits[0].parameters, 'a12'))
    expect(shift).toBeGreaterThan(1)
    expect(shift).toBeCloseTo(Math.abs(value(eVirial.parameters, 'a12') - value(eIdeal.parameters, 'a12')), 3)
    // the band of an isothermal set is the P–x–y band at its temperature, under the fit's own vapour: the engine's
    // band of the same fit (parameters and covariance equal to the engine's for the same points and vapour)
    const band = (
      await lab.analyst.get(`/api/data-sets/${d.id}/fits/${virial.id}/band`).query({ points: 11 }).expect(200)
    ).body
    const eBand = predictionBandIsothermal(eVirial, { T, points: 11 })
    expect(band).toMatchObject({
      kind: 'isothermal',
      T,
      vapour: 'virial gas, Tsonopoulos second virial coefficients, with the Poynting factor',
      stale: false,
    })
    band.x1.forEach((_: number, i: number) => {
      expect(band.P[i]).toBeCloseTo(eBand.P[i], 0)
      expect(band.y1[i]).toBeCloseTo(eBand.y1[i], 5)
      expect(Math.abs(band.sigmaP[i] - eBand.sigmaP[i])).toBeLessThan(1e-3 * Math.max(...eBand.sigmaP) + 1e-9)
    })
    expect(Math.max(...band.sigmaP)).toBeGreaterThan(0)
    // the old ideal-vapour fit states its own vapour (and that it is stale)
    const old = (
      await lab.analyst.get(`/api/data-sets/${d.id}/fits/${ideal.fits[0].id}/band`).query({ points: 11 }).expect(200)
    ).body
    expect(old).toMatchObject({ kind: 'isothermal', vapour: 'ideal gas (modified Raoult’s law)', stale: true })
    // asked at a pressure, it is the T–x–y band there, still under the fit's vapour
    const atP = (
      await lab.analyst
        .get(`/api/data-sets/${d.id}/fits/${virial.id}/band`)
        .query({ pressure: 100, unit: 'kPa', points: 5 })
        .expect(200)
    ).body
    expect(atP).toMatchObject({ kind: 'isobaric', P: 100000, vapour: band.vapour })
    // where to measure next is planned at one pressure: without one it says so
    const next = await lab.analyst.get(`/api/data-sets/${d.id}/fits/${virial.id}/next-compositions`)
    expect(next.status).toBe(409)
    expect(next.body.error.message).toBe(
      'Where to measure next is planned at one pressure (T–x–y); for isothermal data ask for it at a pressure.',
    )
    // the signed content names the kind and the vapour model
    const content = await signedContentV2(t.db, d.id)
    expect(content!.dataSet).toMatchObject({
      kind: 'isothermal',
      nominalTemperatureK: T,
      vaporModel: { kind: 'virial', correlation: 'tsonopoulos', poynting: true },
    })
  })

  it('signs an isobaric ideal-vapour record exactly as before (no new members)', async () => {
    const d = await lab.analyst
      .post('/api/data-sets')
      .send({ systemId: lab.systemId, title: 'Plain', nominalPressurePa: 101325 })
      .expect(201)
    const content = await signedContentV2(t.db, d.body.id)
    expect(Object.keys(content!.dataSet)).not.toContain('vaporModel')
    expect(Object.keys(content!.dataSet)).not.toContain('kind')
    expect(Object.keys(content!.dataSet)).not.toContain('nominalTemperatureK')
  })
})

describe('the data-quality score', () => {
  it('is stored with the point set, names its tests and worst points, and goes stale after an edit', async () => {
    const d = await isothermalSet('Quality')
    const pts = modelPoints()
    pts[6].y1 = Math.round((pts[6].y1 + 0.03) * 1e4) / 1e4 // one vapour composition off by 0.03
    await addPoints(d, pts)
    const c = await lab.analyst.post(`/api/data-sets/${d.id}/consistency`).send({ model: 'wilson' })
    expect(c.status, JSON.stringify(c.body)).toBe(201)
    const q = c.body.items.find((i: { test: string }) => i.test === 'quality-score')
    expect(q.stale).toBe(false)
    expect(q.result.tests.map((x: { test: string }) => x.test)).toEqual([
      'area',
      'point',
      'infinite-dilution',
      'end-point',
    ])
    expect(q.result.quality).toBeGreaterThan(0)
    expect(q.result.quality).toBeLessThanOrEqual(1)
    // the point whose y1 was moved is the one that lowers the score most
    expect(q.result.points[0].sample).toBe('I-07')
    const area = c.body.items.find((i: { test: string }) => i.test.endsWith('-area'))
    expect(area.test).toBe('redlich-kister-area')
    const detail = (await lab.analyst.get(`/api/data-sets/${d.id}`).expect(200)).body
    const p = detail.points.find((x: { sampleLabel: string }) => x.sampleLabel === 'I-07')
    const ex = await lab.analyst
      .patch(`/api/data-sets/${d.id}/points/${p.id}`)
      .send({ rowVersion: detail.rowVersion, excluded: true, reason: 'vapour sample suspect' })
    expect(ex.status).toBe(200)
    const after = (await lab.analyst.get(`/api/data-sets/${d.id}`).expect(200)).body
    expect(after.consistency.find((i: { test: string }) => i.test === 'quality-score').stale).toBe(true)
    const submit = await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: after.rowVersion })
    expect(submit.status).toBe(409)
    expect(submit.body.error.message).toContain('the data-quality score was computed on 11 points')
  })
})
