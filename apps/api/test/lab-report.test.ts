/**
 * The signed report: a PDF of one data set version, read back as text (pdf-parse) and checked against the stored
 * record — title, every point's values, the signer, the digest — and the verify page's check of a report.
 */
import { sql } from 'kysely'
import { PDFParse } from 'pdf-parse'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { JOINT_TITLES } from '../../../db/seeds/joint-scenario.js'
import { VIRIAL_TITLE } from '../../../db/seeds/lab-scenario-vapour.js'
import { seedLab } from '../../../db/seeds/lab.js'
import { DEMO_PASSWORD, seedUsers } from '../../../db/seeds/users.js'
import { createTestContext, resetDatabase, signedInAgent, type TestContext } from './helpers.js'

let t: TestContext
type Agent = Awaited<ReturnType<typeof signedInAgent>>
let engineer: Agent
let analyst: Agent
let ids: { approved: string; draft: string; submitted: string }

beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  await seedLab(t.db, await seedUsers(t.db))
  engineer = await signedInAgent(t.app, 'engineer@demo.ebullio.test', DEMO_PASSWORD)
  analyst = await signedInAgent(t.app, 'analyst@demo.ebullio.test', DEMO_PASSWORD)
  const rows = await t.db.selectFrom('data_set').select(['id', 'title', 'state']).execute()
  const find = (state: string, title: string) => rows.find((r) => r.state === state && r.title.includes(title))!.id
  ids = {
    approved: find('approved', 'acetone/methanol'),
    draft: find('draft', 'methanol/water'),
    submitted: find('submitted', '1-propanol/water'),
  }
}, 120_000)
afterAll(() => t.close())

async function pdfText(a: Agent, id: string) {
  const res = await a.get(`/api/data-sets/${id}/report.pdf`).responseType('blob').expect(200)
  expect(res.headers['content-type']).toBe('application/pdf')
  const buf = res.body as Buffer
  expect(buf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
  const parser = new PDFParse({ data: new Uint8Array(buf) })
  const { text } = await parser.getText()
  await parser.destroy()
  // pdf.js splits lines and cells with line breaks and tabs: compare on single spaces
  return {
    text: text.replace(/\s+/g, ' '),
    reportId: String(res.headers['x-report-id']),
    disposition: res.headers['content-disposition'],
  }
}

const fixed = (v: number, d: number) => v.toFixed(d).replace(/^-/, '−')

describe('GET /api/data-sets/:id/report.pdf', () => {
  it('prints the title, every point, the signer and the digest of an approved version (engineer)', async () => {
    const detail = (await engineer.get(`/api/data-sets/${ids.approved}`).expect(200)).body
    const verify = (await engineer.get(`/api/data-sets/${ids.approved}/signatures/verify`).expect(200)).body
    const { text, disposition } = await pdfText(engineer, ids.approved)
    expect(disposition).toMatch(/attachment; filename="?[a-z0-9-]+-v1-report-\d+\.pdf"?$/)
    expect(text).toContain(detail.title)
    expect(text).toContain(`${detail.system.component1.name} / ${detail.system.component2.name}`)
    expect(detail.points.length).toBeGreaterThan(5)
    for (const p of detail.points) {
      // one table row per point: seq, sample, T/K, T/°C, P/kPa, x1, u(x1), y1, u(y1)
      const row = [
        p.seq,
        p.sampleLabel,
        fixed(p.temperatureK, 2),
        fixed(p.temperatureK - 273.15, 2),
        fixed(p.pressurePa / 1000, 3),
        fixed(p.x1, 4),
        fixed(p.x1Uncertainty, 4),
        fixed(p.y1, 4),
        fixed(p.y1Uncertainty, 4),
      ].join(' ')
      expect(text).toContain(row)
    }
    const approval = detail.approvals.find((a: { meaning: string }) => a.meaning === 'approved')
    expect(text).toContain(approval.signerName)
    expect(text).toContain('Approved')
    expect(text).toMatch(/\d{4}-\d\d-\d\d \d\d:\d\d:\d\d UTC/)
    // the digest printed in four groups of 16 equals the one the API recomputes and the one signed
    const grouped = (hex: string) => hex.match(/.{16}/g)!.join(' ')
    expect(verify.currentDigest).toBe(approval.digest)
    expect(text).toContain(grouped(verify.currentDigest))
    expect(text).toContain('RECOMMENDED')
    expect(text).toContain('licensed engineer')
    expect(text).not.toContain('NOT APPROVED')
  })

  it('marks a draft as not approved, for lab roles; engineers get 404 and no report is registered', async () => {
    const { text } = await pdfText(analyst, ids.draft)
    expect(text).toContain('Not an approved record.')
    expect(text).toContain('DRAFT · NOT APPROVED')
    const before = await sql<{ n: number }>`select count(*)::int as n from lab_report`.execute(t.db)
    const r = await engineer.get(`/api/data-sets/${ids.draft}/report.pdf`).expect(404)
    expect(r.body.error.message).toBe('There is no such data set.')
    await engineer.get(`/api/data-sets/${ids.submitted}/report.pdf`).expect(404)
    const after = await sql<{ n: number }>`select count(*)::int as n from lab_report`.execute(t.db)
    expect(after.rows[0].n).toBe(before.rows[0].n)
  })

  it('prints open and resolved comment threads', async () => {
    const detail = (await analyst.get(`/api/data-sets/${ids.submitted}`).expect(200)).body
    const roots = detail.comments.filter((c: { parentId: string | null }) => !c.parentId)
    expect(roots.length).toBeGreaterThan(0)
    const { text } = await pdfText(analyst, ids.submitted)
    for (const c of roots) {
      expect(text).toContain(c.resolved ? 'RESOLVED' : 'OPEN')
      expect(text).toContain(c.body.replace(/\s+/g, ' ').slice(0, 40))
    }
  })
})

describe('GET /api/reports/:id/verify', () => {
  it('says the stored record still matches the printed digest, and not after a change behind the triggers', async () => {
    const { reportId } = await pdfText(analyst, ids.draft)
    const ok = (await analyst.get(`/api/reports/${reportId}/verify`).expect(200)).body
    expect(ok.matches).toBe(true)
    expect(ok.report.digest).toBe(ok.currentDigest)
    expect(ok.dataSet).toMatchObject({ id: ids.draft, state: 'draft' })
    // engineers may not learn that a draft's report exists
    await engineer.get(`/api/reports/${reportId}/verify`).expect(404)
    // a point of the draft changed directly in the database: the digest no longer matches the report
    await sql`update point set temperature_k = temperature_k + 1 where data_set_id = ${ids.draft} and seq = 1`.execute(
      t.db,
    )
    const changed = (await analyst.get(`/api/reports/${reportId}/verify`).expect(200)).body
    expect(changed.matches).toBe(false)
    expect(changed.currentDigest).not.toBe(changed.report.digest)
  })

  it('verifies an approved report for an engineer, with each signature', async () => {
    const { reportId } = await pdfText(engineer, ids.approved)
    const v = (await engineer.get(`/api/reports/${reportId}/verify`).expect(200)).body
    expect(v.matches).toBe(true)
    expect(v.signatures).toEqual([
      expect.objectContaining({ meaning: 'approved', matches: true, signerName: 'Dr. Tobias Lindqvist' }),
    ])
    const missing = await engineer.get('/api/reports/00000000-0000-4000-8000-000000000000/verify').expect(404)
    expect(missing.body.error.message).toBe('There is no such report.')
  })

  it('refuses report rows changing after the fact', async () => {
    await expect(sql`update lab_report set content_digest = ${'0'.repeat(64)}`.execute(t.db)).rejects.toThrow(
      /append-only/,
    )
  })
})

describe('stale results in the report', () => {
  it('prints results computed on other points as STALE, with what they were computed on, and nothing stale after a re-run', async () => {
    const before = (await analyst.get(`/api/data-sets/${ids.draft}`).expect(200)).body
    const fit = await analyst.post(`/api/data-sets/${ids.draft}/fits`).send({ models: ['van-laar'] })
    expect(fit.status, JSON.stringify(fit.body)).toBe(201)
    const fresh = await pdfText(analyst, ids.draft)
    expect(fresh.text).not.toContain('STALE')
    const included = before.points.filter((p: { excluded: boolean }) => !p.excluded)
    const ex = await analyst
      .patch(`/api/data-sets/${ids.draft}/points/${included[0].id}`)
      .send({ rowVersion: fit.body.rowVersion, excluded: true, reason: 'air in the sample line' })
      .expect(200)
    const stale = await pdfText(analyst, ids.draft)
    const after = (await analyst.get(`/api/data-sets/${ids.draft}`).expect(200)).body
    const staleCount =
      after.fits.filter((f: { stale: boolean }) => f.stale).length +
      after.consistency.filter((c: { stale: boolean }) => c.stale).length
    expect(staleCount).toBeGreaterThan(0)
    expect(stale.text).toContain(`${staleCount} result${staleCount === 1 ? ' is' : 's are'} marked STALE`)
    expect(stale.text).toContain(`computed on ${included.length} points on`)
    expect(stale.text.match(/STALE computed on/g)?.length).toBe(staleCount)
    // fits run again on the current points print without the mark (older fits of the same model stay stale)
    await analyst
      .post(`/api/data-sets/${ids.draft}/fits`)
      .send({ models: ['van-laar'] })
      .expect(201)
    const rerun = (await analyst.get(`/api/data-sets/${ids.draft}`).expect(200)).body
    const stillStale =
      rerun.fits.filter((f: { stale: boolean }) => f.stale).length +
      rerun.consistency.filter((c: { stale: boolean }) => c.stale).length
    expect((await pdfText(analyst, ids.draft)).text.match(/STALE computed on/g)?.length ?? 0).toBe(stillStale)
    expect(ex.body.rowVersion).toBeGreaterThan(fit.body.rowVersion)
  })
})

describe("the system's recommended parameter set and the vapour model in the report", () => {
  it('prints the signed set of the system: parameters, members with their condition, range, signer, digest', async () => {
    // the demo's set (db/seeds/joint-scenario.ts): NRTL over methanol/water at 1 atm and 40 kPa, both approved
    const row = await t.db
      .selectFrom('data_set')
      .select(['id', 'system_id'])
      .where('title', '=', JOINT_TITLES.vacuum)
      .executeTakeFirstOrThrow()
    const set = (await engineer.get(`/api/systems/${row.system_id}/recommended-parameters`).expect(200)).body
    expect(
      set.dataSets.map((d: Record<string, unknown>) => [d.kind, d.nominalPressurePa, d.nominalTemperatureK]),
    ).toEqual([
      ['isobaric', 101325, null],
      ['isobaric', 40000, null],
    ])
    expect(set.vaporModel).toEqual({ kind: 'ideal' })
    const { text } = await pdfText(engineer, row.id)
    expect(text).toContain(`The system's recommended parameter set: ${set.label}`)
    expect(text).toContain('This version is one of the data sets it rests on.')
    // every parameter as stored, 6 significant figures, with its unit (the temperature terms in J/(mol·K))
    expect(set.parameters.map((p: { name: string }) => p.name)).toEqual(['b12', 'b21', 'b12T', 'b21T'])
    for (const p of set.parameters as { name: string; value: number; standardError: number }[]) {
      const unit = p.name.endsWith('T') ? 'J/(mol·K)' : 'J/mol'
      expect(text).toContain(
        `${p.name} = ${p.value.toPrecision(6).replace(/^-/, '−')} ± ${p.standardError.toPrecision(3)} ${unit}`,
      )
    }
    expect(text).toContain('b12(T) = b12 + b12T (T - 298.15 K)')
    expect(text).toContain(
      `T ${set.range.Tmin.toFixed(2)} to ${set.range.Tmax.toFixed(2)} K; P ${(set.range.Pmin / 1000).toFixed(3)} to ${(set.range.Pmax / 1000).toFixed(3)} kPa`,
    )
    for (const d of set.dataSets as { title: string; version: number; nominalPressurePa: number; pointCount: number }[])
      expect(text).toContain(
        `${d.title} ${d.version} isobaric at ${(d.nominalPressurePa / 1000).toFixed(3)} kPa ${d.pointCount}`,
      )
    expect(text).toContain(`by ${set.signedBy}`)
    expect(text).toContain(set.digest.match(/.{16}/g)!.join(' '))
    expect(text).toContain('Vapour model ideal gas (modified Raoult’s law)')
  })

  it('leaves the block out for a system without a signed set', async () => {
    // water/1-butanol (acetone/methanol and methanol/water have signed sets in the demo)
    const rows = await t.db.selectFrom('data_set').select(['id', 'title', 'state']).execute()
    const butanol = rows.find((r) => r.state === 'approved' && r.title.includes('water/1-butanol'))!.id
    const { text } = await pdfText(engineer, butanol)
    expect(text).not.toContain("The system's recommended parameter set")
  })

  it('prints a virial-vapour data set with its vapour model on every result, and its fits not stale', async () => {
    const row = await t.db
      .selectFrom('data_set')
      .select(['id'])
      .where('title', '=', VIRIAL_TITLE)
      .executeTakeFirstOrThrow()
    const detail = (await analyst.get(`/api/data-sets/${row.id}`).expect(200)).body
    expect(detail.fits.length).toBeGreaterThan(0)
    expect(detail.fits.every((f: { stale: boolean }) => !f.stale)).toBe(true)
    const { text } = await pdfText(analyst, row.id)
    // the report compares the fits with the same point set as the API (vapour model included): nothing is stale
    expect(text).not.toContain('STALE')
    const virial = 'virial gas, Tsonopoulos second virial coefficients'
    expect(text).toContain(`Vapour model ${virial}`)
    expect(text.split(`Vapour: ${virial}`).length - 1).toBe(detail.fits.length)
    expect(text).toContain(`Computed under the data set's vapour model: ${virial}.`)
    expect(text).toContain('γ–φ, virial vapour (Tsonopoulos)')
  })
})
