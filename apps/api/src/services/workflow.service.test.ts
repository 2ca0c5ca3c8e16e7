/**
 * Submit, approve, return and verify: who may sign, what a signature records and who is told. Pure unit tests with
 * fake repositories (a transaction is the same fake), so each refusal is checked on its own and "nothing was
 * signed" means no approval row, no state change and no mail. The rules are the product's (docs/workflow.md):
 * four-eyes, literature data only once counted as the lab's own, a recommended fit, unresolved threads only with
 * an override reason, at least 3 included points to submit.
 */
import type { Role } from '@ebullio/schemas'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import type { SessionUser } from '../auth/index.js'
import type { Config } from '../config.js'
import type { Database } from '../db/index.js'
import { AppError } from '../errors/index.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'
import type { Kysely } from 'kysely'

const s = vi.hoisted(() => ({
  dataSets: new Map<string, Record<string, unknown>>(),
  included: 12,
  leads: [] as string[],
  open: 0,
  contributors: [] as { userId: string; name: string; changes: string[] }[],
  stale: false,
  approvals: [] as Record<string, unknown>[],
  inserted: [] as Record<string, unknown>[],
  updates: [] as [string, Record<string, unknown>][],
  audit: [] as Record<string, unknown>[],
  mail: [] as { to: string; subject: string; text: string }[],
  digestCalls: [] as string[],
}))

vi.mock('../auth/password.js', () => ({
  verifyPassword: async (hash: string | null, password: string) => hash === 'hash' && password === 'right',
}))
vi.mock('../mail/outbox.js', () => ({
  notifyUser: async (_db: unknown, to: string, m: { subject: string; text: string }) => void s.mail.push({ to, ...m }),
}))
vi.mock('../repositories/approvals.repository.js', () => ({
  insertApproval: async (_db: unknown, a: Record<string, unknown>) => {
    s.inserted.push(a)
    s.approvals.push({ id: `ap${s.inserted.length}`, ...a })
    return `ap${s.inserted.length}`
  },
  listApprovals: async () => s.approvals,
}))
vi.mock('./outliers.js', () => ({ signedOutliers: async () => ({ fitId: 'f1', pointIds: ['p9'] }) }))
vi.mock('../repositories/audit.repository.js', () => ({
  appendAudit: async (_db: unknown, e: Record<string, unknown>) => void s.audit.push(e),
}))
vi.mock('../repositories/comments.repository.js', () => ({ countOpenThreads: async () => s.open }))
vi.mock('../repositories/datasets.repository.js', () => ({
  lockDataSet: async (_db: unknown, id: string) => s.dataSets.get(id),
  findDataSet: async (_db: unknown, id: string) => s.dataSets.get(id),
  listVersions: async (_db: unknown, lineageId: string) =>
    [...s.dataSets.values()].filter((d) => d.lineageId === lineageId),
  updateDataSet: async (_db: unknown, id: string, patch: Record<string, unknown>) => {
    s.updates.push([id, patch])
    const d = { ...s.dataSets.get(id), ...patch }
    s.dataSets.set(id, d)
    return d
  },
}))
vi.mock('../repositories/points.repository.js', () => ({
  countPoints: async () => ({ total: s.included + 1, included: s.included }),
}))
vi.mock('../repositories/users.repository.js', () => ({
  activeLeadChemistIds: async () => s.leads,
  passwordHashOf: async () => 'hash',
}))
vi.mock('./digest.js', async (importOriginal) => ({
  ...(await importOriginal<typeof import('./digest.js')>()),
  contentDigest: async (_db: unknown, _id: string, algorithm: string) => {
    s.digestCalls.push(algorithm)
    return `digest of ${algorithm}`
  },
}))
vi.mock('./contributors.js', () => ({ contributorsOf: async () => s.contributors }))
vi.mock('./stale-results.js', () => ({
  refuseWhileStale: async (_db: unknown, _d: unknown, action: string) => {
    if (s.stale) throw new AppError(409, 'stale_results', `Cannot ${action}: stale`)
    return 'point-set digest'
  },
}))
vi.mock('./point-set.js', () => ({ currentPointSet: async () => ({ digest: 'point-set digest', included: 12 }) }))

const { approve, returnForRework, submit, verifySignatures } = await import('./workflow.service.js')
const { DIGEST_V1, DIGEST_V2 } = await import('./digest.js')

const tx = {}
const db = { transaction: () => ({ execute: (fn: (t: unknown) => unknown) => fn(tx) }) } as unknown as Kysely<Database>
const config = { allowSelfApproval: false, publicUrl: 'https://ebullio.test' } as Config
const person = (id: string, ...roles: Role[]): SessionUser => ({
  id,
  email: `${id}@lab.test`,
  displayName: id.toUpperCase(),
  roles,
})
const lead = person('lea', 'lead_chemist')
const analyst = person('ana', 'analyst')

function dataSet(id: string, over: Partial<DataSetRecord> = {}) {
  const d = {
    id,
    lineageId: 'line',
    version: 2,
    title: 'Ethanol–water (invented)',
    state: 'submitted',
    rowVersion: 7,
    createdBy: 'ana',
    origin: 'gc',
    countsAsOwn: false,
    recommendedFitId: 'f1',
    ...over,
  }
  s.dataSets.set(id, d)
  return d
}

const sign = { password: 'right', reason: 'checked', rowVersion: 7 }

async function refusal(p: Promise<unknown>): Promise<AppError> {
  try {
    await p
  } catch (err) {
    expect(err).toBeInstanceOf(AppError)
    return err as AppError
  }
  throw new Error('expected a refusal')
}

/** Nothing was signed: no approval row, no state change, no audit line, no mail. */
function nothingSigned() {
  expect(s.inserted).toEqual([])
  expect(s.updates).toEqual([])
  expect(s.audit).toEqual([])
  expect(s.mail).toEqual([])
}

beforeEach(() => {
  s.dataSets.clear()
  s.included = 12
  s.leads = []
  s.open = 0
  s.contributors = [{ userId: 'ana', name: 'ANA', changes: ['created the data set', 'uploaded points'] }]
  s.stale = false
  s.approvals = []
  s.inserted = []
  s.updates = []
  s.audit = []
  s.mail = []
  s.digestCalls = []
})

describe('approve: who may sign', () => {
  it('an independent lead chemist signs: the approval records digest, point set, contributors and flags', async () => {
    dataSet('v2')
    s.approvals = [{ id: 'earlier', meaning: 'returned for rework' }]
    const r = await approve(db, config, lead, 'v2', sign)
    expect(s.inserted).toEqual([
      {
        dataSetId: 'v2',
        signerId: 'lea',
        meaning: 'approved',
        reason: 'checked',
        digest: `digest of ${DIGEST_V2}`,
        digestAlgorithm: DIGEST_V2,
        pointSetDigest: 'point-set digest',
        changes: s.contributors,
        selfApproval: false,
        overrideReason: null,
        outliers: { fitId: 'f1', pointIds: ['p9'] },
      },
    ])
    expect(r.approvalId).toBe('ap1')
    expect(r.digest).toBe(`digest of ${DIGEST_V2}`)
    expect(r.dataSet.state).toBe('approved')
    // the answer carries the signature just made, not an earlier one
    expect(r.approval).toMatchObject({ id: 'ap1', meaning: 'approved' })
    expect(s.updates).toEqual([['v2', { state: 'approved', approvedAt: expect.any(Date) }]])
    expect(s.audit).toEqual([
      {
        actorId: 'lea',
        entity: 'data_set',
        entityId: 'v2',
        action: 'approve',
        dataSetId: 'v2',
        before: { state: 'submitted' },
        after: {
          state: 'approved',
          approvalId: 'ap1',
          digest: `digest of ${DIGEST_V2}`,
          selfApproval: false,
          overrideReason: null,
        },
      },
    ])
    // the creator is told, with the signer, the reason and the digest
    expect(s.mail).toHaveLength(1)
    expect(s.mail[0].to).toBe('ana')
    expect(s.mail[0].subject).toBe('Ebullio: "Ethanol–water (invented)" v2 approved')
    expect(s.mail[0].text).toContain('LEA approved the data set "Ethanol–water (invented)" (version 2).')
    expect(s.mail[0].text).toContain('Reason: checked')
    expect(s.mail[0].text).toContain(`Signature digest (SHA-256): digest of ${DIGEST_V2}`)
    expect(s.mail[0].text).toContain('https://ebullio.test/')
  })

  it('four-eyes: a lead chemist who changed the version is refused, told what they did, and nothing is signed', async () => {
    dataSet('v2')
    s.contributors.push({ userId: 'lea', name: 'LEA', changes: ['excluded or included points', 'edited the metadata'] })
    const e = await refusal(approve(db, config, lead, 'v2', sign))
    expect(e.status).toBe(403)
    expect(e.code).toBe('four_eyes')
    expect(e.message).toBe(
      'You changed this version (excluded or included points, edited the metadata); another lead chemist must approve it.',
    )
    expect(e.details).toEqual({ changes: ['excluded or included points', 'edited the metadata'] })
    nothingSigned()
  })

  it('a one-person lab (ALLOW_SELF_APPROVAL) may sign its own changes; the signature says so', async () => {
    dataSet('v2')
    s.contributors.push({ userId: 'lea', name: 'LEA', changes: ['ran the recommended fit'] })
    await approve(db, { ...config, allowSelfApproval: true }, lead, 'v2', sign)
    expect(s.inserted[0]).toMatchObject({ selfApproval: true, changes: s.contributors })
    expect(s.audit.at(-1)).toMatchObject({ after: { selfApproval: true } })
  })

  it('a wrong password signs nothing', async () => {
    dataSet('v2')
    const e = await refusal(approve(db, config, lead, 'v2', { ...sign, password: 'wrong' }))
    expect(e).toMatchObject({
      status: 403,
      code: 'signature_refused',
      message: 'The password is not correct; nothing was signed.',
    })
    nothingSigned()
  })

  it('only a submitted version, of own data, with a recommended fit, at the version loaded', async () => {
    dataSet('draft', { state: 'draft' })
    expect(await refusal(approve(db, config, lead, 'draft', sign))).toMatchObject({
      status: 409,
      code: 'conflict',
      message: 'This data set is draft; approval is possible only when it is submitted.',
    })
    dataSet('lit', { origin: 'literature' })
    const lit = await refusal(approve(db, config, lead, 'lit', sign))
    expect(lit).toMatchObject({ status: 409, code: 'literature_not_own' })
    expect(lit.message).toContain("a lead chemist must first mark it as the lab's own measurement")
    dataSet('nofit', { recommendedFitId: null })
    const e = await refusal(approve(db, config, lead, 'nofit', sign))
    expect(e.message).toBe('Mark one fit as the recommended fit before approving.')
    dataSet('moved', { rowVersion: 8 })
    expect(await refusal(approve(db, config, lead, 'moved', sign))).toMatchObject({ code: 'stale_write' })
    s.stale = true
    dataSet('stale')
    expect(await refusal(approve(db, config, lead, 'stale', sign))).toMatchObject({
      code: 'stale_results',
      message: 'Cannot approve: stale',
    })
    nothingSigned()
  })

  it('literature data counted as the lab’s own may be approved', async () => {
    dataSet('lit', { origin: 'literature', countsAsOwn: true })
    await approve(db, config, lead, 'lit', sign)
    expect(s.inserted).toHaveLength(1)
  })

  it('an engineer does not learn that an unapproved version exists', async () => {
    dataSet('v2')
    const e = await refusal(approve(db, config, person('eng', 'engineer'), 'v2', sign))
    expect(e.status).toBe(404)
    nothingSigned()
  })
})

describe('approve: open comment threads', () => {
  it('block the signature unless an override reason is given (blank is none); the reason is kept, trimmed', async () => {
    dataSet('v2')
    s.open = 2
    const e = await refusal(approve(db, config, lead, 'v2', { ...sign, overrideReason: '   ' }))
    expect(e.message).toBe('This data set has 2 unresolved comment threads; resolve them or give an override reason.')
    expect(e.details).toEqual({ openThreads: 2 })
    s.open = 1
    const one = await refusal(approve(db, config, lead, 'v2', sign))
    expect(one.message).toBe('This data set has 1 unresolved comment thread; resolve them or give an override reason.')
    nothingSigned()
    await approve(db, config, lead, 'v2', { ...sign, overrideReason: '  agreed by phone  ' })
    expect(s.inserted[0].overrideReason).toBe('agreed by phone')
  })

  it('without open threads an override reason is not recorded', async () => {
    dataSet('v2')
    await approve(db, config, lead, 'v2', { ...sign, overrideReason: 'not needed' })
    expect(s.inserted[0].overrideReason).toBeNull()
  })
})

describe('approve supersedes', () => {
  it('every other approved version of the lineage, and nothing else', async () => {
    dataSet('v1', { state: 'approved', version: 1 })
    dataSet('v0', { state: 'superseded', version: 0 })
    dataSet('draft3', { state: 'draft', version: 3 })
    dataSet('other', { state: 'approved', lineageId: 'other line' })
    dataSet('v2')
    await approve(db, config, lead, 'v2', sign)
    expect(s.updates.map(([id, p]) => [id, p.state])).toEqual([
      ['v2', 'approved'],
      ['v1', 'superseded'],
    ])
    expect(s.audit.find((a) => a.action === 'supersede')).toEqual({
      actorId: 'lea',
      entity: 'data_set',
      entityId: 'v1',
      action: 'supersede',
      dataSetId: 'v1',
      before: { state: 'approved' },
      after: { state: 'superseded', by: 'v2' },
    })
  })
})

describe('submit', () => {
  it('needs at least 3 included points', async () => {
    dataSet('d', { state: 'draft' })
    s.included = 2
    const e = await refusal(submit(db, config, analyst, 'd', 7))
    expect(e.message).toBe('A data set needs at least 3 included points to be submitted; it has 2.')
    expect(s.updates).toEqual([])
    s.included = 3
    const r = await submit(db, config, analyst, 'd', 7)
    expect(r.state).toBe('submitted')
  })

  it('tells every other active lead chemist, not the submitter, and says how many were told', async () => {
    dataSet('d', { state: 'returned' })
    s.leads = ['lea', 'ana', 'bo']
    const r = await submit(db, config, analyst, 'd', 7)
    expect(r.notifiedLeadChemists).toBe(2)
    expect(s.mail.map((m) => m.to)).toEqual(['lea', 'bo'])
    expect(s.mail[0].subject).toBe('Ebullio: "Ethanol–water (invented)" v2 submitted for approval')
    expect(s.mail[0].text).toContain('ANA submitted the data set "Ethanol–water (invented)" (version 2) with 12 points')
    expect(s.audit).toEqual([
      {
        actorId: 'ana',
        entity: 'data_set',
        entityId: 'd',
        action: 'submit',
        dataSetId: 'd',
        before: { state: 'returned' },
        after: { state: 'submitted' },
      },
    ])
  })

  it('is refused when already submitted, at another row version, or with stale results', async () => {
    dataSet('d', { state: 'submitted' })
    expect(await refusal(submit(db, config, analyst, 'd', 7))).toMatchObject({
      code: 'conflict',
      message: 'This data set is submitted; submitting is possible only when it is draft or returned.',
    })
    dataSet('d', { state: 'draft' })
    expect(await refusal(submit(db, config, analyst, 'd', 6))).toMatchObject({ code: 'stale_write' })
    s.stale = true
    expect(await refusal(submit(db, config, analyst, 'd', 7))).toMatchObject({
      code: 'stale_results',
      message: 'Cannot submit: stale',
    })
    expect(s.updates).toEqual([])
    expect(s.mail).toEqual([])
  })
})

describe('return for rework', () => {
  it('a contributor may return (no four-eyes); the signature lists the contributors, the creator is told', async () => {
    dataSet('v2')
    s.approvals = [{ id: 'earlier', meaning: 'returned for rework' }]
    s.contributors.push({ userId: 'lea', name: 'LEA', changes: ['edited the metadata'] })
    const r = await returnForRework(db, config, lead, 'v2', { ...sign, reason: 'point 4 looks wrong' })
    expect(r.approval).toMatchObject({ id: 'ap1', reason: 'point 4 looks wrong' })
    expect(s.audit).toEqual([
      {
        actorId: 'lea',
        entity: 'data_set',
        entityId: 'v2',
        action: 'return',
        dataSetId: 'v2',
        before: { state: 'submitted' },
        after: { state: 'returned', approvalId: 'ap1', reason: 'point 4 looks wrong' },
      },
    ])
    expect(s.inserted).toEqual([
      expect.objectContaining({
        meaning: 'returned for rework',
        reason: 'point 4 looks wrong',
        digestAlgorithm: DIGEST_V2,
        pointSetDigest: 'point-set digest',
        changes: s.contributors,
        selfApproval: false,
        overrideReason: null,
      }),
    ])
    expect(r.dataSet.state).toBe('returned')
    expect(s.mail.map((m) => [m.to, m.subject])).toEqual([
      ['ana', 'Ebullio: "Ethanol–water (invented)" v2 returned for rework'],
    ])
    expect(s.mail[0].text).toContain('Reason: point 4 looks wrong')
  })

  it('only a submitted version, with the right password', async () => {
    dataSet('v2', { state: 'approved' })
    expect(await refusal(returnForRework(db, config, lead, 'v2', sign))).toMatchObject({
      code: 'conflict',
      message: 'This data set is approved; returning is possible only when it is submitted.',
    })
    dataSet('v2')
    expect(await refusal(returnForRework(db, config, lead, 'v2', { ...sign, password: 'x' }))).toMatchObject({
      code: 'signature_refused',
    })
    nothingSigned()
  })
})

describe('verifySignatures', () => {
  it('recomputes each signature with its own algorithm and says whether it matches', async () => {
    dataSet('v2', { state: 'approved' })
    s.approvals = [
      { id: 'a1', digest: `digest of ${DIGEST_V1}`, digestAlgorithm: DIGEST_V1 },
      { id: 'a2', digest: 'tampered', digestAlgorithm: DIGEST_V2 },
    ]
    const r = await verifySignatures(db, lead, 'v2')
    expect(r.currentDigest).toBe(`digest of ${DIGEST_V2}`)
    expect(r.signatures.map((x) => [x.id, x.recomputedDigest, x.matches])).toEqual([
      ['a1', `digest of ${DIGEST_V1}`, true],
      ['a2', `digest of ${DIGEST_V2}`, false],
    ])
  })

  it('a version without signatures is 404', async () => {
    dataSet('v2', { state: 'draft' })
    expect(await refusal(verifySignatures(db, lead, 'v2'))).toMatchObject({
      status: 404,
      message: 'This data set has no signatures.',
    })
  })
})
