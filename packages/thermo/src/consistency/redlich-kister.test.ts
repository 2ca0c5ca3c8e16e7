import { describe, expect, it } from 'vitest'
import { bubblePressure } from '../equilibrium/index.js'
import type { BinarySystem } from '../types.js'
import { heringtonAreaTest } from './herington.js'
import { redlichKisterAreaTest } from './redlich-kister.js'

// 1-propanol (1) / water (2): NRTL and Antoine constants from Smith, Van Ness & Abbott, 7th ed., Tables 12.5
// and B.2 (cal/mol × 4.184 = J/mol).
const system: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha: 0.5081 },
}
const xs = [0.02, 0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95, 0.98]
const isothermal = (T: number, shiftY = 0) =>
  xs.map((x1) => {
    const b = bubblePressure(system, { T, x1 })
    return { T, P: b.P, x1, y1: Math.min(0.999, b.y1 + shiftY) }
  })

describe('Redlich–Kister area test (isothermal data)', () => {
  it('symmetric Margules data integrate to zero exactly: ln(γ1/γ2) = A(1 − 2x1) (closed form)', () => {
    const A = 1.2
    const psat = 50000
    const flat: BinarySystem = {
      vaporPressure: [
        { kind: 'antoine', A: Math.log(psat), B: 0, C: 0, log: 'ln', pressureUnit: 'Pa', temperatureUnit: 'K' },
        { kind: 'antoine', A: Math.log(psat), B: 0, C: 0, log: 'ln', pressureUnit: 'Pa', temperatureUnit: 'K' },
      ],
      activity: { kind: 'margules', A12: A, A21: A },
    }
    const pts = [0.1, 0.3, 0.5, 0.7, 0.9].map((x1) => {
      const b = bubblePressure(flat, { T: 350, x1 })
      return { T: 350, P: b.P, x1, y1: b.y1 }
    })
    const r = redlichKisterAreaTest(pts, { vaporPressure: flat.vaporPressure })
    expect(r.D).toBeLessThan(1e-9)
    for (const p of r.integrand) expect(p.lnGammaRatio).toBeCloseTo(A * (1 - 2 * p.x1), 10)
  })

  it('data generated from a Gibbs–Duhem-consistent model pass; the same data with y raised by 0.03 fail', () => {
    const good = redlichKisterAreaTest(isothermal(360), { vaporPressure: system.vaporPressure })
    expect(good.test).toBe('redlich-kister')
    expect(good.passed).toBe(true)
    expect(good.D).toBeLessThan(5)
    expect(good.warnings).toEqual([])
    const bad = redlichKisterAreaTest(isothermal(360, 0.03), { vaporPressure: system.vaporPressure })
    expect(bad.passed).toBe(false)
    expect(bad.D).toBeGreaterThan(10)
  })

  it('says which test ran and warns when the data are not isothermal', () => {
    const pts = isothermal(360).map((p, i) => ({ ...p, T: p.T + (i % 2 ? 1 : 0) }))
    const r = redlichKisterAreaTest(pts, { vaporPressure: system.vaporPressure })
    expect(r.warnings).toEqual([
      'The temperatures differ by more than 0.5 K; the Redlich–Kister area test is meant for isothermal data.',
    ])
    expect(heringtonAreaTest(isothermal(360), { vaporPressure: system.vaporPressure }).test).toBe('herington')
  })

  it('needs three mixture points', () => {
    expect(() => redlichKisterAreaTest(isothermal(360).slice(0, 2), { vaporPressure: system.vaporPressure })).toThrow(
      'The area test needs at least 3 mixture points with 0 < x1 < 1 and 0 < y1 < 1; got 2.',
    )
  })
})
