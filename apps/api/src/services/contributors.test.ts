/**
 * Who changed a data set version (the four-eyes rule refuses the approval to each of them, and the approval record
 * lists them). Pure unit tests with fake repositories; the rule is the product's own (docs/workflow.md).
 */
import { beforeEach, describe, expect, it, vi } from 'vitest'
import type { Db } from '../db/index.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'

const store = vi.hoisted(() => ({
  uploaders: [] as string[],
  actors: [] as { actorId: string; action: string }[],
  askedActions: [] as string[],
  fits: new Map<string, { runBy: string }>(),
  names: new Map<string, string>(),
}))
vi.mock('../repositories/uploads.repository.js', () => ({ uploadersOf: async () => store.uploaders }))
vi.mock('../repositories/audit.repository.js', () => ({
  actorsOf: async (_db: unknown, _id: string, actions: string[]) => {
    store.askedActions = actions
    return store.actors.filter((a) => actions.includes(a.action))
  },
}))
vi.mock('../repositories/fits.repository.js', () => ({
  findFit: async (_db: unknown, id: string) => store.fits.get(id),
}))
vi.mock('../repositories/approvals.repository.js', () => ({
  displayNamesOf: async (_db: unknown, ids: string[]) =>
    new Map(ids.filter((id) => store.names.has(id)).map((id) => [id, store.names.get(id)!])),
}))

const { contributorsOf } = await import('./contributors.js')

const db = {} as Db
const version = (over: Partial<DataSetRecord> = {}) =>
  ({ id: 'd2', createdBy: 'ana', previousVersionId: null, recommendedFitId: null, ...over }) as DataSetRecord

describe('contributorsOf', () => {
  beforeEach(() => {
    store.uploaders = []
    store.actors = []
    store.fits = new Map([['fit-1', { runBy: 'lea' }]])
    store.names = new Map([
      ['ana', 'Ana Analyst'],
      ['lea', 'Lea Lead'],
      ['bo', 'Bo Second'],
    ])
  })

  it('the creator of a first version "created the data set"; of a revision "created this version"', async () => {
    expect(await contributorsOf(db, version())).toEqual([
      { userId: 'ana', name: 'Ana Analyst', changes: ['created the data set'] },
    ])
    expect((await contributorsOf(db, version({ previousVersionId: 'd1' })))[0].changes).toEqual([
      'created this version',
    ])
  })

  it('uploads, content edits in the audit log and the recommended fit each count, sorted by name', async () => {
    store.uploaders = ['bo']
    store.actors = [
      { actorId: 'lea', action: 'exclude point' },
      { actorId: 'lea', action: 'include point' },
      { actorId: 'bo', action: 'update metadata' },
      { actorId: 'ana', action: 'enter points' },
      { actorId: 'ana', action: 'edit point' },
      { actorId: 'ana', action: 'import point sheet' },
      { actorId: 'bo', action: 'upload run file' },
    ]
    const got = await contributorsOf(db, version({ recommendedFitId: 'fit-1' }))
    expect(got).toEqual([
      {
        userId: 'ana',
        name: 'Ana Analyst',
        changes: ['created the data set', 'entered points', 'edited points', 'uploaded points'],
      },
      { userId: 'bo', name: 'Bo Second', changes: ['uploaded points', 'edited the metadata'] },
      { userId: 'lea', name: 'Lea Lead', changes: ['excluded or included points', 'ran the recommended fit'] },
    ])
  })

  it('sorts by display name, not by the order in which the changes were found', async () => {
    store.names.set('zed', 'Zed Creator')
    store.uploaders = ['lea']
    store.actors = [{ actorId: 'bo', action: 'update metadata' }]
    const got = await contributorsOf(db, version({ createdBy: 'zed' }))
    expect(got.map((c) => c.name)).toEqual(['Bo Second', 'Lea Lead', 'Zed Creator'])
  })

  it('asks the audit log for the content-changing actions only (a comment or a submit is not a change)', async () => {
    await contributorsOf(db, version())
    expect([...store.askedActions].sort()).toEqual([
      'edit point',
      'enter points',
      'exclude point',
      'import point sheet',
      'include point',
      'update metadata',
      'upload run file',
    ])
  })

  it('a recommended fit that no longer exists adds no one; an unknown user keeps the id as name', async () => {
    store.names.delete('ana')
    expect(await contributorsOf(db, version({ recommendedFitId: 'gone' }))).toEqual([
      { userId: 'ana', name: 'ana', changes: ['created the data set'] },
    ])
  })
})
