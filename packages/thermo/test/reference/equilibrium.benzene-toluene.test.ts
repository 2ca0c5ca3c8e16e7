import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  phaseDiagram,
  relativeVolatility,
  findAzeotrope,
  type BinarySystem,
} from '../../src/index.js'
import { b2 } from './helpers/constants.js'

// Trade fact (common practice, no source): an equimolar benzene–toluene liquid at 1 atm boils near 92 °C
// and its first vapour holds roughly 70–75 % benzene (ideal solution). Constants: SVNA Table B.2
// (benzene S, toluene M). Relative volatility of about 2.3–2.7 over the range (about 2.5 on average): common practice, no source.
const system: BinarySystem = {
  vaporPressure: [b2('benzene'), b2('toluene')],
  activity: { kind: 'ideal' },
  names: ['benzene', 'toluene'],
}

describe('benzene–toluene at 1 atm (ideal solution)', () => {
  it('equimolar liquid boils near 92 °C with a first vapour of 70–75 % benzene', () => {
    const r = bubbleTemperature(system, { P: 101325, x1: 0.5 })
    expect(r.T - 273.15).toBeGreaterThan(91)
    expect(r.T - 273.15).toBeLessThan(93)
    expect(r.y1).toBeGreaterThan(0.7)
    expect(r.y1).toBeLessThan(0.75)
  })
  it('relative volatility lies between 2.3 and 2.7 and there is no azeotrope', () => {
    for (const x1 of [0, 0.25, 0.5, 0.75, 1]) {
      const { alpha } = relativeVolatility(system, { P: 101325, x1 })
      expect(alpha).toBeGreaterThan(2.3)
      expect(alpha).toBeLessThan(2.7)
    }
    expect(findAzeotrope(system, { P: 101325 })).toBeNull()
  })
  it('the T–x–y diagram runs from toluene’s to benzene’s boiling point, ends included', () => {
    const d = phaseDiagram(system, { P: 101325 })
    if (d.kind !== 'isobaric') throw new Error('expected isobaric')
    expect(d.x1.length).toBe(101)
    expect([d.x1[0], d.y1[0], d.x1[100], d.y1[100]]).toEqual([0, 0, 1, 1])
    expect(Math.abs(d.T[0] - 273.15 - 110.6)).toBeLessThan(0.01)
    expect(Math.abs(d.T[100] - 273.15 - 80.0)).toBeLessThan(0.01)
    for (let i = 1; i < d.T.length; i++) expect(d.T[i]).toBeLessThan(d.T[i - 1])
  })
})
