import { describe, expect, it } from 'vitest'
import { simpleBatchDistillation } from '../batch/index.js'
import type { BinarySystem } from '../types.js'

// Antoine constants with their ranges: Smith, Van Ness & Abbott, Table B.2 (ln kPa, °C).
const system: BinarySystem = {
  vaporPressure: [
    {
      kind: 'antoine',
      A: 14.3145,
      B: 2756.22,
      C: 228.06,
      log: 'ln',
      pressureUnit: 'kPa',
      temperatureUnit: 'C',
      range: [-26, 77],
    },
    {
      kind: 'antoine',
      A: 16.5785,
      B: 3638.27,
      C: 239.5,
      log: 'ln',
      pressureUnit: 'kPa',
      temperatureUnit: 'C',
      range: [-11, 83],
    },
  ],
  activity: { kind: 'ideal' },
  names: ['acetone', 'methanol'],
}

describe('range warnings of tabulated equilibrium', () => {
  it('says once per component that a curve leaves its vapour-pressure range', () => {
    // At 300 kPa both liquids boil above their correlation ranges.
    const r = simpleBatchDistillation(
      { system, P: 300_000 },
      { charge: { moles: 100, x1: 0.5 }, until: { potMoles: 50 } },
    )
    const range = r.warnings.filter((w) => w.includes('vapour-pressure correlation'))
    expect(range).toHaveLength(2)
    expect(range[0]).toMatch(/^acetone: temperatures from/)
  })
})
