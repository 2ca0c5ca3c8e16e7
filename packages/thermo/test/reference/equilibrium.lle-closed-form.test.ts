import { describe, expect, it } from 'vitest'
import {
  bubblePressure,
  bubbleTemperature,
  dewPressure,
  dewTemperature,
  findAzeotropes,
  liquidLiquidEquilibrium,
  phaseDiagram,
  ThermoError,
  type BinarySystem,
} from '../../src/index.js'
import { minimumThermodynamicFactor } from '../../src/equilibrium/stability.js'
import { b2 } from './helpers/constants.js'

// Closed forms for the symmetric (one-parameter) Margules liquid, gE/RT = A·x1·x2 (reference-values §7, C):
// binodal ln(x/(1 − x)) = A·(2x − 1); critical solution point A = 2 at x = 0.5; spinodal x(1 − x) = 1/(2A).
// For A = 2.5: binodal 0.1448 / 0.8552, spinodal 0.2764 / 0.7236 (closed form, reference-values §7).
const margules = (A: number): BinarySystem => ({
  vaporPressure: [b2('benzene'), b2('toluene')],
  activity: { kind: 'margules', A12: A, A21: A },
})

function binodal(A: number): number {
  let lo = 1e-300
  let hi = 0.5 - 1e-12
  for (let i = 0; i < 400; i++) {
    const m = 0.5 * (lo + hi)
    if (Math.log(m / (1 - m)) - A * (2 * m - 1) > 0) hi = m
    else lo = m
  }
  return 0.5 * (lo + hi)
}

describe('symmetric Margules: closed-form binodal, critical point and spinodal', () => {
  it('A = 2.5 gives the tabulated binodal 0.1448 / 0.8552', () => {
    const lle = liquidLiquidEquilibrium(margules(2.5), { T: 300 })!
    expect(lle.x1I).toBeCloseTo(0.1448, 4)
    expect(lle.x1II).toBeCloseTo(0.8552, 4)
  })
  for (const A of [2.05, 2.5, 3, 5, 10, 20]) {
    it(`A = ${A}: the binodal solves ln(x/(1 − x)) = A(2x − 1) to 1e-9`, () => {
      const lle = liquidLiquidEquilibrium(margules(A), { T: 350 })!
      const x = binodal(A)
      expect(Math.abs(lle.x1I - x)).toBeLessThan(1e-9 + 1e-7 * x)
      expect(Math.abs(lle.x1II - (1 - x))).toBeLessThan(1e-9 + 1e-7 * x)
      // equal activities: x·γ in both liquids. x2 = 1 − x1II of a nearly pure liquid is only known to
      // 2.2e-16/x2 relative once x1II is rounded to a double; that representation limit is added.
      const rounding = (4 * Number.EPSILON) / (1 - lle.x1II)
      expect(Math.abs(Math.log((lle.x1I * lle.gammaI[0]) / (lle.x1II * lle.gammaII[0])))).toBeLessThan(1e-10)
      expect(Math.abs(Math.log(((1 - lle.x1I) * lle.gammaI[1]) / ((1 - lle.x1II) * lle.gammaII[1])))).toBeLessThan(
        1e-10 + rounding,
      )
    })
  }
  it('no split at or below the critical A = 2; a split just above it', () => {
    expect(liquidLiquidEquilibrium(margules(1.9), { T: 300 })).toBeNull()
    expect(liquidLiquidEquilibrium(margules(2), { T: 300 })).toBeNull()
    const just = liquidLiquidEquilibrium(margules(2.1), { T: 300 })!
    expect(just.x1I).toBeCloseTo(binodal(2.1), 8)
  })
  it('the smallest thermodynamic factor is 1 − A/2 (spinodal where 2A·x(1 − x) = 1)', () => {
    for (const A of [1, 2.5, 4]) {
      expect(minimumThermodynamicFactor({ kind: 'margules', A12: A, A21: A }, 300)).toBeCloseTo(1 - A / 2, 6)
    }
  })
  it('isothermal: a liquid inside the gap gives the three-phase pressure; the diagram meets the tie line', () => {
    const s = margules(2.5)
    const T = 360
    const inside = bubblePressure(s, { T, x1: 0.5 })
    const edge = bubblePressure(s, { T, x1: binodal(2.5) })
    expect(inside.liquidPhases![0]).toBeCloseTo(binodal(2.5), 9)
    expect(inside.P).toBeCloseTo(edge.P, 3)
    expect(inside.gammaPhases).toHaveLength(2)
    const d = phaseDiagram(s, { T }, { points: 51, lle: true })
    if (d.kind !== 'isothermal') throw new Error('isothermal expected')
    expect(d.threePhase!.P).toBeCloseTo(edge.P, 3)
    expect(d.x1.every((x) => x <= d.threePhase!.x1I || x >= d.threePhase!.x1II)).toBe(true)
    expect(d.lle!.x1I[0]).toBe(d.threePhase!.x1I)
    // the vapour at exactly the three-phase composition first condenses as two layers at P3
    const dew = dewPressure(s, { T, y1: d.threePhase!.y1 })
    expect(dew.liquidPhases).toBeDefined()
    expect(dew.P).toBeCloseTo(d.threePhase!.P, 3)
  })
  it('benzene–toluene vapour pressures with A = 3: heterogeneous azeotrope found, no false homogeneous one', () => {
    const az = findAzeotropes(margules(3), { P: 101325 })
    expect(az.map((a) => a.kind)).toEqual(['heterogeneous'])
    expect(az[0].liquidPhases![0]).toBeCloseTo(binodal(3), 8)
  })
  it('dew points on either side of the three-phase vapour have stable liquids outside the binodal', () => {
    const s = margules(3)
    const az = findAzeotropes(s, { P: 101325 })[0]
    for (const y1 of [0.05, 0.2, az.x1 - 0.01, az.x1 + 0.01, 0.9, 0.99]) {
      const d = dewTemperature(s, { P: 101325, y1 })
      expect(d.x1 <= az.liquidPhases![0] + 1e-9 || d.x1 >= az.liquidPhases![1] - 1e-9).toBe(true)
      expect(d.T).toBeGreaterThanOrEqual(az.T - 1e-9)
    }
  })
})

describe('vapour pressure outside its domain: every function refuses with out-of-domain', () => {
  // SVNA Table B.2 Antoine constants are in °C with C ≈ 217–231: at 30 K, T + C < 0.
  const system: BinarySystem = { vaporPressure: [b2('benzene'), b2('toluene')], activity: { kind: 'ideal' } }
  const message =
    'benzene: the vapour-pressure equation has no value at 30 K (-243.15 °C): T + C is zero or negative there.'
  const named = { ...system, names: ['benzene', 'toluene'] as [string, string] }
  const calls: [string, () => unknown][] = [
    ['bubblePressure', () => bubblePressure(named, { T: 30, x1: 0.5 })],
    ['dewPressure', () => dewPressure(named, { T: 30, y1: 0.5 })],
    ['phaseDiagram at T', () => phaseDiagram(named, { T: 30 })],
    ['findAzeotropes at T', () => findAzeotropes(named, { T: 30 })],
  ]
  for (const [name, call] of calls) {
    it(name, () => {
      expect(call).toThrow(ThermoError)
      try {
        call()
      } catch (e) {
        expect((e as ThermoError).code).toBe('out-of-domain')
        expect((e as Error).message).toBe(message)
      }
    })
  }
  it('a bubble temperature never lands outside the domain (the solver brackets T + C > 0)', () => {
    const b = bubbleTemperature(system, { P: 1, x1: 0.5 })
    expect(b.T + (217.572 - 273.15)).toBeGreaterThan(0)
  })
})
