import { describe, expect, it } from 'vitest'
import { bubbleTemperature } from '../equilibrium/index.js'
import type { BinarySystem, VaporPressureModel } from '../types.js'
import { fitJoint } from './joint-fit.js'

// 1-propanol (1) / water (2): Antoine constants from Smith, Van Ness & Abbott, 7th ed., Table B.2; NRTL b12, b21 and
// α from Table 12.5 (cal/mol × 4.184). The temperature slopes b12T, b21T are invented for the round trip.
const vaporPressure: [VaporPressureModel, VaporPressureModel] = [
  { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
]
const alpha = 0.5081
const truth: BinarySystem = {
  vaporPressure,
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha, b12T: -8, b21T: 12 },
}
/** 30 points at P with a deterministic scatter of about 0.1 K and 0.005 in y; `shiftT` adds a systematic offset. */
function dataSet(P: number, seed: number, shiftT = 0) {
  return Array.from({ length: 30 }, (_, i) => {
    const x1 = 0.02 + (0.96 * i) / 29
    const b = bubbleTemperature(truth, { P, x1 })
    return { T: b.T + shiftT + 0.1 * Math.sin(3.7 * i + seed), P, x1, y1: b.y1 + 0.005 * Math.cos(2.3 * i + seed) }
  })
}

describe('joint fit of several data sets with temperature-dependent NRTL energies', () => {
  const sets = [
    { id: 'A-40kPa', points: dataSet(40000, 1) },
    { id: 'B-1atm', points: dataSet(101325, 2) },
    { id: 'C-250kPa', points: dataSet(250000, 3) },
  ]
  it('recovers b12, b21, b12T and b21T within 3 standard errors (round trip over 40–250 kPa)', () => {
    const fit = fitJoint({ dataSets: sets, vaporPressure, model: 'nrtl', alpha })
    expect(fit.parameters.map((p) => p.name)).toEqual(['b12', 'b21', 'b12T', 'b21T'])
    const want = [500.4 * 4.184, 1636.57 * 4.184, -8, 12]
    fit.parameters.forEach((p, j) => expect(Math.abs(p.value - want[j])).toBeLessThan(3 * p.standardError!))
    expect(fit.covariance).toHaveLength(4)
    for (const d of fit.dataSets) {
      expect(d.n).toBe(30)
      expect(d.rmsT).toBeLessThan(0.12)
      expect(Math.abs(d.biasT)).toBeLessThan(0.05)
    }
    expect(fit.range.Pmin).toBe(40000)
    expect(fit.range.Pmax).toBe(250000)
  })

  it('constant energies cannot follow the temperature dependence: each data set keeps a bias', () => {
    const flat = fitJoint({ dataSets: sets, vaporPressure, model: 'nrtl', alpha, temperatureDependent: false })
    const tdep = fitJoint({ dataSets: sets, vaporPressure, model: 'nrtl', alpha })
    expect(flat.parameters).toHaveLength(2)
    expect(flat.rmsT).toBeGreaterThan(tdep.rmsT)
    expect(flat.aic).toBeGreaterThan(tdep.aic)
  })

  it('a data set read 0.5 K high shows a bias of about +0.5 K (measured − calculated) against the others', () => {
    const fit = fitJoint({
      dataSets: [...sets, { id: 'D-1atm-high', points: dataSet(101325, 4, 0.5) }],
      vaporPressure,
      model: 'nrtl',
      alpha,
    })
    const d = fit.dataSets.find((s) => s.id === 'D-1atm-high')!
    const b = fit.dataSets.find((s) => s.id === 'B-1atm')!
    expect(d.biasT - b.biasT).toBeGreaterThan(0.4)
    expect(d.biasT - b.biasT).toBeLessThan(0.6)
  })

  it('refuses what it cannot fit, naming it', () => {
    expect(() => fitJoint({ dataSets: [sets[0], sets[0]], vaporPressure, model: 'nrtl' })).toThrow(
      'Data set "A-40kPa" is listed twice.',
    )
    expect(() => fitJoint({ dataSets: [], vaporPressure, model: 'nrtl' })).toThrow(
      'A joint fit needs at least one data set.',
    )
  })
})
