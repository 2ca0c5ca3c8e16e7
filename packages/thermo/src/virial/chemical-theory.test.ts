import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { bubblePressure, bubbleTemperature } from '../equilibrium/index.js'
import { activityCoefficients } from '../index.js'
import { fitBinary } from '../fitting/index.js'
import { R } from '../types.js'
import { lnPhiChemical, pureMonomerFraction, solveSpecies } from './chemical-theory.js'
import {
  bubblePressureGammaPhi,
  bubbleTemperatureGammaPhi,
  dewTemperatureGammaPhi,
  secondVirialCoefficients,
  secondVirialHaydenOConnell,
  vaporCorrection,
  vaporSpeciation,
  virialValidityWarnings,
  type VaporModel,
  type VirialComponent,
} from './index.js'
import { aceticAcid, acidWaterLiquid, acidWaterVapour, water } from './acid-water.fixture.js'

const benzene: VirialComponent = { Tc: 562.02, Pc: 4907277, omega: 0.211, Vc: 256.34, RD: 3.004 }
const acidWater = acidWaterVapour
const pureAcid: VaporModel = {
  kind: 'virial',
  correlation: 'hayden-oconnell',
  components: [aceticAcid, { ...aceticAcid }],
  eta12: 4.5,
}
const system = acidWaterLiquid
const psat = (T: number): [number, number] => [
  133.322387415 * 10 ** (7.38782 - 1533.313 / (T - 273.15 + 222.309)),
  1000 * Math.exp(16.3872 - 3885.7 / (T - 273.15 + 230.17)),
]

describe('pure acetic-acid vapour by the chemical theory', () => {
  // Marek & Standart, Collect. Czech. Chem. Commun. 19 (1954) 1074 (from memory):
  // log10(K/mmHg⁻¹) = −10.4205 + 3166/T, the dimerisation constant used in hayden-oconnell.test.ts.
  const T = 391.05 // normal boiling point, 117.9 °C (from memory)
  const P = 101325
  const Kms = 10 ** (-10.4205 + 3166 / T) / 133.322368 // 1/Pa
  const zMs = (-1 + Math.sqrt(1 + 4 * Kms * P)) / (2 * Kms * P) // the closed form as usually written

  it('the closed form z_M = (−1 + √(1 + 4KP))/(2KP) at the Marek–Standart K: 59 % dimers (computed 0.5938)', () => {
    expect(pureMonomerFraction(Kms * P)).toBeCloseTo(zMs, 14)
    expect(1 - zMs).toBeCloseTo(0.5938, 3)
    // the same by the binary solver with the acid on either side
    const out = new Float64Array(5)
    solveSpecies(Kms * P, 0, 0, 1, out)
    expect(out[0]).toBe(pureMonomerFraction(Kms * P))
    expect(out[0] + out[2]).toBeCloseTo(1, 15)
    solveSpecies(0, Kms * P, 0, 0, out)
    expect(out[1]).toBe(pureMonomerFraction(Kms * P))
  })

  it('HOC at the normal boiling point: K within 4 % of Marek–Standart, dimers 58.9 % (0.5 % off), M_app 95.4 g/mol', () => {
    const s = vaporSpeciation(pureAcid, T, P, 1)
    // K11 = −B^D/RT with B^D = metastable + bound + chemical of HOC
    const b = secondVirialHaydenOConnell(T, aceticAcid)
    expect(s.K.K11).toBeCloseTo((-1e-6 * (b.metastableBound + b.chemical)) / (R * T), 15)
    expect(s.freeB.B11).toBeCloseTo(b.free, 9)
    expect(Math.abs(s.K.K11 / Kms - 1)).toBeLessThan(0.04) // computed −3.2 %
    const dimers = s.z.d11 + s.z.d12 + s.z.d22
    expect(dimers).toBeCloseTo(0.589, 3)
    expect(Math.abs(dimers - (1 - zMs))).toBeLessThan(0.01)
    // apparent molar mass: M·(1 + zD), M = 60.052 g/mol; with the Marek–Standart K 95.71 g/mol
    expect(60.052 * s.association).toBeCloseTo(95.42, 1)
    expect(Math.abs(60.052 * s.association - 60.052 * (2 - zMs))).toBeLessThan(0.6)
  })

  it('a pure acid boils exactly at its vapour pressure (φ̂ = φ_sat at y = 1, P = P_sat)', () => {
    for (const Tb of [330, 391.05, 420]) {
      const r = bubblePressureGammaPhi(system, { T: Tb, x1: 1 }, acidWater)
      expect(r.P / psat(Tb)[0]).toBeCloseTo(1, 12)
      expect(r.Phi[0]).toBeCloseTo(1, 12)
      // and φ itself is far from 1: the vapour is mostly dimers (0.41 at 1 atm, 391 K)
      if (Tb === 391.05) expect(r.phi[0]).toBeCloseTo(0.411, 3)
    }
    const t = bubbleTemperatureGammaPhi(system, { P: 101325, x1: 1 }, acidWater)
    expect(psat(t.T)[0]).toBeCloseTo(101325, 6)
  })
})

describe('chemical theory: limits and invariants', () => {
  const s = new Float64Array(6)
  const out = new Float64Array(2)

  it('K → 0 gives the truncated virial equation with the free B (SVNA 7th ed. eq. 11.63–11.64; from memory)', () => {
    // B^F (m³/mol) 11, 22, 12 chosen freely; every K = 0
    s.set([-8e-4, -3e-4, -1e-3, 0, 0, 0])
    const T = 350
    const P = 2e5
    for (const y1 of [0, 0.3, 0.8, 1]) {
      lnPhiChemical(s, T, P, y1, out, 0)
      const d12 = 2 * s[2] - s[0] - s[1]
      expect(out[0]).toBeCloseTo((P * (s[0] + (1 - y1) ** 2 * d12)) / (R * T), 14)
      expect(out[1]).toBeCloseTo((P * (s[1] + y1 ** 2 * d12)) / (R * T), 14)
    }
    // a small K moves ln φ̂1 at first order by Σ kij·yi·yj − (2k11·y1 + k12·y2), kij = Kij·P (the expansion of
    // ln[(1 + zD)/(1 + 2k11z1 + k12z2)]): all K = 1e-12 1/Pa at 2 bar, y1 = 0.3 → (0.79 − 1.3)·2e-7 = −1.02e-7
    s[3] = s[4] = s[5] = 1e-12
    lnPhiChemical(s, T, P, 0.3, out, 0)
    const d12 = 2 * s[2] - s[0] - s[1]
    expect(out[0] - (P * (s[0] + 0.49 * d12)) / (R * T)).toBeCloseTo(-1.02e-7, 12)
  })

  it('Gibbs–Duhem: y1·∂ln φ̂1/∂y1 + y2·∂ln φ̂2/∂y1 = 0 at fixed T, P (acid–water, acid–benzene; numerically)', () => {
    // common practice, no source: the residual of a consistent model is at the level of the differencing error
    const acidBenzene: VaporModel = { ...acidWater, components: [aceticAcid, benzene], eta12: 0 } as VaporModel
    for (const v of [acidWater, acidBenzene]) {
      for (const [T, P] of [
        [380, 101325],
        [340, 20000],
      ]) {
        for (const y1 of [0.05, 0.3, 0.6, 0.95]) {
          const h = 1e-5
          const up = vaporCorrection(v, T, P, y1 + h, [1, 1]).phi.map(Math.log)
          const dn = vaporCorrection(v, T, P, y1 - h, [1, 1]).phi.map(Math.log)
          const d1 = (up[0] - dn[0]) / (2 * h)
          const d2 = (up[1] - dn[1]) / (2 * h)
          expect(Math.abs(d1)).toBeGreaterThan(0.01) // the terms themselves are not small
          expect(Math.abs(y1 * d1 + (1 - y1) * d2)).toBeLessThan(1e-7)
        }
      }
    }
  })

  it('the true composition: 0 < z_M ≤ 1, Σz = 1, the apparent balance holds, symmetric on swapping (fast-check)', () => {
    const kArb = fc.oneof(fc.constant(0), fc.double({ min: 0, max: 1e4, noNaN: true }))
    const out1 = new Float64Array(5)
    const out2 = new Float64Array(5)
    fc.assert(
      fc.property(kArb, kArb, kArb, fc.double({ min: 0, max: 1, noNaN: true }), (k11, k22, k12, y1) => {
        solveSpecies(k11, k22, k12, y1, out1)
        const [z1, z2, z11, z12, z22] = out1
        expect(z1 + z2).toBeGreaterThan(0)
        expect(z1).toBeGreaterThanOrEqual(0)
        expect(z2).toBeGreaterThanOrEqual(0)
        expect(z1 + z2).toBeLessThanOrEqual(1)
        if (y1 > 1e-300) expect(z1).toBeGreaterThan(0) // (below that z1 underflows)
        if (y1 < 1) expect(z2).toBeGreaterThan(0)
        expect(z1 + z2 + z11 + z12 + z22).toBeCloseTo(1, 12)
        const a1 = z1 + 2 * z11 + z12
        const a2 = z2 + 2 * z22 + z12
        expect(a1 / (a1 + a2)).toBeCloseTo(y1, 11)
        solveSpecies(k22, k11, k12, 1 - y1, out2)
        expect(out2[0]).toBeCloseTo(z2, 11)
        expect(out2[1]).toBeCloseTo(z1, 11)
        expect(out2[4]).toBeCloseTo(z11, 11)
      }),
      { numRuns: 1000 },
    )
  })

  it('swapping the components of a dimerising vapour swaps φ̂ (fast-check)', () => {
    const swapped: VaporModel = { ...acidWater, components: [water, aceticAcid] } as VaporModel
    fc.assert(
      fc.property(
        fc.double({ min: 300, max: 500, noNaN: true }),
        fc.double({ min: 1000, max: 3e5, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (T, P, y1) => {
          const a = vaporCorrection(acidWater, T, P, y1, [P, P])
          const b = vaporCorrection(swapped, T, P, 1 - y1, [P, P])
          expect(b.phi[0] / a.phi[1]).toBeCloseTo(1, 10)
          expect(b.phi[1] / a.phi[0]).toBeCloseTo(1, 10)
          expect(b.phiSat[0] / a.phiSat[1]).toBeCloseTo(1, 12)
          expect(a.phi[0]).toBeGreaterThan(0)
          expect(a.phi[0]).toBeLessThanOrEqual(1.01)
        },
      ),
      { numRuns: 200 },
    )
  })

  it('a state too dense for the physical part is flagged; an ordinary one carries only the statement', () => {
    // reduced density Vc/V above 0.5 (Prausnitz, Lichtenthaler & de Azevedo, 3rd ed., ch. 5; from memory), with
    // V = RT/(P(1 + zD)) + B^F per apparent mole: pure acid vapour at 560 K and 20 MPa (computed Vc/V = 0.81; 0.46 at 10 MPa)
    const dense = virialValidityWarnings(pureAcid, 560, 2e7, 1)
    expect(dense).toHaveLength(2)
    expect(dense[1]).toBe(
      'The vapour at 560.00 K and 2.000e+4 kPa is denser than half its critical density; the physical part of the chemical theory (the virial equation truncated after the free B) is doubtful there.',
    )
    expect(virialValidityWarnings(pureAcid, 560, 1e7, 1)).toHaveLength(1)
    expect(virialValidityWarnings(pureAcid, 391.05, 101325, 1)).toHaveLength(1)
  })

  it('speciation refuses a vapour the chemical theory does not apply to, naming why', () => {
    const plain: VaporModel = { ...acidWater, components: [benzene, water], eta12: 0 } as VaporModel
    expect(() => vaporSpeciation(plain, 350, 101325, 0.5)).toThrow(
      "Speciation needs a Hayden–O'Connell vapour with a carboxylic acid (η or η12 of at least 4.5).",
    )
    expect(() => vaporSpeciation(acidWater, 350, 101325, 1.5)).toThrow(/y1/)
  })
})

/** y1 of the bubble point under the truncated virial equation with HOC's total B (bisection on T, substitution on y). */
function truncatedVirialBubble(x1: number, P: number): number {
  let y1 = x1
  let T = 380
  for (let k = 0; k < 100; k++) {
    const Phi = (t: number) => {
      const B = secondVirialCoefficients(acidWater, t)
      const rt = R * t
      const d = 2 * B.B12 - B.B11 - B.B22
      const p = psat(t)
      return [
        Math.exp((1e-6 * P * (B.B11 + (1 - y1) ** 2 * d) - 1e-6 * B.B11 * p[0]) / rt),
        Math.exp((1e-6 * P * (B.B22 + y1 ** 2 * d) - 1e-6 * B.B22 * p[1]) / rt),
      ]
    }
    let lo = T - 30
    let hi = T + 30
    for (let it = 0; it < 80; it++) {
      T = 0.5 * (lo + hi)
      const g = activityCoefficients(system.activity, { x1, T })
      const p = psat(T)
      const F = Phi(T)
      if ((x1 * g[0] * p[0]) / F[0] + ((1 - x1) * g[1] * p[1]) / F[1] > P) hi = T
      else lo = T
    }
    const g = activityCoefficients(system.activity, { x1, T })
    y1 = (x1 * g[0] * psat(T)[0]) / Phi(T)[0] / P
  }
  return y1
}

describe('γ–φ with a dimerising vapour: acetic acid (1) + water (2)', () => {
  it('bubble points are self-consistent: Σy = 1, yi·Φi·P = xi·γi·Pi_sat, dew point returns the liquid', () => {
    for (const x1 of [0.01, 0.1, 0.5, 0.9]) {
      const r = bubbleTemperatureGammaPhi(system, { P: 101325, x1 }, acidWater)
      const c = vaporCorrection(acidWater, r.T, r.P, r.y1, psat(r.T))
      const g = activityCoefficients(system.activity, { x1, T: r.T })
      const p = psat(r.T)
      expect(r.y1 * c.Phi[0] * r.P).toBeCloseTo(x1 * g[0] * p[0], 4) // Pa
      expect((1 - r.y1) * c.Phi[1] * r.P).toBeCloseTo((1 - x1) * g[1] * p[1], 4)
      expect(r.Phi[0]).toBeCloseTo(c.Phi[0], 9)
      // the main solver goes through the same path; bubble pressure and dew temperature agree
      expect(bubbleTemperature({ ...system, vapor: acidWater }, { P: 101325, x1 }).T).toBeCloseTo(r.T, 8)
      expect(bubblePressure({ ...system, vapor: acidWater }, { T: r.T, x1 }).P).toBeCloseTo(101325, 3)
      const d = dewTemperatureGammaPhi(system, { P: 101325, y1: r.y1 }, acidWater)
      expect(d.T).toBeCloseTo(r.T, 7)
      expect(d.x1).toBeCloseTo(x1, 8)
      expect(r.warnings[0]).toMatch(/^The vapour dimerises \(η ≥ 4\.5 for component 1: carboxylic acid\)/)
    }
  })

  it('dimerisation lowers the acid in a water-rich vapour; the truncated virial with the total B lowers it absurdly', () => {
    // Known effect (common practice, no source): dilute acid vapour is mostly monomer, while the pure acid's
    // vapour pressure counts dimers too, so Φ_acid = φ̂/φ_sat > 1 and y_acid falls below the ideal-vapour value. The
    // truncated virial equation with B ≈ −1.1e5 cm³/mol takes φ_sat ≈ exp(B·P_sat/RT) ≈ 0.03 and drives y_acid
    // about 40 times lower still. Computed here at x1 = 0.01 and 0.1: chemical theory 0.00544 and 0.0737, ideal
    // 0.0130 and 0.1113, truncated virial 0.00013 and 0.0015.
    const expected: [number, number, number][] = [
      [0.01, 0.00544, 0.013],
      [0.1, 0.0737, 0.1113],
    ]
    for (const [x1, yChem, yIdeal] of expected) {
      const chem = bubbleTemperatureGammaPhi(system, { P: 101325, x1 }, acidWater)
      const ideal = bubbleTemperature(system, { P: 101325, x1 })
      expect(chem.y1).toBeCloseTo(yChem, 4)
      expect(ideal.y1).toBeCloseTo(yIdeal, 4)
      expect(chem.Phi[0]).toBeGreaterThan(1.5)
      expect(truncatedVirialBubble(x1, 101325)).toBeLessThan(chem.y1 / 20)
    }
  })

  it('a fit under the chemical theory recovers the NRTL energies that made its points, and says which vapour ran', () => {
    const pts = [0.05, 0.15, 0.3, 0.5, 0.7, 0.85, 0.95].map((x1) => {
      const r = bubbleTemperatureGammaPhi(system, { P: 101325, x1 }, acidWater)
      return { T: r.T, P: 101325, x1, y1: r.y1 }
    })
    const fit = fitBinary({
      model: 'nrtl',
      alpha: 0.3,
      vaporPressure: system.vaporPressure,
      vapor: acidWater,
      points: pts,
    })
    const b = (n: string) => fit.parameters.find((p) => p.name === n)!.value
    expect(b('b12') / 2000).toBeCloseTo(1, 3)
    expect(b('b21') / 1000).toBeCloseTo(1, 3)
    expect(fit.warnings.some((w) => w.includes('chemical theory of dimerisation'))).toBe(true)
  })
})
