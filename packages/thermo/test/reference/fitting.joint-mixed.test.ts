import { describe, expect, it } from 'vitest'
import { fitJoint, type BinaryPoint, type VaporPressureModel } from '../../src/index.js'

// Joint fit over two isothermal data sets (333.15 K, 363.15 K; bubble-pressure rows) and one isobaric set (250 kPa;
// bubble-temperature rows) against scipy.optimize.least_squares on the same objective.
// Source of the reference optimum: test/reference/joint-fit-reference.py, scipy 1.17.1 least_squares (method 'lm',
// xtol = ftol = gtol = 1e-15), run 2026-12-04. System: 1-propanol (1) / water (2), Antoine constants of Smith,
// Van Ness & Abbott, 7th ed., Table B.2; NRTL α = 0.5081 held (their Table 12.5). The data are invented: generated
// from b12 = 2100, b21 = 6850 J/mol, b12T = −8, b21T = 12 J/(mol·K) plus a deterministic scatter (about 80 Pa,
// 0.1 K, 0.004 in y), frozen here and in the script.
const vaporPressure: [VaporPressureModel, VaporPressureModel] = [
  { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
]
/** x1, P (Pa), y1 at T */
const ISO: [number, [number, number, number][]][] = [
  [
    333.15,
    [
      [0.04, 28478.9, 0.31699],
      [0.1236, 30349.5, 0.36582],
      [0.2073, 30575.4, 0.37575],
      [0.2909, 30602.3, 0.3808],
      [0.3745, 30743.3, 0.39446],
      [0.4582, 30771.5, 0.42487],
      [0.5418, 30399.0, 0.44903],
      [0.6255, 30012.5, 0.4897],
      [0.7091, 28964.4, 0.54402],
      [0.7927, 27634.4, 0.60472],
      [0.8764, 25522.2, 0.70988],
      [0.96, 22268.4, 0.87477],
    ],
  ],
  [
    363.15,
    [
      [0.04, 98408.2, 0.30476],
      [0.1236, 106681.5, 0.37133],
      [0.2073, 107494.3, 0.38454],
      [0.2909, 108195.6, 0.38826],
      [0.3745, 108631.6, 0.41105],
      [0.4582, 108840.0, 0.4386],
      [0.5418, 107982.0, 0.4658],
      [0.6255, 106357.1, 0.5152],
      [0.7091, 103371.8, 0.56655],
      [0.7927, 98737.6, 0.63505],
      [0.8764, 92188.7, 0.74248],
      [0.96, 82464.7, 0.88987],
    ],
  ],
]
/** x1, T (K), y1 at 250 kPa */
const BAR: [number, number, number][] = [
  [0.04, 390.373, 0.29074],
  [0.1236, 387.575, 0.37256],
  [0.2073, 387.119, 0.38313],
  [0.2909, 387.068, 0.39183],
  [0.3745, 386.699, 0.41949],
  [0.4582, 386.793, 0.44227],
  [0.5418, 386.928, 0.47771],
  [0.6255, 387.321, 0.52871],
  [0.7091, 388.29, 0.57895],
  [0.7927, 389.391, 0.65769],
  [0.8764, 391.512, 0.76156],
  [0.96, 394.302, 0.90118],
]
/** scipy 1.17.1 least_squares on the same objective (joint-fit-reference.py). */
const SCIPY = {
  params: [2097.3656089530596, 6918.861826743065, -7.966516429351601, 11.06128124530995],
  objective: 24.358593737801073,
}

describe('joint fit of isothermal and isobaric data sets: the same optimum as scipy.optimize.least_squares', () => {
  const dataSets = [
    ...ISO.map(([T, rows]) => ({
      id: `iso-${T}`,
      kind: 'isothermal' as const,
      points: rows.map(([x1, P, y1]): BinaryPoint => ({ T, P, x1, y1 })),
    })),
    { id: 'bar-250kPa', points: BAR.map(([x1, T, y1]): BinaryPoint => ({ T, P: 250000, x1, y1 })) },
  ]
  const fit = fitJoint({ dataSets, vaporPressure, model: 'nrtl', alpha: 0.5081 })

  it('parameters and objective agree with scipy 1.17.1', () => {
    expect(fit.parameters.map((p) => p.name)).toEqual(['b12', 'b21', 'b12T', 'b21T'])
    fit.parameters.forEach((p, j) => expect(p.value).toBeCloseTo(SCIPY.params[j], j < 2 ? 2 : 4))
    expect(fit.objective / SCIPY.objective).toBeCloseTo(1, 7)
    expect(fit.converged).toBe(true)
  })

  it('per-data-set statistics: dP (Pa) for the isothermal sets, dT (K) for the isobaric one', () => {
    const [a, b, c] = fit.dataSets
    expect(a.kind).toBe('isothermal')
    expect(b.kind).toBe('isothermal')
    expect(c.kind).toBe('isobaric')
    // The scatter put in was about 80 Pa (a sine of amplitude 80: RMS about 57 Pa) and 0.1 K (RMS about 0.07 K).
    for (const d of [a, b]) {
      expect(d.rmsP).toBeGreaterThan(30)
      expect(d.rmsP).toBeLessThan(90)
      expect(Number.isNaN(d.rmsT)).toBe(true)
    }
    expect(c.rmsT).toBeGreaterThan(0.03)
    expect(c.rmsT).toBeLessThan(0.12)
    expect(c.rmsP).toBeUndefined()
    // The RMS over the pooled fit agrees with the members': dP over the 24 isothermal points.
    const pooled = Math.sqrt((a.rmsP! ** 2 * a.n + b.rmsP! ** 2 * b.n) / (a.n + b.n))
    expect(fit.rmsP).toBeCloseTo(pooled, 9)
    expect(fit.range).toEqual({ Tmin: 333.15, Tmax: 394.302, Pmin: 22268.4, Pmax: 250000 })
  })
})
