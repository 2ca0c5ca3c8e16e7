/**
 * Two kinds of run-sheet rows beside the equilibrium samples (docs/csv-formats.md):
 * - pure-component samples (the absent component's peak area 0 or empty): x1 = y1 = 1 or 0 exactly;
 * - check standards (phase `check`, known x1 in `check_x1`): read with the run's calibration and charted per
 *   GC method.
 * The calibration is the documented example (response factor k with A1/A2 = k·n1/n2). Areas of a check standard
 * are built from k so that the calibration reads a chosen x1: r = k·x/(1 − x) gives x = r/(k + r) (the definition
 * of a relative response factor; common practice, no source). Data INVENTED for the test.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, csv, draftWithPoints, type Lab } from './lab-fixture.js'

const HEADER = 'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit,check_x1'

let t: TestContext
let lab: Lab
let k: number
let ds: { id: string; rowVersion: number }
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const cal = await lab.analyst.get(`/api/calibrations/${lab.calibrationId}`).expect(200)
  k = cal.body.result.coefficients[0]
  ds = await draftWithPoints(t, lab, 'Pure and checks')
})
afterAll(() => t.close())

/** Areas that the response-factor calibration reads as exactly x. */
const areasFor = (x: number) => [((k * x) / (1 - x)) * 100000, 100000].map((a) => a.toFixed(4)).join(',')

async function upload(name: string, text: string, commit: boolean) {
  const url = `/api/data-sets/${ds.id}/uploads${commit ? '' : '/preview'}`
  const r = csv(lab.analyst.post(url), Buffer.from(text), name)
  if (commit) r.field('rowVersion', String(ds.rowVersion)).field('acceptWarnings', 'true')
  const res = await r
  if (commit && res.status === 201) ds.rowVersion = res.body.rowVersion
  return res
}

describe('pure-component samples in a run file', () => {
  const text = [
    HEADER,
    'PURE-A,liquid,1,512000.5,0,56.05,C,101.325,kPa,',
    'PURE-A,liquid,2,498700.1,,,,,,',
    'PURE-A,vapour,1,530100.0,0,,,,,',
    'PURE-M,liquid,1,,488000.0,64.62,C,101.325,kPa,',
  ].join('\n')

  it('previews x1 = y1 = 1 and 0 exactly, with no problem and no vapour needed for a pure liquid', async () => {
    const r = await upload('pure.csv', text, false)
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.problems).toEqual([])
    const by = Object.fromEntries(r.body.samples.map((s: { label: string }) => [s.label, s]))
    expect(by['PURE-A']).toMatchObject({ x1: 1, y1: 1, x1Uncertainty: 0, y1Uncertainty: 0, pureComponent: 1 })
    expect(by['PURE-M']).toMatchObject({ x1: 0, y1: 0, pureComponent: 2 })
  })

  it('commits them as points that feed the pure-component check', async () => {
    const r = await upload('pure.csv', text, true)
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const d = await lab.analyst.get(`/api/data-sets/${ds.id}`).expect(200)
    const pts = d.body.points.filter((p: { sampleLabel: string }) => p.sampleLabel.startsWith('PURE-'))
    expect(pts.map((p: { x1: number; y1: number }) => [p.x1, p.y1])).toEqual([
      [1, 1],
      [0, 0],
    ])
    const check = await lab.analyst.get(`/api/data-sets/${ds.id}/pure-component-check`).expect(200)
    const fromPoints = check.body.checks.filter((c: { source: string }) => c.source === 'point')
    expect(fromPoints).toHaveLength(2)
    // acetone at 101.325 kPa boils at 56.2 °C by the SVNA Table B.2 Antoine set: 56.05 °C is about −0.15 K off
    const acetone = fromPoints.find((c: { T: number }) => Math.abs(c.T - 329.2) < 0.1)
    expect(acetone.dT).toBeLessThan(0)
    expect(acetone.dT).toBeGreaterThan(-0.5)
    // the pure points take part in a fit like any other (no division by zero at x1 = 0 or 1)
    const fit = await lab.analyst.post(`/api/data-sets/${ds.id}/fits`).send({ models: ['wilson'] })
    expect(fit.status, JSON.stringify(fit.body)).toBe(201)
    ds.rowVersion = fit.body.rowVersion
    expect(fit.body.fits[0].statistics.converged).toBe(true)
    expect(Number.isFinite(fit.body.fits[0].statistics.rmsT)).toBe(true)
    const consistency = await lab.analyst.post(`/api/data-sets/${ds.id}/consistency`).send({ model: 'wilson' })
    expect([200, 201], JSON.stringify(consistency.body)).toContain(consistency.status)
    ds.rowVersion = (await lab.analyst.get(`/api/data-sets/${ds.id}`)).body.rowVersion
  })

  it('names the line when a sample mixes pure and two-peak rows, or a row has no peak at all', async () => {
    const bad = [
      HEADER,
      'MIX-1,liquid,1,1000,0,60,C,101.3,kPa,',
      'MIX-1,vapour,1,1200,800,,,,,',
      'NONE-1,liquid,1,0,,60,C,101.3,kPa,',
      'NEG-1,liquid,1,-5,100,60,C,101.3,kPa,',
    ].join('\n')
    const r = await upload('bad.csv', bad, false)
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(
      r.body.problems.map((p: { row: number; column: string; message: string }) => [p.row, p.column, p.message]),
    ).toEqual([
      [
        2,
        'area_2',
        "Sample MIX-1: line 2 shows only component 1 but line 3 shows both components; a pure-component sample has the absent component's area 0 or empty on every row.",
      ],
      [4, 'area_1', 'Both peak areas are zero or empty; a sample holds at least one component.'],
      [5, 'area_1', 'Peak area cannot be negative.'],
    ])
  })
})

describe('GC check standards', () => {
  // Deviations chosen so that the first five set the centre and σ and the sixth is far beyond 3σ.
  const readings = [0.5005, 0.4995, 0.501, 0.499, 0.5, 0.52]

  it('are previewed with the calibration reading and stored for the GC method on commit', async () => {
    const rows = readings.map((x, i) => `CS-${i + 1},check,1,${areasFor(x)},,,,,0.5`)
    const text = [HEADER, ...rows].join('\n')
    const p = await upload('checks.csv', text, false)
    expect(p.status, JSON.stringify(p.body)).toBe(200)
    expect(p.body.problems).toEqual([])
    expect(p.body.sampleCount).toBe(0)
    expect(p.body.checks.map((c: { measuredX1: number }) => c.measuredX1)).toEqual(
      readings.map((x) => expect.closeTo(x, 9)),
    )
    expect(p.body.checks[5].deviation).toBeCloseTo(0.02, 9)
    const c = await upload('checks.csv', text, true)
    expect(c.status, JSON.stringify(c.body)).toBe(201)
    expect(c.body.checkStandardIds).toHaveLength(6)
    expect(c.body.pointCount).toBe(0)
  })

  it('are charted per GC method: centre and σ from the first results, the far one out of control', async () => {
    const r = await lab.reviewer.get(`/api/gc-methods/${lab.gcMethodId}/check-standards`).query({ baseline: 5 })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    const dev = readings.map((x) => x - 0.5)
    // mean and sample standard deviation of the first five deviations, by hand: 0, √(2.5e-6/4) = 7.9057e-4
    expect(r.body.chart.centre).toBeCloseTo(0, 9)
    expect(r.body.chart.sigma).toBeCloseTo(Math.sqrt((0.0005 ** 2 * 2 + 0.001 ** 2 * 2) / 4), 9)
    expect(r.body.chart.baselineCount).toBe(5)
    expect(r.body.items.map((i: { deviation: number }) => i.deviation)).toEqual(dev.map((d) => expect.closeTo(d, 9)))
    const last = r.body.items[5]
    expect(last.label).toBe('CS-6')
    expect(last.outOfControl).toBe(true)
    expect(last.rules).toContain('one result beyond the 3σ limit')
    expect(r.body.chart.outOfControl).toEqual([last.id])
    expect(r.body.items.slice(0, 5).every((i: { outOfControl: boolean }) => !i.outOfControl)).toBe(true)
  })

  it('refuses a check row without a known x1 or with both areas needed, naming line and column', async () => {
    const text = [
      HEADER,
      'CS-X,check,1,1000,1000,,,,,',
      'CS-Y,check,1,1000,0,,,,,0.4',
      'CS-Z,check,1,1000,1000,,,,,1.5',
      'S-1,liquid,1,1000,1000,60,C,101.3,kPa,',
      'S-1,vapour,1,1000,900,,,,,',
      'S-1,check,1,1000,1000,,,,,0.5',
    ].join('\n')
    const r = await upload('bad-checks.csv', text, false)
    expect(
      r.body.problems.map((p: { row: number; column: string; message: string }) => [p.row, p.column, p.message]),
    ).toEqual([
      [2, 'check_x1', 'Check standard CS-X has no known x1 (check_x1).'],
      [3, 'area_2', 'A check standard is a mixture: both peak areas must be greater than zero.'],
      [4, 'check_x1', 'The check standard’s x1 must be a mole fraction between 0 and 1.'],
      [4, 'check_x1', 'Check standard CS-Z has no known x1 (check_x1).'],
      [7, 'sample', 'S-1 is used both for a check standard and for an equilibrium sample; give each its own label.'],
    ])
  })

  it('keeps hostile labels as text in the chart answer', async () => {
    const hostile = ['<img src=x onerror=alert(1)>', '=HYPERLINK("http://x")', 'a'.repeat(150)]
    const rows = hostile.map((h) => `"${h.replace(/"/g, '""')}",check,1,${areasFor(0.5)},,,,,0.5`)
    const c = await upload(`hostile.csv`, [HEADER, ...rows].join('\n'), true)
    expect(c.status, JSON.stringify(c.body)).toBe(201)
    const r = await lab.analyst.get(`/api/gc-methods/${lab.gcMethodId}/check-standards`).expect(200)
    expect(r.headers['content-type']).toMatch(/application\/json/)
    expect(r.body.items.slice(-3).map((i: { label: string }) => i.label)).toEqual(hostile)
    // A NUL byte in a label: the whole file is refused once, at its line, and nothing is stored
    const before = r.body.items.length
    const nul = await upload('nul.csv', [HEADER, `CS\u0000N,check,1,${areasFor(0.5)},,,,,0.5`].join('\n'), true)
    expect(nul.status).toBe(422)
    const again = await lab.analyst.get(`/api/gc-methods/${lab.gcMethodId}/check-standards`).expect(200)
    expect(again.body.items).toHaveLength(before)
  })

  it('answers 404 for an unknown method and 422 for a bad baseline', async () => {
    const none = await lab.analyst.get('/api/gc-methods/00000000-0000-4000-8000-000000000000/check-standards')
    expect(none.status).toBe(404)
    expect(none.body.error.message).toBe('There is no such GC method.')
    const bad = await lab.analyst.get(`/api/gc-methods/${lab.gcMethodId}/check-standards`).query({ baseline: 1 })
    expect(bad.status).toBe(422)
    expect(bad.body.error.details).toEqual([{ path: 'baseline', message: 'baseline must be 2–100 results' }])
  })
})
