import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  activityCoefficients,
  bubblePressure,
  bubbleTemperature,
  liquidLiquidEquilibrium,
  vaporPressure,
  ThermoError,
  type ActivityModel,
  type BinarySystem,
} from '../../src/index.js'
import { b2 } from './helpers/constants.js'

// Property tests (fast-check): for random NRTL and Margules liquids, (1) no liquid the engine returns is
// unstable — its tangent-plane distance D(w) = Σ wi·(ln wi + ln γi(w) − ln zi − ln γi(z)) is ≥ −1e-9 at every
// trial composition w of a dense grid — and (2) every returned equilibrium has equal fugacities to 1e-8
// (liquids: xi·γi equal in both layers; vapour: yi·P = xi·γi·Pi_sat). D is computed here from the public
// activityCoefficients, independently of the engine's own stability code.
const TRIAL = (() => {
  const w: number[] = []
  for (let i = 1; i < 2000; i++) w.push(i / 2000)
  for (let k = 4; k <= 12; k++) w.push(10 ** -k, 1 - 10 ** -k)
  return w
})()

function tpdMin(model: ActivityModel, z: number, T: number): number {
  const [g1z, g2z] = activityCoefficients(model, { x1: z, T })
  const m1 = Math.log(z) + Math.log(g1z)
  const m2 = Math.log1p(-z) + Math.log(g2z)
  let min = Infinity
  for (const w of TRIAL) {
    const [g1, g2] = activityCoefficients(model, { x1: w, T })
    const d = w * (Math.log(w) + Math.log(g1) - m1) + (1 - w) * (Math.log1p(-w) + Math.log(g2) - m2)
    if (d < min) min = d
  }
  return min
}

const nrtl = fc.record({
  kind: fc.constant('nrtl' as const),
  b12: fc.double({ min: -3000, max: 16000, noNaN: true }),
  b21: fc.double({ min: -3000, max: 16000, noNaN: true }),
  alpha: fc.double({ min: 0.1, max: 0.5, noNaN: true }),
})
const margules = fc.record({
  kind: fc.constant('margules' as const),
  A12: fc.double({ min: 0, max: 5, noNaN: true }),
  A21: fc.double({ min: 0, max: 5, noNaN: true }),
})
const model: fc.Arbitrary<ActivityModel> = fc.oneof(nrtl, margules)
const x1 = fc.double({ min: 0.001, max: 0.999, noNaN: true })
const T = fc.double({ min: 290, max: 400, noNaN: true })

const systemOf = (activity: ActivityModel): BinarySystem => ({
  vaporPressure: [b2('benzene'), b2('toluene')],
  activity,
})

/** Vapour fugacities yi·P against xi·γi·Pi_sat of one liquid, both components. */
function vapourMatches(s: BinarySystem, T: number, P: number, y1: number, x: number): void {
  const [g1, g2] = activityCoefficients(s.activity, { x1: x, T })
  const p1 = vaporPressure(s.vaporPressure[0], T)
  const p2 = vaporPressure(s.vaporPressure[1], T)
  expect(Math.abs(y1 * P - x * g1 * p1)).toBeLessThanOrEqual(1e-8 * P)
  expect(Math.abs((1 - y1) * P - (1 - x) * g2 * p2)).toBeLessThanOrEqual(1e-8 * P)
}

// Each property checks 150 random cases against a 2,000-point stability scan: allow time on a loaded machine.
describe('properties of returned equilibria (fast-check)', { timeout: 120_000 }, () => {
  it('liquid–liquid: equal activities to 1e-8 and both liquids stable', () => {
    let splits = 0
    fc.assert(
      fc.property(model, T, (m, t) => {
        const lle = liquidLiquidEquilibrium(systemOf(m), { T: t })
        if (!lle) return
        splits++
        expect(lle.x1I).toBeLessThan(lle.x1II)
        const a = (x: number, g: number) => Math.log(x * g)
        const rounding = (4 * Number.EPSILON) / Math.min(lle.x1I, 1 - lle.x1II)
        expect(Math.abs(a(lle.x1I, lle.gammaI[0]) - a(lle.x1II, lle.gammaII[0]))).toBeLessThan(1e-8 + rounding)
        expect(Math.abs(a(1 - lle.x1I, lle.gammaI[1]) - a(1 - lle.x1II, lle.gammaII[1]))).toBeLessThan(1e-8 + rounding)
        expect(tpdMin(m, lle.x1I, t)).toBeGreaterThanOrEqual(-1e-9)
        expect(tpdMin(m, lle.x1II, t)).toBeGreaterThanOrEqual(-1e-9)
      }),
      { numRuns: 150, seed: 20261203 },
    )
    // The property is only worth something if the random liquids do split: about 1 in 7 of them here.
    expect(splits).toBeGreaterThan(10)
  })

  it('bubble pressure: the liquid returned is stable, or two stable layers; fugacities equal to 1e-8', () => {
    let threePhase = 0
    fc.assert(
      fc.property(model, x1, T, (m, x, t) => {
        const s = systemOf(m)
        const b = bubblePressure(s, { T: t, x1: x })
        if (b.liquidPhases) {
          threePhase++
          expect(b.gamma).toBeUndefined()
          for (const xl of b.liquidPhases) {
            expect(tpdMin(m, xl, t)).toBeGreaterThanOrEqual(-1e-9)
            vapourMatches(s, t, b.P, b.y1, xl)
          }
        } else {
          expect(tpdMin(m, x, t)).toBeGreaterThanOrEqual(-1e-9)
          vapourMatches(s, t, b.P, b.y1, x)
        }
      }),
      { numRuns: 150, seed: 7 },
    )
    expect(threePhase).toBeGreaterThan(4)
  })

  it('bubble temperature at 1 atm: the same, at the temperature returned (or a clear refusal)', () => {
    fc.assert(
      fc.property(model, x1, (m, x) => {
        const s = systemOf(m)
        let b
        try {
          b = bubbleTemperature(s, { P: 101325, x1: x })
        } catch (e) {
          // A refusal is allowed (never a wrong number); it must be the engine's typed error.
          expect(e).toBeInstanceOf(ThermoError)
          return
        }
        const phases = b.liquidPhases ?? [x]
        for (const xl of phases) {
          expect(tpdMin(m, xl, b.T)).toBeGreaterThanOrEqual(-1e-9)
          vapourMatches(s, b.T, 101325, b.y1, xl)
        }
      }),
      { numRuns: 150, seed: 11 },
    )
  })
})
