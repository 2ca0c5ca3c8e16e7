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
  it('judges |Δy₁| against its own RMS, independently of ΔT', () => {
    // Δy RMS over a..e = sqrt(4·0.001² + 0.01²)/√5 = 0.004561; 2σ = 0.009121, so e (0.01) is beyond; ΔT is quiet.
    const r = ['a', 'b', 'c', 'd'].map((pointId, i) => ({ pointId, dT: 0.1, dy: i % 2 ? 0.001 : -0.001 }))
    expect(outlierPointIds([...r, { pointId: 'e', dT: 0.1, dy: -0.01 }])).toEqual(['e'])
  })
  it('judges |ΔP| (fits on measured pressures) against its own RMS, in Pa, independently of Δy₁', () => {
    // ΔP RMS over a..e = sqrt(4·50² + 400²)/√5 = 186.8 Pa; 2σ = 373.6 Pa, so e (400 Pa) is beyond; Δy₁ is quiet.
    const r = ['a', 'b', 'c', 'd'].map((pointId, i) => ({ pointId, dP: i % 2 ? 50 : -50, dy: 0.001 }))
    const all = [...r, { pointId: 'e', dP: 400, dy: 0.001 }]
    expect(rootMeanSquare(all.map((x) => x.dP))).toBeCloseTo(Math.sqrt((4 * 2500 + 160000) / 5), 9)
    expect(outlierPointIds(all)).toEqual(['e'])
    // with four points at ±50 Pa, e is beyond 2σ exactly when e² > 4·(4·50² + e²)/5, i.e. |e| > 200 Pa
    expect(outlierPointIds([...r, { pointId: 'e', dP: 190, dy: 0.001 }])).toEqual([]) // 2σ = 192.1 Pa
    expect(outlierPointIds([...r, { pointId: 'e', dP: -210, dy: 0.001 }])).toEqual(['e']) // 2σ = 208.1 Pa
  })
  it('is strict at exactly 2σ, and a non-finite residual neither counts in the RMS nor hides the others', () => {
    // ΔT = 2, 0, 0, 0: RMS = 1 exactly, so 2 is not above 2σ
    const edge = [2, 0, 0, 0].map((dT, i) => ({ pointId: `p${i}`, dT }))
    expect(outlierPointIds(edge)).toEqual([])
    // one NaN among them: the RMS still comes from the seven finite values (1.138) and 3, above 2σ, is flagged
    const withNaN = [0.1, -0.1, 0.1, -0.1, 0.1, -0.1, Number.NaN, 3].map((dT, i) => ({ pointId: `q${i}`, dT }))
    expect(rootMeanSquare(withNaN.map((x) => x.dT))).toBeCloseTo(Math.sqrt((6 * 0.01 + 9) / 7), 12)
    expect(outlierPointIds(withNaN)).toEqual(['q7'])
  })
  it('flags nothing on a residual when no included point has one, even if an excluded point does', () => {
    expect(
      outlierPointIds([
        { pointId: 'a', dT: 0.1 },
        { pointId: 'b', dT: 0.1 },
        { pointId: 'x', dy: 0.5, excluded: true },
      ]),
    ).toEqual([])
  })
})
