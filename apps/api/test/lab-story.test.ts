/**
 * The whole job through the API alone: an analyst calibrates, uploads, previews, commits, fits and submits;
 * a lead chemist approves with a signature; a reviewer comments on a point; an engineer reads the approved
 * system and downloads its parameters. Every mail is in the fake SMTP capture; the audit log tells the story.
 * Data: the documented example files (invented, generated from SVNA 7th ed. Table 12.5 Wilson parameters).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, createUser, PASSWORD, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import { csv, example, type Agent } from './lab-fixture.js'
import { DEMO_COMPONENTS, demoVaporPressure } from '../../../db/seeds/demo-systems.js'

let t: TestContext
const a: Record<string, Agent> = {}
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  for (const [key, role] of [
    ['mira', 'analyst'],
    ['tobias', 'lead_chemist'],
    ['priya', 'reviewer'],
    ['jonas', 'engineer'],
    ['elena', 'admin'],
  ] as const) {
    await createUser(t.db, {
      email: `${key}@halvorsen.test`,
      roles: [role],
      displayName: key[0].toUpperCase() + key.slice(1),
    })
    a[key] = await signedInAgent(t.app, `${key}@halvorsen.test`)
  }
})
afterAll(() => t.close())

describe('the lab story, end to end', () => {
  it('runs from the GC files to the engineer’s parameter download', async () => {
    // admin and lead chemist set up the components with their published Antoine sets (SVNA 7th ed., Table B.2)
    const comp: string[] = []
    for (const name of ['acetone', 'methanol']) {
      const c = DEMO_COMPONENTS[name]
      const r = await a.elena
        .post('/api/components')
        .send({ name, casNumber: c.cas, formula: c.formula, molarMass: c.molarMass, liquidMolarVolume: c.molarVolume })
        .expect(201)
      await a.tobias
        .post(`/api/components/${r.body.id}/vapor-pressure-sets`)
        .send({ model: demoVaporPressure(name), source: c.source })
        .expect(201)
      comp.push(r.body.id)
    }
    const sys = await a.mira.post('/api/systems').send({ component1Id: comp[0], component2Id: comp[1] }).expect(201)
    const gc = await a.mira
      .post('/api/gc-methods')
      .send({ name: 'FID-1', detector: 'FID', columnDescription: null, conditions: null })
      .expect(201)

    // 1. the analyst previews and commits the calibration
    const calFile = example('calibration-acetone-methanol.csv')
    const calForm = (r: ReturnType<Agent['post']>) =>
      csv(r, calFile, 'calibration-acetone-methanol.csv')
        .field('gcMethodId', gc.body.id)
        .field('systemId', sys.body.id)
        .field('model', 'response-factor')
    const calPreview = await calForm(a.mira.post('/api/calibrations/preview')).expect(200)
    expect(calPreview.body.errorCount).toBe(0)
    const cal = await calForm(a.mira.post('/api/calibrations')).field('acceptWarnings', 'true').expect(201)

    // 2. creates a data set, previews the run file (the spoiled one first), then commits the fixed one
    const ds = await a.mira
      .post('/api/data-sets')
      .send({
        systemId: sys.body.id,
        title: 'Kestrel acetone recycle, 1 atm',
        nominalPressurePa: 101325,
        apparatusNotes: 'Othmer-type still',
        projectRef: 'KES-7',
      })
      .expect(201)
    const bad = await csv(
      a.mira.post(`/api/data-sets/${ds.body.id}/uploads/preview`),
      example('run-acetone-methanol-with-errors.csv'),
    ).expect(200)
    expect(bad.body.errorCount).toBe(3)
    const good = await csv(
      a.mira.post(`/api/data-sets/${ds.body.id}/uploads/preview`),
      example('run-acetone-methanol.csv'),
    ).expect(200)
    expect(good.body.errorCount).toBe(0)
    expect(good.body.calibrationId).toBe(cal.body.id)
    const committed = await csv(
      a.mira.post(`/api/data-sets/${ds.body.id}/uploads`),
      example('run-acetone-methanol.csv'),
    )
      .field('rowVersion', String(ds.body.rowVersion))
      .field('acceptWarnings', 'true')
      .expect(201)
    expect(committed.body.pointCount).toBe(12)

    // 3. runs Wilson and NRTL fits and the consistency tests are optional here; submits
    const fits = await a.mira.post(`/api/data-sets/${ds.body.id}/fits`).send({ models: ['wilson', 'nrtl'] })
    expect(fits.status, JSON.stringify(fits.body)).toBe(201)
    expect(fits.body.fits.map((f: { model: string }) => f.model)).toEqual(['wilson', 'nrtl'])
    const wilson = fits.body.fits[0]
    // the points were generated from SVNA Table 12.5 Wilson a12 = −161.88, a21 = 583.11 cal/mol (×4.184 J/cal) with
    // small simulated noise: the fitted a12, a21 should land within 3 standard errors + 150 J/mol of them (loose, demo data)
    const a12 = wilson.parameters.find((p: { name: string }) => p.name === 'a12')
    expect(Math.abs(a12.value - -161.88 * 4.184)).toBeLessThan(3 * a12.standardError + 150)
    expect(wilson.statistics.rmsT).toBeLessThan(0.5)
    const submitted = await a.mira
      .post(`/api/data-sets/${ds.body.id}/submit`)
      .send({ rowVersion: fits.body.rowVersion })
      .expect(200)
    expect(submitted.body.state).toBe('submitted')

    // 4. the lead chemist marks the recommended fit and approves with a signature (password re-entered)
    const rec = await a.tobias
      .post(`/api/data-sets/${ds.body.id}/recommended-fit`)
      .send({ fitId: wilson.id })
      .expect(200)
    const wrongPw = await a.tobias
      .post(`/api/data-sets/${ds.body.id}/approve`)
      .send({ password: 'not-my-password', reason: 'x', rowVersion: rec.body.rowVersion })
    expect(wrongPw.status).toBe(403)
    expect(wrongPw.body.error).toEqual({
      code: 'signature_refused',
      message: 'The password is not correct; nothing was signed.',
      details: null,
    })
    const approved = await a.tobias
      .post(`/api/data-sets/${ds.body.id}/approve`)
      .send({
        password: PASSWORD,
        reason: 'Consistent with the plant samples; Wilson recommended.',
        rowVersion: rec.body.rowVersion,
      })
      .expect(200)
    expect(approved.body.dataSet.state).toBe('approved')
    expect(approved.body.digest).toMatch(/^[0-9a-f]{64}$/)
    expect(approved.body.approval).toMatchObject({
      meaning: 'approved',
      signerName: 'Tobias',
      digest: approved.body.digest,
      selfApproval: false,
    })

    // 5. a reviewer comments on a point; the analyst replies; the reviewer is told by mail
    const detail = await a.priya.get(`/api/data-sets/${ds.body.id}`).expect(200)
    const point = detail.body.points[4]
    const thread = await a.priya
      .post(`/api/data-sets/${ds.body.id}/comments`)
      .send({ body: 'This vapour sample looks rich for its T.', pointId: point.id })
      .expect(201)
    await a.mira
      .post(`/api/data-sets/${ds.body.id}/comments`)
      .send({ body: 'Re-injected: same areas.', parentId: thread.body.id })
      .expect(201)

    // 6. the engineer finds the approved system with its recommended fit and downloads the parameters
    const cat = await a.jonas.get('/api/catalogue?q=acetone').expect(200)
    expect(cat.body.items).toHaveLength(1)
    expect(cat.body.items[0].approved[0]).toMatchObject({
      dataSetId: ds.body.id,
      recommendedFit: { id: wilson.id, model: 'wilson' },
    })
    const curve = await a.jonas.get(`/api/data-sets/${ds.body.id}/curve?pressure=101.325&unit=kPa`).expect(200)
    // acetone/methanol has a minimum-boiling azeotrope near 55–56 °C at 1 atm (the generating Wilson model gives 55.5 °C)
    expect(curve.body.azeotrope.kind).toBe('minimum-boiling')
    expect(curve.body.azeotrope.T - 273.15).toBeGreaterThan(54.5)
    expect(curve.body.azeotrope.T - 273.15).toBeLessThan(56.5)
    const params = await a.jonas.get(`/api/data-sets/${ds.body.id}/export/parameters.json`).expect(200)
    expect(params.headers['content-disposition']).toBe(
      'attachment; filename=kestrel-acetone-recycle-1-atm-v1-parameters.json',
    )
    expect(params.body.recommendedFitId).toBe(wilson.id)
    expect(params.body.approval.digest).toBe(approved.body.digest)
    const paramsCsv = await a.jonas.get(`/api/data-sets/${ds.body.id}/export/parameters.csv`).expect(200)
    expect(paramsCsv.text.split('\n')[0]).toBe(
      'fit_id,model,recommended,parameter,value,standard_error,unit,component,component_name,cas',
    )

    // every mail of the story went through the outbox to the fake SMTP server
    const mail = await t.mail()
    const subjects = mail.map((m) => `${m.envelope_to} ${m.subject}`).reverse()
    expect(subjects).toEqual([
      'tobias@halvorsen.test Ebullio: "Kestrel acetone recycle, 1 atm" v1 submitted for approval',
      'mira@halvorsen.test Ebullio: "Kestrel acetone recycle, 1 atm" v1 approved',
      'priya@halvorsen.test Ebullio: Mira replied to your comment on "Kestrel acetone recycle, 1 atm"',
    ])

    // the audit log tells the whole story in order
    const audit = await a.priya.get(`/api/data-sets/${ds.body.id}/audit`).expect(200)
    expect(audit.body.items.map((e: { action: string; actorName: string }) => `${e.actorName}: ${e.action}`)).toEqual([
      'Mira: create',
      'Mira: upload run file',
      'Mira: run fit',
      'Mira: run fit',
      'Mira: submit',
      'Tobias: mark recommended fit',
      'Tobias: approve',
      'Priya: comment',
      'Mira: reply',
    ])
  })
})
