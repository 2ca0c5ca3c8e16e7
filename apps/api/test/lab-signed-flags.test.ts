/** A signature keeps the outlier flags the signer saw (against the recommended fit), so later views show what was signed. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { outlierPointIds } from '@ebullio/thermo'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, draftWithPoints, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
})
afterAll(() => t.close())

describe('outlier rule', () => {
  // ±2σ with σ the RMS over included points (common practice, no source); hand-computed table
  it('flags |residual| > 2·RMS of the included points, and what the fit flagged itself', () => {
    const r = [
      { pointId: 'a', dT: 0.1, dy: 0.001 },
      { pointId: 'b', dT: -0.1, dy: -0.001 },
      { pointId: 'c', dT: 0.1, dy: 0.001 },
      { pointId: 'd', dT: -0.1, dy: 0.001 },
      { pointId: 'e', dT: 0.1, dy: -0.001 },
      { pointId: 'f', dT: 1.0, dy: 0.001 },
      { pointId: 'g', dT: 5, dy: 0.5 },
      { pointId: 'h', dT: 0, dy: 0, flagged: true },
    ]
    // excluding g: RMS(dT) = sqrt((5·0.01 + 1 + 0)/7) = 0.387 K, so only f (1.0 > 0.775) and g (5) are beyond 2σ; h was flagged
    expect(outlierPointIds(r.map((x) => ({ ...x, excluded: x.pointId === 'g' })))).toEqual(['f', 'g', 'h'])
  })
})

describe('signed outlier flags', () => {
  it('stores the flags against the recommended fit with the approval', async () => {
    const d = await draftWithPoints(t, lab)
    const fits = await lab.analyst
      .post(`/api/data-sets/${d.id}/fits`)
      .send({ models: ['margules', 'wilson'] })
      .expect(201)
    await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: fits.body.rowVersion }).expect(200)
    const wilson = fits.body.fits.find((f: { model: string }) => f.model === 'wilson')
    const rec = await lab.lead.post(`/api/data-sets/${d.id}/recommended-fit`).send({ fitId: wilson.id }).expect(200)
    await lab.lead
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ password: PASSWORD, reason: 'Wilson recommended.', rowVersion: rec.body.rowVersion })
      .expect(200)
    const detail = (await lab.reviewer.get(`/api/data-sets/${d.id}`).expect(200)).body
    const expected = outlierPointIds(wilson.residuals)
    const labels = expected.map((id: string) => detail.points.find((p: { id: string }) => p.id === id).sampleLabel)
    expect(detail.approvals[0].outliers).toEqual({
      fitId: wilson.id,
      model: 'wilson',
      pointIds: expected,
      sampleLabels: labels,
      rule: 'flagged by the fit, or |ΔT|, |ΔP| or |Δy₁| above 2 × RMS of the included points',
    })
  })
})
