/**
 * Which points the approval record flags as outliers of the recommended fit. Pure unit tests; the repositories are
 * replaced by fakes so that each decision (stale fit, fit of another data set, exclusions) is checked alone.
 * The rule is thermo's (|residual| > 2 × RMS of the included points, or flagged by the fit); the numbers below are
 * worked by hand: RMS of ±0.1 K is 0.1 K, so 0.5 K is beyond 2σ = 0.2 K, while with the 0.5 K point counted
 * the RMS is √((3·0.01 + 0.25)/4) = 0.2646 K and 0.5 K is within 2σ = 0.529 K.
 */
import { beforeEach, describe, expect, it, vi } from 'vitest'
import type { Db } from '../db/index.js'
import type { FitRecord } from '../repositories/fits.repository.js'
import type { PointRecord } from '../repositories/points.repository.js'

const store = vi.hoisted(() => ({
  fit: undefined as unknown,
  points: [] as unknown[],
  digest: 'current',
}))
vi.mock('../repositories/fits.repository.js', () => ({ findFit: async () => store.fit }))
vi.mock('../repositories/points.repository.js', () => ({ listPoints: async () => store.points }))
vi.mock('./point-set.js', () => ({ currentPointSet: async () => ({ digest: store.digest, included: 0 }) }))

const { fitOutliers, OUTLIER_RULE, signedOutliers } = await import('./outliers.js')

const db = {} as Db

const point = (id: string, excluded = false) =>
  ({ id, dataSetId: 'd1', sampleLabel: `S-${id}`, excluded }) as unknown as PointRecord

function fit(residuals: Record<string, unknown>[], over: Partial<FitRecord> = {}): FitRecord {
  return {
    id: 'f1',
    dataSetId: 'd1',
    model: 'wilson',
    residuals,
    pointSetDigest: 'current',
    ...over,
  } as FitRecord
}

/** Three included points at ±0.1 K and p4 at 0.5 K. */
const residuals = [
  { pointId: 'p1', dT: 0.1, dy: 0.001 },
  { pointId: 'p2', dT: -0.1, dy: -0.001 },
  { pointId: 'p3', dT: 0.1, dy: 0.001 },
  { pointId: 'p4', dT: 0.5, dy: 0.001 },
]

describe('fitOutliers', () => {
  it('judges against the RMS of the included points only: an excluded point does not widen the band', () => {
    const points = [point('p1'), point('p2'), point('p3'), point('p4', true)]
    expect(fitOutliers(fit(residuals), points, 'current')).toEqual(['p4'])
    // with p4 counted it is within 2 × RMS: nothing is flagged
    const included = [point('p1'), point('p2'), point('p3'), point('p4')]
    expect(fitOutliers(fit(residuals), included, 'current')).toEqual([])
  })

  it("keeps the fit's own flag, and skips residuals without a point id", () => {
    const points = [point('p1'), point('p2'), point('p3')]
    const flaggedByFit = [{ pointId: 'p1', dT: 0.1, flagged: true }, { pointId: 'p2', dT: -0.1 }, { dT: 9 }]
    expect(fitOutliers(fit(flaggedByFit), points, 'current')).toEqual(['p1'])
  })

  it('reads ΔP and Δy1 as stored (p4 excluded: the RMS is that of ±0.001 and ±10 Pa)', () => {
    const points = [point('p1'), point('p2'), point('p3'), point('p4', true)]
    const dy = [
      { pointId: 'p1', dy: 0.001 },
      { pointId: 'p2', dy: -0.001 },
      { pointId: 'p3', dy: 0.001 },
    ]
    expect(fitOutliers(fit([...dy, { pointId: 'p4', dy: 0.05 }]), points, 'current')).toEqual(['p4'])
    const dP = [
      { pointId: 'p1', dP: 10 },
      { pointId: 'p2', dP: -10 },
      { pointId: 'p3', dP: 10 },
    ]
    expect(fitOutliers(fit([...dP, { pointId: 'p4', dP: 500 }]), points, 'current')).toEqual(['p4'])
  })

  it('gives no flags (null) for a fit computed on other points', () => {
    const points = [point('p1'), point('p2'), point('p3'), point('p4', true)]
    expect(fitOutliers(fit(residuals, { pointSetDigest: 'older' }), points, 'current')).toBeNull()
    expect(fitOutliers(fit(residuals, { pointSetDigest: null }), points, 'current')).toBeNull()
  })
})

describe('signedOutliers (what an approval stores)', () => {
  beforeEach(() => {
    store.fit = fit(residuals)
    store.points = [point('p1'), point('p2'), point('p3'), point('p4', true)]
    store.digest = 'current'
  })

  it('the recommended fit on the current points: its flags with their sample labels and the rule', async () => {
    expect(await signedOutliers(db, 'd1', 'f1')).toEqual({
      fitId: 'f1',
      model: 'wilson',
      pointIds: ['p4'],
      sampleLabels: ['S-p4'],
      rule: OUTLIER_RULE,
    })
  })

  it('a flagged point no longer among the points keeps its id as the label', async () => {
    store.points = [point('p1'), point('p2'), point('p3')]
    store.fit = fit([...residuals.slice(0, 3), { pointId: 'gone', dT: 0, flagged: true }])
    expect((await signedOutliers(db, 'd1', 'f1'))?.sampleLabels).toEqual(['gone'])
  })

  it('nothing without a recommended fit, for a missing fit, a fit of another data set or a stale fit', async () => {
    expect(await signedOutliers(db, 'd1', null)).toBeNull()
    store.fit = undefined
    expect(await signedOutliers(db, 'd1', 'f1')).toBeNull()
    store.fit = fit(residuals, { dataSetId: 'd2' })
    expect(await signedOutliers(db, 'd1', 'f1')).toBeNull()
    store.fit = fit(residuals)
    store.digest = 'changed'
    expect(await signedOutliers(db, 'd1', 'f1')).toBeNull()
  })
})
