import { describe, expect, it } from 'vitest'
import { bubbleTemperature } from '../equilibrium/index.js'
import type { BinarySystem } from '../types.js'
import { heringtonAreaTest } from './herington.js'
import { pointTest } from './point-test.js'

// 1-propanol (1) / water (2): NRTL and Antoine from Smith, Van Ness & Abbott, 7th ed., Tables 12.5 and B.2.
const system: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha: 0.5081 },
}
const points = [0.05, 0.1, 0.2, 0.4, 0.6, 0.8, 0.9].map((x1) => {
  const b = bubbleTemperature(system, { P: 101325, x1 })
  return { T: b.T, P: 101325, x1, y1: b.y1 }
})
// A two-layer sample: its overall x1 is not one liquid's composition, so its y1 would read as a gross outlier.
const twoLayer = { T: 360, P: 101325, x1: 0.5, y1: 0.1, heterogeneous: true }

describe('consistency tests leave two-layer points out and say so', () => {
  it('the area test gives the same D as without the point, with a warning', () => {
    const without = heringtonAreaTest(points, { vaporPressure: system.vaporPressure })
    const withIt = heringtonAreaTest([...points, twoLayer], { vaporPressure: system.vaporPressure })
    expect(withIt.D).toBeCloseTo(without.D, 12)
    expect(withIt.warnings[0]).toBe(
      '1 two-layer point was left out: the test needs the composition of one liquid, and a two-layer sample has two.',
    )
  })
  it('the point test does not judge it', () => {
    const r = pointTest([...points, twoLayer], { vaporPressure: system.vaporPressure, model: 'nrtl', alpha: 0.5081 })
    expect(Number.isNaN(r.residuals[points.length].dy)).toBe(true)
    expect(r.passed).toBe(true)
    expect(r.warnings[0]).toContain('two-layer point was left out')
  })
})
