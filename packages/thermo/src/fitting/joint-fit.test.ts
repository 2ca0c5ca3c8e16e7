import { describe, expect, it } from 'vitest'
import { bubblePressure, bubbleTemperature } from '../equilibrium/index.js'
import type { BinarySystem, VaporPressureModel } from '../types.js'
import { tsonopoulosPolarParameters } from '../virial/index.js'
import type { VaporModel } from '../virial/virial-types.js'
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

describe('joint fit over isothermal and isobaric data sets (bubble-pressure and bubble-temperature rows together)', () => {
  // 1-propanol (1) / water (2) as above; critical data and Tsonopoulos polar classes as frozen from chemicals 1.5.2
  // in src/virial/virial.test.ts. Data without noise from the truth (round trip): the optimum is the truth itself.
  const propanol = { Tc: 536.8, Pc: 5169000.0, omega: 0.624, Vc: 218.0, dipole: 1.55 }
  const water = { Tc: 647.096, Pc: 22064000.0, omega: 0.3443, Vc: 55.9480372671 }
  const virial: VaporModel = {
    kind: 'virial',
    correlation: 'tsonopoulos',
    components: [
      { ...propanol, tsonopoulos: tsonopoulosPolarParameters({ kind: 'alcohol', ...propanol }) },
      { ...water, tsonopoulos: tsonopoulosPolarParameters({ kind: 'water', ...water }) },
    ],
  }
  const want = [500.4 * 4.184, 1636.57 * 4.184, -8, 12]
  const exact = (vapor?: VaporModel) => {
    const sys: BinarySystem = { ...truth, ...(vapor ? { vapor } : {}) }
    const xs = Array.from({ length: 15 }, (_, i) => 0.03 + (0.94 * i) / 14)
    const iso = (T: number) =>
      xs.map((x1) => {
        const b = bubblePressure(sys, { T, x1 })
        return { T, P: b.P, x1, y1: b.y1 }
      })
    const bar = (P: number) =>
      xs.map((x1) => {
        const b = bubbleTemperature(sys, { P, x1 })
        return { T: b.T, P, x1, y1: b.y1 }
      })
    return [
      { id: 'iso-333K', kind: 'isothermal' as const, points: iso(333.15), vapor },
      { id: 'iso-363K', kind: 'isothermal' as const, points: iso(363.15), vapor },
      { id: 'bar-250kPa', points: bar(250000), vapor },
    ]
  }

  it.each([
    ['ideal', undefined],
    ['Tsonopoulos virial', virial],
  ] as const)(
    '%s vapour: recovers b12, b21, b12T, b21T from exact data (two isothermal sets, one isobaric)',
    (_, v) => {
      const fit = fitJoint({ dataSets: exact(v), vaporPressure, model: 'nrtl', alpha })
      expect(fit.vaporModel).toBe(v ? 'virial-tsonopoulos' : 'ideal')
      expect(fit.objectiveKind).toBe('bubble-point')
      fit.parameters.forEach((p, j) => expect(Math.abs(p.value - want[j])).toBeLessThan(j < 2 ? 1e-3 : 1e-5))
      expect(fit.objective).toBeLessThan(1e-12)
      const [a, b, c] = fit.dataSets
      expect([a.kind, b.kind, c.kind]).toEqual(['isothermal', 'isothermal', 'isobaric'])
      // Isothermal members report dP (Pa) and no dT; the isobaric member dT and no dP.
      expect(a.rmsP).toBeLessThan(1e-4)
      expect(Number.isNaN(a.rmsT)).toBe(true)
      expect(c.rmsP).toBeUndefined()
      expect(c.rmsT).toBeLessThan(1e-7)
      expect(fit.range.Tmin).toBeCloseTo(333.15, 10)
      expect(fit.range.Pmax).toBe(250000)
      // The pooled point residuals: dP on the isothermal rows, dT on the isobaric ones.
      expect(fit.residuals[0].dT).toBeNull()
      expect(typeof fit.residuals[0].dP).toBe('number')
      expect(fit.residuals[30].dP).toBeUndefined()
      expect(typeof fit.residuals[30].dT).toBe('number')
    },
  )

  it('isothermal members alone: the bubble-pressure objective', () => {
    const fit = fitJoint({ dataSets: exact().slice(0, 2), vaporPressure, model: 'nrtl', alpha })
    expect(fit.objectiveKind).toBe('bubble-pressure')
    fit.parameters.forEach((p, j) => expect(Math.abs(p.value - want[j])).toBeLessThan(j < 2 ? 1e-3 : 1e-5))
  })

  it('an isothermal set read 200 Pa high shows a dP bias of about +200 Pa (measured − calculated)', () => {
    const sets = exact()
    const high = { ...sets[1], id: 'iso-363K-high', points: sets[1].points.map((p) => ({ ...p, P: p.P + 200 })) }
    const fit = fitJoint({ dataSets: [...sets, high], vaporPressure, model: 'nrtl', alpha })
    const d = fit.dataSets.find((s) => s.id === 'iso-363K-high')!
    const b = fit.dataSets.find((s) => s.id === 'iso-363K')!
    expect(d.biasP! - b.biasP!).toBeGreaterThan(190)
    expect(d.biasP! - b.biasP!).toBeLessThan(201)
  })

  it('refuses members with different vapour models, naming both data sets', () => {
    const sets = exact()
    sets[2] = { ...sets[2], vapor: virial }
    expect(() => fitJoint({ dataSets: sets, vaporPressure, model: 'nrtl', alpha })).toThrow(
      'Data sets "iso-333K" (ideal vapour) and "bar-250kPa" (tsonopoulos virial vapour) have different vapour models; one parameter set holds under one vapour model only. Give the data sets the same vapour model, then fit them jointly.',
    )
    const other: VaporModel = { ...virial, k12: 0.05 }
    const mixed = exact(virial)
    mixed[1] = { ...mixed[1], vapor: other }
    expect(() => fitJoint({ dataSets: mixed, vaporPressure, model: 'nrtl', alpha })).toThrow(
      'Data sets "iso-333K" (tsonopoulos virial vapour) and "iso-363K" (a tsonopoulos virial vapour with other constants)',
    )
    expect(() =>
      fitJoint({ dataSets: [{ ...sets[0], kind: 'adiabatic' as never }], vaporPressure, model: 'nrtl', alpha }),
    ).toThrow('Data set "iso-333K": kind must be isobaric or isothermal; got "adiabatic".')
  })
})

describe('joint fit with temperature-dependent UNIQUAC energies', () => {
  // Ethanol (1) / water (2): Antoine constants from Smith, Van Ness & Abbott, 7th ed., Table B.2; UNIQUAC r, q of
  // ethanol (2.1055, 1.972) and water (0.92, 1.40) as tabulated by Prausnitz et al., Molecular Thermodynamics of
  // Fluid-Phase Equilibria (from memory). The energies and their temperature slopes are invented for the round trip.
  const vp: [VaporPressureModel, VaporPressureModel] = [
    { kind: 'antoine', A: 16.8958, B: 3795.17, C: 230.918, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    vaporPressure[1],
  ]
  const uniquac = { r1: 2.1055, r2: 0.92, q1: 1.972, q2: 1.4 }
  const want = [-350, 1450, 2.5, -6]
  const sys: BinarySystem = {
    vaporPressure: vp,
    activity: { kind: 'uniquac', a12: want[0], a21: want[1], ...uniquac, a12T: want[2], a21T: want[3] },
  }
  /** 20 points at P; `scatter` adds a deterministic scatter of about 0.1 K and 0.005 in y (the default σT, σy). */
  const at = (P: number, seed: number, scatter: number) =>
    Array.from({ length: 20 }, (_, i) => {
      const x1 = 0.03 + (0.94 * i) / 19
      const b = bubbleTemperature(sys, { P, x1 })
      return {
        T: b.T + scatter * 0.1 * Math.sin(3.7 * i + seed),
        P,
        x1,
        y1: b.y1 + scatter * 0.005 * Math.cos(2.3 * i + seed),
      }
    })
  const sets = (scatter: number) => [
    { id: 'A-30kPa', points: at(30000, 1, scatter) },
    { id: 'B-1atm', points: at(101325, 2, scatter) },
    { id: 'C-300kPa', points: at(300000, 3, scatter) },
  ]

  it('recovers a12, a21, a12T and a21T from exact data at three pressures (30–300 kPa)', () => {
    const fit = fitJoint({ dataSets: sets(0), vaporPressure: vp, model: 'uniquac', uniquac })
    expect(fit.parameters.map((p) => p.name)).toEqual(['a12', 'a21', 'a12T', 'a21T'])
    // exact data: the optimum is the truth itself (J/mol to 1e-3, J/(mol·K) to 1e-5)
    fit.parameters.forEach((p, j) => expect(Math.abs(p.value - want[j])).toBeLessThan(j < 2 ? 1e-3 : 1e-5))
    expect(fit.activity).toMatchObject({ kind: 'uniquac', ...uniquac })
    expect(fit.objective).toBeLessThan(1e-12)
    expect(fit.settings).toMatchObject({ model: 'uniquac', uniquac, temperatureDependent: true })
  })

  it('from scattered data: within 3 standard errors, with a sane covariance', () => {
    const fit = fitJoint({ dataSets: sets(1), vaporPressure: vp, model: 'uniquac', uniquac })
    expect(fit.converged).toBe(true)
    fit.parameters.forEach((p, j) => expect(Math.abs(p.value - want[j])).toBeLessThan(3 * p.standardError!))
    const C = fit.covariance
    expect(C).toHaveLength(4)
    for (let i = 0; i < 4; i++) {
      // the diagonal is the squared standard error; the matrix is symmetric, correlations inside [−1, 1]
      expect(Math.sqrt(C[i][i])).toBeCloseTo(fit.parameters[i].standardError!, 10)
      expect(fit.correlation[i][i]).toBeCloseTo(1, 12)
      for (let j = 0; j < 4; j++) {
        expect(C[i][j]).toBeCloseTo(C[j][i], 10)
        expect(Math.abs(fit.correlation[i][j])).toBeLessThanOrEqual(1 + 1e-12)
      }
    }
    // positive definite: a Cholesky factorisation exists (every pivot positive)
    const L = C.map((r) => r.map(() => 0))
    for (let i = 0; i < 4; i++)
      for (let j = 0; j <= i; j++) {
        let s = C[i][j]
        for (let k = 0; k < j; k++) s -= L[i][k] * L[j][k]
        if (i === j) {
          expect(s).toBeGreaterThan(0)
          L[i][i] = Math.sqrt(s)
        } else L[i][j] = s / L[j][j]
      }
    // the scatter is the fit's default σ, so the residual variance is near 1 and the points fit to about 0.1 K
    expect(fit.rmsT).toBeLessThan(0.12)
    for (const d of fit.dataSets) expect(Math.abs(d.biasT)).toBeLessThan(0.05)
    // 60 points over 30–300 kPa pin each energy to under 100 J/mol and each slope to under 1.5 J/(mol·K) (measured:
    // a12 −354.6 ± 61.4, a21 1454.0 ± 80.5, a12T 2.81 ± 1.02, a21T −6.36 ± 1.25)
    expect(fit.parameters.map((p) => p.standardError! < (p.name.endsWith('T') ? 1.5 : 100))).toEqual([
      true,
      true,
      true,
      true,
    ])
    // UNIQUAC's two energies trade off against each other (common practice, no source): strongly anti-correlated
    expect(fit.correlation[0][1]).toBeLessThan(-0.95)
  })

  it('refuses without r and q, naming them', () => {
    expect(() => fitJoint({ dataSets: sets(0), vaporPressure: vp, model: 'uniquac' })).toThrow(
      'UNIQUAC needs the structure parameters r1, r2, q1 and q2 (positive numbers) of both components.',
    )
  })
})
