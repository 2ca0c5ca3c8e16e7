import { describe, expect, it } from 'vitest'
import { fitCalibration } from './calibration.js'
import { compositionFromAreas } from './composition.js'

const standards = [0.1, 0.3, 0.5, 0.7, 0.9].map((x1, i) => ({
  composition: { x1 },
  // ±0.5 % alternating scatter so that the calibration has a non-zero covariance
  injections: [
    { area1: 1.5 * x1 * (1 + (i % 2 ? 0.005 : -0.005)), area2: 1 - x1 },
    { area1: 1.5 * x1, area2: 1 - x1 },
  ],
}))

describe('compositionFromAreas', () => {
  const cal = fitCalibration({ model: 'response-factor', standards })

  it('inverts the response factor and combines the uncertainty parts in quadrature', () => {
    const r = compositionFromAreas(cal, {
      injections: [
        { area1: 1.5 * 0.4, area2: 0.6 },
        { area1: 1.5 * 0.4 * 1.01, area2: 0.6 },
      ],
    })
    expect(r.x1).toBeCloseTo(0.4, 2)
    const b = r.uncertaintyBudget
    expect(r.standardUncertainty).toBeCloseTo(
      Math.sqrt(b.replicate ** 2 + b.calibration ** 2 + b.betweenStandards ** 2),
      15,
    )
    expect(r.uncertaintyBudget.replicate).toBeGreaterThan(0)
    expect(r.uncertaintyBudget.calibration).toBeGreaterThan(0)
    expect(r.outsideCalibratedRange).toBe(false)
    expect(r.warnings).toEqual([])
  })

  it('propagates the covariance of a linear calibration: u² = gᵀΣg + s²_between for exact replicates', () => {
    // one injection per standard: no method repeatability, so identical sample replicates leave only the calibration part
    const lin = fitCalibration({
      model: 'linear',
      standards: standards.map((s) => ({ ...s, injections: s.injections.slice(0, 1) })),
    })
    expect(lin.repeatability).toBeNull()
    const f = 0.45
    const r = compositionFromAreas(lin, {
      injections: [
        { area1: f, area2: 1 - f },
        { area1: f, area2: 1 - f },
      ],
    })
    const [[s00, s01], [, s11]] = lin.covariance
    expect(r.uncertaintyBudget.replicate).toBe(0)
    // With one injection per standard nothing separates injection scatter from preparation scatter, so the whole
    // residual scatter of the standards (in x1, n − p degrees of freedom) counts as between-standards scatter.
    const sRes = Math.sqrt(lin.residuals.reduce((t, q) => t + q.residual ** 2, 0) / lin.degreesOfFreedom)
    expect(r.uncertaintyBudget.betweenStandards).toBeCloseTo(sRes, 14)
    expect(r.standardUncertainty).toBeCloseTo(Math.sqrt(s00 + 2 * f * s01 + f * f * s11 + sRes ** 2), 14)
  })

  it('flags a sample outside the calibrated range; one injection uses the method repeatability', () => {
    const r = compositionFromAreas(cal, { injections: [{ area1: 1.5 * 0.97, area2: 0.03 }] })
    expect(r.outsideCalibratedRange).toBe(true)
    expect(r.replicateRsd).toBeNull()
    expect(r.pooledRsd).toBeCloseTo(cal.repeatability!.ratioRsd, 15)
    expect(r.uncertaintyBudget.replicate).toBeGreaterThan(0)
    expect(r.warnings).toEqual([
      'The sample lies outside the calibrated range (standards x1 = 0.100–0.900): the result is an extrapolation.',
    ])
  })

  it('pools the sample RSD with the method repeatability by degrees of freedom', () => {
    const inj = [
      { area1: 0.6, area2: 0.6 },
      { area1: 0.63, area2: 0.6 },
      { area1: 0.6, area2: 0.6 },
    ]
    const r = compositionFromAreas(cal, { injections: inj })
    const nu = cal.repeatability!.degreesOfFreedom
    expect(r.pooledRsd).toBeCloseTo(
      Math.sqrt((2 * r.replicateRsd! ** 2 + nu * cal.repeatability!.ratioRsd ** 2) / (2 + nu)),
      15,
    )
  })

  it('warns when a single injection meets a calibration without replicates', () => {
    const single = fitCalibration({
      model: 'response-factor',
      standards: standards.map((s) => ({ ...s, injections: s.injections.slice(1) })),
    })
    const r = compositionFromAreas(single, { injections: [{ area1: 0.6, area2: 0.6 }] })
    expect(r.uncertaintyBudget.replicate).toBe(0)
    expect(r.warnings).toEqual([
      'One injection only: the replicate scatter is not in the uncertainty; inject at least twice.',
    ])
  })

  it.each([
    [[{ area1: 0, area2: 1 }], 'Injection 1: area1 must be a positive peak area; got 0.'],
    [
      [
        { area1: 1, area2: 1 },
        { area1: 1, area2: -2 },
      ],
      'Injection 2: area2 must be a positive peak area; got -2.',
    ],
    [[{ area1: 1, area2: 1 }, { area2: 1 }], 'Injection 2: area1 is missing.'],
    [[{ area1: Number.NaN, area2: 1 }], 'Injection 1: area1 must be a positive peak area; got NaN.'],
    [[], 'The sample has no injections.'],
  ])('rejects bad areas: %j', (injections, message) => {
    expect(() => compositionFromAreas(cal, { injections: injections as never })).toThrow(message)
  })
})

describe('between-standards scatter', () => {
  // Standards weighed with errors of ±0.004 in x1 (signs alternating), injected three times with 0.1 % scatter:
  // the curve's residuals are far larger than replicate injections explain (invented numbers, constructed for the check).
  const offsets = [0.004, -0.004, 0.004, -0.004, 0.004, -0.004]
  const weighed = [0.1, 0.25, 0.4, 0.55, 0.7, 0.85].map((x1, i) => {
    const trueX = x1 + offsets[i]
    const r = (1.3 * trueX) / (1 - trueX)
    return { composition: { x1 }, injections: [0.999, 1, 1.001].map((f) => ({ area1: r * f, area2: 1 })) }
  })
  const cal = fitCalibration({ model: 'response-factor', standards: weighed })

  it("carries the standards' own scatter into every sample, however often it is injected", () => {
    const inj = Array.from({ length: 6 }, () => ({ area1: 1.3, area2: 1 }))
    const r = compositionFromAreas(cal, { injections: inj })
    expect(r.uncertaintyBudget.betweenStandards).toBeGreaterThan(0.003)
    expect(r.uncertaintyBudget.betweenStandards).toBeLessThan(0.006)
    expect(r.standardUncertainty).toBeGreaterThan(r.uncertaintyBudget.betweenStandards)
    expect(r.uncertaintyBudget.replicate).toBeLessThan(0.0005)
  })

  it('adds nothing when the standards sit on the curve within their replicate scatter', () => {
    const exact = [0.1, 0.3, 0.5, 0.7, 0.9].map((x1) => ({
      composition: { x1 },
      injections: [
        { area1: 1.5 * x1, area2: 1 - x1 },
        { area1: 1.5 * x1 * 1.002, area2: 1 - x1 },
      ],
    }))
    const c = fitCalibration({ model: 'response-factor', standards: exact })
    expect(
      compositionFromAreas(c, { injections: [{ area1: 0.75, area2: 0.5 }] }).uncertaintyBudget.betweenStandards,
    ).toBe(0)
  })
})
