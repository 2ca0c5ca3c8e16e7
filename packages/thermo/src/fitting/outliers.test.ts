import { describe, expect, it } from 'vitest'
import { outlierPointIds, rootMeanSquare } from './outliers.js'

// The ±2σ rule: common practice, no source. Hand-computed cases.
describe('outlierPointIds', () => {
  it('flags |ΔT| above 2 × RMS of the included points, and the fit’s own flags', () => {
    // RMS of ΔT over a..e = sqrt((4·0.01 + 1)/5) = 0.4561; 2σ = 0.9121, so only e (1.0) is beyond.
    const r = [
      { pointId: 'a', dT: 0.1, dy: 0 },
      { pointId: 'b', dT: -0.1, dy: 0 },
      { pointId: 'c', dT: 0.1, dy: 0 },
      { pointId: 'd', dT: -0.1, dy: 0, flagged: true },
      { pointId: 'e', dT: 1.0, dy: 0 },
    ]
    expect(rootMeanSquare(r.map((x) => x.dT))).toBeCloseTo(0.4561, 4)
    expect(outlierPointIds(r)).toEqual(['d', 'e'])
  })
  it('excluded points do not widen the band but are still judged', () => {
    const r = [
      { pointId: 'a', dT: 0.1 },
      { pointId: 'b', dT: -0.1 },
      { pointId: 'c', dT: 0.1 },
      { pointId: 'x', dT: 5, excluded: true },
    ]
    expect(outlierPointIds(r)).toEqual(['x'])
  })
  it('no finite residual, no flag', () => {
    expect(outlierPointIds([{ pointId: 'a', dT: null, dy: Number.NaN }])).toEqual([])
  })
})
