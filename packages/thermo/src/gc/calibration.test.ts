import { describe, expect, it } from 'vitest'
import { fitCalibration } from './calibration.js'
import type { CalibrationStandard } from './gc-types.js'

/** Noise-free areas for a true response factor k: A1/A2 = k·x/(1 − x). */
function exactStandard(x1: number, k: number, injections = 2): CalibrationStandard {
  return {
    composition: { x1 },
    injections: Array.from({ length: injections }, () => ({ area1: 1000 * k * x1, area2: 1000 * (1 - x1) })),
  }
}

describe('fitCalibration', () => {
  it('recovers an exact response factor with R² = 1 and no residuals', () => {
    const cal = fitCalibration({
      model: 'response-factor',
      standards: [0.1, 0.3, 0.5, 0.7, 0.9].map((x) => exactStandard(x, 1.37)),
    })
    expect(cal.coefficients[0]).toBeCloseTo(1.37, 12)
    expect(cal.rSquared).toBeCloseTo(1, 12)
    cal.residuals.forEach((r) => expect(Math.abs(r.residual)).toBeLessThan(1e-12))
    expect(cal.calibratedRange.x1).toEqual([0.1, 0.9])
    expect(cal.signalKind).toBe('area-ratio')
    expect(cal.warnings).toEqual([])
  })

  it('flags curvature when a straight line is forced through a curved area-fraction relation', () => {
    // k = 2 makes x1(f) = f/(f + 2(1 − f)) visibly curved
    const cal = fitCalibration({
      model: 'linear',
      standards: [0.1, 0.25, 0.4, 0.55, 0.7, 0.85].map((x) => exactStandard(x, 2)),
    })
    expect(cal.warnings.some((w) => w.startsWith('Curvature: an extra squared term is significant'))).toBe(true)
    const quad = fitCalibration({
      model: 'quadratic',
      standards: [0.1, 0.25, 0.4, 0.55, 0.7, 0.85].map((x) => exactStandard(x, 2)),
    })
    expect(quad.coefficients).toHaveLength(3)
    expect(quad.covariance).toHaveLength(3)
    expect(quad.rSquared).toBeGreaterThan(cal.rSquared)
  })

  it('says when curvature cannot be tested', () => {
    const cal = fitCalibration({ model: 'linear', standards: [0.2, 0.5, 0.8].map((x) => exactStandard(x, 1)) })
    expect(cal.warnings).toEqual([
      'With 3 standards the curvature of the linear model cannot be tested; 4 or more are needed.',
    ])
  })

  it('warns about a standard whose replicates exceed 2 % RSD', () => {
    const standards = [0.2, 0.4, 0.6, 0.8].map((x) => exactStandard(x, 1))
    standards[1] = {
      label: 'vial B',
      composition: { x1: 0.4 },
      injections: [
        { area1: 400, area2: 600 },
        { area1: 430, area2: 600 },
      ],
    }
    const cal = fitCalibration({ model: 'response-factor', standards })
    expect(cal.residuals[1].replicateRsd).toBeCloseTo(0.0511, 3)
    expect(cal.warnings[0]).toBe(
      'vial B (x1 = 0.400): replicate area ratios scatter by 5.1 % RSD, above the usual 2 %; re-inject or check the integration.',
    )
  })

  it('converts mass fractions with the molar masses', () => {
    // ethanol (46.07 g/mol) / water (18.015 g/mol), w1 = 0.5 → x1 = 0.2811 (computed by hand)
    const cal = fitCalibration({
      model: 'response-factor',
      molarMasses: [46.07, 18.015],
      standards: [{ composition: { w1: 0.5 }, injections: [{ area1: 0.2811, area2: 0.7189 }] }, exactStandard(0.6, 1)],
    })
    expect(cal.residuals[0].x1).toBeCloseTo(0.28112, 4)
  })
})

describe('fitCalibration bad input', () => {
  const good = [0.2, 0.5, 0.8].map((x) => exactStandard(x, 1))
  const cases: [string, () => unknown, string][] = [
    [
      'zero area',
      () =>
        fitCalibration({
          model: 'linear',
          standards: [good[0], { composition: { x1: 0.5 }, injections: [{ area1: 0, area2: 5 }] }, good[2]],
        }),
      'Standard 2, injection 1: area1 must be a positive peak area; got 0.',
    ],
    [
      'negative area',
      () =>
        fitCalibration({
          model: 'linear',
          standards: [good[0], good[1], { composition: { x1: 0.8 }, injections: [{ area1: 3, area2: -5 }] }],
        }),
      'Standard 3, injection 1: area2 must be a positive peak area; got -5.',
    ],
    [
      'missing area',
      () =>
        fitCalibration({
          model: 'linear',
          standards: [{ composition: { x1: 0.2 }, injections: [{ area1: 3 } as never] }, good[1], good[2]],
        }),
      'Standard 1, injection 1: area2 is missing.',
    ],
    [
      'no injections',
      () =>
        fitCalibration({
          model: 'linear',
          standards: [good[0], { composition: { x1: 0.5 }, injections: [] }, good[2]],
        }),
      'Standard 2 has no injections.',
    ],
    [
      'too few',
      () => fitCalibration({ model: 'quadratic', standards: good }),
      'A quadratic calibration needs at least 4 standards; got 3.',
    ],
    [
      'x1 out of range',
      () =>
        fitCalibration({
          model: 'linear',
          standards: [good[0], { composition: { x1: 1.2 }, injections: good[1].injections }, good[2]],
        }),
      'Standard 2: x1 must lie strictly between 0 and 1; got 1.2.',
    ],
    [
      'both x1 and w1',
      () =>
        fitCalibration({
          model: 'linear',
          standards: [{ composition: { x1: 0.2, w1: 0.3 } as never, injections: good[0].injections }, good[1], good[2]],
        }),
      'Standard 1: give the composition as x1 (mole fraction) or w1 (mass fraction), not both.',
    ],
    [
      'w1 without M',
      () =>
        fitCalibration({
          model: 'linear',
          standards: [{ composition: { w1: 0.3 }, injections: good[0].injections }, good[1], good[2]],
        }),
      'Standard 1 is given as a mass fraction: pass molarMasses [M1, M2] in g/mol to convert it.',
    ],
    [
      'bad M',
      () => fitCalibration({ model: 'linear', molarMasses: [46, 0], standards: good }),
      'molarMasses must be two positive numbers in g/mol; got [46,0].',
    ],
    [
      'unknown model',
      () => fitCalibration({ model: 'cubic' as never, standards: good }),
      "Unknown calibration model 'cubic'; use 'response-factor', 'linear' or 'quadratic'.",
    ],
    [
      'identical standards',
      () => fitCalibration({ model: 'linear', standards: [good[1], good[1], good[1]] }),
      'The standards do not determine the calibration: their area ratios are too alike. Add standards spread over the working range.',
    ],
  ]
  it.each(cases)('%s', (_name, run, message) => {
    expect(run).toThrow(message)
    try {
      run()
    } catch (e) {
      expect((e as Error).name).toBe('ThermoError')
      expect((e as Error).message).toBe(message)
    }
  })
})
