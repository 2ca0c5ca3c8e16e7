/**
 * The point set a derived result was computed on, and its digest. Every fit and consistency result keeps
 * the digest of the points as they were when it was computed; a result whose digest differs from the data
 * set's current one is **stale** (computed on other points) and is shown, signed and exported as such.
 *
 * The digest is the SHA-256 (hex) of the RFC 8785 canonical JSON (`canonicalize`) of
 * `{ format: 'ebullio-point-set/1', points: [{ seq, T, P, x1, ux1, y1, uy1, excluded }, …] }`, points in
 * sequence order, T in K, P in Pa. It leaves out what no computation reads (ids, labels, reasons, files),
 * so a revision's carried-over points keep the digest of the version they come from.
 * Two members are present only when they say something (so older point sets keep their digest): `uP` (σP, Pa) on a
 * point that gives it, and `vapor` (the data set's vapour model) when it is not the ideal gas — every computation
 * reads it, so changing the vapour model makes the results computed under the other one stale.
 */
import canonicalize from 'canonicalize'
import { createHash } from 'node:crypto'
import type { Db } from '../db/index.js'
import { findDataSet, type DataSetRecord } from '../repositories/datasets.repository.js'
import { listPoints, type PointRecord } from '../repositories/points.repository.js'

export const POINT_SET_FORMAT = 'ebullio-point-set/1'

/** RFC 8785 canonical JSON of a value (throws on NaN or Infinity: they have no JSON form). */
export function canonicalJson8785(value: unknown): string {
  const text = canonicalize(value)
  if (text === undefined) throw new Error('Nothing to canonicalise.')
  return text
}

export function sha256Hex(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex')
}

/** The canonical content of a point set: what any computation on the points reads. */
export function pointSetContent(points: readonly PointRecord[], vapor?: DataSetRecord['vaporModel']) {
  return {
    format: POINT_SET_FORMAT,
    ...(vapor && vapor.kind !== 'ideal' ? { vapor } : {}),
    points: [...points]
      .sort((a, b) => a.seq - b.seq)
      .map((p) => ({
        seq: p.seq,
        T: p.temperatureK,
        P: p.pressurePa,
        x1: p.x1,
        ux1: p.x1Uncertainty,
        y1: p.y1,
        uy1: p.y1Uncertainty,
        ...(p.pressureUncertaintyPa ? { uP: p.pressureUncertaintyPa } : {}),
        excluded: p.excluded,
      })),
  }
}

/** Digest and included-point count of a point set. */
export function pointSetOf(
  points: readonly PointRecord[],
  vapor?: DataSetRecord['vaporModel'],
): { digest: string; included: number } {
  return {
    digest: sha256Hex(canonicalJson8785(pointSetContent(points, vapor))),
    included: points.filter((p) => !p.excluded).length,
  }
}

/** The data set's current point set, as stored now. */
export async function currentPointSet(db: Db, dataSetId: string) {
  return pointSetOf(await listPoints(db, dataSetId), (await findDataSet(db, dataSetId))?.vaporModel)
}

/** A result bound to a point set. */
export interface BoundResult {
  pointSetDigest: string | null
  pointCount: number | null
  runAt: Date
}

/** The result with `stale`: true when it was computed on other points than the current ones (or unknown ones). */
export function withStale<T extends BoundResult>(r: T, currentDigest: string): T & { stale: boolean } {
  return { ...r, stale: r.pointSetDigest !== currentDigest }
}

/** "computed on 12 points on 2026-12-03 14:05 UTC" (or "on an unrecorded point set"). */
export function computedOn(r: Pick<BoundResult, 'pointCount' | 'runAt'>): string {
  const when = r.runAt.toISOString().slice(0, 16).replace('T', ' ')
  return r.pointCount === null
    ? `computed on an unrecorded point set on ${when} UTC`
    : `computed on ${r.pointCount} point${r.pointCount === 1 ? '' : 's'} on ${when} UTC`
}

/** A point as the engine reads it (y1 null without vapour composition; sigmaP in Pa when the point gives it). */
export function enginePoint(p: PointRecord) {
  return {
    T: p.temperatureK,
    P: p.pressurePa,
    x1: p.x1,
    y1: p.y1,
    excluded: p.excluded,
    ...(p.pressureUncertaintyPa ? { sigmaP: p.pressureUncertaintyPa } : {}),
    ...(p.heterogeneous ? { heterogeneous: true } : {}),
  }
}
