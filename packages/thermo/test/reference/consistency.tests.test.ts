import { describe, expect, it } from 'vitest'
import {
  bubbleTemperature,
  heringtonAreaTest,
  pointTest,
  pureComponentCheck,
  type BinaryPoint,
  type BinarySystem,
} from '../../src/index.js'
import { b2, CAL, TABLE_12_5 } from './helpers/constants.js'
import { seededRandom as prng } from '../../src/random.js'

// Consistency tests on data whose consistency is known by construction: points generated from a gE model
// (SVNA 7th ed. Table 12.5 1-propanol/water NRTL, S; Table B.2 Antoine, S) obey Gibbs–Duhem; the same
// points with a composition-dependent error in y do not. Criteria: Herington D − J < 10
// (J. Inst. Petrol. 37 (1951) 457, M); Van Ness–Byer–Gibbs mean |Δy| < 0.01 (AIChE J. 19 (1973) 238, limit M).
const pw = TABLE_12_5.propanolWater
const vaporPressure: BinarySystem['vaporPressure'] = [b2('1-propanol'), b2('water')]
const system: BinarySystem = {
  vaporPressure,
  activity: { kind: 'nrtl', b12: pw.b12 * CAL, b21: pw.b21 * CAL, alpha: pw.alpha },
}

/** 19 isobaric points; `bias` adds bias·4·x1·x2 to y1 (largest mid-range, zero at the ends). */
function generate(noise: number, bias: number): BinaryPoint[] {
  const rng = prng(3)
  return Array.from({ length: 19 }, (_, i) => {
    const x1 = 0.05 * (i + 1)
    const b = bubbleTemperature(system, { P: 101325, x1 })
    return {
      T: b.T + 0.1 * noise * rng.gaussian(),
      P: 101325,
      x1,
      y1: b.y1 + 0.005 * noise * rng.gaussian() + 4 * bias * x1 * (1 - x1),
    }
  })
}

describe('Herington area test', () => {
  it('passes consistent data, with and without measurement noise', () => {
    for (const noise of [0, 1]) {
      const r = heringtonAreaTest(generate(noise, 0), { vaporPressure })
      expect(r.passed).toBe(true)
      expect(r.D - r.J).toBeLessThan(10)
      expect(r.rule).toBe('trapezoidal rule over the measured compositions (no extrapolation to the pure ends)')
      expect(r.integrand.length).toBe(19)
    }
  })
  it('fails data whose y1 is 0.05 too low mid-range', () => {
    expect(heringtonAreaTest(generate(0, -0.05), { vaporPressure }).passed).toBe(false)
  })
  it('computes D and J as defined, on a hand-worked three-point case', () => {
    // Same vapour-pressure model for both components, so ln(γ1/γ2) = ln α12; α chosen for ln α = 1, 0, −0.5.
    // Trapezoids: ∫ = 0.125·(1 + 0) + 0.125·(0 − 0.5) = 0.0625; ∫|·| = 0.125 + 0.0625 = 0.1875 → D = 33.333;
    // J = 150·(360 − 350)/350 = 4.2857.
    const same = b2('benzene')
    const point = (x1: number, lnAlpha: number, T: number) => {
      const a = Math.exp(lnAlpha)
      return { T, P: 101325, x1, y1: (a * x1) / (1 + (a - 1) * x1) }
    }
    const r = heringtonAreaTest([point(0.25, 1, 350), point(0.5, 0, 355), point(0.75, -0.5, 360)], {
      vaporPressure: [same, same],
    })
    expect(r.D).toBeCloseTo(100 / 3, 9)
    expect(r.J).toBeCloseTo(1500 / 350, 9)
    expect(r.passed).toBe(false)
  })
  it('needs three usable points', () => {
    expect(() => heringtonAreaTest(generate(0, 0).slice(0, 2), { vaporPressure })).toThrow(
      'The area test needs at least 3 mixture points with 0 < x1 < 1 and 0 < y1 < 1; got 2.',
    )
  })
})

describe('Van Ness–Byer–Gibbs point test', () => {
  it('passes consistent noisy data: the T–x fit predicts y to about the noise', () => {
    const r = pointTest(generate(1, 0), { vaporPressure, model: 'nrtl', alpha: pw.alpha })
    expect(r.passed).toBe(true)
    expect(r.meanAbsDeltaY).toBeLessThan(0.006)
  })
  it('fails data with a 0.03 error in y1 that the area test lets through', () => {
    // The area test can miss errors that largely cancel in the integral, which is why the point test exists.
    const points = generate(0, 0.03)
    expect(heringtonAreaTest(points, { vaporPressure }).passed).toBe(true)
    const r = pointTest(points, { vaporPressure, model: 'nrtl', alpha: pw.alpha })
    expect(r.passed).toBe(false)
    expect(r.meanAbsDeltaY).toBeGreaterThan(0.015)
  })
})

describe('pure-component boiling points against the vapour-pressure models', () => {
  // Table B.2 normal boiling points (S): water 100.0 °C, 1-propanol 97.2 °C.
  it('accepts the handbook boiling points and flags one 0.6 K off', () => {
    const points = [
      { T: 373.15, P: 101325, x1: 0, y1: 0 },
      { T: 97.8 + 273.15, P: 101325, x1: 1, y1: 1 },
      { T: 365, P: 101325, x1: 0.3, y1: 0.4 },
    ]
    const r = pureComponentCheck(points, { vaporPressure })
    expect(r.checks.map((c) => [c.index, c.component, c.passed])).toEqual([
      [0, 2, true],
      [1, 1, false],
    ])
    expect(Math.abs(r.checks[1].dT - 0.6)).toBeLessThan(0.01)
    expect(r.passed).toBe(false)
  })
  it('refuses a bad tolerance with an exact message', () => {
    expect(() => pureComponentCheck([], { vaporPressure, tolerance: 0 })).toThrow(
      'The tolerance must be a positive number of kelvins; got 0.',
    )
  })
  it('says so when there is nothing to compare', () => {
    expect(pureComponentCheck([{ T: 365, P: 101325, x1: 0.3 }], { vaporPressure }).warnings).toEqual([
      'No pure-component points (x1 = 0 or 1) to compare with the vapour-pressure models.',
    ])
  })
})

describe('Herington J spans the system boiling range', () => {
  // Herington's J uses the boiling range of the system (E. F. G. Herington, J. Inst. Petrol. 37 (1951) 457;
  // the use of the whole range is from memory). Points only from x1 = 0.2 to 0.8 must not shrink it.
  it('takes the pure boiling points at the mean pressure into Tmax and Tmin', () => {
    const P = 101325
    const points: BinaryPoint[] = [0.2, 0.35, 0.5, 0.65, 0.8].map((x1) => {
      const b = bubbleTemperature(system, { P, x1 })
      return { T: b.T, P, x1, y1: b.y1 }
    })
    const r = heringtonAreaTest(points, { vaporPressure })
    // SVNA Table B.2: water boils at 100.0 °C; 1-propanol at 97.2 °C; the mixture's minimum lies inside the points.
    expect(r.Tmax - 273.15).toBeCloseTo(100.0, 1)
    expect(r.Tmin).toBeCloseTo(Math.min(...points.map((p) => p.T)), 10)
    expect(r.J).toBeCloseTo((150 * (r.Tmax - r.Tmin)) / r.Tmin, 12)
    expect(r.temperatureSpan).toBe('measured points and both pure boiling points at the mean pressure (101.33 kPa)')
  })
})
