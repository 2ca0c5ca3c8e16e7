/**
 * The point-set digest every fit and consistency result is bound to (a changed digest makes them stale). Pure unit
 * tests: the expected canonical text is written out by hand following RFC 8785 (keys sorted by UTF-16 code units,
 * no whitespace, ECMAScript number form) and hashed with node:crypto; SHA-256("abc") is the FIPS 180-2 test vector.
 * The repositories are fakes.
 */
import { createHash } from 'node:crypto'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import type { Db } from '../db/index.js'
import type { PointRecord } from '../repositories/points.repository.js'

const store = vi.hoisted(() => ({ points: [] as unknown[], dataSet: undefined as unknown }))
vi.mock('../repositories/points.repository.js', () => ({ listPoints: async () => store.points }))
vi.mock('../repositories/datasets.repository.js', () => ({ findDataSet: async () => store.dataSet }))

const { canonicalJson8785, computedOn, currentPointSet, enginePoint, pointSetOf, sha256Hex, withStale } =
  await import('./point-set.js')

const sha = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex')

function point(over: Partial<PointRecord>): PointRecord {
  return {
    id: `p${over.seq}`,
    dataSetId: 'd1',
    seq: 1,
    sampleLabel: 'S',
    temperatureK: 351.2,
    pressurePa: 101325,
    x1: 0.25,
    x1Uncertainty: 0.002,
    y1: 0.41,
    y1Uncertainty: 0.003,
    pressureUncertaintyPa: null,
    excluded: false,
    exclusionReason: null,
    uploadId: null,
    calibrationId: null,
    rowRefs: [],
    ...over,
  }
}

const first = point({ seq: 1 })
const second = point({
  seq: 2,
  temperatureK: 349.9,
  x1: 0.5,
  y1: null,
  y1Uncertainty: null,
  pressureUncertaintyPa: 150,
  excluded: true,
  exclusionReason: 'leak',
  sampleLabel: 'ignored by the digest',
})
const FIRST = '{"P":101325,"T":351.2,"excluded":false,"seq":1,"ux1":0.002,"uy1":0.003,"x1":0.25,"y1":0.41}'
const SECOND = '{"P":101325,"T":349.9,"excluded":true,"seq":2,"uP":150,"ux1":0.002,"uy1":null,"x1":0.5,"y1":null}'
const CANONICAL = `{"format":"ebullio-point-set/1","points":[${FIRST},${SECOND}]}`
const VIRIAL = { kind: 'virial', correlation: 'tsonopoulos', poynting: true } as const

describe('point-set digest', () => {
  it('is SHA-256 of the RFC 8785 text of the points in sequence order, with the included count', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad')
    expect(pointSetOf([second, first])).toEqual({ digest: sha(CANONICAL), included: 1 })
    expect(pointSetOf([first, second]).digest).toBe(sha(CANONICAL))
  })

  it('counts the included points, not the excluded ones', () => {
    const third = point({ seq: 3, temperatureK: 348.1, x1: 0.7 })
    expect(pointSetOf([first, second, third]).included).toBe(2)
    expect(pointSetOf([second]).included).toBe(0)
  })

  it('an ideal vapour adds nothing; a virial vapour is part of the content', () => {
    expect(pointSetOf([first, second], { kind: 'ideal' }).digest).toBe(sha(CANONICAL))
    const withVapour = `{"format":"ebullio-point-set/1","points":[${FIRST},${SECOND}],"vapor":{"correlation":"tsonopoulos","kind":"virial","poynting":true}}`
    expect(pointSetOf([first, second], VIRIAL).digest).toBe(sha(withVapour))
  })

  it('σP is left out when the point does not give it, so older point sets keep their digest', () => {
    const without = point({ seq: 1, pressureUncertaintyPa: undefined })
    expect(pointSetOf([without]).digest).toBe(sha(`{"format":"ebullio-point-set/1","points":[${FIRST}]}`))
  })

  it('excluding a point, or changing any measured value, changes the digest', () => {
    const base = pointSetOf([first, second]).digest
    expect(pointSetOf([{ ...first, excluded: true }, second]).digest).not.toBe(base)
    expect(pointSetOf([{ ...first, y1Uncertainty: 0.004 }, second]).digest).not.toBe(base)
    expect(pointSetOf([{ ...first, x1Uncertainty: 0.001 }, second]).digest).not.toBe(base)
    expect(pointSetOf([first, { ...second, pressureUncertaintyPa: 151 }]).digest).not.toBe(base)
  })

  it('canonical JSON refuses what has no JSON form', () => {
    expect(() => canonicalJson8785(undefined)).toThrow('Nothing to canonicalise.')
    expect(() => canonicalJson8785({ T: Number.NaN })).toThrow()
  })
})

describe('the current point set', () => {
  beforeEach(() => {
    store.points = [second, first]
    store.dataSet = { id: 'd1', vaporModel: VIRIAL }
  })

  it("reads the stored points with the data set's vapour model", async () => {
    expect(await currentPointSet({} as Db, 'd1')).toEqual(pointSetOf([first, second], VIRIAL))
    store.dataSet = { id: 'd1', vaporModel: { kind: 'ideal' } }
    expect((await currentPointSet({} as Db, 'd1')).digest).toBe(sha(CANONICAL))
  })

  it('a data set that is gone (deleted draft) reads as the ideal gas instead of failing', async () => {
    store.dataSet = undefined
    expect((await currentPointSet({} as Db, 'd1')).digest).toBe(sha(CANONICAL))
  })
})

describe('stale results', () => {
  const runAt = new Date('2026-12-03T14:05:59Z')

  it('a result is stale unless it was computed on the current digest (unknown digests are stale)', () => {
    expect(withStale({ pointSetDigest: 'abc', pointCount: 12, runAt }, 'abc').stale).toBe(false)
    expect(withStale({ pointSetDigest: 'abd', pointCount: 12, runAt }, 'abc').stale).toBe(true)
    expect(withStale({ pointSetDigest: null, pointCount: null, runAt }, 'abc')).toEqual({
      pointSetDigest: null,
      pointCount: null,
      runAt,
      stale: true,
    })
  })

  it('says what a result was computed on, in UTC to the minute', () => {
    expect(computedOn({ pointCount: 12, runAt })).toBe('computed on 12 points on 2026-12-03 14:05 UTC')
    expect(computedOn({ pointCount: 1, runAt })).toBe('computed on 1 point on 2026-12-03 14:05 UTC')
    expect(computedOn({ pointCount: null, runAt })).toBe('computed on an unrecorded point set on 2026-12-03 14:05 UTC')
  })
})

describe('enginePoint', () => {
  it('passes T, P, x1, y1 and the exclusion; σP and the two-liquid flag only when the point has them', () => {
    expect(enginePoint(first)).toEqual({ T: 351.2, P: 101325, x1: 0.25, y1: 0.41, excluded: false })
    expect(enginePoint({ ...second, heterogeneous: true })).toEqual({
      T: 349.9,
      P: 101325,
      x1: 0.5,
      y1: null,
      excluded: true,
      sigmaP: 150,
      heterogeneous: true,
    })
    expect(enginePoint({ ...first, heterogeneous: false })).not.toHaveProperty('heterogeneous')
  })
})
