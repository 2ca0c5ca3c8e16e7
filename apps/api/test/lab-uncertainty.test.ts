/**
 * The fit's uncertainty tools over HTTP: the T–x–y band (±2σ from the parameter covariance), the next
 * compositions to measure, and the pure-component boiling-point check. The points are the documented
 * example run (INVENTED, generated from SVNA 7th ed. Table 12.5 Wilson parameters).
 * Vapour pressures: Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, 7th ed.,
 * Table B.2, ln(P/kPa) = A − B/(t/°C + C): acetone 14.3145, 2756.22, 228.060, tn 56.2 °C;
 * methanol 16.5785, 3638.27, 239.500, tn 64.7 °C.
 */
import { sql } from 'kysely'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, draftWithPoints, type Lab } from './lab-fixture.js'

/** Saturation temperature in K at P kPa from an SVNA Table B.2 Antoine set. */
const tsat = (A: number, B: number, C: number, PkPa: number) => B / (A - Math.log(PkPa)) - C + 273.15
const ACETONE = [14.3145, 2756.22, 228.06] as const
const METHANOL = [16.5785, 3638.27, 239.5] as const

let t: TestContext
let lab: Lab
let ds: { id: string; rowVersion: number }
let fit: { id: string }
let fitResponse: {
  predictions: { fitId: string; band: Record<string, number[]>; nextCompositions: { items: unknown[] } }[]
}
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  ds = await draftWithPoints(t, lab, 'Uncertainty')
  const r = await lab.analyst.post(`/api/data-sets/${ds.id}/fits`).send({ models: ['wilson'] })
  if (r.status !== 201) throw new Error(JSON.stringify(r.body))
  fit = r.body.fits[0]
  fitResponse = r.body
  ds.rowVersion = r.body.rowVersion
})
afterAll(() => t.close())

describe('prediction band', () => {
  it('comes with the fit run, at the nominal pressure', () => {
    const [p] = fitResponse.predictions
    expect(p.fitId).toBe(fit.id)
    expect(p.band.P).toBe(101325)
    expect(p.band.x1).toHaveLength(51)
    expect(p.nextCompositions.items).toHaveLength(5)
  })

  it('is recomputed from the stored fit exactly as the fit run gave it', async () => {
    const r = await lab.reviewer.get(`/api/data-sets/${ds.id}/fits/${fit.id}/band`)
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.dataSetId).toBe(ds.id)
    expect(r.body.model).toBe('wilson')
    expect(r.body.note).toMatch(/^Band of ±2σ around the fitted curve/)
    for (const k of ['T', 'y1', 'sigmaT', 'sigmaY', 'Tlow', 'Thigh']) {
      r.body[k].forEach((v: number, i: number) => expect(v).toBeCloseTo(fitResponse.predictions[0].band[k][i], 9))
    }
  })

  it('ends at the pure boiling points with no width there, and encloses the curve', async () => {
    const r = await lab.analyst.get(`/api/data-sets/${ds.id}/fits/${fit.id}/band`).query({ points: 21 })
    const b = r.body
    expect(b.x1).toHaveLength(21)
    // SVNA Table B.2: tn methanol 64.7 °C, acetone 56.2 °C (tabulated to 0.1 °C).
    expect(b.T[0] - 273.15).toBeCloseTo(64.7, 1)
    expect(b.T[20] - 273.15).toBeCloseTo(56.2, 1)
    // A pure component's boiling point does not depend on the mixing parameters (common practice, no source).
    expect(b.sigmaT[0]).toBeLessThan(1e-6)
    expect(b.sigmaT[20]).toBeLessThan(1e-6)
    expect(Math.max(...b.sigmaT)).toBeGreaterThan(0)
    b.T.forEach((T: number, i: number) => {
      expect(b.Tlow[i]).toBeLessThanOrEqual(T)
      expect(b.Thigh[i]).toBeGreaterThanOrEqual(T)
      expect(b.Thigh[i] - b.Tlow[i]).toBeCloseTo(4 * b.sigmaT[i], 9)
    })
  })

  it('is drawn at a pressure given with its unit', async () => {
    const r = await lab.analyst
      .get(`/api/data-sets/${ds.id}/fits/${fit.id}/band`)
      .query({ pressure: 50, unit: 'kPa', points: 11 })
    expect(r.status).toBe(200)
    expect(r.body.P).toBe(50000)
    expect(r.body.T[0]).toBeCloseTo(tsat(...METHANOL, 50), 3)
    expect(r.body.T[10]).toBeCloseTo(tsat(...ACETONE, 50), 3)
    const bad = await lab.analyst.get(`/api/data-sets/${ds.id}/fits/${fit.id}/band`).query({ pressure: -1 })
    expect(bad.status).toBe(422)
    expect(bad.body.error.details).toEqual([{ path: 'pressure', message: 'Pressure must be positive' }])
  })

  it('works for a fit stored before its settings were kept (fitted again on the same points)', async () => {
    const before = await lab.analyst.get(`/api/data-sets/${ds.id}/fits/${fit.id}/band`)
    await sql`update fit set statistics = statistics - 'settings' where id = ${fit.id}`.execute(t.db)
    const after = await lab.analyst.get(`/api/data-sets/${ds.id}/fits/${fit.id}/band`)
    expect(after.status, JSON.stringify(after.body)).toBe(200)
    after.body.sigmaT.forEach((s: number, i: number) => expect(s).toBeCloseTo(before.body.sigmaT[i], 9))
    const next = await lab.analyst.get(`/api/data-sets/${ds.id}/fits/${fit.id}/next-compositions`).query({ count: 2 })
    expect(next.status, JSON.stringify(next.body)).toBe(200)
  })

  it("answers 404 for another data set's fit, and engineers 404 for a draft", async () => {
    const other = await lab.analyst.get(`/api/data-sets/${ds.id}/fits/00000000-0000-4000-8000-000000000000/band`)
    expect(other.status).toBe(404)
    expect(other.body.error.message).toBe('There is no such fit in this data set.')
    const eng = await lab.engineer.get(`/api/data-sets/${ds.id}/fits/${fit.id}/band`)
    expect(eng.status).toBe(404)
    expect(eng.body.error.message).toBe('There is no such data set.')
  })
})

describe('where to measure next', () => {
  it('suggests distinct compositions inside (0, 1), the most uncertain first', async () => {
    const r = await lab.lead.get(`/api/data-sets/${ds.id}/fits/${fit.id}/next-compositions`).query({ count: 3 })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.P).toBe(101325)
    const items: { x1: number; T: number; y1: number; sigmaY: number }[] = r.body.items
    expect(items).toHaveLength(3)
    expect(r.body.criterion).toBe('sigma-y')
    for (const s of items) {
      expect(s.x1).toBeGreaterThanOrEqual(0.01)
      expect(s.x1).toBeLessThanOrEqual(0.99)
      expect(s.sigmaY).toBeGreaterThan(0)
    }
    for (let i = 0; i < items.length; i++)
      for (let j = 0; j < i; j++) expect(Math.abs(items[i].x1 - items[j].x1)).toBeGreaterThanOrEqual(0.05 - 1e-9)
    expect(items[0].sigmaY).toBeGreaterThanOrEqual(items[1].sigmaY)
  })

  it('checks the count and keeps engineers out', async () => {
    const bad = await lab.analyst.get(`/api/data-sets/${ds.id}/fits/${fit.id}/next-compositions`).query({ count: 0 })
    expect(bad.status).toBe(422)
    expect(bad.body.error.details[0].path).toBe('count')
    expect((await lab.engineer.get(`/api/data-sets/${ds.id}/fits/${fit.id}/next-compositions`)).status).toBe(403)
  })

  it('ranks by the D-optimal criterion when asked, and names it', async () => {
    const url = `/api/data-sets/${ds.id}/fits/${fit.id}/next-compositions`
    const d = await lab.lead.get(url).query({ count: 2, criterion: 'd-optimal' })
    expect(d.status, JSON.stringify(d.body)).toBe(200)
    expect(d.body.criterion).toBe('d-optimal')
    expect(d.body.fitId).toBe(fit.id)
    const xs: number[] = d.body.items.map((s: { x1: number }) => s.x1)
    expect(xs).toHaveLength(2)
    // A two-parameter model is pinned by its γ∞ values, so D-optimal picks lie toward the dilute ends
    // (Atkinson & Donev, Optimum Experimental Designs, 1992, ch. 11; from memory).
    expect(Math.min(...xs.map((x) => Math.min(x, 1 - x)))).toBeLessThan(0.25)
    const again = await lab.lead.get(url).query({ count: 2, criterion: 'd-optimal' })
    expect(again.body.items).toEqual(d.body.items)
    const plain = await lab.lead.get(url).query({ count: 2, criterion: 'sigma-y' })
    expect(plain.body.criterion).toBe('sigma-y')
    expect(plain.body.items).toEqual((await lab.lead.get(url).query({ count: 2 })).body.items)
  })

  it("keeps away from the data set's own points and inside the range asked for", async () => {
    const url = `/api/data-sets/${ds.id}/fits/${fit.id}/next-compositions`
    const measured: number[] = (await lab.lead.get(`/api/data-sets/${ds.id}`)).body.points.map(
      (p: { x1: number }) => p.x1,
    )
    expect(measured.length).toBeGreaterThan(3)
    const r = await lab.lead.get(url).query({ count: 4, criterion: 'd-optimal', exclusion: 0.04 })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.exclusion).toBe(0.04)
    expect(r.body.range).toEqual([0, 1])
    for (const s of r.body.items as { x1: number }[])
      for (const m of measured) expect(Math.abs(s.x1 - m)).toBeGreaterThanOrEqual(0.04 - 1e-9)
    const end = await lab.lead.get(url).query({ count: 2, from: 0.9, to: 1, exclusion: 0 })
    expect(end.status, JSON.stringify(end.body)).toBe(200)
    expect(end.body.range).toEqual([0.9, 1])
    expect(end.body.items).toHaveLength(2)
    for (const s of end.body.items as { x1: number }[]) expect(s.x1 >= 0.9 && s.x1 <= 0.999).toBe(true)
    const none = await lab.lead.get(url).query({ count: 2, from: 0.5, to: 0.51, exclusion: 0.5 })
    expect(none.body.items).toEqual([])
    expect(none.body.notes).toEqual([
      'No composition in x1 = 0.50–0.51 is at least 0.50 from every measured point; widen the range or shorten the distance.',
    ])
  })

  it('refuses a range narrower than 0.01 or a distance out of bounds, naming the field', async () => {
    const url = `/api/data-sets/${ds.id}/fits/${fit.id}/next-compositions`
    const narrow = await lab.lead.get(url).query({ from: 0.5, to: 0.4 })
    expect(narrow.status).toBe(422)
    expect(narrow.body.error.details).toEqual([
      { path: 'to', message: 'The composition range must be at least 0.01 wide (to − from ≥ 0.01)' },
    ])
    const far = await lab.lead.get(url).query({ exclusion: 0.7 })
    expect(far.status).toBe(422)
    expect(far.body.error.details).toEqual([{ path: 'exclusion', message: 'exclusion must be 0–0.5 (x1)' }])
    // text where a number belongs (a formula, markup, a NUL byte, a long string) is refused, never echoed as markup
    for (const bad of ['=1+1', '<b>0.1</b>', '9'.repeat(400)]) {
      const r = await lab.lead.get(url).query({ from: bad })
      expect(r.status, bad).toBe(422)
      expect(r.body.error.details[0].path).toBe('from')
      expect(JSON.stringify(r.body)).not.toContain('<b>')
    }
    // a NUL byte is refused at the door (middleware/invalid-text.ts), before any parsing
    const nul = await lab.lead.get(url).query({ from: '0.1\u0000' })
    expect(nul.status).toBe(400)
  })

  it('refuses an unknown criterion, naming the field', async () => {
    const bad = await lab.lead
      .get(`/api/data-sets/${ds.id}/fits/${fit.id}/next-compositions`)
      .query({ criterion: 'widest' })
    expect(bad.status).toBe(422)
    expect(bad.body.error.details).toEqual([
      { path: 'criterion', message: "The criterion must be 'sigma-y' or 'd-optimal'" },
    ])
  })
})

describe('pure-component check', () => {
  it('compares measured boiling points with the vapour-pressure sets', async () => {
    const sys = await lab.analyst.get(`/api/systems/${lab.systemId}`)
    const [acetone, methanol] = [sys.body.component1.id, sys.body.component2.id]
    const none = await lab.analyst.get(`/api/data-sets/${ds.id}/pure-component-check`)
    expect(none.status).toBe(200)
    expect(none.body.checks).toEqual([])
    expect(none.body.warnings).toContain(
      'No pure-component points (x1 = 0 or 1) to compare with the vapour-pressure models.',
    )
    // acetone at its SVNA Table B.2 normal boiling point; methanol measured 1 K too high.
    await lab.analyst
      .post(`/api/components/${acetone}/pure-measurements`)
      .send({ temperatureK: 56.2 + 273.15, pressurePa: 101325 })
      .expect(201)
    await lab.analyst
      .post(`/api/components/${methanol}/pure-measurements`)
      .send({ temperatureK: 65.7 + 273.15, pressurePa: 101325 })
      .expect(201)
    const r = await lab.reviewer.get(`/api/data-sets/${ds.id}/pure-component-check`)
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.toleranceK).toBe(0.3)
    expect(r.body.passed).toBe(false)
    const byComponent = Object.fromEntries(r.body.checks.map((c: { component: number }) => [c.component, c]))
    expect(byComponent[1]).toMatchObject({ source: 'pure-measurement', passed: true })
    expect(byComponent[1].Tmodel).toBeCloseTo(tsat(...ACETONE, 101.325), 6)
    expect(Math.abs(byComponent[1].dT)).toBeLessThan(0.1)
    expect(byComponent[2]).toMatchObject({ source: 'pure-measurement', passed: false })
    expect(byComponent[2].dT).toBeCloseTo(65.7 + 273.15 - tsat(...METHANOL, 101.325), 6)
    const loose = await lab.analyst.get(`/api/data-sets/${ds.id}/pure-component-check`).query({ toleranceK: 2 })
    expect(loose.body.passed).toBe(true)
  })

  it('comes with the consistency tests', async () => {
    const r = await lab.analyst.post(`/api/data-sets/${ds.id}/consistency`).send({ model: 'wilson' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    // the area test, the point test and the data-quality score
    expect(r.body.items.map((i: { test: string }) => i.test)).toEqual(['herington-area', 'point', 'quality-score'])
    expect(r.body.pureComponent.checks).toHaveLength(2)
    expect(r.body.pureComponent.passed).toBe(false)
  })

  it('refuses a bad tolerance with the exact message', async () => {
    const r = await lab.analyst.get(`/api/data-sets/${ds.id}/pure-component-check`).query({ toleranceK: 0 })
    expect(r.status).toBe(422)
    expect(r.body.error.details).toEqual([{ path: 'toleranceK', message: 'The tolerance must be positive (K)' }])
  })
})
