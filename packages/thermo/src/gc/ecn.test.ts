import { describe, expect, it } from 'vitest'
import { detectorWarnings, ecnResponseFactor, effectiveCarbonNumber } from './ecn.js'

describe('ecnResponseFactor', () => {
  it('adds group contributions (Scanlon & Willis 1985, Table I, from memory)', () => {
    expect(effectiveCarbonNumber({ name: 'ethanol', groups: { aliphaticC: 2, primaryAlcoholO: 1 } })).toBeCloseTo(
      1.5,
      12,
    )
    expect(effectiveCarbonNumber({ name: 'acetone', groups: { aliphaticC: 2, carbonylC: 1 } })).toBeCloseTo(2, 12)
  })

  it('estimates k = ECN1/ECN2 for two FID-visible components', () => {
    const r = ecnResponseFactor({
      detector: 'FID',
      components: [
        { name: 'benzene', groups: { aromaticC: 6 } },
        { name: 'toluene', groups: { aromaticC: 6, aliphaticC: 1 } },
      ],
    })
    expect(r.k).toBeCloseTo(6 / 7, 12)
    expect(r.warnings).toEqual([])
  })

  it('refuses a factor and warns when an FID cannot see water', () => {
    const r = ecnResponseFactor({
      detector: 'FID',
      components: [{ name: 'ethanol', groups: { aliphaticC: 2, primaryAlcoholO: 1 } }, { name: 'Water' }],
    })
    expect(r.k).toBeNull()
    expect(r.warnings).toEqual([
      'An FID barely responds to water: measure Water with a TCD, or take it by difference from the other component.',
    ])
  })

  it('warns for a component with almost no carbon response, and not for a TCD', () => {
    expect(detectorWarnings('FID', [{ name: 'formic acid', ecn: 0 }])).toEqual([
      'An FID barely responds to formic acid (effective carbon number 0.00): use a TCD or another detector for it.',
    ])
    expect(detectorWarnings('TCD', [{ name: 'water' }])).toEqual([])
  })

  it('applies to an FID only', () => {
    expect(() =>
      ecnResponseFactor({
        detector: 'TCD',
        components: [
          { name: 'a', ecn: 1 },
          { name: 'b', ecn: 2 },
        ],
      }),
    ).toThrow(
      'Effective carbon numbers estimate FID responses only; a TCD needs response factors measured on standards.',
    )
  })
})
