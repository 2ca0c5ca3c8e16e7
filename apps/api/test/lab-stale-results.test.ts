/**
 * Derived results are bound to the point set they were computed on: a change to the points makes older fits
 * and consistency results stale at once, and submit and approve refuse while a shown result is stale.
 * Residuals read measured − calculated; four-eyes covers every content change; threads are resolved only by
 * their author or an independent lead chemist. Data: the documented example run file (invented).
 */
import canonicalize from 'canonicalize'
import { createHash } from 'node:crypto'
import { sql } from 'kysely'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { contentDigest, DIGEST_V1 } from '../src/services/digest.js'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, csv, draftWithPoints, example, labCounts, type Agent, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
})
afterAll(() => t.close())

type Fit = {
  id: string
  model: string
  stale: boolean
  pointSetDigest: string
  pointCount: number
  residuals: { pointId: string; dT: number }[]
}

async function detail(who: Agent, id: string) {
  return (await who.get(`/api/data-sets/${id}`).expect(200)).body
}

/** A draft with two fits (the lead chemist marks Wilson recommended) and a consistency run, all by the analyst. */
async function fittedDraft(title: string) {
  const d = await draftWithPoints(t, lab, title)
  const f = await lab.analyst
    .post(`/api/data-sets/${d.id}/fits`)
    .send({ models: ['margules', 'wilson'] })
    .expect(201)
  await lab.analyst.post(`/api/data-sets/${d.id}/consistency`).send({ model: 'wilson' }).expect(201)
  const wilson = f.body.fits.find((x: Fit) => x.model === 'wilson')
  const rec = await lab.lead.post(`/api/data-sets/${d.id}/recommended-fit`).send({ fitId: wilson.id }).expect(200)
  return { id: d.id, wilsonId: wilson.id as string, rowVersion: rec.body.rowVersion as number }
}

describe('results bound to their point set', () => {
  it('excluding a point makes every older fit and consistency result stale; submit is refused naming them', async () => {
    const d = await fittedDraft('Stale after exclusion')
    const before = await detail(lab.analyst, d.id)
    expect(before.fits.map((f: Fit) => f.stale)).toEqual([false, false])
    // area test, point test and data-quality score
    expect(before.consistency.map((c: Fit) => c.stale)).toEqual([false, false, false])
    expect(before.fits[0].pointSetDigest).toBe(before.pointSetDigest)
    expect(before.fits[0].pointCount).toBe(12)

    const ex = await lab.analyst
      .patch(`/api/data-sets/${d.id}/points/${before.points[3].id}`)
      .send({ rowVersion: d.rowVersion, excluded: true, reason: 'bubble in the sample line' })
      .expect(200)
    const after = await detail(lab.analyst, d.id)
    expect(after.pointSetDigest).not.toBe(before.pointSetDigest)
    expect(after.fits.map((f: Fit) => f.stale)).toEqual([true, true])
    expect(after.consistency.map((c: Fit) => c.stale)).toEqual([true, true, true])
    expect(
      (await lab.analyst.get(`/api/data-sets/${d.id}/fits`).expect(200)).body.items.every((f: Fit) => f.stale),
    ).toBe(true)
    const band = await lab.analyst.get(`/api/data-sets/${d.id}/fits/${d.wilsonId}/band`).expect(200)
    expect(band.body).toMatchObject({ stale: true, pointCount: 12, pointSetDigest: before.pointSetDigest })

    const submit = await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: ex.body.rowVersion })
    expect(submit.status).toBe(409)
    expect(submit.body.error.code).toBe('stale_results')
    expect(submit.body.error.message).toMatch(
      /^Cannot submit: results computed on other points than the data set has now — the recommended fit \(Wilson\) was computed on 12 points on .+ UTC; the (area|point) test was computed on 12 points/,
    )
    // the recommended fit, the area and point tests and the data-quality score
    expect(submit.body.error.details.stale).toHaveLength(4)
    // A stale fit cannot be chosen either.
    const choose = await lab.lead.post(`/api/data-sets/${d.id}/recommended-fit`).send({ fitId: d.wilsonId })
    expect(choose.status).toBe(409)
    expect(choose.body.error.code).toBe('stale_results')

    // Re-running on the current points gives fresh results and the submit goes through.
    const again = await lab.analyst
      .post(`/api/data-sets/${d.id}/fits`)
      .send({ models: ['wilson'] })
      .expect(201)
    expect(again.body.fits[0]).toMatchObject({ stale: false, pointCount: 11, reused: false })
    await lab.analyst.post(`/api/data-sets/${d.id}/consistency`).send({ model: 'wilson' }).expect(201)
    const rec = await lab.lead
      .post(`/api/data-sets/${d.id}/recommended-fit`)
      .send({ fitId: again.body.fits[0].id })
      .expect(200)
    await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: rec.body.rowVersion }).expect(200)
  })

  it('approve is refused (409 stale_results) when the points changed under a submitted version', async () => {
    const d = await fittedDraft('Changed while submitted')
    const sub = await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: d.rowVersion }).expect(200)
    // A change the state machine did not stop (the database allows it for a submitted version).
    const pid = (await detail(lab.lead2, d.id)).points[5].id
    await sql`update point set excluded = true, exclusion_reason = 'changed behind the API' where id = ${pid}`.execute(
      t.db,
    )
    const before = await labCounts(t)
    const r = await lab.lead2
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ password: PASSWORD, reason: 'ok', rowVersion: sub.body.rowVersion })
    expect(r.status).toBe(409)
    expect(r.body.error.code).toBe('stale_results')
    expect(r.body.error.message).toMatch(/^Cannot approve: .*the recommended fit \(Wilson\) was computed on 12 points/)
    expect(await labCounts(t)).toEqual(before)
  })

  it('an identical re-run is not stored twice; a draft’s fit can be deleted (audited), a submitted one’s cannot', async () => {
    const d = await draftWithPoints(t, lab, 'Re-runs')
    const first = await lab.analyst
      .post(`/api/data-sets/${d.id}/fits`)
      .send({ models: ['nrtl'], alpha: 0.3 })
      .expect(201)
    const count = (await labCounts(t)).fit
    const second = await lab.analyst2
      .post(`/api/data-sets/${d.id}/fits`)
      .send({ models: ['nrtl'], alpha: 0.3 })
      .expect(201)
    expect(second.body.fits[0]).toMatchObject({ id: first.body.fits[0].id, reused: true, stale: false })
    expect((await labCounts(t)).fit).toBe(count)
    // another α is another fit
    await lab.analyst
      .post(`/api/data-sets/${d.id}/fits`)
      .send({ models: ['nrtl'], alpha: 0.5 })
      .expect(201)
    expect((await labCounts(t)).fit).toBe(count + 1)

    const del = await lab.analyst.delete(`/api/data-sets/${d.id}/fits/${first.body.fits[0].id}`).expect(200)
    expect(del.body.deleted).toBe(first.body.fits[0].id)
    expect((await labCounts(t)).fit).toBe(count)
    const trail = (await lab.analyst.get(`/api/data-sets/${d.id}/audit`).expect(200)).body.items
    const entry = trail.find((a: { action: string }) => a.action === 'delete fit')
    expect(entry).toMatchObject({ actorName: 'Mira Analyst', entityId: first.body.fits[0].id })

    const fits = (await detail(lab.analyst, d.id)).fits
    await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: del.body.rowVersion }).expect(200)
    const refused = await lab.analyst.delete(`/api/data-sets/${d.id}/fits/${fits[0].id}`)
    expect(refused.status).toBe(409)
    expect(refused.body.error.message).toBe(
      'This data set is submitted; deleting fits is possible only when it is draft or returned.',
    )
  })
})

describe('residual sign: measured − calculated', () => {
  it('a point deliberately raised by 1 K has a residual of about +1 K in the API', async () => {
    const clean = await draftWithPoints(t, lab, 'Clean run')
    // AM-06's boiling temperature raised by exactly 1 K in the file as uploaded.
    const raisedFile = example('run-acetone-methanol.csv')
      .toString('utf8')
      .replace(/^(AM-06,liquid,1,[^,]*,[^,]*,)([0-9.]+)/m, (_, head, T) => `${head}${(Number(T) + 1).toFixed(2)}`)
    expect(raisedFile).not.toBe(example('run-acetone-methanol.csv').toString('utf8'))
    const raised = await draftWithPoints(t, lab, 'Raised run', raisedFile)
    const dT = async (id: string) => {
      const f = await lab.analyst
        .post(`/api/data-sets/${id}/fits`)
        .send({ models: ['wilson'] })
        .expect(201)
      const d = await detail(lab.analyst, id)
      const p = d.points.find((x: { sampleLabel: string }) => x.sampleLabel === 'AM-06')
      return (f.body.fits[0] as Fit).residuals.find((r) => r.pointId === p.id)!.dT
    }
    const before = await dT(clean.id)
    const after = await dT(raised.id)
    // The fit leans a little towards the raised point, so the shift is a bit under 1 K; the sign is what matters.
    expect(after - before).toBeGreaterThan(0.7)
    expect(after - before).toBeLessThan(1.05)
    expect(after).toBeGreaterThan(0.6)
  })
})

describe('four-eyes over every content change', () => {
  async function submitted(title: string, change: (id: string, rv: number) => Promise<number>) {
    const d = await draftWithPoints(t, lab, title)
    const rv = await change(d.id, d.rowVersion)
    const det = await detail(lab.analyst, d.id)
    let fit = det.fits.find((f: Fit) => !f.stale)
    if (!fit)
      fit = (
        await lab.analyst
          .post(`/api/data-sets/${d.id}/fits`)
          .send({ models: ['wilson'] })
          .expect(201)
      ).body.fits[0]
    const rec = await lab.lead.post(`/api/data-sets/${d.id}/recommended-fit`).send({ fitId: fit.id }).expect(200)
    const sub = await lab.analyst
      .post(`/api/data-sets/${d.id}/submit`)
      .send({ rowVersion: rec.body.rowVersion })
      .expect(200)
    void rv
    return { id: d.id, rowVersion: sub.body.rowVersion as number }
  }
  const approve = (who: Agent, d: { id: string; rowVersion: number }) =>
    who
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ password: PASSWORD, reason: 'Checked.', rowVersion: d.rowVersion })

  it('a lead chemist who excluded a point cannot approve; the approval lists who changed what', async () => {
    const d = await submitted('Lead excluded a point', async (id, rv) => {
      const pid = (await detail(lab.lead2, id)).points[2].id
      const r = await lab.lead2
        .patch(`/api/data-sets/${id}/points/${pid}`)
        .send({ rowVersion: rv, excluded: true, reason: 'leak' })
        .expect(200)
      return r.body.rowVersion
    })
    const self = await approve(lab.lead2, d)
    expect(self.status).toBe(403)
    expect(self.body.error).toMatchObject({
      code: 'four_eyes',
      message: 'You changed this version (excluded or included points); another lead chemist must approve it.',
    })
    const ok = await approve(lab.lead, d)
    // lead marked the fit recommended but did not run it: choosing is reviewing, not changing content
    expect(ok.status).toBe(200)
    expect(ok.body.approval.changes).toEqual([
      {
        userId: lab.ids.analyst,
        name: 'Mira Analyst',
        changes: ['created the data set', 'uploaded points', 'ran the recommended fit'],
      },
      { userId: lab.ids.lead2, name: 'Rhea Lead', changes: ['excluded or included points'] },
    ])
    expect(ok.body.approval.selfApproval).toBe(false)
    expect(ok.body.approval.digestAlgorithm).toBe('ebullio-signed-content/2')
  })

  it('a lead chemist who ran the recommended fit, or edited the metadata, cannot approve', async () => {
    const ran = await draftWithPoints(t, lab, 'Lead ran the fit')
    const f = await lab.lead
      .post(`/api/data-sets/${ran.id}/fits`)
      .send({ models: ['wilson'] })
      .expect(201)
    const rec = await lab.lead
      .post(`/api/data-sets/${ran.id}/recommended-fit`)
      .send({ fitId: f.body.fits[0].id })
      .expect(200)
    const sub = await lab.analyst
      .post(`/api/data-sets/${ran.id}/submit`)
      .send({ rowVersion: rec.body.rowVersion })
      .expect(200)
    const r = await approve(lab.lead, { id: ran.id, rowVersion: sub.body.rowVersion })
    expect(r.status).toBe(403)
    expect(r.body.error.message).toBe(
      'You changed this version (ran the recommended fit); another lead chemist must approve it.',
    )

    const edited = await submitted('Lead edited metadata', async (id, rv) => {
      const r2 = await lab.lead.patch(`/api/data-sets/${id}`).send({ rowVersion: rv, projectRef: 'KES-2' }).expect(200)
      return r2.body.rowVersion
    })
    const r3 = await approve(lab.lead, edited)
    expect(r3.status).toBe(403)
    expect(r3.body.error.message).toBe(
      'You changed this version (edited the metadata); another lead chemist must approve it.',
    )
    await approve(lab.lead2, edited).expect(200)
  })

  it('a thread is resolved by its author or an independent lead chemist, not by the data set’s author', async () => {
    const d = await draftWithPoints(t, lab, 'Objection')
    const root = await lab.reviewer
      .post(`/api/data-sets/${d.id}/comments`)
      .send({ body: 'AM-04 looks off' })
      .expect(201)
    const byAuthor = await lab.analyst.post(`/api/data-sets/${d.id}/comments/${root.body.id}/resolve`)
    expect(byAuthor.status).toBe(403)
    expect(byAuthor.body.error.message).toBe(
      'Only the author of this thread or a lead chemist who did not create the data set may resolve it; the approver can otherwise sign with an override reason.',
    )
    await lab.lead.post(`/api/data-sets/${d.id}/comments/${root.body.id}/resolve`).expect(200)
    await lab.reviewer.post(`/api/data-sets/${d.id}/comments/${root.body.id}/reopen`).expect(200)
    await lab.reviewer.post(`/api/data-sets/${d.id}/comments/${root.body.id}/resolve`).expect(200)
  })

  it('an analyst cannot fit a submitted data set; the submit says how many lead chemists were told', async () => {
    const d = await draftWithPoints(t, lab, 'Told')
    const f = await lab.analyst
      .post(`/api/data-sets/${d.id}/fits`)
      .send({ models: ['margules'] })
      .expect(201)
    const sub = await lab.analyst
      .post(`/api/data-sets/${d.id}/submit`)
      .send({ rowVersion: f.body.rowVersion })
      .expect(200)
    expect(sub.body.notifiedLeadChemists).toBe(2)
    const late = await lab.analyst.post(`/api/data-sets/${d.id}/fits`).send({ models: ['wilson'] })
    expect(late.status).toBe(409)
    expect(late.body.error.message).toBe('This data set is submitted; only a lead chemist may go on fitting.')
  })
})

describe('the signed digest', () => {
  it('an auditor recomputes it from the API’s answers as docs/workflow.md describes; format 1 signatures still verify', async () => {
    const d = await fittedDraft('Audited')
    const sub = await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: d.rowVersion }).expect(200)
    const ok = await lab.lead2
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ password: PASSWORD, reason: 'Checked.', rowVersion: sub.body.rowVersion })
      .expect(200)
    const det = await detail(lab.reviewer, d.id)
    // The recipe of docs/workflow.md, "Recomputing a digest", step by step.
    const points = [...det.points].sort((a, b) => a.seq - b.seq)
    const pointSet = {
      format: 'ebullio-point-set/1',
      points: points.map((p) => ({
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
    const sha = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex')
    const psd = sha(canonicalize(pointSet)!)
    expect(psd).toBe(det.pointSetDigest)
    const fit = det.fits.find((f: { id: string }) => f.id === det.recommendedFitId)
    // the eight metadata fields of format 1 (frozen); format 2 adds origin and layout
    const metadataV1 = {
      id: det.id,
      lineageId: det.lineageId,
      version: det.version,
      systemId: det.systemId,
      title: det.title,
      nominalPressurePa: det.nominalPressurePa,
      apparatusNotes: det.apparatusNotes,
      projectRef: det.projectRef,
    }
    const content = {
      format: 'ebullio-signed-content/2',
      dataSet: {
        ...metadataV1,
        origin: det.origin,
        originMethod: det.originMethod,
        citation: det.citation,
        countsAsOwn: det.countsAsOwn,
        countsAsOwnReason: det.countsAsOwnReason,
        layout: det.layout,
      },
      pointSet: { digest: psd, included: points.filter((p) => !p.excluded).length },
      points: points.map((p) => ({
        id: p.id,
        seq: p.seq,
        sample: p.sampleLabel,
        T: p.temperatureK,
        P: p.pressurePa,
        x1: p.x1,
        ux1: p.x1Uncertainty,
        y1: p.y1,
        uy1: p.y1Uncertainty,
        excluded: p.excluded,
        reason: p.exclusionReason,
        uploadId: p.uploadId,
        calibrationId: p.calibrationId,
      })),
      recommendedFit: {
        id: fit.id,
        model: fit.model,
        options: fit.options,
        activity: fit.activity,
        parameters: fit.parameters,
        pointIds: fit.pointIds,
        pointSetDigest: fit.pointSetDigest,
      },
      consistency: det.consistency
        .filter((c: { pointSetDigest: string }) => c.pointSetDigest === psd)
        .sort((a: { id: string }, b: { id: string }) => a.id.localeCompare(b.id))
        .map((c: { id: string; test: string; passed: boolean; result: unknown; pointSetDigest: string }) => ({
          id: c.id,
          test: c.test,
          passed: c.passed,
          result: c.result,
          pointSetDigest: c.pointSetDigest,
        })),
    }
    expect(sha(canonicalize(content)!)).toBe(ok.body.digest)

    // A signature made with format 1 (before this change) verifies with format 1. Format 1 as it was released:
    // sorted-key JSON of eight metadata fields, every point, every fit by id and the recommended fit's id
    // (recomputed here from the API's answers, not with the service's code).
    const v1Content = {
      format: 'ebullio-signed-content/1',
      dataSet: metadataV1,
      points: content.points,
      fits: [...det.fits]
        .sort((a: { id: string }, b: { id: string }) => a.id.localeCompare(b.id))
        .map((f: { id: string; model: string; activity: unknown; parameters: unknown; pointIds: string[] }) => ({
          id: f.id,
          model: f.model,
          activity: f.activity,
          parameters: f.parameters,
          pointIds: f.pointIds,
        })),
      recommendedFitId: det.recommendedFitId,
    }
    const v1 = await contentDigest(t.db, d.id, DIGEST_V1)
    expect(v1).toBe(sha(canonicalize(v1Content)!))
    await sql`insert into approval (data_set_id, signer_id, meaning, reason, digest, digest_algorithm)
      values (${d.id}, ${lab.ids.lead2}, 'approved', 'an older signature', ${v1}, 'ebullio-signed-content/1')`.execute(
      t.db,
    )
    const verify = await lab.reviewer.get(`/api/data-sets/${d.id}/signatures/verify`).expect(200)
    expect(
      verify.body.signatures.map((s: { digestAlgorithm: string; matches: boolean }) => [s.digestAlgorithm, s.matches]),
    ).toEqual([
      ['ebullio-signed-content/2', true],
      ['ebullio-signed-content/1', true],
    ])
  })
})

void csv
