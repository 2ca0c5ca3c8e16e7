/**
 * What an approval signs. Pure unit tests with fake repositories: the expected digest is rebuilt from the stored
 * records by the recipe an auditor follows in docs/workflow.md ("Recomputing a digest"), serialised with the
 * RFC 8785 package `canonicalize` and hashed with node:crypto, so a change to what is signed (a stale fit or
 * consistency result slipping in, a member that should be absent) changes the answer.
 */
import canonicalize from 'canonicalize'
import { createHash } from 'node:crypto'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import type { Db } from '../db/index.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'
import type { ConsistencyRecord, FitRecord } from '../repositories/fits.repository.js'
import type { PointRecord } from '../repositories/points.repository.js'

const store = vi.hoisted(() => ({
  dataSet: undefined as unknown,
  points: [] as unknown[],
  fits: [] as unknown[],
  consistency: [] as unknown[],
}))
vi.mock('../repositories/datasets.repository.js', () => ({ findDataSet: async () => store.dataSet }))
vi.mock('../repositories/points.repository.js', () => ({ listPoints: async () => store.points }))
vi.mock('../repositories/fits.repository.js', () => ({
  listFits: async () => store.fits,
  listConsistency: async () => store.consistency,
}))

const { canonicalJson, contentDigest, DIGEST_V1, DIGEST_V2, signedContentV1, signedContentV2 } =
  await import('./digest.js')

const db = {} as Db
const sha = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex')
const jcs = (v: unknown) => canonicalize(v)!

const dataSet = (over: Partial<DataSetRecord> = {}) =>
  ({
    id: 'd1',
    lineageId: 'l1',
    version: 2,
    systemId: 's1',
    title: 'Acetone–methanol at 101.3 kPa (invented)',
    nominalPressurePa: 101325,
    nominalTemperatureK: null,
    vaporModel: { kind: 'ideal' },
    apparatusNotes: null,
    projectRef: 'P-7',
    recommendedFitId: 'f-new',
    origin: 'gc',
    originMethod: null,
    citation: null,
    countsAsOwn: false,
    countsAsOwnReason: null,
    layout: 'txy',
    state: 'submitted',
    ...over,
  }) as DataSetRecord

const point = (seq: number, over: Partial<PointRecord> = {}) =>
  ({
    id: `p${seq}`,
    dataSetId: 'd1',
    seq,
    sampleLabel: `S${seq}`,
    temperatureK: 330 + seq,
    pressurePa: 101325,
    x1: seq / 10,
    x1Uncertainty: 0.002,
    y1: seq / 8,
    y1Uncertainty: 0.003,
    pressureUncertaintyPa: null,
    excluded: false,
    exclusionReason: null,
    uploadId: 'u1',
    calibrationId: 'c1',
    rowRefs: [seq + 1],
    ...over,
  }) as PointRecord

const fit = (id: string, digest: string | null) =>
  ({
    id,
    dataSetId: 'd1',
    model: 'wilson',
    options: { objective: 'bubble-point' },
    activity: { kind: 'wilson' },
    parameters: [{ name: 'a12', value: 1.5 }],
    statistics: { rmsT: 0.1 },
    residuals: [],
    pointIds: ['p1', 'p2'],
    runBy: 'ana',
    runAt: new Date('2026-12-03T10:00:00Z'),
    pointSetDigest: digest,
    pointCount: 2,
  }) as unknown as FitRecord

const check = (id: string, digest: string | null) =>
  ({ id, test: 'point', passed: true, result: { ok: 1 }, pointSetDigest: digest }) as unknown as ConsistencyRecord

/** Step 1 of the recipe: the point-set digest. */
function pointSetDigest(points: PointRecord[], vapor?: unknown): string {
  return sha(
    jcs({
      format: 'ebullio-point-set/1',
      ...(vapor ? { vapor } : {}),
      points: points.map((p) => ({
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
    }),
  )
}

const auditorPoint = (p: PointRecord) => ({
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
  ...(p.pressureUncertaintyPa ? { uP: p.pressureUncertaintyPa } : {}),
})

describe('format 2: what an approval signs', () => {
  const points = [point(1), point(2, { excluded: true, exclusionReason: 'leak', pressureUncertaintyPa: 120 })]
  const current = pointSetDigest(points)

  beforeEach(() => {
    store.dataSet = dataSet()
    store.points = points
    store.fits = [fit('f-old', 'other'), fit('f-new', current)]
    store.consistency = [check('c2', current), check('c0', 'other'), check('c1', current)]
  })

  it('equals the auditor recipe: only the recommended fit and consistency results on the current points', async () => {
    const d = store.dataSet as DataSetRecord
    const f = fit('f-new', current)
    const expected = {
      format: 'ebullio-signed-content/2',
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
      pointSet: { digest: current, included: 1 },
      points: points.map(auditorPoint),
      recommendedFit: {
        id: f.id,
        model: f.model,
        options: f.options,
        activity: f.activity,
        parameters: f.parameters,
        pointIds: f.pointIds,
        pointSetDigest: current,
      },
      consistency: [check('c1', current), check('c2', current)],
    }
    expect(await contentDigest(db, 'd1')).toBe(sha(jcs(expected)))
    expect(await contentDigest(db, 'd1', DIGEST_V2)).toBe(sha(jcs(expected)))
    expect(await signedContentV2(db, 'd1')).toEqual(expected)
  })

  it('a recommended fit computed on other points is signed as null', async () => {
    store.fits = [fit('f-new', 'other')]
    expect((await signedContentV2(db, 'd1'))?.recommendedFit).toBeNull()
    store.dataSet = dataSet({ recommendedFitId: null })
    expect((await signedContentV2(db, 'd1'))?.recommendedFit).toBeNull()
  })

  it('an isothermal set signs its kind and temperature; a virial vapour is signed and enters the point set', async () => {
    const vaporModel = { kind: 'virial', correlation: 'tsonopoulos', poynting: false } as const
    store.dataSet = dataSet({ nominalPressurePa: null, nominalTemperatureK: 323.15, vaporModel, layout: 'pxy' })
    const c = await signedContentV2(db, 'd1')
    expect(c?.dataSet).toMatchObject({ kind: 'isothermal', nominalTemperatureK: 323.15, vaporModel })
    expect(c?.pointSet.digest).toBe(pointSetDigest(points, vaporModel))
    // results computed under the ideal gas are not part of it
    expect(c?.recommendedFit).toBeNull()
    expect(c?.consistency).toEqual([])
    const isobaric = await signedContentV2(db, 'd1').then(() => {
      store.dataSet = dataSet()
      return signedContentV2(db, 'd1')
    })
    expect(isobaric?.dataSet).not.toHaveProperty('kind')
    expect(isobaric?.dataSet).not.toHaveProperty('nominalTemperatureK')
    expect(isobaric?.dataSet).not.toHaveProperty('vaporModel')
  })

  it('no content for a data set that does not exist', async () => {
    store.dataSet = undefined
    expect(await signedContentV2(db, 'd1')).toBeNull()
    expect(await signedContentV1(db, 'd1')).toBeNull()
  })
})

describe('format 1 (signatures made before format 2 keep verifying)', () => {
  it('sorted-key JSON of the old metadata, every point and every fit by id, and the recommended fit id', async () => {
    const points = [point(1)]
    store.dataSet = dataSet({ origin: 'literature', layout: 'tx' })
    store.points = points
    store.fits = [fit('f-b', 'x'), fit('f-a', null)]
    store.consistency = [check('c1', 'x')]
    const d = store.dataSet as DataSetRecord
    const fitV1 = (id: string) => ({
      id,
      model: 'wilson',
      activity: { kind: 'wilson' },
      parameters: [{ name: 'a12', value: 1.5 }],
      pointIds: ['p1', 'p2'],
    })
    const expected = {
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
      },
      points: points.map(auditorPoint),
      fits: [fitV1('f-a'), fitV1('f-b')],
      recommendedFitId: 'f-new',
    }
    expect(await signedContentV1(db, 'd1')).toEqual(expected)
    // the algorithm name stored with old signatures selects format 1
    expect(DIGEST_V1).toBe('ebullio-signed-content/1')
    expect(DIGEST_V2).toBe('ebullio-signed-content/2')
    expect(await contentDigest(db, 'd1', 'ebullio-signed-content/1')).toBe(sha(jcs(expected)))
    // key order at every level by JSON.stringify of sorted keys: for this content it equals RFC 8785
    expect(await contentDigest(db, 'd1', DIGEST_V1)).toBe(sha(jcs(expected)))
  })

  it('canonicalJson sorts keys at every level, keeps array order, drops undefined and writes dates in ISO', () => {
    expect(
      canonicalJson({ b: [3, { z: 1, a: null }], a: undefined, c: new Date('2026-12-03T10:00:00Z'), d: 'x"y' }),
    ).toBe('{"b":[3,{"a":null,"z":1}],"c":"2026-12-03T10:00:00.000Z","d":"x\\"y"}')
    expect(canonicalJson(undefined)).toBe('null')
    expect(canonicalJson(null)).toBe('null')
    expect(canonicalJson([])).toBe('[]')
    expect(canonicalJson(1.5)).toBe('1.5')
  })
})
