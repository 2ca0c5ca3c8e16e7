/**
 * Joint fits over several data sets of one system and the system's signed recommended parameter set: the
 * stored parameters are thermo's fitJoint for the same points, per-data-set bias is measured − calculated,
 * four-eyes, stale after a contributing draft changes, the engineer's curve is the engine's bubble points with
 * the joint parameters, and a warning outside the fitted pressure range.
 *
 * Points: INVENTED, generated with the engine from the published Wilson parameters of acetone/methanol (Smith,
 * Van Ness & Abbott, 7th ed., Table 12.5) and Antoine constants (Table B.2) at 101.325 and 50 kPa.
 */
import type { JointFitDto } from '@ebullio/schemas'
import { bubbleTemperature, fitJoint, type ActivityModel, type BinaryPoint } from '@ebullio/thermo'
import { seededRandom } from '@ebullio/thermo/random'
import canonicalize from 'canonicalize'
import { createHash } from 'node:crypto'
import { sql } from 'kysely'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ACETONE_METHANOL, buildLab, type Lab } from './lab-fixture.js'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'

let t: TestContext
let lab: Lab
const vaporPressure = [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as [
  ReturnType<typeof demoVaporPressure>,
  ReturnType<typeof demoVaporPressure>,
]
const published = { vaporPressure, activity: ACETONE_METHANOL.activity as ActivityModel }
const X1 = [0.05, 0.15, 0.25, 0.35, 0.5, 0.6, 0.7, 0.8, 0.9]

/** Points of the published model at P (Pa), with seeded noise (σT 0.05 K, σy 0.003) unless noise is 0. */
function generated(P: number, seed: number, noise = 1, raise: { index: number; dT: number } | null = null) {
  const rnd = seededRandom(seed)
  return X1.map((x1, i) => {
    const b = bubbleTemperature(published, { P, x1 })
    const dT = raise?.index === i ? raise.dT : 0
    return {
      sampleLabel: `S${i + 1}`,
      temperatureK: b.T + noise * 0.05 * rnd.gaussian() + dT,
      pressurePa: P,
      x1,
      y1: Math.min(1, Math.max(0, b.y1 + noise * 0.003 * rnd.gaussian())),
      x1Uncertainty: 0.002,
      y1Uncertainty: 0.003,
    }
  })
}
type Typed = ReturnType<typeof generated>

/** A draft (typed points, measured by another method) created by `who`. */
async function draft(who: Lab['analyst'], title: string, P: number, points: Typed) {
  const d = await who
    .post('/api/data-sets')
    .send({ systemId: lab.systemId, title, nominalPressurePa: P, origin: 'other-method', originMethod: 'density' })
    .expect(201)
  const r = await who.post(`/api/data-sets/${d.body.id}/points`).send({ rowVersion: d.body.rowVersion, points })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return d.body.id as string
}

/** Fit Wilson, have `marker` mark it, submit and have `signer` approve. */
async function approveDataSet(id: string, author = lab.analyst, marker = lab.lead, signer = lab.lead) {
  const f = await author
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['wilson'] })
    .expect(201)
  const m = await marker.post(`/api/data-sets/${id}/recommended-fit`).send({ fitId: f.body.fits[0].id }).expect(200)
  const s = await author.post(`/api/data-sets/${id}/submit`).send({ rowVersion: m.body.rowVersion }).expect(200)
  const a = await signer
    .post(`/api/data-sets/${id}/approve`)
    .send({ password: PASSWORD, reason: 'ok', rowVersion: s.body.rowVersion })
  expect(a.status, JSON.stringify(a.body)).toBe(200)
}

const enginePoints = (pts: Typed): BinaryPoint[] =>
  pts.map((p) => ({ T: p.temperatureK, P: p.pressurePa, x1: p.x1, y1: p.y1 }))

const pts = { atm: generated(101325, 11), half: generated(50000, 12) }
const ids: Record<string, string> = {}

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  ids.atm = await draft(lab.analyst, 'Acetone/methanol at 1 atm', 101325, pts.atm)
  ids.half = await draft(lab.analyst, 'Acetone/methanol at 50 kPa', 50000, pts.half)
}, 120_000)
afterAll(() => t.close())

describe('a joint fit over two data sets', () => {
  let joint: JointFitDto
  it("stores thermo's fitJoint for the same points: parameters, covariance, per-data-set statistics and range", async () => {
    const r = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, ids.half], model: 'nrtl' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    joint = r.body
    const engine = fitJoint({
      dataSets: [
        { id: ids.atm, points: enginePoints(pts.atm) },
        { id: ids.half, points: enginePoints(pts.half) },
      ],
      vaporPressure,
      model: 'nrtl',
      alpha: 0.3,
    })
    expect(joint.parameters.map((p: { name: string }) => p.name)).toEqual(['b12', 'b21', 'b12T', 'b21T'])
    joint.parameters.forEach((p, i) => {
      expect(p.value).toBeCloseTo(engine.parameters[i].value, 6)
      expect(p.standardError!).toBeCloseTo(engine.parameters[i].standardError!, 6)
    })
    expect(joint.statistics.covariance![0][0]).toBeCloseTo(engine.covariance[0][0], 3)
    expect(joint.members.map((m) => m.statistics.rmsT)).toEqual(engine.dataSets.map((d) => expect.closeTo(d.rmsT, 9)))
    expect(joint.range).toEqual({
      Tmin: expect.closeTo(engine.range.Tmin, 9),
      Tmax: expect.closeTo(engine.range.Tmax, 9),
      Pmin: 50000,
      Pmax: 101325,
    })
    expect(joint.state).toBe('draft')
    expect(joint.stale).toBe(false)
    // The joint model reproduces the published model the points came from within their noise (σT 0.05 K).
    expect(joint.statistics.rmsT).toBeLessThan(0.1)
  })

  it('plots each data set against the joint model at its own pressure: the curve is the engine’s bubble points', async () => {
    const r = await lab.reviewer.get(`/api/joint-fits/${joint.id}/plots`).expect(200)
    expect(r.body.plots.map((p: { P: number }) => p.P)).toEqual([101325, 50000])
    const plot = r.body.plots[1]
    expect(plot.points).toHaveLength(9)
    const system = { vaporPressure, activity: joint.activity as unknown as ActivityModel }
    const i = plot.curve.x1.findIndex((x: number) => x > 0.3)
    expect(plot.curve.T[i]).toBeCloseTo(bubbleTemperature(system, { P: 50000, x1: plot.curve.x1[i] }).T, 6)
  })

  it('refuses bad requests with a clear message and changes nothing', async () => {
    const before = await sql<{ n: number }>`select count(*)::int as n from joint_fit`.execute(t.db)
    const one = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm], model: 'nrtl' })
      .expect(422)
    expect(JSON.stringify(one.body)).toContain('Choose at least two data sets for a joint fit')
    const twice = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, ids.atm], model: 'wilson' })
      .expect(422)
    expect(JSON.stringify(twice.body)).toContain('A data set is chosen twice')
    const analyst = await lab.analyst
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, ids.half], model: 'nrtl' })
    expect(analyst.status).toBe(403)
    const after = await sql<{ n: number }>`select count(*)::int as n from joint_fit`.execute(t.db)
    expect(after.rows[0].n).toBe(before.rows[0].n)
  })
})

describe('per-data-set bias (measured − calculated)', () => {
  it('a data set with one point raised by 1 K shows a positive temperature bias, the other data set a negative one', async () => {
    const exact = await draft(lab.analyst, 'Exact at 1 atm', 101325, generated(101325, 1, 0))
    const raised = await draft(
      lab.analyst,
      'One point +1 K at 50 kPa',
      50000,
      generated(50000, 2, 0, { index: 4, dT: 1 }),
    )
    const r = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [exact, raised], model: 'wilson', temperatureDependent: false })
      .expect(201)
    const [a, b] = r.body.members.map((m: { statistics: { biasT: number } }) => m.statistics.biasT)
    // One of nine points 1 K high: at most +1/9 K, less what the shared parameters absorb (engine: +0.058 K);
    // the parameters then pull the other data set's curve up, so its bias turns negative (engine: −0.060 K).
    // With temperature-dependent energies the two isobars get enough freedom to absorb most of the offset.
    expect(b).toBeGreaterThan(0.04)
    expect(b).toBeLessThan(1 / 9)
    expect(a).toBeLessThan(-0.04)
  })
})

describe('stale when a contributing draft changes', () => {
  it('marks the joint fit stale, refuses to submit it, and is current again when the point is back', async () => {
    const r = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, ids.half], model: 'wilson' })
      .expect(201)
    const detail = await lab.analyst.get(`/api/data-sets/${ids.half}`).expect(200)
    const point = detail.body.points[2]
    const ex = await lab.analyst
      .patch(`/api/data-sets/${ids.half}/points/${point.id}`)
      .send({ rowVersion: detail.body.rowVersion, excluded: true, reason: 'bubble in the sampling line' })
      .expect(200)
    const stale = await lab.lead.get(`/api/joint-fits/${r.body.id}`).expect(200)
    expect(stale.body.stale).toBe(true)
    expect(stale.body.members.map((m: { stale: boolean }) => m.stale)).toEqual([false, true])
    const refused = await lab.lead.post(`/api/joint-fits/${r.body.id}/submit`).send({ rowVersion: r.body.rowVersion })
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('stale_results')
    expect(refused.body.error.message).toContain('"Acetone/methanol at 50 kPa" v1 changed since this joint fit was run')
    await lab.analyst
      .patch(`/api/data-sets/${ids.half}/points/${point.id}`)
      .send({ rowVersion: ex.body.rowVersion, excluded: false })
      .expect(200)
    const back = await lab.lead.get(`/api/joint-fits/${r.body.id}`).expect(200)
    expect(back.body.stale).toBe(false)
    // A draft used by a joint fit cannot be deleted from under it.
    const del = await lab.analyst.delete(`/api/data-sets/${ids.half}`)
    expect(del.status).toBe(409)
    expect(del.body.error.message).toContain('part of a joint fit')
  })
})

describe('the recommended parameter set', () => {
  let first: JointFitDto
  beforeAll(async () => {
    // Approved data sets: the analyst measured them, lead2 marks and signs them (no change to the content).
    await approveDataSet(ids.atm, lab.analyst, lab.lead2, lab.lead2)
    await approveDataSet(ids.half, lab.analyst, lab.lead2, lab.lead2)
  }, 60_000)

  it('refuses to sign while a contributing data set is a draft', async () => {
    const other = await draft(lab.analyst, 'Still a draft at 70 kPa', 70000, generated(70000, 5))
    const r = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, other], model: 'wilson' })
      .expect(201)
    await lab.lead.post(`/api/joint-fits/${r.body.id}/submit`).send({ rowVersion: r.body.rowVersion }).expect(200)
    const a = await lab.lead2
      .post(`/api/joint-fits/${r.body.id}/approve`)
      .send({ password: PASSWORD, reason: 'ok', rowVersion: r.body.rowVersion + 1 })
    expect(a.status).toBe(409)
    expect(a.body.error.message).toContain('"Still a draft at 70 kPa" v1 is draft')
  })

  it('four-eyes: whoever ran it cannot sign it; a wrong password signs nothing; another lead chemist can', async () => {
    const r = await lab.lead
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, ids.half], model: 'wilson' })
      .expect(201)
    const s = await lab.lead.post(`/api/joint-fits/${r.body.id}/submit`).send({ rowVersion: r.body.rowVersion })
    expect(s.status).toBe(200)
    expect(s.body.notifiedLeadChemists).toBe(1)
    const own = await lab.lead
      .post(`/api/joint-fits/${r.body.id}/approve`)
      .send({ password: PASSWORD, reason: 'mine', rowVersion: s.body.rowVersion })
    expect(own.status).toBe(403)
    expect(own.body.error.code).toBe('four_eyes')
    expect(own.body.error.message).toBe('You ran the joint fit; another lead chemist must sign this parameter set.')
    const wrong = await lab.lead2
      .post(`/api/joint-fits/${r.body.id}/approve`)
      .send({ password: 'not-it', reason: 'x', rowVersion: s.body.rowVersion })
    expect(wrong.status).toBe(403)
    expect(wrong.body.error.code).toBe('signature_refused')
    const ok = await lab.lead2
      .post(`/api/joint-fits/${r.body.id}/approve`)
      .send({ password: PASSWORD, reason: 'Both pressures agree; recommended.', rowVersion: s.body.rowVersion })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    first = ok.body.jointFit
    expect(first.state).toBe('approved')
    expect(first.signatures[0]).toMatchObject({ signerName: 'Rhea Lead', meaning: 'approved', selfApproval: false })
    expect(first.signatures[0].changes.map((c: { name: string }) => c.name)).toEqual(['Mira Analyst', 'Tobias Lead'])
    const audit = await sql<{ action: string }>`
      select action from audit_log where entity = 'joint_fit' and entity_id = ${first.id} order by id`.execute(t.db)
    expect(audit.rows.map((a) => a.action)).toEqual(['run joint fit', 'submit joint fit', 'approve joint fit'])
  })

  it('a contributor to a data set cannot sign either, and the message says what they changed', async () => {
    const own = await draft(lab.lead, 'Lead’s own series at 80 kPa', 80000, generated(80000, 7))
    await approveDataSet(own, lab.lead, lab.lead, lab.lead2)
    const r = await lab.lead2
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.half, own], model: 'wilson' })
      .expect(201)
    const s = await lab.lead2.post(`/api/joint-fits/${r.body.id}/submit`).send({ rowVersion: r.body.rowVersion })
    const a = await lab.lead
      .post(`/api/joint-fits/${r.body.id}/approve`)
      .send({ password: PASSWORD, reason: 'x', rowVersion: s.body.rowVersion })
    expect(a.status).toBe(403)
    expect(a.body.error.message).toContain('created the data set in "Lead’s own series at 80 kPa" v1')
    await lab.lead2.delete(`/api/joint-fits/${r.body.id}`).expect(409)
  })

  it('the signed digest is the SHA-256 of the documented canonical content (format 2), and verifies', async () => {
    const v = await lab.reviewer.get(`/api/joint-fits/${first.id}/signatures/verify`).expect(200)
    expect(v.body.signatures[0].matches).toBe(true)
    // The recipe of docs/workflow.md, rebuilt from the API's answers and the stored rows.
    const sys = await lab.reviewer.get(`/api/systems/${lab.systemId}`).expect(200)
    const dataSets = []
    for (const m of first.members) {
      const d = await lab.reviewer.get(`/api/data-sets/${m.dataSetId}`).expect(200)
      const content = {
        format: 'ebullio-point-set/1',
        points: d.body.points.map((p: Record<string, unknown>) => ({
          seq: p.seq,
          T: p.temperatureK,
          P: p.pressurePa,
          x1: p.x1,
          ux1: p.x1Uncertainty,
          y1: p.y1,
          uy1: p.y1Uncertainty,
          excluded: p.excluded,
        })),
      }
      // Format 2 signs what the fit read of each member: its kind, vapour model and points' digest.
      const read = { kind: 'isobaric', vaporModel: d.body.vaporModel }
      const points = createHash('sha256').update(canonicalize(content)!).digest('hex')
      const member = { format: 'ebullio-joint-member/2', ...read, pointSet: points }
      dataSets.push({
        id: d.body.id,
        lineageId: d.body.lineageId,
        version: d.body.version,
        title: d.body.title,
        nominalPressurePa: d.body.nominalPressurePa,
        ...read,
        pointSet: {
          format: 'ebullio-joint-member/2',
          digest: createHash('sha256').update(canonicalize(member)!).digest('hex'),
          included: d.body.points.filter((p: { excluded: boolean }) => !p.excluded).length,
        },
        statistics: m.statistics,
      })
    }
    const content = {
      format: 'ebullio-parameter-set/2',
      system: {
        id: sys.body.id,
        component1: { id: sys.body.component1.id, name: sys.body.component1.name },
        component2: { id: sys.body.component2.id, name: sys.body.component2.name },
      },
      jointFit: {
        id: first.id,
        model: first.model,
        options: first.options,
        activity: first.activity,
        parameters: first.parameters,
        covariance: first.statistics.covariance,
        rmsT: first.statistics.rmsT,
        rmsY: first.statistics.rmsY,
        converged: first.statistics.converged,
        rmsP: null,
        range: first.range,
      },
      dataSets,
    }
    expect(createHash('sha256').update(canonicalize(content)!).digest('hex')).toBe(first.signatures[0].digest)
  })

  it("gives the engineer the engine's bubble points with the joint parameters inside the range, and warns outside", async () => {
    const rec = await lab.engineer.get(`/api/systems/${lab.systemId}/recommended-parameters`).expect(200)
    expect(rec.body).toMatchObject({ id: first.id, label: 'Wilson (joint, 2 data sets)', signedBy: 'Rhea Lead' })
    const inside = await lab.engineer
      .get(`/api/systems/${lab.systemId}/recommended-parameters/curve?pressure=75&unit=kPa&points=21`)
      .expect(200)
    expect(inside.body.pressureInRange).toBe(true)
    expect(inside.body.rangeWarning).toBeNull()
    expect(inside.body.label).toBe('Wilson (joint, 2 data sets; recommended for the system)')
    const system = { vaporPressure, activity: first.activity as unknown as ActivityModel }
    const d = inside.body.diagram
    for (const i of [3, 10, 17]) {
      const b = bubbleTemperature(system, { P: 75000, x1: d.x1[i] })
      expect(d.T[i]).toBeCloseTo(b.T, 6)
      expect(d.y1[i]).toBeCloseTo(b.y1, 6)
    }
    const above = await lab.engineer
      .get(`/api/systems/${lab.systemId}/recommended-parameters/curve?pressure=2&unit=bar`)
      .expect(200)
    expect(above.body.pressureInRange).toBe(false)
    expect(above.body.rangeWarning).toBe(
      '200.0 kPa is above the pressures the recommended parameter set was fitted on (50.00 kPa to 101.3 kPa): this curve is an extrapolation and may be wrong. Ask the lab for data at this pressure before relying on it.',
    )
    const below = await lab.engineer
      .get(`/api/systems/${lab.systemId}/recommended-parameters/curve?pressure=20&unit=kPa`)
      .expect(200)
    expect(below.body.rangeWarning).toMatch(/^20\.00 kPa is below the pressures/)
  })

  it('the catalogue and the parameters exports carry the recommended set', async () => {
    const c = await lab.engineer.get('/api/catalogue').expect(200)
    const entry = c.body.items.find((e: { system: { id: string } }) => e.system.id === lab.systemId)
    expect(entry.recommendedSet).toMatchObject({ id: first.id, range: { Pmin: 50000, Pmax: 101325 } })
    const json = await lab.engineer.get(`/api/data-sets/${ids.atm}/export/parameters.json`).expect(200)
    expect(json.body.systemRecommendedSet).toMatchObject({
      id: first.id,
      label: 'Wilson (joint, 2 data sets)',
      parameters: first.parameters.map((p: { name: string; value: number }) =>
        expect.objectContaining({ name: p.name, value: p.value }),
      ),
    })
    const csv = await lab.engineer.get(`/api/data-sets/${ids.atm}/export/parameters.csv`).expect(200)
    const a12T = first.parameters.find((p: { name: string }) => p.name === 'a12T')
    expect(csv.text).toContain(`${first.id},system-recommended/wilson,`)
    expect(csv.text).toContain(`,a12T,${a12T!.value}`)
    expect(csv.text).toContain(',pressure_max,101325,')
  })

  it('a newer signed set supersedes the older, which stays in the record unchanged', async () => {
    const r = await lab.lead2
      .post(`/api/systems/${lab.systemId}/joint-fits`)
      .send({ dataSetIds: [ids.atm, ids.half], model: 'nrtl' })
      .expect(201)
    const s = await lab.lead2.post(`/api/joint-fits/${r.body.id}/submit`).send({ rowVersion: r.body.rowVersion })
    // lead ran nothing here and changed no data set: lead may sign.
    await lab.lead
      .post(`/api/joint-fits/${r.body.id}/approve`)
      .send({ password: PASSWORD, reason: 'NRTL fits both pressures better.', rowVersion: s.body.rowVersion })
      .expect(200)
    const old = await lab.reviewer.get(`/api/joint-fits/${first.id}`).expect(200)
    expect(old.body).toMatchObject({ state: 'superseded', supersededBy: r.body.id, parameters: first.parameters })
    const rec = await lab.engineer.get(`/api/systems/${lab.systemId}/recommended-parameters`).expect(200)
    expect(rec.body.id).toBe(r.body.id)
    // The database itself keeps signed sets as they were.
    await expect(
      sql`update joint_fit set parameters = '[]'::jsonb where id = ${first.id}`.execute(t.db),
    ).rejects.toThrow(/cannot be changed/)
    await expect(sql`delete from joint_fit_approval`.execute(t.db)).rejects.toThrow(/append-only/)
  })
})
