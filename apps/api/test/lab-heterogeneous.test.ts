/**
 * A partially miscible pair end to end, over the demo scenario (invented data, db/seeds): the approved
 * water/1-butanol data set's curve carries the heterogeneous azeotrope and the three-phase line, the catalogue
 * marks the system, and an analyst's run file with two-layer samples is stored with both layers.
 */
import { findAzeotropes, phaseDiagram, type ActivityModel, type BinarySystem } from '@ebullio/thermo'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { seedLab } from '../../../db/seeds/lab.js'
import { DEMO_PASSWORD, seedUsers } from '../../../db/seeds/users.js'
import { createTestContext, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import { csv, example, labCounts } from './lab-fixture.js'

let t: TestContext
let engineer: Awaited<ReturnType<typeof signedInAgent>>
let analyst: Awaited<ReturnType<typeof signedInAgent>>
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  await seedLab(t.db, await seedUsers(t.db))
  engineer = await signedInAgent(t.app, 'engineer@demo.ebullio.test', DEMO_PASSWORD)
  analyst = await signedInAgent(t.app, 'analyst@demo.ebullio.test', DEMO_PASSWORD)
})
afterAll(() => t.close())

type Azeo = { x1: number; T: number; P: number; kind: string; liquidPhases?: [number, number] }

/**
 * Outside references for water (1) / 1-butanol (2) at 101.325 kPa.
 * - Handbook: heterogeneous azeotrope near 92.7 °C (CRC Handbook azeotrope table; from memory), so 365.85 K ± 1 K.
 * - Independent calculation: the published NRTL parameters and Antoine sets of db/seeds/demo-systems.ts solved
 *   with a separate Python/SciPy script of the NRTL and Antoine equations (numpy 1.26, scipy 1.11; fsolve on equal
 *   activities, brentq on the pressure balance): T = 366.1248 K, y_water = 0.7644, layers 0.5881 and 0.9821.
 *   The demo's fit is to noisy invented points, so its numbers lie near these, not on them.
 */
const HANDBOOK_T = 273.15 + 92.7
const SCIPY = { T: 366.1248, y1: 0.7644, x1I: 0.5881, x1II: 0.9821 }

async function approvedWaterButanol() {
  const cat = await engineer.get('/api/catalogue').query({ q: 'butanol' }).expect(200)
  expect(cat.body.total).toBe(1)
  return cat.body.items[0]
}

/** The engine's own answer for the stored fit: the same inputs the curve endpoint uses. */
async function engineSystem(fitId: string): Promise<BinarySystem> {
  const fit = await t.db.selectFrom('fit').select('activity').where('id', '=', fitId).executeTakeFirstOrThrow()
  return {
    vaporPressure: [demoVaporPressure('water'), demoVaporPressure('1-butanol')],
    activity: fit.activity as unknown as ActivityModel,
  }
}

describe('partially miscible system (water/1-butanol)', () => {
  it('is marked partially miscible in the catalogue; a miscible system is not', async () => {
    const entry = await approvedWaterButanol()
    const m = entry.approved[0].miscibility
    expect(m.partial).toBe(true)
    expect(m.threePhase.T).toBeCloseTo(SCIPY.T, 0)
    // room temperature: two layers, the water-rich one nearly pure water (mutual solubilities, reference-values §7)
    expect(m.atRoomTemperature.x1II).toBeGreaterThan(0.97)
    expect(m.atRoomTemperature.x1I).toBeLessThan(0.7)
    const acetone = (await engineer.get('/api/catalogue').query({ q: 'acetone' }).expect(200)).body.items[0]
    expect(acetone.approved[0].miscibility).toEqual({ partial: false, atRoomTemperature: null, threePhase: null })
  })

  it('returns the heterogeneous azeotrope and the three-phase line, equal to the engine and near the handbook', async () => {
    const v = (await approvedWaterButanol()).approved[0]
    const r = await engineer.get(`/api/data-sets/${v.dataSetId}/curve`).query({ pressure: 101.325, unit: 'kPa' })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    const az: Azeo[] = r.body.azeotropes
    expect(az.map((a) => a.kind)).toEqual(['heterogeneous'])
    const het = az[0]
    // equal to the engine's value for the same inputs
    const engine = findAzeotropes(await engineSystem(v.recommendedFit.id), { P: 101325 })
    expect(engine).toHaveLength(1)
    expect(Math.abs(het.T - engine[0].T)).toBeLessThan(1e-6)
    expect(het.liquidPhases![0]).toBeCloseTo(engine[0].liquidPhases![0], 8)
    expect(het.liquidPhases![1]).toBeCloseTo(engine[0].liquidPhases![1], 8)
    // and near the outside world
    expect(Math.abs(het.T - HANDBOOK_T)).toBeLessThan(1)
    expect(Math.abs(het.T - SCIPY.T)).toBeLessThan(0.5)
    expect(Math.abs(het.x1 - SCIPY.y1)).toBeLessThan(0.03)
    // VLE points fix the layers only loosely (the fit sees T and y, not the layers): within 0.08 of the published model
    expect(Math.abs(het.liquidPhases![0] - SCIPY.x1I)).toBeLessThan(0.08)
    expect(Math.abs(het.liquidPhases![1] - SCIPY.x1II)).toBeLessThan(0.08)
    expect(het.liquidPhases![0]).toBeLessThan(het.x1)
    expect(het.x1).toBeLessThan(het.liquidPhases![1])
    // the three-phase line is the azeotrope's temperature, layers and vapour
    expect(r.body.threePhase).toEqual({ T: het.T, x1I: het.liquidPhases![0], x1II: het.liquidPhases![1], y1: het.x1 })
    expect(r.body.diagram.threePhase).toEqual(r.body.threePhase)
    // the two-liquid region climbs to the three-phase line and no single-liquid point lies inside the gap
    const lle = r.body.diagram.lle
    expect(lle.T[lle.T.length - 1]).toBeCloseTo(het.T, 6)
    const inside = r.body.diagram.x1.filter(
      (x: number) => x > het.liquidPhases![0] + 1e-9 && x < het.liquidPhases![1] - 1e-9,
    )
    expect(inside).toEqual([])
    // α is not reported inside the gap (there is no single liquid there)
    for (const a of r.body.relativeVolatility)
      expect(a.x1 <= het.liquidPhases![0] || a.x1 >= het.liquidPhases![1]).toBe(true)
  })

  it('the lab curve at another pressure equals the engine too', async () => {
    const v = (await approvedWaterButanol()).approved[0]
    const r = await engineer.get(`/api/data-sets/${v.dataSetId}/curve`).query({ pressure: 50, unit: 'kPa' }).expect(200)
    const d = phaseDiagram(await engineSystem(v.recommendedFit.id), { P: 50000 }, { points: 101, lle: true })
    expect(d.kind).toBe('isobaric')
    expect(r.body.threePhase.T).toBeCloseTo((d as { threePhase: { T: number } }).threePhase.T, 8)
    // lower pressure, lower three-phase temperature (Clausius–Clapeyron; common practice, no source)
    expect(r.body.threePhase.T).toBeLessThan(HANDBOOK_T - 10)
  })

  it('stores the seeded two-layer samples as heterogeneous points with both layers', async () => {
    const v = (await approvedWaterButanol()).approved[0]
    const d = (await engineer.get(`/api/data-sets/${v.dataSetId}`).expect(200)).body
    const het = d.points.filter((p: { heterogeneous: boolean }) => p.heterogeneous)
    expect(het.length).toBeGreaterThanOrEqual(4)
    for (const p of het) {
      const [I, II] = p.liquidPhases
      expect(I.x1).toBeLessThan(II.x1)
      // every two-layer sample boiled at the three-phase temperature: 366.12 K within the simulated noise
      expect(Math.abs(p.temperatureK - SCIPY.T)).toBeLessThan(0.5)
      expect(Math.abs(p.y1 - SCIPY.y1)).toBeLessThan(0.03)
      expect(Math.abs(I.x1 - SCIPY.x1I)).toBeLessThan(0.03)
      expect(Math.abs(II.x1 - SCIPY.x1II)).toBeLessThan(0.01)
    }
  })
})

describe('uploading a run file with two-layer samples', () => {
  let dataSet: { id: string; rowVersion: number }
  beforeAll(async () => {
    const sys = (await approvedWaterButanol()).system
    const r = await analyst
      .post('/api/data-sets')
      .send({ systemId: sys.id, title: 'Two-layer upload check', nominalPressurePa: 101325 })
      .expect(201)
    dataSet = { id: r.body.id, rowVersion: r.body.rowVersion }
  })

  it('refuses a file whose layer entries are wrong, naming line and column, and stores nothing', async () => {
    const bad = example('run-water-1-butanol-two-layers.csv')
      .toString()
      .replace(
        'WB-08,liquid,1,246362.9,228973.6,92.95,C,101.36,kPa,2',
        'WB-08,liquid,1,246362.9,228973.6,92.95,C,101.36,kPa,3',
      )
      .replace('WB-09,lower,1,', 'WB-09,lowest,1,')
    const before = await labCounts(t)
    const r = await csv(analyst.post(`/api/data-sets/${dataSet.id}/uploads`), bad)
      .field('rowVersion', String(dataSet.rowVersion))
      .field('acceptWarnings', 'true')
    expect(r.status).toBe(422)
    const problems = JSON.stringify(r.body)
    expect(problems).toContain('Layers must be 1 or 2 (the number of liquid layers seen in the still).')
    expect(problems).toContain('Sample WB-08 has layer injections but is not marked as two-layered; put 2 in layers.')
    expect(problems).toContain('Phase must be liquid, vapour, upper, lower or check.')
    expect(await labCounts(t)).toEqual(before)
  })

  it('previews and stores the overall liquid, the vapour and both layers, ordered by composition', async () => {
    const file = example('run-water-1-butanol-two-layers.csv')
    const p = await csv(analyst.post(`/api/data-sets/${dataSet.id}/uploads/preview`), file).expect(200)
    expect(p.body.errorCount).toBe(0)
    const wb08 = p.body.samples.find((s: { label: string }) => s.label === 'WB-08')
    expect(wb08.heterogeneous).toBe(true)
    // the upper layer is the butanol-rich one (x_water ≈ 0.59), the lower the water-rich one (≈ 0.98)
    expect(wb08.liquidPhases.map((l: { layer: string }) => l.layer)).toEqual(['upper', 'lower'])
    expect(Math.abs(wb08.liquidPhases[0].x1 - SCIPY.x1I)).toBeLessThan(0.03)
    expect(Math.abs(wb08.liquidPhases[1].x1 - SCIPY.x1II)).toBeLessThan(0.01)
    const c = await csv(analyst.post(`/api/data-sets/${dataSet.id}/uploads`), file)
      .field('rowVersion', String(dataSet.rowVersion))
      .field('acceptWarnings', 'true')
    expect(c.status, JSON.stringify(c.body)).toBe(201)
    const d = (await analyst.get(`/api/data-sets/${dataSet.id}`).expect(200)).body
    const stored = d.points.find((x: { sampleLabel: string }) => x.sampleLabel === 'WB-08')
    expect(stored.heterogeneous).toBe(true)
    expect(stored.x1).toBeCloseTo(wb08.x1, 12)
    expect(stored.liquidPhases).toEqual([
      { x1: wb08.liquidPhases[0].x1, uncertainty: wb08.liquidPhases[0].uncertainty },
      { x1: wb08.liquidPhases[1].x1, uncertainty: wb08.liquidPhases[1].uncertainty },
    ])
    const one = d.points.find((x: { sampleLabel: string }) => x.sampleLabel === 'WB-01')
    expect([one.heterogeneous, one.liquidPhases]).toEqual([false, null])
    const detail = (await analyst.get(`/api/data-sets/${dataSet.id}/points/${stored.id}`).expect(200)).body
    const phases = (detail.injections as { phase: string }[]).map((i) => i.phase).sort()
    expect(phases).toEqual(['liquid', 'liquid', 'lower', 'lower', 'upper', 'upper', 'vapour', 'vapour'])
  })

  it('fits the two-layer points as three-phase points: NRTL recovers the three-phase temperature', async () => {
    const r = await analyst.post(`/api/data-sets/${dataSet.id}/fits`).send({ models: ['nrtl'] })
    expect(r.status, JSON.stringify(r.body)).toBeLessThan(300)
    const fit = r.body.fits[0]
    const az = findAzeotropes(
      { vaporPressure: [demoVaporPressure('water'), demoVaporPressure('1-butanol')], activity: fit.activity },
      { P: 101325 },
    )
    expect(az.map((a) => a.kind)).toContain('heterogeneous')
    expect(Math.abs(az.find((a) => a.kind === 'heterogeneous')!.T - SCIPY.T)).toBeLessThan(0.5)
  })
})
