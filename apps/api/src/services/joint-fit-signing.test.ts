/**
 * Signing a joint fit as the system's recommended parameter set: who may sign (four-eyes over the runner and everyone
 * who changed a contributing data set), what must hold first (submitted, approved members, converged, fresh points),
 * what the signature records, which set it supersedes, and verification. Pure unit tests with fake repositories; the
 * rules are the product's (docs/workflow.md, "Recommended parameter set").
 */
import type { Role } from '@ebullio/schemas'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import type { SessionUser } from '../auth/index.js'
import type { Config } from '../config.js'
import type { Db } from '../db/index.js'
import { AppError } from '../errors/index.js'

const s = vi.hoisted(() => ({
  fits: new Map<string, Record<string, unknown>>(),
  members: [] as { dataSetId: string; title: string; version: number; state: string; stale: boolean }[],
  contributors: new Map<string, { userId: string; name: string; changes: string[] }[]>(),
  names: new Map<string, string>(),
  approvals: [] as Record<string, unknown>[],
  inserted: [] as Record<string, unknown>[],
  updates: [] as [string, Record<string, unknown>][],
  audit: [] as Record<string, unknown>[],
  mail: [] as { to: string; subject: string; text: string }[],
  passwordOk: true,
}))

vi.mock('../repositories/joint-fits.repository.js', () => ({
  lockJointFit: async (_db: unknown, id: string) => s.fits.get(id),
  findJointFit: async (_db: unknown, id: string) => s.fits.get(id),
  listMembers: async () =>
    s.members.map((m, i) => ({ jointFitId: 'j1', dataSetId: m.dataSetId, position: i, statistics: {} })),
  listJointFits: async (_db: unknown, systemId: string, states: string[]) =>
    [...s.fits.values()].filter((f) => f.systemId === systemId && states.includes(f.state as string)),
  updateJointFit: async (_db: unknown, id: string, patch: Record<string, unknown>) => {
    s.updates.push([id, patch])
    s.fits.set(id, { ...s.fits.get(id), ...patch })
  },
  insertJointFitApproval: async (_db: unknown, a: Record<string, unknown>) => {
    s.inserted.push(a)
    return `ja${s.inserted.length}`
  },
  listJointFitApprovals: async () => s.approvals,
}))
vi.mock('../repositories/datasets.repository.js', () => ({
  findDataSet: async (_db: unknown, id: string) => {
    const m = s.members.find((x) => x.dataSetId === id)!
    return {
      id,
      lineageId: `l-${id}`,
      version: m.version,
      title: m.title,
      nominalPressurePa: 101325,
      nominalTemperatureK: null,
      vaporModel: { kind: 'ideal' },
    }
  },
}))
vi.mock('../repositories/points.repository.js', () => ({ listPoints: async () => [] }))
vi.mock('../repositories/approvals.repository.js', () => ({
  displayNamesOf: async (_db: unknown, ids: string[]) =>
    new Map(ids.filter((id) => s.names.has(id)).map((id) => [id, s.names.get(id)!])),
}))
vi.mock('../repositories/audit.repository.js', () => ({
  appendAudit: async (_db: unknown, e: Record<string, unknown>) => void s.audit.push(e),
}))
vi.mock('./contributors.js', () => ({
  contributorsOf: async (_db: unknown, d: { id: string }) => s.contributors.get(d.id) ?? [],
}))
vi.mock('../mail/outbox.js', () => ({
  notifyUser: async (_db: unknown, to: string, m: { subject: string; text: string }) => void s.mail.push({ to, ...m }),
}))
vi.mock('./workflow.service.js', () => ({
  checkSignaturePassword: async () => {
    if (!s.passwordOk) throw new AppError(403, 'signature_refused', 'The password is not correct; nothing was signed.')
  },
}))
vi.mock('./systems.service.js', () => ({
  getSystem: async (_db: unknown, id: string) => ({
    id,
    name: 'Ethanol–water',
    component1: { id: 'c1', name: 'ethanol' },
    component2: { id: 'c2', name: 'water' },
  }),
  binarySystem: () => ({}),
  engineInputs: async () => ({}),
}))
vi.mock('./catalogue.service.js', () => ({ cautionFor: () => null, curveOf: () => ({}) }))
vi.mock('./joint-fits.service.js', async (importOriginal) => ({
  ...(await importOriginal<typeof import('./joint-fits.service.js')>()),
  jointFitDetail: async (_db: unknown, _user: unknown, id: string) => ({
    ...s.fits.get(id),
    id,
    members: s.members.map((m) => ({ ...m, pointCount: 12 })),
  }),
}))

const {
  approveJointFit,
  jointFitContributors,
  PARAMETER_SET_DIGEST,
  parameterSetDigest,
  returnJointFit,
  verifyJointFit,
} = await import('./joint-fit-signing.js')

const tx = {}
const db = { transaction: () => ({ execute: (fn: (t: unknown) => unknown) => fn(tx) }) } as unknown as Db
const config = { allowSelfApproval: false, publicUrl: 'https://ebullio.test' } as Config
const person = (id: string, ...roles: Role[]): SessionUser => ({
  id,
  email: `${id}@lab.test`,
  displayName: id.toUpperCase(),
  roles,
})
const lead = person('lea', 'lead_chemist')
const sign = { password: 'right', reason: 'fits both sets', rowVersion: 3 }

function jointFit(id: string, over: Record<string, unknown> = {}) {
  const f = {
    id,
    systemId: 'sys',
    model: 'nrtl',
    options: { temperatureDependent: false },
    activity: { kind: 'nrtl' },
    parameters: [{ name: 'a12', value: 1 }],
    statistics: { converged: true, rmsT: 0.1 },
    range: { Tmin: 350, Tmax: 373, Pmin: 50000, Pmax: 101325 },
    state: 'submitted',
    runBy: 'ana',
    submittedBy: 'bo',
    rowVersion: 3,
    ...over,
  }
  s.fits.set(id, f)
  return f
}

async function refusal(p: Promise<unknown>): Promise<AppError> {
  try {
    await p
  } catch (err) {
    expect(err).toBeInstanceOf(AppError)
    return err as AppError
  }
  throw new Error('expected a refusal')
}

function nothingSigned() {
  expect(s.inserted).toEqual([])
  expect(s.updates).toEqual([])
  expect(s.audit).toEqual([])
}

beforeEach(() => {
  s.fits.clear()
  s.members = [
    { dataSetId: 'd1', title: 'At 101.3 kPa (invented)', version: 2, state: 'approved', stale: false },
    { dataSetId: 'd2', title: 'At 50 kPa (invented)', version: 1, state: 'approved', stale: false },
  ]
  s.contributors = new Map([
    ['d1', [{ userId: 'ana', name: 'Ana', changes: ['created the data set'] }]],
    ['d2', [{ userId: 'cy', name: 'Cy', changes: ['uploaded points'] }]],
  ])
  s.names = new Map([
    ['ana', 'Ana'],
    ['lea', 'Lea'],
  ])
  s.approvals = []
  s.inserted = []
  s.updates = []
  s.audit = []
  s.mail = []
  s.passwordOk = true
})

describe('jointFitContributors', () => {
  it('the runner and everyone who changed a member, with the data set named; one entry per person, by name', async () => {
    s.contributors.set('d2', [
      { userId: 'ana', name: 'Ana', changes: ['uploaded points'] },
      { userId: 'cy', name: 'Cy', changes: ['ran the recommended fit'] },
    ])
    const got = await jointFitContributors(db, jointFit('j1') as never)
    expect(got).toEqual([
      {
        userId: 'ana',
        name: 'Ana',
        changes: [
          'ran the joint fit',
          'created the data set in "At 101.3 kPa (invented)" v2',
          'uploaded points in "At 50 kPa (invented)" v1',
        ],
      },
      { userId: 'cy', name: 'Cy', changes: ['ran the recommended fit in "At 50 kPa (invented)" v1'] },
    ])
  })

  it('sorts by name, not by the order found (the runner comes first in the search)', async () => {
    s.names.set('zoe', 'Zoe')
    const got = await jointFitContributors(db, jointFit('j1', { runBy: 'zoe' }) as never)
    expect(got.map((c) => c.name)).toEqual(['Ana', 'Cy', 'Zoe'])
  })

  it('a runner without a display name keeps the id', async () => {
    s.names.delete('ana')
    s.members = []
    expect(await jointFitContributors(db, jointFit('j1') as never)).toEqual([
      { userId: 'ana', name: 'ana', changes: ['ran the joint fit'] },
    ])
  })
})

describe('approveJointFit', () => {
  it('an independent lead chemist signs; the older recommended set of the system is superseded', async () => {
    jointFit('old', { state: 'approved' })
    jointFit('elsewhere', { state: 'approved', systemId: 'other' })
    jointFit('j1')
    const r = await approveJointFit(db, config, lead, 'j1', sign)
    const digest = await parameterSetDigest(db, 'j1')
    expect(r.digest).toBe(digest)
    expect(s.inserted).toEqual([
      {
        jointFitId: 'j1',
        signerId: 'lea',
        meaning: 'approved',
        reason: 'fits both sets',
        digest,
        digestAlgorithm: PARAMETER_SET_DIGEST,
        changes: await jointFitContributors(db, s.fits.get('j1') as never),
        selfApproval: false,
      },
    ])
    expect(s.updates.map(([id, p]) => [id, p.state])).toEqual([
      ['old', 'superseded'],
      ['j1', 'approved'],
    ])
    expect(s.updates[0][1]).toMatchObject({ supersededBy: 'j1' })
    expect(s.audit.map((a) => [a.action, a.entityId])).toEqual([
      ['supersede joint fit', 'old'],
      ['approve joint fit', 'j1'],
    ])
    expect(s.audit).toEqual([
      {
        actorId: 'lea',
        entity: 'joint_fit',
        entityId: 'old',
        action: 'supersede joint fit',
        before: { state: 'approved' },
        after: { state: 'superseded', by: 'j1' },
      },
      {
        actorId: 'lea',
        entity: 'joint_fit',
        entityId: 'j1',
        action: 'approve joint fit',
        before: { state: 'submitted' },
        after: { state: 'approved', approvalId: 'ja1', digest, selfApproval: false, supersedes: ['old'] },
      },
    ])
    expect(r.approvalId).toBe('ja1')
    expect(r.jointFit).toMatchObject({ id: 'j1', state: 'approved' })
  })

  it('four-eyes: the runner, or whoever changed a contributing data set, may not sign', async () => {
    jointFit('j1', { runBy: 'lea' })
    const e = await refusal(approveJointFit(db, config, lead, 'j1', sign))
    expect(e.status).toBe(403)
    expect(e.code).toBe('four_eyes')
    expect(e.message).toBe('You ran the joint fit; another lead chemist must sign this parameter set.')
    jointFit('j2')
    s.contributors.set('d2', [{ userId: 'lea', name: 'Lea', changes: ['edited the metadata'] }])
    s.contributors.set('d1', [{ userId: 'lea', name: 'Lea', changes: ['uploaded points'] }])
    const e2 = await refusal(approveJointFit(db, config, lead, 'j2', sign))
    expect(e2.message).toBe(
      'You uploaded points in "At 101.3 kPa (invented)" v2; edited the metadata in "At 50 kPa (invented)" v1; another lead chemist must sign this parameter set.',
    )
    expect(e2.details).toEqual({
      changes: ['uploaded points in "At 101.3 kPa (invented)" v2', 'edited the metadata in "At 50 kPa (invented)" v1'],
    })
    nothingSigned()
  })

  it('a one-person lab (ALLOW_SELF_APPROVAL) may sign its own joint fit; the signature says so', async () => {
    jointFit('j1', { runBy: 'lea' })
    await approveJointFit(db, { ...config, allowSelfApproval: true }, lead, 'j1', sign)
    expect(s.inserted[0]).toMatchObject({ selfApproval: true })
    expect(s.audit.at(-1)).toMatchObject({ action: 'approve joint fit', after: { selfApproval: true } })
  })

  it('only a submitted, converged fit on approved, unchanged data, at the version loaded, with the password', async () => {
    jointFit('draft', { state: 'draft' })
    const e1 = await refusal(approveJointFit(db, config, lead, 'draft', sign))
    expect(e1.message).toBe('This joint fit is draft; only a submitted joint fit can be signed.')
    expect(e1.details).toEqual({ state: 'draft' })
    jointFit('moved', { rowVersion: 4 })
    expect(await refusal(approveJointFit(db, config, lead, 'moved', sign))).toMatchObject({ code: 'stale_write' })
    jointFit('nc', { statistics: { converged: false } })
    const e3 = await refusal(approveJointFit(db, config, lead, 'nc', sign))
    expect(e3.message).toBe('This joint fit did not converge; it cannot be the recommended parameter set.')
    expect(await refusal(approveJointFit(db, config, lead, 'none', sign))).toMatchObject({
      status: 404,
      message: 'There is no such joint fit.',
    })
    jointFit('j1')
    s.passwordOk = false
    expect(await refusal(approveJointFit(db, config, lead, 'j1', sign))).toMatchObject({ code: 'signature_refused' })
    s.passwordOk = true
    s.members[1].state = 'submitted'
    const e4 = await refusal(approveJointFit(db, config, lead, 'j1', sign))
    expect(e4.message).toBe(
      'The recommended parameter set must rest on approved data only; "At 50 kPa (invented)" v1 is submitted. Approve it first, then run the joint fit again if the points changed.',
    )
    s.members[0].state = 'returned'
    expect((await refusal(approveJointFit(db, config, lead, 'j1', sign))).message).toBe(
      'The recommended parameter set must rest on approved data only; "At 101.3 kPa (invented)" v2 is returned, "At 50 kPa (invented)" v1 is submitted. Approve them first, then run the joint fit again if the points changed.',
    )
    s.members[0].state = 'approved'
    s.members[1].state = 'approved'
    s.members[0].stale = true
    const e5 = await refusal(approveJointFit(db, config, lead, 'j1', sign))
    expect(e5.code).toBe('stale_results')
    expect(e5.message).toMatch(/^Cannot approve: the points of "At 101\.3 kPa \(invented\)" v2 changed/)
    nothingSigned()
  })

  it('a fit whose convergence is not recorded may be signed (only an explicit false refuses)', async () => {
    jointFit('j1', { statistics: {} })
    await approveJointFit(db, config, lead, 'j1', sign)
    expect(s.inserted).toHaveLength(1)
  })
})

describe('returnJointFit', () => {
  it('records the return with the contributors, and tells the runner and the submitter once each', async () => {
    jointFit('j1', { runBy: 'lea', submittedBy: 'lea' })
    await returnJointFit(db, config, lead, 'j1', { ...sign, reason: 'use the 50 kPa set too' })
    const r = s.inserted[0]
    expect(r).toMatchObject({ meaning: 'returned for rework', reason: 'use the 50 kPa set too', selfApproval: false })
    expect(s.updates).toEqual([['j1', { state: 'returned' }]])
    expect(s.audit).toEqual([
      {
        actorId: 'lea',
        entity: 'joint_fit',
        entityId: 'j1',
        action: 'return joint fit',
        before: { state: 'submitted' },
        after: { state: 'returned', approvalId: 'ja1', digest: r.digest, reason: 'use the 50 kPa set too' },
      },
    ])
    expect(s.mail.map((m) => m.to)).toEqual(['lea'])
    // the fit holds the energies constant: the label says so
    expect(s.mail[0].text).toContain(
      'the joint parameter set NRTL (joint, constant energies, 2 data sets) for Ethanol–water',
    )
    jointFit('j2', { options: {} })
    s.mail = []
    const back = await returnJointFit(db, config, lead, 'j2', { ...sign, reason: 'again' })
    expect(back.approvalId).toBe('ja2')
    expect(back.digest).toBe(await parameterSetDigest(db, 'j2'))
    expect(back.jointFit).toMatchObject({ id: 'j2', state: 'returned' })
    expect(s.mail.map((m) => m.to)).toEqual(['ana', 'bo'])
    expect(s.mail[0].text).toContain('the joint parameter set NRTL (joint, 2 data sets) for Ethanol–water')
    expect(s.mail[0].subject).toBe('Ebullio: the joint parameter set for Ethanol–water was returned for rework')
    expect(s.mail[0].text).toContain('Reason: again')
  })

  it('only a submitted fit that exists, at the version loaded', async () => {
    jointFit('j1', { state: 'approved' })
    const e = await refusal(returnJointFit(db, config, lead, 'j1', sign))
    expect(e).toMatchObject({ code: 'conflict', details: { state: 'approved' } })
    expect(e.message).toBe('This joint fit is approved; only a submitted joint fit can be returned for rework.')
    jointFit('j2', { rowVersion: 4 })
    expect(await refusal(returnJointFit(db, config, lead, 'j2', sign))).toMatchObject({ code: 'stale_write' })
    expect(await refusal(returnJointFit(db, config, lead, 'none', sign))).toMatchObject({
      status: 404,
      message: 'There is no such joint fit.',
    })
    nothingSigned()
  })
})

describe('verifyJointFit', () => {
  it('recomputes every signature with its own format and says whether it matches', async () => {
    jointFit('j1', { state: 'approved' })
    const now = await parameterSetDigest(db, 'j1')
    const v1 = await parameterSetDigest(db, 'j1', 'ebullio-parameter-set/1')
    expect(v1).not.toBe(now)
    s.approvals = [
      { id: 'a1', digest: v1, digestAlgorithm: 'ebullio-parameter-set/1' },
      { id: 'a2', digest: now, digestAlgorithm: PARAMETER_SET_DIGEST },
      { id: 'a3', digest: 'tampered', digestAlgorithm: PARAMETER_SET_DIGEST },
    ]
    const r = await verifyJointFit(db, 'j1')
    expect(r.currentDigest).toBe(now)
    expect(r.signatures.map((x) => [x.id, x.matches])).toEqual([
      ['a1', true],
      ['a2', true],
      ['a3', false],
    ])
  })

  it('404 for a missing fit or one without signatures', async () => {
    expect(await refusal(verifyJointFit(db, 'none'))).toMatchObject({
      status: 404,
      message: 'There is no such joint fit.',
    })
    jointFit('j1')
    expect(await refusal(verifyJointFit(db, 'j1'))).toMatchObject({
      status: 404,
      message: 'This joint fit has no signatures.',
    })
  })
})
