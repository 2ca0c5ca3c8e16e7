/**
 * Round trip: standards generated from a known response factor plus seeded noise are calibrated,
 * a sample of known composition is measured, and the true x1 must lie within 3 standard uncertainties.
 * Source: the construction itself (common practice, no source); the noise is a deterministic PRNG,
 * so the test is reproducible.
 */
import { describe, expect, it } from 'vitest'
import { compositionFromAreas, fitCalibration, type CalibrationModel, type Injection } from '../../src/gc/index.js'
import { gaussian, mulberry32 } from '../../src/random.js'

const TRUE_K = 1.37
const RELATIVE_NOISE = 0.008 // 0.8 % on each peak area

function injections(x1: number, count: number, normal: () => number): Injection[] {
  return Array.from({ length: count }, () => ({
    area1: 5.0e5 * TRUE_K * x1 * (1 + RELATIVE_NOISE * normal()),
    area2: 5.0e5 * (1 - x1) * (1 + RELATIVE_NOISE * normal()),
  }))
}

function trial(seed: number, model: CalibrationModel, sampleX1: number) {
  const uniform = mulberry32(seed)
  const normal = () => gaussian(uniform)
  const standards = [0.1, 0.25, 0.4, 0.55, 0.7, 0.85].map((x1) => ({
    composition: { x1 },
    injections: injections(x1, 3, normal),
  }))
  const calibration = fitCalibration({ model, standards })
  const sample = compositionFromAreas(calibration, { injections: injections(sampleX1, 3, normal) })
  return { calibration, sample, z: Math.abs(sample.x1 - sampleX1) / sample.standardUncertainty }
}

describe('GC calibration round trip with seeded noise', () => {
  it('recovers the response factor within 3 standard errors and the sample within 3 u (seed 20240611)', () => {
    const { calibration, sample, z } = trial(20240611, 'response-factor', 0.47)
    expect(Math.abs(calibration.coefficients[0] - TRUE_K)).toBeLessThan(3 * calibration.standardErrors[0])
    expect(z).toBeLessThan(3)
    expect(sample.standardUncertainty).toBeGreaterThan(0.0005)
    expect(sample.standardUncertainty).toBeLessThan(0.01)
  })

  it.each(['response-factor', 'quadratic'] as const)(
    '%s: at least 95 %% of 200 seeded trials lie within 3 u',
    (model) => {
      let inside = 0
      for (let seed = 1; seed <= 200; seed++) if (trial(seed, model, 0.1 + (seed % 8) * 0.1).z < 3) inside++
      expect(inside).toBeGreaterThanOrEqual(190)
    },
  )
})
