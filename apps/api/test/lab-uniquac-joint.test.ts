/**
 * UNIQUAC in joint fits, over HTTP: refused naming each component's missing r and q (nothing stored); with them, the
 * stored parameters (a12, a21, a12T, a21T) are thermo's fitJoint for the same points; signed as the system's
 * recommended set it carries UNIQUAC, r, q and the temperature terms into the engineer's curve (the engine's
 * bubble points for the same inputs), the parameters export and the printed report.
 *
 * Points: INVENTED, T–x–y at 101.325 and 50 kPa from the demo's acetone (1)/methanol (2) Wilson model (SVNA 7th ed.
 * Table 12.5 parameters, Table B.2 Antoine constants) with seeded noise. UNIQUAC r and q of acetone (2.5735, 2.336)
 * and methanol (1.4311, 1.432): the usual tabulated values (from memory).
 */
import type { JointFitDto } from '@ebullio/schemas'
import { bubbleTemperature, fitJoint, type ActivityModel, type BinaryPoint } from '@ebullio/thermo'
import { seededRandom } from '@ebullio/thermo/random'
import { sql } from 'kysely'
import { PDFParse } from 'pdf-parse'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { ACETONE_METHANOL, buildLab, type Lab } from './lab-fixture.js'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
let lab: Lab
const vaporPressure = [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as [
  ReturnType<typeof demoVaporPressure>,
  ReturnType<typeof demoVaporPressure>,
]
const published = { vaporPressure, activity: ACETONE_METHANOL.activity as ActivityModel }
const RQ = { acetone: { uniquacR: 2.5735, uniquacQ: 2.336 }, methanol: { uniquacR: 1.4311, uniquacQ: 1.432 } }
const STRUCTURE = { r1: 2.5735, r2: 1.4311, q1: 2.336, q2: 1.432 }

/** Points of the published model at P (Pa) with seeded noise (σT 0.05 K, σy 0.003). */
function generated(P: number, seed: number) {
  const rnd = seededRandom(seed)
  return [0.05, 0.15, 0.25, 0.35, 0.5, 0.6, 0.7, 0.8, 0.9].map((x1, i) => {
    const b = bubbleTemperature(published, { P, x1 })
    return {
      sampleLabel: `S${i + 1}`,
      temperatureK: b.T + 0.05 * rnd.gaussian(),
      pressurePa: P,
      x1,
      y1: Math.min(1, Math.max(0, b.y1 + 0.003 * rnd.gaussian())),
      x1Uncertainty: 0.002,
      y1Uncertainty: 0.003,
    }
  })
}
type Typed = ReturnType<typeof generated>
const enginePoints = (pts: Typed): BinaryPoint[] =>
  pts.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1 }))

async function draft(title: string, P: number, points: Typed) {
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({ systemId: lab.systemId, title, nominalPressurePa: P, origin: 'other-method', originMethod: 'density' })
    .expect(201)
  const r = await lab.analyst.post(`/api/data-sets/${d.body.id}/points`).send({ rowVersion: d.body.rowVersion, points })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return d.body.id as string
}

/** Fit Wilson, lead2 marks it, the analyst submits, lead2 approves. */
async function approveDataSet(id: string) {
  const f = await lab.analyst
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['wilson'] })
    .expect(201)
  const m = await lab.lead2.post(`/api/data-sets/${id}/recommended-fit`).send({ fitId: f.body.fits[0].id }).expect(200)
  const s = await lab.analyst.post(`/api/data-sets/${id}/submit`).send({ rowVersion: m.body.rowVersion }).expect(200)
  const a = await lab.lead2
    .post(`/api/data-sets/${id}/approve`)
    .send({ password: PASSWORD, reason: 'ok', rowVersion: s.body.rowVersion })
  expect(a.status, JSON.stringify(a.body)).toBe(200)
}

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

const pts = { atm: generated(101325, 21), half: generated(50000, 22) }
const ids: Record<string, string> = {}

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  ids.atm = await draft('Acetone/methanol at 1 atm', 101325, pts.atm)
  ids.half = await draft('Acetone/methanol at 50 kPa', 50000, pts.half)
  await approveDataSet(ids.atm)
  await approveDataSet(ids.half)
}, 120_000)
afterAll(() => t.close())

describe('a joint UNIQUAC fit', () => {
  let joint: JointFitDto
  const engine = () =>
    fitJoint({
      dataSets: [
        { id: ids.atm, points: enginePoints(pts.atm) },
        { id: ids.half, points: enginePoints(pts.half) },
      ],
      vaporPressure,
      model: 'uniquac',
      uniquac: STRUCTURE,
    })

  it('is refused without r and q, naming each component and what it lacks; nothing is stored', async () => {
    await setRq('acetone')
    const r = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, ids.half], model: 'uniquac' })
    expect(r.status).toBe(422)
    expect(r.body.error.code).toBe('missing_uniquac_data')
    expect(r.body.error.message).toBe(
      "A UNIQUAC fit needs each component's r and q; missing — methanol: UNIQUAC r, UNIQUAC q. Enter them on the components screen (with their source).",
    )
    const n = await sql<{ n: number }>`select count(*)::int as n from joint_fit`.execute(t.db)
    expect(n.rows[0].n).toBe(0)
  })

  it("with the components' r and q: thermo's fitJoint for the same points (a12, a21, a12T, a21T), r and q stored", async () => {
    await setRq('methanol')
    const r = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, ids.half], model: 'uniquac' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    joint = r.body
    const e = engine()
    expect(joint.model).toBe('uniquac')
    expect(joint.options).toMatchObject({ model: 'uniquac', temperatureDependent: true, uniquac: STRUCTURE })
    expect(joint.activity).toMatchObject({ kind: 'uniquac', ...STRUCTURE })
    expect(joint.parameters.map((p) => p.name)).toEqual(['a12', 'a21', 'a12T', 'a21T'])
    joint.parameters.forEach((p, i) => {
      expect(p.value).toBeCloseTo(e.parameters[i].value, 6)
      expect(p.standardError!).toBeCloseTo(e.parameters[i].standardError!, 6)
    })
    expect(joint.statistics.covariance).toHaveLength(4)
    expect(joint.statistics.covariance![3][3]).toBeCloseTo(e.covariance[3][3], 6)
    expect(joint.members.map((m) => m.statistics.rmsT)).toEqual(e.dataSets.map((d) => expect.closeTo(d.rmsT, 9)))
    // the points came from a Wilson model with σT 0.05 K: UNIQUAC reproduces them within the noise
    expect(joint.statistics.rmsT).toBeLessThan(0.1)
  })

  it('signed as the recommended set, it carries UNIQUAC into the engineer curve: the engine’s bubble points', async () => {
    const s = await lab.lead.post(`/api/joint-fits/${joint.id}/submit`).send({ rowVersion: joint.rowVersion })
    expect(s.status, JSON.stringify(s.body)).toBe(200)
    const ok = await lab.lead2
      .post(`/api/joint-fits/${joint.id}/approve`)
      .send({ password: PASSWORD, reason: 'Both pressures agree.', rowVersion: s.body.rowVersion })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    const rec = (await lab.engineer.get(`/api/systems/${lab.systemId}/recommended-parameters`).expect(200)).body
    expect(rec).toMatchObject({ id: joint.id, model: 'uniquac', label: 'UNIQUAC (joint, 2 data sets)' })
    expect(rec.activity).toMatchObject({ kind: 'uniquac', ...STRUCTURE })
    expect(rec.parameters.map((p: { name: string }) => p.name)).toEqual(['a12', 'a21', 'a12T', 'a21T'])
    const curve = (
      await lab.engineer
        .get(`/api/systems/${lab.systemId}/recommended-parameters/curve?pressure=75&unit=kPa&points=21`)
        .expect(200)
    ).body
    expect(curve).toMatchObject({ model: 'uniquac', pressureInRange: true, rangeWarning: null })
    // The engine's own fit of the same points, at the same x1 and P: the same bubble points.
    const e = engine()
    for (const i of [3, 10, 17]) {
      const b = bubbleTemperature(e.system, { P: 75000, x1: curve.diagram.x1[i] })
      expect(curve.diagram.T[i]).toBeCloseTo(b.T, 5)
      expect(curve.diagram.y1[i]).toBeCloseTo(b.y1, 5)
    }
  })

  it('the parameters export and the report print the set with its temperature form, r and q', async () => {
    const csv = (await lab.engineer.get(`/api/data-sets/${ids.atm}/export/parameters.csv`).expect(200)).text
    const a12T = joint.parameters.find((p) => p.name === 'a12T')!
    expect(csv).toContain(
      `${joint.id},system-recommended/uniquac,system,a12T,${a12T.value},${a12T.standardError},J/(mol K)`,
    )
    expect(csv).toContain(
      `${joint.id},system-recommended/uniquac,system,temperature_form,a12(T) = a12 + a12T (T - 298.15 K); a21(T) = a21 + a21T (T - 298.15 K); tau_ij = exp(-a_ij(T)/(R T)),`,
    )
    expect(csv).toContain(`${joint.id},system-recommended/uniquac,system,r1,2.5735,,1,`)
    const res = await lab.engineer.get(`/api/data-sets/${ids.atm}/report.pdf`).responseType('blob').expect(200)
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) })
    const text = (await parser.getText()).text.replace(/\s+/g, ' ')
    await parser.destroy()
    expect(text).toContain("The system's recommended parameter set: UNIQUAC (joint, 2 data sets")
    expect(text).toContain(
      `a12T = ${a12T.value.toPrecision(6).replace(/^-/, '−')} ± ${a12T.standardError!.toPrecision(3)} J/(mol·K)`,
    )
    expect(text).toContain('q1 = 2.33600 held q2 = 1.43200 held r1 = 2.57350 held r2 = 1.43110 held')
  })
})
