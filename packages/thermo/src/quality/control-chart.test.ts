import { describe, expect, it } from 'vitest'
import { controlChart } from './control-chart.js'

describe('controlChart', () => {
  it('takes centre and σ from the baseline (sample standard deviation, n − 1)', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, sample SD sqrt(32/7) = 2.138 (hand-computed, common practice, no source)
    const r = controlChart({ values: [2, 4, 4, 4, 5, 5, 7, 9], baselineCount: 8 })
    expect(r.centre).toBe(5)
    expect(r.sigma).toBeCloseTo(Math.sqrt(32 / 7), 12)
    expect(r.limits.upper3).toBeCloseTo(5 + 3 * Math.sqrt(32 / 7), 12)
    expect(r.outOfControl).toEqual([])
  })

  it('flags one result beyond 3σ and nothing else', () => {
    const r = controlChart({ values: [0, 0.1, -0.1, 0.2, -0.2, 5], centre: 0, sigma: 1 })
    expect(r.outOfControl).toEqual([5])
    expect(r.flags[5]).toEqual(['beyond-3-sigma'])
  })

  it('flags 2 of 3 beyond 2σ on the same side, but not on opposite sides', () => {
    const same = controlChart({ values: [0, 2.5, 0.1, 2.4], centre: 0, sigma: 1 })
    expect(same.flags[3]).toContain('2-of-3-beyond-2-sigma')
    const opposite = controlChart({ values: [0, 2.5, 0.1, -2.4], centre: 0, sigma: 1 })
    expect(opposite.outOfControl).toEqual([])
  })

  it('flags 4 of 5 beyond 1σ and 8 in a row on one side', () => {
    const four = controlChart({ values: [1.5, 1.2, 0.2, 1.4, 1.3], centre: 0, sigma: 1 })
    expect(four.flags[4]).toContain('4-of-5-beyond-1-sigma')
    const eight = controlChart({ values: [0.1, 0.2, 0.3, 0.1, 0.2, 0.4, 0.1, 0.3], centre: 0, sigma: 1 })
    expect(eight.flags[7]).toEqual(['8-on-one-side'])
    expect(eight.outOfControl).toEqual([7])
  })

  it('refuses too few results with a clear message', () => {
    expect(() => controlChart({ values: [1] })).toThrow(
      'A control chart needs at least 2 results to set its centre line and limits.',
    )
  })
})
