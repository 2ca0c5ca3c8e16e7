import { describe, expect, it } from 'vitest'
import type { BinarySystem } from '../types.js'
import { bubbleTemperature } from '../equilibrium/index.js'
import {
  bubblePressureGammaPhi,
  bubbleTemperatureGammaPhi,
  crossCriticalConstants,
  dewTemperatureGammaPhi,
  secondVirialCoefficients,
  secondVirialTsonopoulos,
  tsonopoulosPolarParameters,
  vaporCorrection,
  virialValidityWarnings,
  type VaporModel,
  type VirialComponent,
} from './index.js'

// Critical data: Python library `chemicals` 1.5.2 (its default data sources), frozen here.
const crit = {
  benzene: { Tc: 562.02, Pc: 4907277.0, omega: 0.211, Vc: 256.344527044 },
  toluene: { Tc: 591.75, Pc: 4126300.0, omega: 0.2657, Vc: 315.556958031 },
  ethanol: { Tc: 514.71, Pc: 6268000.0, omega: 0.646, Vc: 168.634064081, dipole: 1.44 },
  water: { Tc: 647.096, Pc: 22064000.0, omega: 0.3443, Vc: 55.9480372671 },
  acetone: { Tc: 508.1, Pc: 4692400.0, omega: 0.3071, Vc: 212.765957447, dipole: 2.88 },
  methanol: { Tc: 513.38, Pc: 8215850.0, omega: 0.5625, Vc: 113.828190007 },
  propanol: { Tc: 536.8, Pc: 5169000.0, omega: 0.624, Vc: 218.0, dipole: 1.55 },
}

describe('Tsonopoulos second virial coefficients', () => {
  // Source: chemicals 1.5.2, BVirial_Tsonopoulos_extended(T, Tc, Pc, omega, …) × 1e6 (cm³/mol), species types
  // 'alkanol' (ethanol) and 'ketone' (acetone) with their dipoles, explicit a, b for the others.
  const polar = {
    benzene: tsonopoulosPolarParameters({ kind: 'non-polar', ...crit.benzene }),
    toluene: tsonopoulosPolarParameters({ kind: 'non-polar', ...crit.toluene }),
    ethanol: tsonopoulosPolarParameters({ kind: 'alcohol', ...crit.ethanol }),
    water: tsonopoulosPolarParameters({ kind: 'water', ...crit.water }),
    acetone: tsonopoulosPolarParameters({ kind: 'ketone-ether-ester-aldehyde-nitrile', ...crit.acetone }),
    methanol: tsonopoulosPolarParameters({ kind: 'methanol', ...crit.methanol }),
  }
  const table: [keyof typeof polar, number, number][] = [
    ['benzene', 300, -1633.8845015317768],
    ['benzene', 400, -721.0936972359805],
    ['toluene', 350, -1580.038473191031],
    ['ethanol', 300, -2051.6469388175424],
    ['ethanol', 400, -470.10206082615315],
    ['water', 300, -1198.6025527816976],
    ['water', 400, -354.19601627631033],
    ['acetone', 350, -1076.1063090045946],
    ['methanol', 350, -701.4488294941362],
  ]
  it.each(table)('%s at %d K', (name, T, expected) => {
    const c: VirialComponent = { ...crit[name], tsonopoulos: polar[name] }
    expect(secondVirialTsonopoulos(T, c)).toBeCloseTo(expected, 6)
  })

  it('the polar parameters of an alcohol and a ketone follow the published rules', () => {
    // chemicals 1.5.2 computes, for ethanol (alkanol, 1.44 D): a = 0.0878, b = 0.042764813793726396;
    // for acetone (ketone, 2.88 D): a = −0.03287507420501906, b = 0.
    expect(polar.ethanol.b).toBeCloseTo(0.042764813793726396, 12)
    expect(polar.acetone.a).toBeCloseTo(-0.03287507420501906, 12)
  })

  it('an alkyl halide gets a small polar a (chloroform, 1.01 D: about −2.7e-6), not the −26 of a misprinted exponent', () => {
    // μr = 1e5·1.01²·(5.33 MPa/1 atm)/536.2² = 18.66; a = −2.188e-11·μr⁴ − 7.831e-21·μr⁸ (closed form).
    const a = tsonopoulosPolarParameters({
      kind: 'haloalkane-mercaptan-sulfide',
      dipole: 1.01,
      Tc: 536.2,
      Pc: 5330000,
    }).a
    expect(a).toBeCloseTo(-2.652e-6, 8)
  })

  it('the cross rule gives B12 = B11 for two identical components (closed form)', () => {
    const c = { ...crit.benzene }
    const x = crossCriticalConstants(c, c)
    expect(x.Tc).toBeCloseTo(c.Tc, 10)
    expect(x.Pc / c.Pc).toBeCloseTo(1, 12)
    const v: VaporModel = { kind: 'virial', correlation: 'tsonopoulos', components: [c, c] }
    const b = secondVirialCoefficients(v, 350)
    expect(b.B12).toBeCloseTo(b.B11, 8)
  })

  it('k12 lowers the cross critical temperature and makes B12 less negative', () => {
    const v = (k12: number): VaporModel => ({
      kind: 'virial',
      correlation: 'tsonopoulos',
      components: [crit.benzene, crit.toluene],
      k12,
    })
    expect(secondVirialCoefficients(v(0.1), 350).B12).toBeGreaterThan(secondVirialCoefficients(v(0), 350).B12)
  })
})

// 1-propanol (1) / water (2): NRTL and Antoine constants from Smith, Van Ness & Abbott, 7th ed., Tables 12.5 and
// B.2 (cal/mol × 4.184 = J/mol); critical data chemicals 1.5.2; polar parameters as published (alcohol, water).
const propanolWater: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha: 0.5081 },
}
const virialPW: VaporModel = {
  kind: 'virial',
  correlation: 'tsonopoulos',
  components: [
    { ...crit.propanol, tsonopoulos: tsonopoulosPolarParameters({ kind: 'alcohol', ...crit.propanol }) },
    { ...crit.water, tsonopoulos: tsonopoulosPolarParameters({ kind: 'water', ...crit.water }) },
  ],
}

describe('γ–φ bubble points against an independent calculation', () => {
  // Source: test/reference/gamma-phi-reference.py (chemicals 1.5.2 B, scipy brentq), run 2026-12-03.
  it('B11, B22, B12 at 330 and 370 K', () => {
    const at330 = secondVirialCoefficients(virialPW, 330)
    expect(at330.B11).toBeCloseTo(-1644.2244216759407, 6)
    expect(at330.B22).toBeCloseTo(-760.508984764784, 6)
    expect(at330.B12).toBeCloseTo(-1011.2546233419961, 6)
    expect(secondVirialCoefficients(virialPW, 370).B12).toBeCloseTo(-671.5791319758813, 6)
  })
  const cases: [number, number, number, number, number, number][] = [
    [101325, 0.1, 361.5680223232252, 0.37806308947758643, 0.9675752294743876, 0.983064620053106],
    [101325, 0.5, 360.50465833924204, 0.46317034664453854, 0.9668394801162595, 0.9830188498111028],
    [101325, 0.9, 365.31390319445677, 0.7539476797309155, 0.9686889721382266, 0.9845358132916759],
    [1e6, 0.3, 432.6064463309254, 0.44027654148293793, 0.8665109255418522, 0.9242701684871208],
  ]
  it.each(cases)('P = %d Pa, x1 = %d', (P, x1, T, y1, phi1, phi2) => {
    const r = bubbleTemperatureGammaPhi(propanolWater, { P, x1 }, virialPW)
    expect(r.T).toBeCloseTo(T, 6)
    expect(r.y1).toBeCloseTo(y1, 8)
    expect(r.phi[0]).toBeCloseTo(phi1, 8)
    expect(r.phi[1]).toBeCloseTo(phi2, 8)
  })

  it('the vapour correction at 1 atm is of the order of the uncertainty in y (about 0.001), and small in T', () => {
    const ideal = bubbleTemperature(propanolWater, { P: 101325, x1: 0.1 })
    const real = bubbleTemperatureGammaPhi(propanolWater, { P: 101325, x1: 0.1 }, virialPW)
    expect(Math.abs(real.y1 - ideal.y1)).toBeGreaterThan(0.0003)
    expect(Math.abs(real.y1 - ideal.y1)).toBeLessThan(0.003)
    expect(Math.abs(real.T - ideal.T)).toBeLessThan(0.2)
  })
})

describe('γ–φ invariants', () => {
  it('a pure component boils exactly at its vapour pressure (φ at saturation is applied)', () => {
    for (const x1 of [0, 1]) {
      const ideal = bubbleTemperature(propanolWater, { P: 101325, x1 })
      const real = bubbleTemperatureGammaPhi(propanolWater, { P: 101325, x1 }, virialPW)
      expect(real.T).toBeCloseTo(ideal.T, 7)
    }
  })

  it('bubble pressure and bubble temperature agree, and dew temperature inverts the bubble point', () => {
    const b = bubbleTemperatureGammaPhi(propanolWater, { P: 150000, x1: 0.35 }, virialPW)
    const p = bubblePressureGammaPhi(propanolWater, { T: b.T, x1: 0.35 }, virialPW)
    expect(p.P / 150000).toBeCloseTo(1, 9)
    expect(p.y1).toBeCloseTo(b.y1, 9)
    const d = dewTemperatureGammaPhi(propanolWater, { P: 150000, y1: b.y1 }, virialPW)
    expect(d.T).toBeCloseTo(b.T, 6)
    expect(d.x1).toBeCloseTo(0.35, 6)
  })

  it('refuses a liquid inside a two-liquid gap instead of giving a single-liquid number', () => {
    // Symmetric Margules A = 2.5 splits between x1 = 0.1448 and 0.8552 at every T (closed form, reference-values §7).
    const split: BinarySystem = { ...propanolWater, activity: { kind: 'margules', A12: 2.5, A21: 2.5 } }
    expect(() => bubbleTemperatureGammaPhi(split, { P: 101325, x1: 0.5 }, virialPW)).toThrow(/two liquid phases/)
    expect(() => bubblePressureGammaPhi(split, { T: 360, x1: 0.5 }, virialPW)).toThrow(/two liquid phases/)
    expect(bubbleTemperatureGammaPhi(split, { P: 101325, x1: 0.05 }, virialPW).converged).toBe(true)
  })

  it('with an ideal vapour the corrections are 1', () => {
    const c = vaporCorrection({ kind: 'ideal' }, 350, 101325, 0.5, [1e5, 5e4])
    expect(c.Phi).toEqual([1, 1])
  })

  it('the Poynting factor needs liquid molar volumes, and raises the bubble pressure', () => {
    expect(() => bubblePressureGammaPhi(propanolWater, { T: 360, x1: 0.3 }, { ...virialPW, poynting: true })).toThrow(
      'The Poynting factor needs the liquid molar volume of component 1 (cm³/mol).',
    )
    const withV: VaporModel = {
      ...virialPW,
      poynting: true,
      components: [
        { ...virialPW.components[0], liquidMolarVolume: 75.14 },
        { ...virialPW.components[1], liquidMolarVolume: 18.07 },
      ],
    } as VaporModel
    const a = bubblePressureGammaPhi(propanolWater, { T: 360, x1: 0.3 }, virialPW).P
    const b = bubblePressureGammaPhi(propanolWater, { T: 360, x1: 0.3 }, withV).P
    // P (about 99 kPa) exceeds both vapour pressures at 360 K, so PF > 1 and Φ falls: the bubble pressure rises by
    // about V_L·(P − P_sat)/RT ≈ 2e-4 to 4e-4 relative (closed form, first order).
    expect(b / a - 1).toBeGreaterThan(2e-4)
    expect(b / a - 1).toBeLessThan(6e-4)
  })

  it('a virial vapour without Vc is refused with the field named', () => {
    const bad = { ...virialPW, components: [{ ...crit.water, Vc: undefined }, crit.water] } as unknown as VaporModel
    expect(() => bubbleTemperatureGammaPhi(propanolWater, { P: 101325, x1: 0.5 }, bad)).toThrow(
      'A virial vapour needs Vc of component 1 (finite, positive); got undefined.',
    )
  })

  it('warns where the truncated virial equation is doubtful', () => {
    // At 500 K and 8 MPa, V = RT/P + B ≈ 220 cm³/mol against Vc ≈ 137 cm³/mol: denser than half critical.
    expect(virialValidityWarnings(virialPW, 500, 8e6, 0.5)[0]).toContain('half its critical density')
    expect(bubbleTemperatureGammaPhi(propanolWater, { P: 101325, x1: 0.5 }, virialPW).warnings).toEqual([])
  })
})
