/**
 * Which shown results are stale (computed on other points than the data set has now), and the refusal that names
 * them before a submit or an approval. Pure unit tests with fake repositories: only the recommended fit and the
 * latest result of each consistency test count (the product's rule, docs/workflow.md).
 */
import { beforeEach, describe, expect, it, vi } from 'vitest'
import type { Db } from '../db/index.js'
import { AppError } from '../errors/index.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'
import type { ConsistencyRecord, FitRecord } from '../repositories/fits.repository.js'

const store = vi.hoisted(() => ({ fits: [] as unknown[], consistency: [] as unknown[], digest: 'now' }))
vi.mock('../repositories/fits.repository.js', () => ({
  listFits: async () => store.fits,
  listConsistency: async () => store.consistency,
}))
vi.mock('./point-set.js', async (importOriginal) => ({
  ...(await importOriginal<typeof import('./point-set.js')>()),
  currentPointSet: async () => ({ digest: store.digest, included: 12 }),
}))

const { latestConsistency, refuseWhileStale, staleShownResults } = await import('./stale-results.js')

const db = {} as Db
const at = (hhmm: string) => new Date(`2026-12-03T${hhmm}:00Z`)

const fit = (id: string, model: string, digest: string | null, pointCount: number | null = 12) =>
  ({
    id,
    model,
    options: {},
    pointIds: [],
    runAt: at('10:00'),
    pointSetDigest: digest,
    pointCount,
  }) as unknown as FitRecord

const check = (id: string, test: ConsistencyRecord['test'], hhmm: string, digest: string | null) =>
  ({ id, test, runAt: at(hhmm), pointSetDigest: digest, pointCount: 11 }) as unknown as ConsistencyRecord

const dataSet = (recommendedFitId: string | null) => ({ id: 'd1', recommendedFitId }) as DataSetRecord

describe('latestConsistency', () => {
  it('keeps the newest result of each test; of two at the same time, the later one listed', () => {
    const all = [
      check('a1', 'herington-area', '10:00', 'x'),
      check('p1', 'point', '10:00', 'x'),
      check('a2', 'herington-area', '11:00', 'x'),
      check('a0', 'herington-area', '09:00', 'x'),
      check('p2', 'point', '10:00', 'x'),
    ]
    expect(latestConsistency(all).map((c) => c.id)).toEqual(['a2', 'p2'])
    expect(latestConsistency([])).toEqual([])
  })
})

describe('staleShownResults', () => {
  beforeEach(() => {
    store.digest = 'now'
    store.fits = [fit('f1', 'wilson', 'now'), fit('f2', 'margules', 'before')]
    store.consistency = []
  })

  it('a stale fit that is not the recommended one is not in the way', async () => {
    expect(await staleShownResults(db, dataSet('f1'))).toEqual({ digest: 'now', stale: [] })
    expect((await staleShownResults(db, dataSet(null))).stale).toEqual([])
  })

  it('the recommended fit computed on other points is stale, named by its label', async () => {
    const { stale } = await staleShownResults(db, dataSet('f2'))
    expect(stale).toEqual([
      { kind: 'fit', id: 'f2', pointCount: 12, runAt: at('10:00'), what: 'the recommended fit (Margules)' },
    ])
  })

  it('only the latest result of each consistency test counts, named in words', async () => {
    store.consistency = [
      check('a-old', 'herington-area', '09:00', 'before'),
      check('a-new', 'herington-area', '10:00', 'now'),
      check('rk', 'redlich-kister-area', '10:00', 'before'),
      check('pt', 'point', '10:00', null),
      check('q', 'quality-score', '10:00', 'before'),
    ]
    const { stale } = await staleShownResults(db, dataSet('f1'))
    expect(stale.map((s) => [s.kind, s.id, s.what])).toEqual([
      ['consistency', 'rk', 'the area test (Redlich–Kister)'],
      ['consistency', 'pt', 'the point test'],
      ['consistency', 'q', 'the data-quality score'],
    ])
    store.consistency = [check('a', 'herington-area', '10:00', 'before')]
    expect((await staleShownResults(db, dataSet('f1'))).stale).toEqual([
      { kind: 'consistency', id: 'a', pointCount: 11, runAt: at('10:00'), what: 'the area test' },
    ])
  })
})

describe('refuseWhileStale', () => {
  beforeEach(() => {
    store.digest = 'now'
    store.fits = [fit('f1', 'wilson', 'now'), fit('f2', 'wilson', 'before', 1)]
    store.consistency = [check('a', 'herington-area', '10:00', 'now')]
  })

  it('lets the action go on with the current digest when nothing shown is stale', async () => {
    expect(await refuseWhileStale(db, dataSet('f1'), 'approve')).toBe('now')
  })

  async function refusal(recommended: string): Promise<AppError> {
    try {
      await refuseWhileStale(db, dataSet(recommended), 'approve')
    } catch (err) {
      expect(err).toBeInstanceOf(AppError)
      return err as AppError
    }
    throw new Error('expected refuseWhileStale to refuse')
  }

  it('refuses with 409 stale_results naming the one stale result and what it was computed on', async () => {
    const e = await refusal('f2')
    expect(e.status).toBe(409)
    expect(e.code).toBe('stale_results')
    expect(e.message).toBe(
      'Cannot approve: results computed on other points than the data set has now — the recommended fit (Wilson #2 (run 10:00 UTC)) was computed on 1 point on 2026-12-03 10:00 UTC. Run it again on the current points first.',
    )
    expect((e.details as { stale: { id: string }[] }).stale.map((s) => s.id)).toEqual(['f2'])
  })

  it('names every stale result, joined by semicolons, and asks to run "them" again', async () => {
    store.consistency = [check('a', 'herington-area', '10:00', 'before')]
    const e = await refusal('f2')
    expect(e.message).toContain(
      'was computed on 1 point on 2026-12-03 10:00 UTC; the area test was computed on 11 points on 2026-12-03 10:00 UTC. Run them again',
    )
    expect((e.details as { stale: { id: string }[] }).stale.map((s) => s.id)).toEqual(['f2', 'a'])
  })
})
