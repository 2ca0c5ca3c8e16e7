import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  fitBinary,
  type ActivityModel,
  type BinaryPoint,
  type BinarySystem,
  type FittableModel,
} from '../../src/index.js'
import { b2, CAL, TABLE_12_5 } from './helpers/constants.js'
import { seededRandom as prng } from '../../src/random.js'

// Round trips: T–x–y points generated from known parameters under modified Raoult's law, plus Gaussian
// noise of known σ (σT = 0.1 K, σy = 0.005, the fit's defaults), are fitted back; the true parameters must
// lie within 3 standard errors. Generating parameters: SVNA 7th ed. Table 12.5 (1-propanol/water NRTL S,
// methanol/water Wilson M) with Table B.2 Antoine constants; the Margules pair is illustrative.
// Half of the points are at 101.325 kPa and half at 60 kPa: each point is fitted at its own pressure.
const pw = TABLE_12_5.propanolWater
const mw = TABLE_12_5.methanolWater

function generate(system: BinarySystem, seed: number, n = 24): BinaryPoint[] {
  const rng = prng(seed)
  return Array.from({ length: n }, (_, i) => {
    const x1 = 0.03 + (0.94 * i) / (n - 1)
    const P = i % 2 === 0 ? 101325 : 60000
    const b = bubbleTemperature(system, { P, x1 })
    return { T: b.T + 0.1 * rng.gaussian(), P, x1, y1: Math.min(1, Math.max(0, b.y1 + 0.005 * rng.gaussian())) }
  })
}

const cases: {
  name: string
  system: BinarySystem
  model: FittableModel
  truth: Record<string, number>
  extra: object
}[] = [
  {
    name: 'NRTL, 1-propanol/water',
    system: {
      vaporPressure: [b2('1-propanol'), b2('water')],
      activity: { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha },
    },
    model: 'nrtl',
    truth: { b12: pw.b12 * CAL, b21: pw.b21 * CAL },
    extra: { alpha: pw.alpha },
  },
  {
    name: 'Wilson, methanol/water',
    system: {
      vaporPressure: [b2('methanol'), b2('water')],
      activity: { kind: 'wilson', a12: mw.a12 * CAL, a21: mw.a21 * CAL, V1: mw.V1, V2: mw.V2 },
    },
    model: 'wilson',
    truth: { a12: mw.a12 * CAL, a21: mw.a21 * CAL },
    extra: { V1: mw.V1, V2: mw.V2 },
  },
  {
    name: 'Margules, benzene/cyclohexane (illustrative A12 = 0.45, A21 = 0.35)',
    system: { vaporPressure: [b2('benzene'), b2('cyclohexane')], activity: { kind: 'margules', A12: 0.45, A21: 0.35 } },
    model: 'margules',
    truth: { A12: 0.45, A21: 0.35 },
    extra: {},
  },
  {
    name: 'Van Laar, ethanol/water (A12 = 1.6798, A21 = 0.9227, a textbook-standard pair; from memory)',
    system: { vaporPressure: [b2('ethanol'), b2('water')], activity: { kind: 'van-laar', A12: 1.6798, A21: 0.9227 } },
    model: 'van-laar',
    truth: { A12: 1.6798, A21: 0.9227 },
    extra: {},
  },
]

describe('fitBinary recovers known parameters from noisy generated data', () => {
  for (const c of cases) {
    it(`${c.name}: true values within 3 standard errors`, () => {
      const points = generate(c.system, 7)
      const fit = fitBinary({ points, vaporPressure: c.system.vaporPressure, model: c.model, ...c.extra })
      expect(fit.converged).toBe(true)
      for (const p of fit.parameters) {
        expect(Math.abs(p.value - c.truth[p.name])).toBeLessThan(3 * (p.standardError as number))
      }
      // The scatter matches the noise put in (rough, 24 points): RMS ΔT near 0.1 K, RMS Δy near 0.005.
      expect(fit.rmsT).toBeGreaterThan(0.05)
      expect(fit.rmsT).toBeLessThan(0.16)
      expect(fit.rmsY).toBeLessThan(0.008)
      // With 48 residual rows and the |t| > 3 rule, pure noise flags one point in roughly one data set of
      // eight (2·24·0.27 %); more than one would mean the rule or the statistics are wrong.
      expect(fit.residuals.filter((r) => r.flagged).length).toBeLessThanOrEqual(1)
      expect(Math.abs(fit.correlation[0][1])).toBeLessThanOrEqual(1)
    })
  }

  it('the activity objective lands near the same NRTL parameters', () => {
    const c = cases[0]
    const points = generate(c.system, 7)
    const fit = fitBinary({
      points,
      vaporPressure: c.system.vaporPressure,
      model: 'nrtl',
      alpha: pw.alpha,
      objective: 'activity',
    })
    expect(fit.objectiveKind).toBe('activity')
    for (const p of fit.parameters)
      expect(Math.abs(p.value - c.truth[p.name])).toBeLessThan(5 * (p.standardError as number))
  })

  it('fitting α as well still brackets the true NRTL values', () => {
    const c = cases[0]
    const fit = fitBinary({
      points: generate(c.system, 7, 40),
      vaporPressure: c.system.vaporPressure,
      model: 'nrtl',
      fitAlpha: true,
    })
    const truth = { ...c.truth, alpha: pw.alpha } as Record<string, number>
    expect(fit.parameters.map((p) => p.name)).toEqual(['b12', 'b21', 'alpha'])
    for (const p of fit.parameters)
      expect(Math.abs(p.value - truth[p.name])).toBeLessThan(3 * (p.standardError as number))
  })

  it('is deterministic: the same data give the same numbers', () => {
    const c = cases[0]
    const a = fitBinary({
      points: generate(c.system, 7),
      vaporPressure: c.system.vaporPressure,
      model: 'nrtl',
      alpha: pw.alpha,
    })
    const b = fitBinary({
      points: generate(c.system, 7),
      vaporPressure: c.system.vaporPressure,
      model: 'nrtl',
      alpha: pw.alpha,
    })
    expect(a.parameters).toEqual(b.parameters)
  })
})

describe('range warnings', () => {
  // Table B.2 ranges (S): benzene 6 to 104 °C, cyclohexane 9 to 105 °C. At 3 bar the mixture boils
  // above 110 °C, beyond both ranges, and the fit must say so.
  it('a fit whose data leave the vapour-pressure ranges says so for each component', () => {
    const system = cases[2].system
    const points = generate(system, 5).map((p) => ({ ...p, P: 300000 }))
    const hot = points.map((p) => ({ ...p, T: bubbleTemperature(system, { P: 300000, x1: p.x1 }).T }))
    const fit = fitBinary({ points: hot, vaporPressure: system.vaporPressure, model: 'margules' })
    expect(fit.warnings.filter((w) => w.includes('outside the range of its vapour-pressure correlation')).length).toBe(
      2,
    )
    expect(fit.warnings[0]).toMatch(
      /^Component 1: temperatures from \d+\.\d\d to \d+\.\d\d °C reach outside the range of its vapour-pressure correlation \(6 to 104 °C\); values there are extrapolated\.$/,
    )
  })
})

describe('outliers and excluded points', () => {
  const c = cases[0]
  it('a planted 10σ outlier in T is flagged, and no other point is', () => {
    const points = generate(c.system, 7)
    points[11] = { ...points[11], T: points[11].T + 1.0 }
    const fit = fitBinary({ points, vaporPressure: c.system.vaporPressure, model: 'nrtl', alpha: pw.alpha })
    expect(fit.residuals.flatMap((r, i) => (r.flagged ? [i] : []))).toEqual([11])
    // Residuals are measured − calculated: the point raised by 1 K reads about +1 K (the fit leans a little
    // towards it, hence the lower bound), and its studentized residual is positive too.
    expect(fit.residuals[11].dT).toBeGreaterThan(0.8)
    expect(fit.residuals[11].dT).toBeLessThan(1.05)
    expect(fit.residuals[11].studentized).toBeGreaterThan(3)
    expect(fit.warnings).toContain(
      '1 point looks like an outlier (|studentized residual| > 3); check it before approving.',
    )
  })
  it('an excluded outlier does not move the fit but is still reported and flagged', () => {
    const points = generate(c.system, 7)
    const clean = fitBinary({ points, vaporPressure: c.system.vaporPressure, model: 'nrtl', alpha: pw.alpha })
    points[5] = { ...points[5], y1: points[5].y1! + 0.05, excluded: true }
    const fit = fitBinary({ points, vaporPressure: c.system.vaporPressure, model: 'nrtl', alpha: pw.alpha })
    const others = clean.parameters.map((p) => p.value)
    // Removing one of 24 points shifts the estimates by well under one standard error.
    fit.parameters.forEach((p, j) => expect(Math.abs(p.value - others[j])).toBeLessThan(p.standardError as number))
    expect(fit.residuals[5].excluded).toBe(true)
    expect(fit.residuals[5].flagged).toBe(true)
    // y raised by 0.05 reads about +0.05 (measured − calculated).
    expect(Math.abs(fit.residuals[5].dy! - 0.05)).toBeLessThan(0.02)
  })
  it('leverages of the fitted rows add up to the number of parameters', () => {
    const fit = fitBinary({
      points: generate(c.system, 7),
      vaporPressure: c.system.vaporPressure,
      model: 'nrtl',
      alpha: pw.alpha,
    })
    expect(fit.residuals.reduce((s, r) => s + r.leverage, 0)).toBeCloseTo(2, 6)
  })
  it('pure-component points are reported and not fitted; AIC prefers the true model', () => {
    const points = [...generate(c.system, 7), { T: 373.15, P: 101325, x1: 0, y1: 0 }]
    const nrtl = fitBinary({ points, vaporPressure: c.system.vaporPressure, model: 'nrtl', alpha: pw.alpha })
    const margules = fitBinary({ points, vaporPressure: c.system.vaporPressure, model: 'margules' })
    expect(nrtl.residuals[24].leverage).toBe(0)
    expect(Math.abs(nrtl.residuals[24].dT!)).toBeLessThan(0.01)
    expect(nrtl.aic).toBeLessThan(margules.aic)
  })
})

export type { ActivityModel }
