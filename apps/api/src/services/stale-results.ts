/**
 * Which of a data set's shown results were computed on other points than it has now. Submit and approve
 * refuse while the recommended fit or the latest result of a consistency test is stale (409 `stale_results`).
 */
import { fitLabel } from '@ebullio/schemas'
import type { Db } from '../db/index.js'
import { AppError } from '../errors/index.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'
import { listConsistency, listFits, type ConsistencyRecord } from '../repositories/fits.repository.js'
import { computedOn, currentPointSet } from './point-set.js'

export interface StaleItem {
  kind: 'fit' | 'consistency'
  id: string
  pointCount: number | null
  runAt: Date
  /** "the recommended fit (Wilson)", "the area test" */
  what?: string
}

/** 409 stale_results with the stale items in details. */
export function staleResults(message: string, stale: StaleItem[]): AppError {
  return new AppError(409, 'stale_results', message, { stale })
}

const TEST_NAMES: Record<ConsistencyRecord['test'], string> = {
  'herington-area': 'the area test',
  'redlich-kister-area': 'the area test (Redlich–Kister)',
  point: 'the point test',
  'quality-score': 'the data-quality score',
}

/** The latest result of each consistency test: what the consistency panel and the record show. */
export function latestConsistency(all: ConsistencyRecord[]): ConsistencyRecord[] {
  const latest = new Map<string, ConsistencyRecord>()
  for (const c of all) {
    const seen = latest.get(c.test)
    if (!seen || c.runAt.getTime() >= seen.runAt.getTime()) latest.set(c.test, c)
  }
  return [...latest.values()]
}

/** The shown results that are stale: the recommended fit and the latest consistency results. */
export async function staleShownResults(db: Db, d: DataSetRecord): Promise<{ digest: string; stale: StaleItem[] }> {
  const { digest } = await currentPointSet(db, d.id)
  const stale: StaleItem[] = []
  if (d.recommendedFitId) {
    const fits = await listFits(db, d.id)
    const fit = fits.find((f) => f.id === d.recommendedFitId)
    if (fit && fit.pointSetDigest !== digest)
      stale.push({
        kind: 'fit',
        id: fit.id,
        pointCount: fit.pointCount,
        runAt: fit.runAt,
        what: `the recommended fit (${fitLabel(fit, fits)})`,
      })
  }
  for (const c of latestConsistency(await listConsistency(db, d.id))) {
    if (c.pointSetDigest !== digest)
      stale.push({ kind: 'consistency', id: c.id, pointCount: c.pointCount, runAt: c.runAt, what: TEST_NAMES[c.test] })
  }
  return { digest, stale }
}

/** Refuse `action` while a shown result is stale, naming each one and what it was computed on. */
export async function refuseWhileStale(db: Db, d: DataSetRecord, action: string): Promise<string> {
  const { digest, stale } = await staleShownResults(db, d)
  if (stale.length) {
    const list = stale.map((s) => `${s.what} was ${computedOn(s)}`).join('; ')
    throw staleResults(
      `Cannot ${action}: results computed on other points than the data set has now — ${list}. Run ${stale.length === 1 ? 'it' : 'them'} again on the current points first.`,
      stale,
    )
  }
  return digest
}
