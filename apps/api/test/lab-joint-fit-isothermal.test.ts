/**
 * Joint fits over isothermal and isobaric data sets, under the members' vapour model, the member digests that sign
 * the kind, temperature and vapour model (format 2, old signatures still verifying), and the return of a submitted
 * joint fit for rework, over HTTP.
 *
 * Points: INVENTED, generated with the engine from the demo's acetone (1)/methanol (2) Wilson model (SVNA 7th ed.
 * Table 12.5 parameters, Table B.2 Antoine constants): an isobaric set at 101.325 kPa and an isothermal one at
 * 55 °C, with seeded noise. Expected results are the engine's own answers for the same inputs (fitJoint called
 * here), so the API is checked against the engine, and the engine against scipy in packages/thermo's reference tests.
 */
import type { JointFitDto } from '@ebullio/schemas'
import {
  bubblePressure,
  bubbleTemperature,
  fitJoint,
  type ActivityModel,
  type BinaryPoint,
  type VaporModel,
} from '@ebullio/thermo'
import { seededRandom } from '@ebullio/thermo/random'
import canonicalize from 'canonicalize'
import { sql } from 'kysely'
import { PDFParse } from 'pdf-parse'
import { createHash } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { DEMO_PROPERTIES } from '../../../db/seeds/demo-properties.js'
import { ACETONE_METHANOL, buildLab, type Lab } from './lab-fixture.js'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
let lab: Lab
const VP = [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as [
  ReturnType<typeof demoVaporPressure>,
  ReturnType<typeof demoVaporPressure>,
]
const published = { vaporPressure: VP, activity: ACETONE_METHANOL.activity as ActivityModel }
const X1 = [0.05, 0.15, 0.25, 0.35, 0.5, 0.6, 0.7, 0.8, 0.9]
const T55 = 328.15
const sha = (v: unknown) => createHash('sha256').update(canonicalize(v)!).digest('hex')

type Row = { sampleLabel: string; temperatureK: number; pressurePa: number; x1: number; y1: number }
/** Isobaric points of the published model at P with seeded noise (σT 0.05 K, σy 0.003). */
function isobaric(P: number, seed: number): Row[] {
  const rnd = seededRandom(seed)
  return X1.map((x1, i) => {
    const b = bubbleTemperature(published, { P, x1 })
    return {
      sampleLabel: `B${i + 1}`,
      temperatureK: b.T + 0.05 * rnd.gaussian(),
      pressurePa: P,
      x1,
      y1: b.y1 + 0.003 * rnd.gaussian(),
    }
  })
}
/** Isothermal points of the published model at T with seeded noise (σP 50 Pa, σy 0.003). */
function isothermal(T: number, seed: number): Row[] {
  const rnd = seededRandom(seed)
  return X1.map((x1, i) => {
    const b = bubblePressure(published, { T, x1 })
    return {
      sampleLabel: `I${i + 1}`,
      temperatureK: T,
      pressurePa: b.P + 50 * rnd.gaussian(),
      x1,
      y1: b.y1 + 0.003 * rnd.gaussian(),
    }
  })
}
const engine = (rows: Row[]): BinaryPoint[] =>
  rows.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1 }))

async function dataSet(title: string, rows: Row[], condition: Record<string, unknown>) {
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({ systemId: lab.systemId, title, origin: 'other-method', originMethod: 'static cell', ...condition })
  expect(d.status, JSON.stringify(d.body)).toBe(201)
  const r = await lab.analyst.post(`/api/data-sets/${d.body.id}/points`).send({
    rowVersion: d.body.rowVersion,
    points: rows.map((p) => ({ ...p, x1Uncertainty: 0.002, y1Uncertainty: 0.003 })),
  })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return d.body.id as string
}
async function setVapour(id: string, vaporModel: Record<string, unknown>) {
  const d = await lab.analyst.get(`/api/data-sets/${id}`).expect(200)
  const r = await lab.analyst.patch(`/api/data-sets/${id}`).send({ rowVersion: d.body.rowVersion, vaporModel })
  expect(r.status, JSON.stringify(r.body)).toBe(200)
}
const run = (ids: string[], who = lab.lead) =>
  who.post(`/api/systems/${lab.systemId}/joint-fits`).send({ dataSetIds: ids, model: 'nrtl' })

const pts = { bar: isobaric(101325, 21), iso: isothermal(T55, 22), iso2: isothermal(313.15, 23) }
const ids: Record<string, string> = {}

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  // Critical data (the demo's, with their sources) so that a data set may choose the virial vapour.
  for (const c of (await lab.admin.get('/api/components?pageSize=100')).body.items) {
    const props = DEMO_PROPERTIES[c.casNumber as keyof typeof DEMO_PROPERTIES]
    if (!props) continue
    const u = await lab.admin.patch(`/api/components/${c.id}`).send({ rowVersion: c.rowVersion, properties: props })
    expect(u.status, JSON.stringify(u.body)).toBe(200)
  }
  ids.bar = await dataSet('Acetone/methanol at 1 atm', pts.bar, { nominalPressurePa: 101325 })
  ids.iso = await dataSet('Acetone/methanol at 55 °C', pts.iso, { layout: 'pxy', nominalTemperatureK: T55 })
  ids.iso2 = await dataSet('Acetone/methanol at 40 °C', pts.iso2, { layout: 'pxy', nominalTemperatureK: 313.15 })
}, 120_000)
afterAll(() => t.close())

describe('a joint fit over an isobaric and two isothermal data sets', () => {
  let joint: JointFitDto
  it("stores thermo's fitJoint with each member's kind: bubble pressures (dP) for the isothermal sets", async () => {
    const r = await run([ids.bar, ids.iso, ids.iso2])
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    joint = r.body
    const e = fitJoint({
      dataSets: [
        { id: 'bar', points: engine(pts.bar) },
        { id: 'iso', kind: 'isothermal', points: engine(pts.iso) },
        { id: 'iso2', kind: 'isothermal', points: engine(pts.iso2) },
      ],
      vaporPressure: VP,
      model: 'nrtl',
      alpha: 0.3,
    })
    joint.parameters.forEach((p, i) => expect(p.value).toBeCloseTo(e.parameters[i].value, 6))
    expect(joint.members.map((m) => [m.kind, m.nominalTemperatureK, m.digestFormat])).toEqual([
      ['isobaric', null, 'ebullio-joint-member/2'],
      ['isothermal', T55, 'ebullio-joint-member/2'],
      ['isothermal', 313.15, 'ebullio-joint-member/2'],
    ])
    const [bar, iso] = joint.members.map((m) => m.statistics)
    expect(bar.rmsT).toBeCloseTo(e.dataSets[0].rmsT, 9)
    expect(bar.rmsP).toBeUndefined()
    expect(iso.kind).toBe('isothermal')
    expect(iso.rmsP).toBeCloseTo(e.dataSets[1].rmsP!, 6)
    expect(iso.biasP).toBeCloseTo(e.dataSets[1].biasP!, 6)
    // no temperature deviation on an isothermal set (NaN in the engine, null over JSON)
    expect(iso.rmsT).toBeNull()
    // the noise put in was σP = 50 Pa
    expect(iso.rmsP).toBeGreaterThan(20)
    expect(iso.rmsP).toBeLessThan(90)
    expect(joint.statistics).toMatchObject({ objectiveKind: 'bubble-point', vaporModel: 'ideal' })
    expect((joint.statistics as { rmsP?: number }).rmsP).toBeCloseTo(e.rmsP!, 6)
    expect(joint.range.Tmin).toBe(313.15)
  })

  it('plots an isothermal set against the P–x–y curve at its temperature: the engine’s bubble pressures', async () => {
    const r = await lab.reviewer.get(`/api/joint-fits/${joint.id}/plots`).expect(200)
    expect(r.body.plots.map((p: { kind: string }) => p.kind)).toEqual(['isobaric', 'isothermal', 'isothermal'])
    const plot = r.body.plots[1]
    expect(plot).toMatchObject({ T: T55, P: null })
    const system = { vaporPressure: VP, activity: joint.activity as unknown as ActivityModel }
    for (const i of [5, 20, 40]) {
      const b = bubblePressure(system, { T: T55, x1: plot.curve.x1[i] })
      expect(plot.curve.P[i]).toBeCloseTo(b.P, 3)
      expect(plot.curve.y1[i]).toBeCloseTo(b.y1, 6)
    }
  })

  it('refuses data sets with different vapour models, naming them, and stores nothing', async () => {
    await setVapour(ids.iso2, { kind: 'virial', poynting: false })
    const before = await sql<{ n: number }>`select count(*)::int as n from joint_fit`.execute(t.db)
    const r = await run([ids.bar, ids.iso, ids.iso2])
    expect(r.status).toBe(409)
    expect(r.body.error.message).toBe(
      'The chosen data sets have different vapour models ("Acetone/methanol at 1 atm" v1, "Acetone/methanol at 55 °C" v1: ideal gas (modified Raoult’s law); "Acetone/methanol at 40 °C" v1: virial gas, Tsonopoulos second virial coefficients). One parameter set holds under one vapour model only: give them the same vapour model, or fit them in separate joint fits.',
    )
    const after = await sql<{ n: number }>`select count(*)::int as n from joint_fit`.execute(t.db)
    expect(after.rows[0].n).toBe(before.rows[0].n)
    await setVapour(ids.iso2, { kind: 'ideal' })
  })
})

describe('under a virial vapour', () => {
  let joint: JointFitDto
  beforeAll(async () => {
    await setVapour(ids.bar, { kind: 'virial', poynting: false })
    await setVapour(ids.iso, { kind: 'virial', poynting: false })
  })
  afterAll(async () => {
    await setVapour(ids.bar, { kind: 'ideal' })
    await setVapour(ids.iso, { kind: 'ideal' })
  })

  it("fits every point γ–φ with the members' vapour: the engine's parameters for the same vapour", async () => {
    const r = await run([ids.bar, ids.iso])
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    joint = r.body
    const vapor = joint.options.vapor as VaporModel
    expect(vapor).toMatchObject({ kind: 'virial', correlation: 'tsonopoulos' })
    const e = fitJoint({
      dataSets: [
        { id: 'bar', points: engine(pts.bar), vapor },
        { id: 'iso', kind: 'isothermal', points: engine(pts.iso), vapor },
      ],
      vaporPressure: VP,
      model: 'nrtl',
      alpha: 0.3,
    })
    expect(e.vaporModel).toBe('virial-tsonopoulos')
    joint.parameters.forEach((p, i) => expect(p.value).toBeCloseTo(e.parameters[i].value, 4))
    expect(joint.statistics).toMatchObject({ vaporModel: 'virial-tsonopoulos' })
    // the ideal-vapour joint fit of the same data is a different parameter set
    const ideal = fitJoint({
      dataSets: [
        { id: 'bar', points: engine(pts.bar) },
        { id: 'iso', kind: 'isothermal', points: engine(pts.iso) },
      ],
      vaporPressure: VP,
      model: 'nrtl',
      alpha: 0.3,
    })
    expect(Math.abs(joint.parameters[0].value - ideal.parameters[0].value)).toBeGreaterThan(1)
    expect(joint.members.map((m) => m.vaporModel)).toEqual([
      { kind: 'virial', correlation: 'tsonopoulos', poynting: false },
      { kind: 'virial', correlation: 'tsonopoulos', poynting: false },
    ])
  })

  it('changing a member’s vapour model makes the joint fit stale (refused to submit) until it is back', async () => {
    await setVapour(ids.iso, { kind: 'virial', poynting: true })
    const stale = await lab.lead.get(`/api/joint-fits/${joint.id}`).expect(200)
    expect(stale.body.members.map((m: { stale: boolean }) => m.stale)).toEqual([false, true])
    const refused = await lab.lead.post(`/api/joint-fits/${joint.id}/submit`).send({ rowVersion: joint.rowVersion })
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('stale_results')
    await setVapour(ids.iso, { kind: 'virial', poynting: false })
    const back = await lab.lead.get(`/api/joint-fits/${joint.id}`).expect(200)
    expect(back.body.stale).toBe(false)
  })
})

/** The member digest of docs/workflow.md (format 'ebullio-joint-member/2'), from a data set as the API answers it. */
function memberDigestOf(d: Record<string, unknown> & { points: Record<string, unknown>[] }) {
  const pointSet = sha({
    format: 'ebullio-point-set/1',
    points: d.points.map((p) => ({
      seq: p.seq,
      T: p.temperatureK,
      P: p.pressurePa,
      x1: p.x1,
      ux1: p.x1Uncertainty,
      y1: p.y1,
      uy1: p.y1Uncertainty,
      excluded: p.excluded,
    })),
  })
  const kind = ['pxy', 'px'].includes(d.layout as string) ? 'isothermal' : 'isobaric'
  const read = {
    kind,
    ...(kind === 'isothermal' ? { nominalTemperatureK: d.nominalTemperatureK } : {}),
    vaporModel: d.vaporModel,
  }
  return { pointSet, read, digest: sha({ format: 'ebullio-joint-member/2', ...read, pointSet }) }
}

/** The signed content of docs/workflow.md in format 1 or 2, rebuilt from the API's answers. */
async function contentOf(fit: JointFitDto, format: 1 | 2) {
  const sys = await lab.reviewer.get(`/api/systems/${lab.systemId}`).expect(200)
  const dataSets = []
  for (const m of fit.members) {
    const d = (await lab.reviewer.get(`/api/data-sets/${m.dataSetId}`).expect(200)).body
    const member = memberDigestOf(d)
    const identity = {
      id: d.id,
      lineageId: d.lineageId,
      version: d.version,
      title: d.title,
      nominalPressurePa: d.nominalPressurePa,
    }
    const included = d.points.filter((p: { excluded: boolean }) => !p.excluded).length
    dataSets.push(
      format === 1
        ? { ...identity, pointSet: { digest: member.pointSet, included }, statistics: m.statistics }
        : {
            ...identity,
            ...member.read,
            pointSet: { format: 'ebullio-joint-member/2', digest: member.digest, included },
            statistics: m.statistics,
          },
    )
  }
  return {
    format: `ebullio-parameter-set/${format}`,
    system: {
      id: sys.body.id,
      component1: { id: sys.body.component1.id, name: sys.body.component1.name },
      component2: { id: sys.body.component2.id, name: sys.body.component2.name },
    },
    jointFit: {
      id: fit.id,
      model: fit.model,
      options: fit.options,
      activity: fit.activity,
      parameters: fit.parameters,
      covariance: fit.statistics.covariance,
      rmsT: fit.statistics.rmsT,
      rmsY: fit.statistics.rmsY,
      converged: fit.statistics.converged,
      ...(format === 2 ? { rmsP: (fit.statistics as { rmsP?: number }).rmsP ?? null } : {}),
      range: fit.range,
    },
    dataSets,
  }
}

describe('return for rework, resubmission and signature (four-eyes)', () => {
  let joint: JointFitDto
  const hostile = '<img src=x onerror=alert(1)> =HYPERLINK("http://x") refit with the 40 °C set too'

  beforeAll(async () => {
    // The recommended set must rest on approved data: lead2 approves what the analyst measured.
    for (const id of [ids.bar, ids.iso]) {
      const m = await lab.analyst.post(`/api/data-sets/${id}/fits`).send({ models: ['nrtl'] })
      expect(m.status, JSON.stringify(m.body)).toBe(201)
      const mk = await lab.lead2.post(`/api/data-sets/${id}/recommended-fit`).send({ fitId: m.body.fits[0].id })
      const s = await lab.analyst.post(`/api/data-sets/${id}/submit`).send({ rowVersion: mk.body.rowVersion })
      expect(s.status, JSON.stringify(s.body)).toBe(200)
      await lab.lead2
        .post(`/api/data-sets/${id}/approve`)
        .send({ password: PASSWORD, reason: 'ok', rowVersion: s.body.rowVersion })
        .expect(200)
    }
    const r = await run([ids.bar, ids.iso])
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const s = await lab.lead.post(`/api/joint-fits/${r.body.id}/submit`).send({ rowVersion: r.body.rowVersion })
    expect(s.status, JSON.stringify(s.body)).toBe(200)
    joint = (await lab.lead.get(`/api/joint-fits/${r.body.id}`).expect(200)).body
  }, 60_000)

  it('refuses what cannot be returned, with a clear message, and changes nothing', async () => {
    const url = `/api/joint-fits/${joint.id}/return`
    const ok = { password: PASSWORD, reason: 'x', rowVersion: joint.rowVersion }
    expect((await lab.analyst.post(url).send(ok)).status).toBe(403)
    const nul = await lab.lead2.post(url).send({ ...ok, reason: 'bad\u0000reason' })
    expect(nul.status).toBe(400)
    expect(nul.body.error.code).toBe('invalid_text')
    const long = await lab.lead2.post(url).send({ ...ok, reason: 'y'.repeat(2001) })
    expect(long.status).toBe(422)
    expect(JSON.stringify(long.body)).toContain('Say what must be reworked in at most 2000 characters')
    const blank = await lab.lead2.post(url).send({ ...ok, reason: '   ' })
    expect(blank.status).toBe(422)
    expect(JSON.stringify(blank.body)).toContain('Say what must be reworked')
    const wrong = await lab.lead2.post(url).send({ ...ok, password: 'not-it' })
    expect(wrong.status).toBe(403)
    expect(wrong.body.error.code).toBe('signature_refused')
    const stale = await lab.lead2.post(url).send({ ...ok, rowVersion: joint.rowVersion - 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('stale_write')
    const now = (await lab.lead.get(`/api/joint-fits/${joint.id}`).expect(200)).body
    expect(now).toMatchObject({ state: 'submitted', rowVersion: joint.rowVersion, signatures: [] })
  })

  it('a lead chemist returns it with a reason: the author is mailed a link, the audit log records it', async () => {
    await t.mail()
    const r = await lab.lead2
      .post(`/api/joint-fits/${joint.id}/return`)
      .send({ password: PASSWORD, reason: hostile, rowVersion: joint.rowVersion })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.jointFit.state).toBe('returned')
    // the reason stays text, exactly as written
    expect(r.body.jointFit.signatures).toEqual([
      expect.objectContaining({ signerName: 'Rhea Lead', meaning: 'returned for rework', reason: hostile }),
    ])
    expect(r.body.digest).toBe(sha(await contentOf(r.body.jointFit, 2)))
    const mail = (await t.mail()).filter((m) => m.subject.includes('returned for rework'))
    expect(mail).toHaveLength(1)
    expect(mail[0].envelope_to).toBe('lead@lab.test')
    expect(mail[0].subject).toBe('Ebullio: the joint parameter set for acetone / methanol was returned for rework')
    expect(mail[0].body_text).toContain(`Reason: ${hostile}\n`)
    expect(mail[0].body_text).toContain(`${t.config.publicUrl}/lab/systems/${lab.systemId}?joint=${joint.id}\n`)
    const audit = await sql<{ action: string; after: { reason: string; state: string } }>`
      select action, after from audit_log where entity = 'joint_fit' and entity_id = ${joint.id} order by id`.execute(
      t.db,
    )
    expect(audit.rows.map((a) => a.action)).toEqual(['run joint fit', 'submit joint fit', 'return joint fit'])
    expect(audit.rows[2].after).toMatchObject({ state: 'returned', reason: hostile })
    // a returned set is not a recommended set, and cannot be signed until it is submitted again
    await lab.engineer.get(`/api/systems/${lab.systemId}/recommended-parameters`).expect(404)
    const early = await lab.lead2
      .post(`/api/joint-fits/${joint.id}/approve`)
      .send({ password: PASSWORD, reason: 'ok', rowVersion: r.body.jointFit.rowVersion })
    expect(early.status).toBe(409)
    expect(early.body.error.message).toBe('This joint fit is returned; only a submitted joint fit can be signed.')
    joint = r.body.jointFit
  })

  it('resubmitted by its author, it is signed by another lead chemist only, and signs the kind and vapour model', async () => {
    const s = await lab.lead.post(`/api/joint-fits/${joint.id}/submit`).send({ rowVersion: joint.rowVersion })
    expect(s.status, JSON.stringify(s.body)).toBe(200)
    expect(s.body.state).toBe('submitted')
    const own = await lab.lead
      .post(`/api/joint-fits/${joint.id}/approve`)
      .send({ password: PASSWORD, reason: 'mine', rowVersion: s.body.rowVersion })
    expect(own.status).toBe(403)
    expect(own.body.error.code).toBe('four_eyes')
    const ok = await lab.lead2
      .post(`/api/joint-fits/${joint.id}/approve`)
      .send({ password: PASSWORD, reason: 'Isobaric and isothermal agree.', rowVersion: s.body.rowVersion })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    joint = ok.body.jointFit
    expect(joint.signatures.map((x) => [x.meaning, x.digestAlgorithm])).toEqual([
      ['returned for rework', 'ebullio-parameter-set/2'],
      ['approved', 'ebullio-parameter-set/2'],
    ])
    // the digest is the SHA-256 of the documented format-2 content, rebuilt here from the API's answers
    const content = await contentOf(joint, 2)
    expect(content.dataSets[1]).toMatchObject({
      kind: 'isothermal',
      nominalTemperatureK: T55,
      vaporModel: { kind: 'ideal' },
    })
    expect(sha(content)).toBe(ok.body.digest)
    expect(joint.members.map((m) => m.pointSetDigest)).toEqual(content.dataSets.map((d) => d.pointSet.digest))
    const rec = await lab.engineer.get(`/api/systems/${lab.systemId}/recommended-parameters`).expect(200)
    expect(rec.body).toMatchObject({ id: joint.id, signedBy: 'Rhea Lead', digest: ok.body.digest })
    const audit = await sql<{ action: string }>`
      select action from audit_log where entity = 'joint_fit' and entity_id = ${joint.id} order by id`.execute(t.db)
    expect(audit.rows.map((a) => a.action)).toEqual([
      'run joint fit',
      'submit joint fit',
      'return joint fit',
      'submit joint fit',
      'approve joint fit',
    ])
  })

  it('engineers read each member with its kind and condition: API, parameters export and printed report', async () => {
    const expected = [
      { dataSetId: ids.bar, kind: 'isobaric', nominalPressurePa: 101325, nominalTemperatureK: null },
      { dataSetId: ids.iso, kind: 'isothermal', nominalPressurePa: null, nominalTemperatureK: T55 },
    ]
    const rec = (await lab.engineer.get(`/api/systems/${lab.systemId}/recommended-parameters`).expect(200)).body
    expect(rec.dataSets).toMatchObject(expected)
    expect(rec.dataSets.map((d: { pointCount: number }) => d.pointCount)).toEqual([X1.length, X1.length])
    expect(rec.vaporModel).toEqual({ kind: 'ideal' })
    const json = (await lab.engineer.get(`/api/data-sets/${ids.iso}/export/parameters.json`).expect(200)).body
    expect(json.systemRecommendedSet.dataSets).toMatchObject(expected)
    const csv = (await lab.engineer.get(`/api/data-sets/${ids.iso}/export/parameters.csv`).expect(200)).text
    expect(csv).toContain(
      `Acetone/methanol at 1 atm v1 (isobaric at 101.325 kPa); Acetone/methanol at 55 °C v1 (isothermal at 328.15 K (55.00 °C))`,
    )
    expect(csv).toMatch(/,vapour_model,ideal gas \(modified Raoult’s law\),/)
    // the printed report of a member names every member with its kind and condition, and the set's parameters
    const res = await lab.engineer.get(`/api/data-sets/${ids.iso}/report.pdf`).responseType('blob').expect(200)
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) })
    const text = (await parser.getText()).text.replace(/\s+/g, ' ')
    await parser.destroy()
    expect(text).toContain('Acetone/methanol at 1 atm 1 isobaric at 101.325 kPa 9')
    expect(text).toContain('Acetone/methanol at 55 °C 1 isothermal at 328.15 K (55.00 °C) 9')
    expect(text).toContain('This version is one of the data sets it rests on.')
    for (const p of rec.parameters as { name: string; value: number }[])
      expect(text).toContain(`${p.name} = ${p.value.toPrecision(6).replace(/^-/, '−')}`)
  })

  it('verifies every signature in its own format: a signature made in format 1 still verifies', async () => {
    // A signature as format 1 made it (the points alone), rebuilt from the API's answers and stored as such.
    const v1 = sha(await contentOf(joint, 1))
    await sql`insert into joint_fit_approval (joint_fit_id, signer_id, meaning, reason, digest, digest_algorithm, changes)
      values (${joint.id}, ${lab.ids.lead2}, 'approved', 'signed before format 2', ${v1}, 'ebullio-parameter-set/1', '[]'::jsonb)`.execute(
      t.db,
    )
    const v = await lab.reviewer.get(`/api/joint-fits/${joint.id}/signatures/verify`).expect(200)
    expect(v.body.digestAlgorithm).toBe('ebullio-parameter-set/2')
    expect(
      v.body.signatures.map((s: { digestAlgorithm: string; matches: boolean }) => [s.digestAlgorithm, s.matches]),
    ).toEqual([
      ['ebullio-parameter-set/2', true],
      ['ebullio-parameter-set/2', true],
      ['ebullio-parameter-set/1', true],
    ])
    // format 1 did not sign the vapour model: the two formats differ for the same stored content
    expect(v1).not.toBe(v.body.currentDigest)
  })
})
