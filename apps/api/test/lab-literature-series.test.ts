/**
 * Literature data of a system for its plots (GET /api/systems/:id/literature): every literature data set the
 * user may read, with its citation and points, and none of the lab's own (GC) data sets.
 * Points INVENTED: bubble points of the demo's acetone/methanol Wilson model (SVNA 7th ed. Table 12.5
 * parameters) computed by @ebullio/thermo, rounded as a table would print them.
 */
import { bubbleTemperature } from '@ebullio/thermo'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { ACETONE_METHANOL, buildLab, draftWithPoints, type Lab } from './lab-fixture.js'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'

let t: TestContext
let lab: Lab
const hostileTitle = '<script>alert(1)</script> =SUM(A1:A9) ' + 'x'.repeat(150)
const citation = {
  authors: '<b>A. Author</b>, =HYPERLINK("http://x")',
  title: 'Vapour-liquid equilibrium of acetone and methanol',
  source: 'Journal of Invented Data',
  year: 1987,
  volume: '12',
  pages: '101-109',
  doi: '10.0000/invented.1987.12',
  table: 'Table 2',
}
const points = [0.1, 0.5, 0.9].map((x1, i) => {
  const system = {
    vaporPressure: [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as [never, never],
    activity: ACETONE_METHANOL.activity as never,
  }
  const b = bubbleTemperature(system, { P: 101325, x1 })
  return {
    sampleLabel: `L${i + 1}`,
    temperatureK: Math.round(b.T * 100) / 100,
    pressurePa: 101325,
    x1,
    y1: Math.round(b.y1 * 1000) / 1000,
    x1Uncertainty: 0.002,
    y1Uncertainty: 0.003,
  }
})
let litId: string

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  await draftWithPoints(t, lab, 'Our own GC series')
  const d = await lab.analyst.post('/api/data-sets').send({
    systemId: lab.systemId,
    title: hostileTitle,
    nominalPressurePa: 101325,
    origin: 'literature',
    citation,
  })
  if (d.status !== 201) throw new Error(JSON.stringify(d.body))
  litId = d.body.id
  await lab.analyst.post(`/api/data-sets/${litId}/points`).send({ rowVersion: d.body.rowVersion, points }).expect(201)
})
afterAll(() => t.close())

describe('literature series of a system', () => {
  it('lists the literature data set with its citation and its points as typed, and not the GC series', async () => {
    const r = await lab.reviewer.get(`/api/systems/${lab.systemId}/literature`)
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.items).toHaveLength(1)
    const [s] = r.body.items
    expect(s.dataSetId).toBe(litId)
    expect(s.title).toBe(hostileTitle) // markup and formula text come back as the same text
    expect(s.citation).toEqual(citation)
    expect(s.points.map((p: { x1: number; y1: number; temperatureK: number }) => [p.x1, p.y1, p.temperatureK])).toEqual(
      points.map((p) => [p.x1, p.y1, p.temperatureK]),
    )
  })

  it('shows engineers only approved literature (this draft is not), and 404s an unknown system', async () => {
    const r = await lab.engineer.get(`/api/systems/${lab.systemId}/literature`).expect(200)
    expect(r.body.items).toEqual([])
    const none = await lab.analyst.get('/api/systems/00000000-0000-4000-8000-000000000000/literature')
    expect(none.status).toBe(404)
    expect(none.body.error.message).toBe('There is no such binary system.')
  })
})
