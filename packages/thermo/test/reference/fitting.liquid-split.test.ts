import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  findAzeotropes,
  fitBinary,
  liquidLiquidEquilibrium,
  R,
  type BinaryPoint,
  type BinarySystem,
  type VaporPressureModel,
} from '../../src/index.js'
import { b2, CAL, TABLE_12_5 } from './helpers/constants.js'
import { prng } from './helpers/prng.js'

const P = 101325

/** Bubble points of `s` at x1 = i/n (i = 1…n−1) with seeded Gaussian noise σT, σy; two-layer points marked. */
function generated(s: BinarySystem, n: number, sT: number, sY: number, seed: number): BinaryPoint[] {
  const rng = prng(seed)
  return Array.from({ length: n - 1 }, (_, k) => {
    const x1 = (k + 1) / n
    const b = bubbleTemperature(s, { P, x1 })
    return {
      T: b.T + sT * rng.gaussian(),
      P,
      x1,
      y1: b.y1 + sY * rng.gaussian(),
      ...(b.liquidPhases ? { heterogeneous: true } : {}),
    }
  })
}

describe('fitBinary warns when the fitted parameters split a liquid the measurements show as one', () => {
  // Data generated from a Wilson liquid, which cannot split into two liquids (G. M. Wilson, J. Am. Chem. Soc. 86
  // (1964) 127; from memory), strongly non-ideal (γ∞ ≈ 10). Margules, Van Laar and NRTL (α = 0.2) fitted to it
  // predict a false two-liquid region — the known hazard (reference-values §7, common practice, no source).
  const wilson: BinarySystem = {
    vaporPressure: [b2('benzene'), b2('toluene')],
    activity: { kind: 'wilson', a12: 5000, a21: 5000, V1: 90, V2: 100 },
  }
  const points = generated(wilson, 12, 0.1, 0.005, 7)
  for (const model of ['margules', 'van-laar', 'nrtl'] as const) {
    it(`${model}: named warning 'spurious-liquid-split' saying where, consistent with liquidLiquidEquilibrium`, () => {
      const fit = fitBinary({ points, vaporPressure: wilson.vaporPressure, model, alpha: 0.2 })
      const w = fit.namedWarnings!.find((n) => n.code === 'spurious-liquid-split')!
      expect(w).toBeDefined()
      expect(fit.warnings).toContain(w.message)
      const lle = liquidLiquidEquilibrium(fit.system, { T: w.T! })!
      expect(Math.abs(lle.x1I - w.x1I!)).toBeLessThan(1e-9)
      expect(Math.abs(lle.x1II - w.x1II!)).toBeLessThan(1e-9)
      const Ts = points.map((p) => p.T)
      expect(w.T!).toBeGreaterThanOrEqual(Math.min(...Ts))
      expect(w.T!).toBeLessThanOrEqual(Math.max(...Ts))
      expect(w.message).toContain(`between x1 = ${w.x1I!.toFixed(3)} and ${w.x1II!.toFixed(3)}`)
    })
  }
  it('no such warning for a miscible NRTL fit (1-propanol–water, SVNA Table 12.5)', () => {
    const pw = TABLE_12_5.propanolWater
    const s: BinarySystem = {
      vaporPressure: [b2('1-propanol'), b2('water')],
      activity: { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha },
    }
    const fit = fitBinary({
      points: generated(s, 15, 0.1, 0.005, 3),
      vaporPressure: s.vaporPressure,
      model: 'nrtl',
      alpha: pw.alpha,
    })
    expect(fit.namedWarnings).toEqual([])
  })
})

describe('points marked heterogeneous are fitted as three-phase points', () => {
  // Water (1) – 1-butanol (2): ChemSep NRTL parameters as distributed in Python `thermo` 0.6.1; Poling Antoine
  // constants as distributed in `chemicals` 1.5.2 (see equilibrium.water-butanol.test.ts).
  const antoine = (A: number, B: number, C: number): VaporPressureModel => ({
    kind: 'antoine',
    A,
    B,
    C,
    log: 'log10',
    pressureUnit: 'Pa',
    temperatureUnit: 'K',
  })
  const truth: BinarySystem = {
    vaporPressure: [antoine(10.11564, 1687.537, -42.98), antoine(9.6493, 1395.14, -90.411)],
    activity: { kind: 'nrtl', b12: 1325.3268195999854 * R, b21: 253.64181754760426 * R, alpha: 0.4447 },
  }
  const points = generated(truth, 20, 0.05, 0.003, 42)
  it('the generated data hold two-layer points (x_water 0.60–0.95), each at the three-phase T within the noise', () => {
    const het = points.filter((p) => p.heterogeneous)
    expect(het.map((p) => p.x1.toFixed(2))).toEqual(['0.60', '0.65', '0.70', '0.75', '0.80', '0.85', '0.90', '0.95'])
  })
  it('the fit recovers the parameters within 2 standard errors and the three-phase point within 0.05 K', () => {
    const fit = fitBinary({ points, vaporPressure: truth.vaporPressure, model: 'nrtl', alpha: 0.4447 })
    expect(fit.converged).toBe(true)
    const [b12, b21] = fit.parameters
    expect(Math.abs(b12.value - 1325.3268195999854 * R)).toBeLessThan(2 * b12.standardError!)
    expect(Math.abs(b21.value - 253.64181754760426 * R)).toBeLessThan(2 * b21.standardError!)
    expect(fit.namedWarnings).toEqual([])
    const az = findAzeotropes(fit.system, { P }).find((a) => a.kind === 'heterogeneous')!
    expect(Math.abs(az.T - 366.18124504180616)).toBeLessThan(0.05)
    // a two-layer point raised by 1 K has its temperature residual moved by about 1 K (the three-phase T does not
    // depend on the overall composition)
    const i = points.findIndex((p) => p.heterogeneous)
    const raised = points.map((p, k) => (k === i ? { ...p, T: p.T + 1 } : p))
    const again = fitBinary({ points: raised, vaporPressure: truth.vaporPressure, model: 'nrtl', alpha: 0.4447 })
    expect(Math.abs(Math.abs(again.residuals[i].dT! - fit.residuals[i].dT!) - 1)).toBeLessThan(0.15)
  })
  it('fitted as one liquid (not marked), the same data give different parameters and the spurious-split warning', () => {
    const unmarked = points.map(({ heterogeneous: _h, ...p }) => p)
    const fit = fitBinary({ points: unmarked, vaporPressure: truth.vaporPressure, model: 'nrtl', alpha: 0.4447 })
    expect(fit.namedWarnings!.map((w) => w.code)).toEqual(['spurious-liquid-split'])
    expect(Math.abs(fit.parameters[0].value / R - 1325.33)).toBeGreaterThan(100)
  })
  it('a bad heterogeneous flag is refused with a message naming the point', () => {
    const bad = points.map((p, k) => (k === 2 ? { ...p, heterogeneous: 'yes' as unknown as boolean } : p))
    expect(() => fitBinary({ points: bad, vaporPressure: truth.vaporPressure, model: 'nrtl' })).toThrow(
      'Point 3: heterogeneous must be true or false; got yes.',
    )
  })
})
