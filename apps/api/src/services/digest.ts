/**
 * The content an approval signs and its SHA-256 digest. Two algorithms, named in each signature
 * (`approval.digest_algorithm`):
 * - `ebullio-signed-content/2` (every new signature): RFC 8785 canonical JSON (`canonicalize`) of the
 *   metadata, every point, the point-set digest, the recommended fit and the consistency results, where a
 *   result is included only when it was computed on the current point set (docs/workflow.md says how an
 *   auditor recomputes it);
 *   Format 2 also signs what a data set says beyond isobaric data under an ideal vapour, as members present only
 *   when they apply, so the signed bytes of every record without them are what they were: `kind: 'isothermal'` and
 *   `nominalTemperatureK` (K) on an isothermal set that has its temperature, `vaporModel` when the vapour is not the
 *   ideal gas, and `uP` (σP, Pa) on a point that gives it.
 * - `ebullio-signed-content/1` (signatures made before): JSON with sorted keys of the metadata, every point
 *   and every fit; kept so those signatures still verify.
 */
import type { Db } from '../db/index.js'
import { findDataSet } from '../repositories/datasets.repository.js'
import { listConsistency, listFits } from '../repositories/fits.repository.js'
import { listPoints } from '../repositories/points.repository.js'
import { canonicalJson8785, pointSetOf, sha256Hex } from './point-set.js'

export const DIGEST_V1 = 'ebullio-signed-content/1'
export const DIGEST_V2 = 'ebullio-signed-content/2'
export type DigestAlgorithm = typeof DIGEST_V1 | typeof DIGEST_V2

/** JSON with sorted keys at every level (arrays keep their order); format 1 only. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value ?? null)
  if (value instanceof Date) return JSON.stringify(value.toISOString())
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`
  const obj = value as Record<string, unknown>
  const keys = Object.keys(obj)
    .filter((k) => obj[k] !== undefined)
    .sort()
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(obj[k])}`).join(',')}}`
}

/** Format 1 (signatures made before format 2): metadata, every point (in sequence), every fit (by id) and the recommended fit. */
export async function signedContentV1(db: Db, dataSetId: string) {
  const d = await findDataSet(db, dataSetId)
  if (!d) return null
  const points = await listPoints(db, dataSetId)
  const fits = (await listFits(db, dataSetId)).sort((a, b) => a.id.localeCompare(b.id))
  return {
    format: 'ebullio-signed-content/1',
    dataSet: metadataV1Of(d),
    points: points.map(signedPoint),
    fits: fits.map((f) => ({
      id: f.id,
      model: f.model,
      activity: f.activity,
      parameters: f.parameters,
      pointIds: f.pointIds,
    })),
    recommendedFitId: d.recommendedFitId,
  }
}

/**
 * The metadata format 1 signed, exactly as it was when format 1 was current (before data-set origin and layout
 * existed): a signature made then must still verify, so nothing may ever be added here.
 */
const metadataV1Of = (d: NonNullable<Awaited<ReturnType<typeof findDataSet>>>) => ({
  id: d.id,
  lineageId: d.lineageId,
  version: d.version,
  systemId: d.systemId,
  title: d.title,
  nominalPressurePa: d.nominalPressurePa,
  apparatusNotes: d.apparatusNotes,
  projectRef: d.projectRef,
})

/** The metadata format 2 signs. */
const metadataOf = (d: NonNullable<Awaited<ReturnType<typeof findDataSet>>>) => ({
  ...metadataV1Of(d),
  origin: d.origin,
  originMethod: d.originMethod,
  citation: d.citation,
  countsAsOwn: d.countsAsOwn,
  countsAsOwnReason: d.countsAsOwnReason,
  layout: d.layout,
})

/** One point as both digest formats sign it. */
const signedPoint = (p: Awaited<ReturnType<typeof listPoints>>[number]) => ({
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
})

/** Format 2's optional members of the metadata: the data set's kind and condition, and a non-ideal vapour. */
const conditionAndVapour = (d: NonNullable<Awaited<ReturnType<typeof findDataSet>>>) => ({
  ...(d.nominalTemperatureK !== null ? { kind: 'isothermal', nominalTemperatureK: d.nominalTemperatureK } : {}),
  ...(d.vaporModel.kind !== 'ideal' ? { vaporModel: d.vaporModel } : {}),
})

/**
 * Format 2: metadata, every point (in sequence), the point set's digest, the recommended fit when it was
 * computed on that point set (else null) and every consistency result computed on it (by id). Results
 * computed on other points are not part of what is signed; approval refuses while the shown ones are stale.
 */
export async function signedContentV2(db: Db, dataSetId: string) {
  const d = await findDataSet(db, dataSetId)
  if (!d) return null
  const points = await listPoints(db, dataSetId)
  const pointSet = pointSetOf(points, d.vaporModel)
  const fit = d.recommendedFitId ? (await listFits(db, dataSetId)).find((f) => f.id === d.recommendedFitId) : undefined
  const consistency = (await listConsistency(db, dataSetId))
    .filter((c) => c.pointSetDigest === pointSet.digest)
    .sort((a, b) => a.id.localeCompare(b.id))
  return {
    format: DIGEST_V2,
    dataSet: { ...metadataOf(d), ...conditionAndVapour(d) },
    pointSet: { digest: pointSet.digest, included: pointSet.included },
    points: points.map((p) => ({
      ...signedPoint(p),
      ...(p.pressureUncertaintyPa ? { uP: p.pressureUncertaintyPa } : {}),
    })),
    recommendedFit:
      fit && fit.pointSetDigest === pointSet.digest
        ? {
            id: fit.id,
            model: fit.model,
            options: fit.options,
            activity: fit.activity,
            parameters: fit.parameters,
            pointIds: fit.pointIds,
            pointSetDigest: fit.pointSetDigest,
          }
        : null,
    consistency: consistency.map((c) => ({
      id: c.id,
      test: c.test,
      passed: c.passed,
      result: c.result,
      pointSetDigest: c.pointSetDigest,
    })),
  }
}

export { sha256Hex }

/** SHA-256 (hex) of the canonical signed content of a data set as stored now, with the given algorithm. */
export async function contentDigest(db: Db, dataSetId: string, algorithm: string = DIGEST_V2): Promise<string> {
  if (algorithm === DIGEST_V1) return sha256Hex(canonicalJson(await signedContentV1(db, dataSetId)))
  return sha256Hex(canonicalJson8785(await signedContentV2(db, dataSetId)))
}
