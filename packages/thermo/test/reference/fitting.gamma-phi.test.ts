import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  activityCoefficients,
  equilibriumCurve,
  findAzeotropes,
  minimumReflux,
  areaTest,
  bubblePressure,
  bubbleTemperature,
  dewPressure,
  dewTemperature,
  fitBinary,
  heringtonAreaTest,
  pointTest,
  predictionBand,
  ThermoError,
  tsonopoulosPolarParameters,
  vaporCorrectionSize,
  type BinaryPoint,
  type BinarySystem,
  type VaporModel,
} from '../../src/index.js'
import { seededRandom as prng } from '../../src/random.js'

// System: 1-propanol (1) / water (2), Antoine constants of Smith, Van Ness & Abbott, 7th ed., Table B.2 (no range,
// as in gamma-phi-reference.py), NRTL with α = 0.5081 (SVNA Table 12.5); critical data and the Tsonopoulos polar
// classes as frozen from chemicals 1.5.2 in src/virial/virial.test.ts. The energies b12 = 2100, b21 = 6850 J/mol
// are round numbers near Table 12.5's, used to generate invented data.
const ALPHA = 0.5081
const propanol = { Tc: 536.8, Pc: 5169000.0, omega: 0.624, Vc: 218.0, dipole: 1.55 }
const water = { Tc: 647.096, Pc: 22064000.0, omega: 0.3443, Vc: 55.9480372671 }
const vapor: VaporModel = {
  kind: 'virial',
  correlation: 'tsonopoulos',
  components: [
    { ...propanol, tsonopoulos: tsonopoulosPolarParameters({ kind: 'alcohol', ...propanol }) },
    { ...water, tsonopoulos: tsonopoulosPolarParameters({ kind: 'water', ...water }) },
  ],
}
const vaporPressure: BinarySystem['vaporPressure'] = [
  { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
]
const truth: BinarySystem = {
  vaporPressure,
  activity: { kind: 'nrtl', b12: 2100, b21: 6850, alpha: ALPHA },
  vapor,
}
const base = { vaporPressure, model: 'nrtl' as const, alpha: ALPHA }

/** Isobaric T–x–y at P (Pa) from the γ–φ truth plus Gaussian noise σT = 0.1 K, σy = 0.005 (the fit's defaults). */
function isobaric(P: number, seed: number, n = 20): BinaryPoint[] {
  const rng = prng(seed)
  return Array.from({ length: n }, (_, i) => {
    const x1 = 0.03 + (0.94 * i) / (n - 1)
    const b = bubbleTemperature(truth, { P, x1 })
    return { T: b.T + 0.1 * rng.gaussian(), P, x1, y1: b.y1 + 0.005 * rng.gaussian() }
  })
}

/** Exact isothermal P–x–y at T (K) from the γ–φ truth. */
function isothermalExact(T: number, n = 12): BinaryPoint[] {
  return Array.from({ length: n }, (_, i) => {
    const x1 = 0.04 + (0.92 * i) / (n - 1)
    const b = bubblePressure(truth, { T, x1 })
    return { T, P: b.P, x1, y1: b.y1 }
  })
}

const values = (r: { parameters: { value: number }[] }) => r.parameters.map((p) => p.value)

describe('γ–φ fits recover the parameters of data generated with a virial vapour', () => {
  // At 500 kPa the vapour correction is about 0.8 K and 0.002 in y (see vaporCorrectionSize below).
  const points = isobaric(500_000, 11)
  const gp = fitBinary({ ...base, points, vapor })
  const ideal = fitBinary({ ...base, points })

  it('the virial fit states its vapour model and lands within 3 standard errors of the truth', () => {
    expect(gp.vaporModel).toBe('virial-tsonopoulos')
    expect(gp.method).toBe('with-y')
    expect(gp.system.vapor).toBe(vapor)
    const truthValues = [2100, 6850]
    gp.parameters.forEach((p, j) =>
      expect(Math.abs(p.value - truthValues[j])).toBeLessThan(3 * (p.standardError as number)),
    )
    // The scatter is the generated one (σT = 0.1 K, σy = 0.005).
    expect(gp.rmsT).toBeGreaterThan(0.06)
    expect(gp.rmsT).toBeLessThan(0.14)
  })

  it('an ideal-vapour fit of the same data is measurably biased', () => {
    expect(ideal.vaporModel).toBe('ideal')
    const b12 = ideal.parameters[0]
    // More than 5 of its own standard errors away from the truth, and a worse objective by far.
    expect(Math.abs(b12.value - 2100)).toBeGreaterThan(5 * (b12.standardError as number))
    expect(ideal.objective).toBeGreaterThan(1.5 * gp.objective)
    // Its temperature residuals lean one way: the ideal vapour boils the mixture too hot.
    const meanDT = ideal.residuals.reduce((s, r) => s + (r.dT as number), 0) / ideal.residuals.length
    expect(Math.abs(meanDT)).toBeLessThan(0.05)
    expect(ideal.rmsT).toBeGreaterThan(gp.rmsT)
  })

  it('exact γ–φ data give the truth to 1e-6 through every objective', () => {
    const exact = isothermalExact(363.15)
    for (const objective of ['bubble-pressure', 'activity'] as const) {
      const fit = fitBinary({ ...base, points: exact, vapor, objective })
      expect(fit.objectiveKind).toBe(objective)
      values(fit).forEach((v, j) => expect(v).toBeCloseTo([2100, 6850][j], 3))
    }
    // The activity objective with an ideal vapour misreads the same data (γ without Φ).
    const idealActivity = fitBinary({ ...base, points: exact, objective: 'activity' })
    expect(Math.abs(values(idealActivity)[0] - 2100)).toBeGreaterThan(20)
  })

  it('the prediction band of a virial fit is drawn with the virial vapour', () => {
    const band = predictionBand(gp, { P: 500_000, points: 11 })
    const b = bubbleTemperature(gp.system, { P: 500_000, x1: band.x1[5] })
    expect(band.T[5]).toBeCloseTo(b.T, 6)
    expect(band.y1[5]).toBeCloseTo(b.y1, 8)
    expect(band.sigmaT[5]).toBeGreaterThan(0)
  })
})

describe('bubble-pressure fit of isothermal data against scipy.optimize.least_squares (same objective)', () => {
  // Invented isothermal set at 363.15 K (generated from the γ–φ truth plus a deterministic scatter), frozen here and in
  // test/reference/gamma-phi-fit-reference.py. Reference optimum: that script, scipy 1.17.1 least_squares (method
  // 'lm'), Tsonopoulos B from chemicals 1.5.2; objective Σ[(ΔP/100 Pa)² + (Δy/0.005)²].
  const T = 363.15
  const data: [number, number, number][] = [
    [0.04, 97113.9, 0.29975],
    [0.1108, 108442.8, 0.38319],
    [0.1815, 110271.1, 0.39731],
    [0.2523, 111309.0, 0.412],
    [0.3231, 111979.6, 0.42479],
    [0.3938, 112202.1, 0.43321],
    [0.4646, 112537.0, 0.45115],
    [0.5354, 112179.7, 0.48006],
    [0.6062, 110891.3, 0.5073],
    [0.6769, 109178.3, 0.53696],
    [0.7477, 106108.3, 0.58506],
    [0.8185, 101211.0, 0.65139],
    [0.8892, 94553.1, 0.73553],
    [0.96, 84433.8, 0.87163],
  ]
  const points: BinaryPoint[] = data.map(([x1, P, y1]) => ({ T, P, x1, y1 }))
  const reference = {
    ideal: { b12: 2234.056518400254, b21: 6872.966939027658, objective: 57.70416366532431 },
    virial: { b12: 2099.1905476259853, b21: 6861.027303133063, objective: 18.863101614320108 },
  }
  it.each([
    ['virial', vapor],
    ['ideal', undefined],
  ] as const)('%s vapour: the same optimum as scipy', (name, v) => {
    const fit = fitBinary(points, { ...base, vapor: v, objective: 'bubble-pressure' })
    const ref = reference[name]
    expect(fit.objectiveKind).toBe('bubble-pressure')
    expect(fit.vaporModel).toBe(name === 'virial' ? 'virial-tsonopoulos' : 'ideal')
    expect(fit.parameters[0].value).toBeCloseTo(ref.b12, 2)
    expect(fit.parameters[1].value).toBeCloseTo(ref.b21, 2)
    expect(fit.objective / ref.objective).toBeCloseTo(1, 7)
    // Residuals are pressures in Pa (measured − calculated) and compositions; no temperature residual.
    expect(fit.residuals[0].dT).toBeNull()
    expect(typeof fit.residuals[0].dP).toBe('number')
    expect(fit.rmsP).toBeGreaterThan(20)
    expect(fit.settings.sigmaP).toBeCloseTo(100, 9)
  })

  it('a pressure raised by 100 Pa reads about +100 Pa (measured − calculated)', () => {
    const fit = fitBinary(points, { ...base, vapor, objective: 'bubble-pressure' })
    const raised = points.map((p, k) => (k === 6 ? { ...p, P: p.P + 100 } : p))
    const again = fitBinary(raised, { ...base, vapor, objective: 'bubble-pressure' })
    const shift = (again.residuals[6].dP as number) - (fit.residuals[6].dP as number)
    // The fit leans a little towards the raised point (its leverage is about 0.1), so a bit under 100 Pa.
    expect(shift).toBeGreaterThan(80)
    expect(shift).toBeLessThan(101)
  })
})

describe("Barker's method: data without vapour compositions", () => {
  it('P–x data alone give back the parameters, and the result says barker', () => {
    const px = isothermalExact(363.15).map((p) => ({ ...p, y1: null }))
    const fit = fitBinary(px, { ...base, vapor, objective: 'bubble-pressure' })
    expect(fit.method).toBe('barker')
    values(fit).forEach((v, j) => expect(v).toBeCloseTo([2100, 6850][j], 3))
    expect(fit.residuals.every((r) => r.dy === null)).toBe(true)
    expect(Number.isNaN(fit.rmsY)).toBe(true)
  })

  it('noisy T–x data alone land within 3 standard errors of the truth', () => {
    const tx = isobaric(101_325, 5, 24).map((p) => ({ ...p, y1: null }))
    const fit = fitBinary({ ...base, points: tx, vapor })
    expect(fit.method).toBe('barker')
    fit.parameters.forEach((p, j) =>
      expect(Math.abs(p.value - [2100, 6850][j])).toBeLessThan(3 * (p.standardError as number)),
    )
  })

  it('a mixed set fits the points without y by their T row only', () => {
    const pts = isobaric(101_325, 9, 20).map((p, i) => (i % 3 === 0 ? { ...p, y1: null } : p))
    const fit = fitBinary({ ...base, points: pts, vapor })
    expect(fit.method).toBe('with-y')
    expect(fit.residuals[0].dy).toBeNull()
    expect(typeof fit.residuals[1].dy).toBe('number')
    // leverages of the fitted rows still add up to the number of parameters
    expect(fit.residuals.reduce((s, r) => s + r.leverage, 0)).toBeCloseTo(2, 6)
  })

  it('the activity objective and the consistency tests refuse points without y, naming the point', () => {
    const pts = isobaric(101_325, 9, 10).map((p, i) => (i === 3 ? { ...p, y1: null } : p))
    const refusal = (f: () => unknown) => {
      try {
        f()
      } catch (e) {
        return e as ThermoError
      }
      throw new Error('did not refuse')
    }
    const a = refusal(() => fitBinary({ ...base, points: pts, objective: 'activity' }))
    expect(a.code).toBe('needs-vapour-composition')
    expect(a.message).toBe(
      "Point 4 has no vapour composition (y1); the activity objective needs y1 at every fitted point. Fit data without y with the bubble-point or bubble-pressure objective (Barker's method).",
    )
    const h = refusal(() => heringtonAreaTest(pts, { vaporPressure }))
    expect(h.code).toBe('needs-vapour-composition')
    expect(h.message).toBe(
      "The area test needs the vapour composition y1 of every mixture point; point 4 has none (T–x or P–x data). Exclude such points or fit the data by Barker's method instead.",
    )
    expect(refusal(() => pointTest(pts, base)).code).toBe('needs-vapour-composition')
  })
})

describe('the area test says which test ran and uses the vapour model', () => {
  const iso = isothermalExact(363.15)
  it('isothermal data: Redlich–Kister; isobaric data: Herington', () => {
    expect(areaTest(iso, { kind: 'isothermal', vaporPressure, vapor }).test).toBe('redlich-kister')
    expect(areaTest(isobaric(101_325, 3), { kind: 'isobaric', vaporPressure, vapor }).test).toBe('herington')
  })
  it('with the virial vapour the integrand is the model’s own ln(γ1/γ2); with an ideal one it is off by ln(Φ1/Φ2)', () => {
    const withVirial = areaTest(iso, { kind: 'isothermal', vaporPressure, vapor })
    const withIdeal = areaTest(iso, { kind: 'isothermal', vaporPressure })
    withVirial.integrand.forEach((row, k) => {
      const [g1, g2] = activityCoefficients(truth.activity, { x1: row.x1, T: 363.15 })
      expect(row.lnGammaRatio).toBeCloseTo(Math.log(g1 / g2), 9)
      expect(Math.abs(withIdeal.integrand[k].lnGammaRatio - row.lnGammaRatio)).toBeGreaterThan(1e-4)
    })
  })
})

describe('vaporCorrectionSize', () => {
  it('at 1 atm the correction is small, at 500 kPa it exceeds σT', () => {
    const low = vaporCorrectionSize(truth, isobaric(101_325, 1))
    const high = vaporCorrectionSize(truth, isobaric(500_000, 1))
    expect(low.kind).toBe('isobaric')
    expect(low.correlation).toBe('tsonopoulos')
    expect(high.maxAbsDT as number).toBeGreaterThan(low.maxAbsDT as number)
    // The same numbers as the two solvers side by side at one point (virial − ideal).
    const x1 = isobaric(500_000, 1)[10].x1
    const dT = Math.abs(
      bubbleTemperature(truth, { P: 500_000, x1 }).T -
        bubbleTemperature({ ...truth, vapor: undefined }, { P: 500_000, x1 }).T,
    )
    expect(high.maxAbsDT as number).toBeGreaterThanOrEqual(dT - 1e-9)
    expect(high.exceedsUncertainty).toBe(true)
    expect(high.maxAbsDT as number).toBeGreaterThan(0.1)
  })
  it('isothermal data compare pressures', () => {
    const r = vaporCorrectionSize(truth, isothermalExact(363.15))
    expect(r.kind).toBe('isothermal')
    expect(r.maxAbsDP as number).toBeGreaterThan(0)
    expect(r.maxAbsDT).toBeUndefined()
  })
  it('refuses without a virial vapour', () => {
    expect(() => vaporCorrectionSize({ vaporPressure, activity: truth.activity }, isothermalExact(363.15))).toThrow(
      'The size of the vapour correction needs a virial vapour model',
    )
  })
})

describe('the main solvers use γ–φ for a virial vapour (properties)', () => {
  it('bubble and dew points are inverse to each other, and φ is reported', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.02, max: 0.98, noNaN: true }),
        fc.double({ min: 20_000, max: 800_000, noNaN: true }),
        (x1, P) => {
          const b = bubbleTemperature(truth, { P, x1 })
          expect(b.phi).toBeDefined()
          const d = dewTemperature(truth, { P, y1: b.y1 })
          expect(d.x1).toBeCloseTo(x1, 6)
          expect(d.T).toBeCloseTo(b.T, 5)
          const bp = bubblePressure(truth, { T: b.T, x1 })
          expect(bp.P / P).toBeCloseTo(1, 7)
          const dp = dewPressure(truth, { T: b.T, y1: b.y1 })
          expect(dp.P / P).toBeCloseTo(1, 6)
          expect(dp.phi).toBeDefined()
        },
      ),
      { numRuns: 40, seed: 7 },
    )
  })

  it('a shifted pressure always shows up with its own sign in dP (measured − calculated)', () => {
    const exact = isothermalExact(363.15, 10)
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 8 }),
        fc.double({ min: 50, max: 2000, noNaN: true }),
        fc.boolean(),
        (i, size, up) => {
          const delta = up ? size : -size
          const pts = exact.map((p, k) => (k === i ? { ...p, P: p.P + delta } : p))
          const fit = fitBinary(pts, { ...base, vapor, objective: 'bubble-pressure' })
          const dP = fit.residuals[i].dP as number
          expect(Math.sign(dP)).toBe(Math.sign(delta))
          expect(Math.abs(dP)).toBeLessThanOrEqual(Math.abs(delta) * 1.0001)
          expect(Math.abs(dP)).toBeGreaterThan(0.5 * Math.abs(delta))
        },
      ),
      { numRuns: 15, seed: 3 },
    )
  })
})

describe('design helpers follow the system’s virial vapour', () => {
  const P = 101_325
  const curve = equilibriumCurve({ system: truth, P })
  const idealCurve = equilibriumCurve({ system: { vaporPressure, activity: truth.activity }, P })
  it('the tabulated curve is the γ–φ bubble curve (interpolation error below 1e-5), not the ideal one', () => {
    for (const x of [0.05, 0.2, 0.33, 0.6, 0.9]) {
      const b = bubbleTemperature(truth, { P, x1: x })
      expect(Math.abs(curve.y(x) - b.y1)).toBeLessThan(1e-5)
      expect(Math.abs((curve.T(x) as number) - b.T)).toBeLessThan(1e-3)
    }
    expect(curve.description).toContain('virial vapour')
    expect(Math.abs(curve.y(0.05) - idealCurve.y(0.05))).toBeGreaterThan(1e-5)
  })
  it('the azeotrope of the curve is the γ–φ azeotrope, and minimum reflux uses that curve', () => {
    const [az] = findAzeotropes(truth, { P })
    expect(az.kind).toBe('minimum-boiling')
    expect(curve.azeotropes[0]).toBeCloseTo(az.x1, 4)
    const b = bubbleTemperature(truth, { P, x1: az.x1 })
    expect(b.y1).toBeCloseTo(az.x1, 8)
    const spec = { xF: 0.02, q: 1, xD: 0.4 }
    const withVirial = minimumReflux({ system: truth, P }, spec)
    const withIdeal = minimumReflux({ system: { vaporPressure, activity: truth.activity }, P }, spec)
    expect(withVirial.Rmin).toBeGreaterThan(0.1)
    expect(withVirial.Rmin).not.toBeCloseTo(withIdeal.Rmin, 4)
  })
})
