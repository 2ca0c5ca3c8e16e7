/** Reliability and security of the lab data: immutability, append-only logs, stale writes, digests, visibility. */
import { sql } from 'kysely'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { contentDigest } from '../src/services/digest.js'
import { createTestContext, PASSWORD, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import { buildLab, draftWithPoints, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let approved: { id: string; digest: string }
let draft: { id: string; rowVersion: number }

/** Fit, submit, recommend and approve a draft through the API. */
async function approveThroughApi(id: string) {
  const fit = await lab.analyst
    .post(`/api/data-sets/${id}/fits`)
    .send({ models: ['margules'] })
    .expect(201)
  const sub = await lab.analyst
    .post(`/api/data-sets/${id}/submit`)
    .send({ rowVersion: fit.body.rowVersion })
    .expect(200)
  const rec = await lab.lead
    .post(`/api/data-sets/${id}/recommended-fit`)
    .send({ fitId: fit.body.fits[0].id })
    .expect(200)
  expect(rec.body.rowVersion).toBeGreaterThan(sub.body.rowVersion)
  const ok = await lab.lead
    .post(`/api/data-sets/${id}/approve`)
    .send({ password: PASSWORD, reason: 'Fit and points checked.', rowVersion: rec.body.rowVersion })
  expect(ok.status, JSON.stringify(ok.body)).toBe(200)
  return ok.body as { digest: string; dataSet: { rowVersion: number } }
}

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await draftWithPoints(t, lab, 'Approved set')
  approved = { id: d.id, digest: (await approveThroughApi(d.id)).digest }
  draft = await draftWithPoints(t, lab, 'Open draft')
})
afterAll(() => t.close())

const DB_FROZEN = /cannot be changed/

describe('approved data is immutable', () => {
  it('refuses edits, exclusions, uploads and fits through the API', async () => {
    const detail = await lab.analyst.get(`/api/data-sets/${approved.id}`).expect(200)
    const rv = detail.body.rowVersion
    const edit = await lab.analyst.patch(`/api/data-sets/${approved.id}`).send({ rowVersion: rv, title: 'changed' })
    expect(edit.status).toBe(409)
    expect(edit.body.error.message).toBe(
      'This data set is approved; editing is possible only when it is draft or returned.',
    )
    const excl = await lab.analyst
      .patch(`/api/data-sets/${approved.id}/points/${detail.body.points[0].id}`)
      .send({ rowVersion: rv, excluded: true, reason: 'x' })
    expect(excl.status).toBe(409)
    const fit = await lab.analyst.post(`/api/data-sets/${approved.id}/fits`).send({ models: ['nrtl'] })
    expect(fit.body.error.message).toBe(
      'This data set is approved; fitting is possible only when it is draft or returned or submitted.',
    )
    const del = await lab.analyst.delete(`/api/data-sets/${approved.id}`)
    expect(del.status).toBe(409)
  })

  it('refuses a direct SQL UPDATE or DELETE of the data set, its points, injections and fits (trigger)', async () => {
    await expect(sql`update data_set set title = 'x' where id = ${approved.id}`.execute(t.db)).rejects.toThrow(
      DB_FROZEN,
    )
    await expect(sql`update point set x1 = 0.5 where data_set_id = ${approved.id}`.execute(t.db)).rejects.toThrow(
      DB_FROZEN,
    )
    await expect(sql`delete from point where data_set_id = ${approved.id}`.execute(t.db)).rejects.toThrow(DB_FROZEN)
    await expect(
      sql`update point_injection set area1 = 1 where point_id in (select id from point where data_set_id = ${approved.id})`.execute(
        t.db,
      ),
    ).rejects.toThrow(DB_FROZEN)
    await expect(
      sql`update fit set parameters = '[]' where data_set_id = ${approved.id}`.execute(t.db),
    ).rejects.toThrow(DB_FROZEN)
    await expect(sql`delete from data_set where id = ${approved.id}`.execute(t.db)).rejects.toThrow('cannot be deleted')
    expect(await contentDigest(t.db, approved.id)).toBe(approved.digest)
  })

  it('keeps the audit log and the signatures append-only', async () => {
    await expect(sql`update audit_log set action = 'nothing happened'`.execute(t.db)).rejects.toThrow(
      'audit_log rows are append-only: UPDATE is not allowed',
    )
    await expect(sql`delete from audit_log`.execute(t.db)).rejects.toThrow(
      'audit_log rows are append-only: DELETE is not allowed',
    )
    await expect(sql`update approval set reason = 'other'`.execute(t.db)).rejects.toThrow(
      'approval rows are append-only: UPDATE is not allowed',
    )
  })
})

describe('approval digest', () => {
  it('recomputed from the stored content matches the signed one', async () => {
    const v = await lab.reviewer.get(`/api/data-sets/${approved.id}/signatures/verify`).expect(200)
    expect(v.body.currentDigest).toBe(approved.digest)
    expect(v.body.signatures[0]).toMatchObject({ meaning: 'approved', matches: true, signerName: 'Tobias Lead' })
  })

  it('detects content changed behind the trigger’s back', async () => {
    // a superuser can disable triggers; the signature still shows the change
    await t.db
      .transaction()
      .execute(async (tx) => {
        await sql`alter table point disable trigger point_frozen`.execute(tx)
        await sql`update point set y1 = y1 + 0.001 where data_set_id = ${approved.id} and seq = 3`.execute(tx)
        expect(await contentDigest(tx, approved.id)).not.toBe(approved.digest)
        throw new Error('rollback')
      })
      .catch((e) => expect((e as Error).message).toBe('rollback'))
    expect(await contentDigest(t.db, approved.id)).toBe(approved.digest)
  })
})

describe('optimistic concurrency', () => {
  it('refuses the second of two edits made from the same version of a draft', async () => {
    const d = await lab.analyst.get(`/api/data-sets/${draft.id}`).expect(200)
    const first = await lab.analyst
      .patch(`/api/data-sets/${draft.id}`)
      .send({ rowVersion: d.body.rowVersion, apparatusNotes: 'Still A, new thermometer' })
    expect(first.status).toBe(200)
    const second = await lab.analyst2
      .patch(`/api/data-sets/${draft.id}`)
      .send({ rowVersion: d.body.rowVersion, apparatusNotes: 'Still B' })
    expect(second.status).toBe(409)
    expect(second.body.error).toEqual({
      code: 'stale_write',
      message: `This data set was changed by someone else since you loaded it (you had version ${d.body.rowVersion}, it is now ${first.body.rowVersion}). Reload it and apply your change again.`,
      details: { expectedRowVersion: d.body.rowVersion, currentRowVersion: first.body.rowVersion },
    })
    const now = await lab.analyst.get(`/api/data-sets/${draft.id}`).expect(200)
    expect(now.body.apparatusNotes).toBe('Still A, new thermometer')
    draft.rowVersion = now.body.rowVersion
  })

  it('applies the same rule to point exclusions; a reason is mandatory', async () => {
    const d = await lab.analyst.get(`/api/data-sets/${draft.id}`).expect(200)
    const pid = d.body.points[2].id
    const noReason = await lab.analyst
      .patch(`/api/data-sets/${draft.id}/points/${pid}`)
      .send({ rowVersion: d.body.rowVersion, excluded: true })
    expect(noReason.status).toBe(422)
    expect(noReason.body.error.details).toEqual([{ path: 'reason', message: 'Give a reason for excluding this point' }])
    const ok = await lab.analyst
      .patch(`/api/data-sets/${draft.id}/points/${pid}`)
      .send({ rowVersion: d.body.rowVersion, excluded: true, reason: 'Still not at steady state' })
      .expect(200)
    expect(ok.body.point).toMatchObject({ excluded: true, exclusionReason: 'Still not at steady state' })
    const stale = await lab.analyst2
      .patch(`/api/data-sets/${draft.id}/points/${pid}`)
      .send({ rowVersion: d.body.rowVersion, excluded: false })
    expect(stale.body.error.code).toBe('stale_write')
    await expect(
      sql`update point set excluded = true, exclusion_reason = null where id = ${pid}`.execute(t.db),
    ).rejects.toThrow('point_exclusion_reason')
  })
})

describe('visibility for engineers', () => {
  it('answers 404, not 403, for unapproved data sets and hides them from lists', async () => {
    const r = await lab.engineer.get(`/api/data-sets/${draft.id}`)
    expect(r.status).toBe(404)
    expect(r.body.error).toEqual({ code: 'not_found', message: 'There is no such data set.', details: null })
    expect((await lab.engineer.get(`/api/data-sets/${draft.id}/export/points.csv`)).status).toBe(404)
    expect((await lab.engineer.get(`/api/data-sets/${draft.id}/fits`)).status).toBe(404)
    const list = await lab.engineer.get('/api/data-sets?state=draft').expect(200)
    expect(list.body.items).toEqual([])
    const all = await lab.engineer.get('/api/data-sets').expect(200)
    expect(all.body.items.map((d: { id: string }) => d.id)).toEqual([approved.id])
    expect((await lab.engineer.get(`/api/data-sets/${approved.id}`)).status).toBe(200)
  })
})

describe('workflow rules', () => {
  it('refuses approval by the person who uploaded the data (four-eyes), records self-approval when allowed', async () => {
    const d = await draftWithPoints(t, { ...lab, analyst: lab.lead }, 'Lead uploads himself')
    const fit = await lab.lead
      .post(`/api/data-sets/${d.id}/fits`)
      .send({ models: ['margules'] })
      .expect(201)
    await lab.lead.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: fit.body.rowVersion }).expect(200)
    const rec = await lab.lead
      .post(`/api/data-sets/${d.id}/recommended-fit`)
      .send({ fitId: fit.body.fits[0].id })
      .expect(200)
    const self = await lab.lead
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ password: PASSWORD, reason: 'mine', rowVersion: rec.body.rowVersion })
    expect(self.status).toBe(403)
    expect(self.body.error.message).toBe(
      'You changed this version (created the data set, uploaded points, ran the recommended fit); another lead chemist must approve it.',
    )
    const other = await lab.lead2
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ password: PASSWORD, reason: 'Checked by a second chemist.', rowVersion: rec.body.rowVersion })
      .expect(200)
    expect(other.body.dataSet.state).toBe('approved')

    const solo = await createTestContext({ ALLOW_SELF_APPROVAL: 'true' })
    try {
      const leadSolo = await signedInAgent(solo.app, 'lead@lab.test')
      const d2 = await draftWithPoints(solo, { ...lab, analyst: leadSolo }, 'One-person lab')
      const f2 = await leadSolo
        .post(`/api/data-sets/${d2.id}/fits`)
        .send({ models: ['margules'] })
        .expect(201)
      await leadSolo.post(`/api/data-sets/${d2.id}/submit`).send({ rowVersion: f2.body.rowVersion }).expect(200)
      const r2 = await leadSolo
        .post(`/api/data-sets/${d2.id}/recommended-fit`)
        .send({ fitId: f2.body.fits[0].id })
        .expect(200)
      await leadSolo
        .post(`/api/data-sets/${d2.id}/approve`)
        .send({ password: PASSWORD, reason: 'One-person lab.', rowVersion: r2.body.rowVersion })
        .expect(200)
      const sig = await leadSolo.get(`/api/data-sets/${d2.id}/signatures/verify`).expect(200)
      expect(sig.body.signatures[0].selfApproval).toBe(true)
    } finally {
      await solo.close()
    }
  })

  it('needs an override reason to approve with unresolved comments; returns are signed and mailed', async () => {
    const d = await draftWithPoints(t, lab, 'With open comments')
    const fit = await lab.analyst
      .post(`/api/data-sets/${d.id}/fits`)
      .send({ models: ['margules'] })
      .expect(201)
    await lab.analyst.post(`/api/data-sets/${d.id}/submit`).send({ rowVersion: fit.body.rowVersion }).expect(200)
    await lab.reviewer.post(`/api/data-sets/${d.id}/comments`).send({ body: 'Check point 3.' }).expect(201)
    const rec = await lab.lead
      .post(`/api/data-sets/${d.id}/recommended-fit`)
      .send({ fitId: fit.body.fits[0].id })
      .expect(200)
    const refused = await lab.lead
      .post(`/api/data-sets/${d.id}/approve`)
      .send({ password: PASSWORD, reason: 'ok', rowVersion: rec.body.rowVersion })
    expect(refused.status).toBe(409)
    expect(refused.body.error.message).toBe(
      'This data set has 1 unresolved comment thread; resolve them or give an override reason.',
    )
    const back = await lab.lead
      .post(`/api/data-sets/${d.id}/return`)
      .send({ password: PASSWORD, reason: 'Re-measure the first three samples.', rowVersion: rec.body.rowVersion })
      .expect(200)
    expect(back.body.dataSet.state).toBe('returned')
    const mail = await t.mail()
    expect(mail[0]).toMatchObject({
      envelope_to: 'analyst@lab.test',
      subject: 'Ebullio: "With open comments" v1 returned for rework',
    })
    expect(mail[0].body_text).toContain('Reason: Re-measure the first three samples.')
  })

  it('revises an approved version into a new draft carrying the points; approving it supersedes the old one', async () => {
    const rev = await lab.analyst.post(`/api/data-sets/${approved.id}/revise`).expect(201)
    expect(rev.body).toMatchObject({ version: 2, state: 'draft', previousVersionId: approved.id })
    const again = await lab.analyst.post(`/api/data-sets/${approved.id}/revise`)
    expect(again.body.error.message).toBe('Version 2 of this data set is already being worked on (draft).')
    const v2 = await lab.analyst.get(`/api/data-sets/${rev.body.id}`).expect(200)
    expect(v2.body.points).toHaveLength(12)
    await approveThroughApi(rev.body.id)
    const v1 = await lab.reviewer.get(`/api/data-sets/${approved.id}`).expect(200)
    expect(v1.body.state).toBe('superseded')
    expect(await contentDigest(t.db, approved.id)).toBe(approved.digest)
  })
})
