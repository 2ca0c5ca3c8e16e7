/**
 * The content an approval signs and its SHA-256 digest. The canonical form is JSON with object keys
 * sorted and points and fits in a fixed order, so the same stored content always gives the same digest
 * and any later change to it (a point, a fit, the recommended fit, the metadata) gives another.
 */
import { createHash } from 'node:crypto'
import type { Db } from '../db/index.js'
import { findDataSet } from '../repositories/datasets.repository.js'
import { listFits } from '../repositories/fits.repository.js'
import { listPoints } from '../repositories/points.repository.js'

/** JSON with sorted keys at every level (arrays keep their order). */
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

/** What is signed: metadata, every point (in sequence), every fit (by id) and the recommended fit. */
export async function signedContent(db: Db, dataSetId: string) {
  const d = await findDataSet(db, dataSetId)
  if (!d) return null
  const points = await listPoints(db, dataSetId)
  const fits = (await listFits(db, dataSetId)).sort((a, b) => a.id.localeCompare(b.id))
  return {
    format: 'ebullio-signed-content/1',
    dataSet: {
      id: d.id,
      lineageId: d.lineageId,
      version: d.version,
      systemId: d.systemId,
      title: d.title,
      nominalPressurePa: d.nominalPressurePa,
      apparatusNotes: d.apparatusNotes,
      projectRef: d.projectRef,
      origin: d.origin,
      originMethod: d.originMethod,
      citation: d.citation,
      countsAsOwn: d.countsAsOwn,
      countsAsOwnReason: d.countsAsOwnReason,
      layout: d.layout,
    },
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

export function sha256Hex(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex')
}

/** SHA-256 (hex) of the canonical signed content of a data set as stored now. */
export async function contentDigest(db: Db, dataSetId: string): Promise<string> {
  return sha256Hex(canonicalJson(await signedContent(db, dataSetId)))
}
