import { describe, expect, it } from 'vitest'
import {
  bubblePressure,
  bubbleTemperature,
  dewPressure,
  dewTemperature,
  vaporPressure,
  type BinarySystem,
} from '../../src/index.js'
import { EX_10_1 } from './helpers/constants.js'

// Source: Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, 7th ed. (2005),
// Example 10.1, acetonitrile (1) / nitromethane (2), Raoult's law, with the example's own Antoine constants.
// Answers: reference-values.md §3 (M+C) for (a), (b), (d), (e flash); the dew answers (c), (d) are
// from memory and agree with the equations recomputed here (C).
const system: BinarySystem = {
  vaporPressure: [EX_10_1.acetonitrile, EX_10_1.nitromethane],
  activity: { kind: 'ideal' },
}
const K = 273.15

describe('SVNA 7th ed. Example 10.1 (Raoult’s law)', () => {
  it('P1sat, P2sat at 75 °C = 83.21, 41.98 kPa (±0.005 kPa)', () => {
    expect(Math.abs(vaporPressure(EX_10_1.acetonitrile, 75 + K) / 1000 - 83.21)).toBeLessThan(0.005)
    expect(Math.abs(vaporPressure(EX_10_1.nitromethane, 75 + K) / 1000 - 41.98)).toBeLessThan(0.005)
  })
  it('bubble P at 75 °C, x1 = 0.6: P = 66.72 kPa, y1 = 0.7483', () => {
    const r = bubblePressure(system, { T: 75 + K, x1: 0.6 })
    expect(Math.abs(r.P / 1000 - 66.72)).toBeLessThan(0.005)
    expect(Math.abs(r.y1 - 0.7483)).toBeLessThan(0.00005)
  })
  it('dew P at 75 °C, y1 = 0.6: P = 59.74 kPa, x1 = 0.4308 (from memory)', () => {
    const r = dewPressure(system, { T: 75 + K, y1: 0.6 })
    expect(Math.abs(r.P / 1000 - 59.74)).toBeLessThan(0.005)
    expect(Math.abs(r.x1 - 0.4308)).toBeLessThan(0.00005)
  })
  it('bubble T at 70 kPa, x1 = 0.6: t = 76.42 °C, y1 = 0.7472 (±0.0002, the example rounds)', () => {
    const r = bubbleTemperature(system, { P: 70000, x1: 0.6 })
    expect(Math.abs(r.T - K - 76.42)).toBeLessThan(0.005)
    expect(Math.abs(r.y1 - 0.7472)).toBeLessThan(0.0002)
    expect(r.converged).toBe(true)
  })
  it('dew T at 70 kPa, y1 = 0.6: t = 79.58 °C, x1 = 0.4351 (from memory)', () => {
    const r = dewTemperature(system, { P: 70000, y1: 0.6 })
    expect(Math.abs(r.T - K - 79.58)).toBeLessThan(0.005)
    expect(Math.abs(r.x1 - 0.4351)).toBeLessThan(0.00005)
  })
  it('70 kPa and 78 °C: x1 = 0.5156, y1 = 0.6759 (checked as the bubble point of x1 = 0.5156)', () => {
    const r = bubbleTemperature(system, { P: 70000, x1: 0.5156 })
    expect(Math.abs(r.T - K - 78)).toBeLessThan(0.01)
    expect(Math.abs(r.y1 - 0.6759)).toBeLessThan(0.0001)
  })
})
