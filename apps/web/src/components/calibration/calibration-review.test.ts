import { compositionFromAreas, fitCalibration } from '@ebullio/thermo'
import { describe, expect, it } from 'vitest'
import { calibrationPlotData, standardReviews, typicalSample } from './calibration-review'

// Invented standards: response factor k = 1.25 (A1/A2 = k·n1/n2) with small replicate scatter.
const standards = [0.1, 0.3, 0.5, 0.7, 0.9].map((x1, i) => {
  const r = (1.25 * x1) / (1 - x1)
  const e = [0.004, -0.003, 0.002, -0.002, 0.003][i]
  return {
    label: `S${i + 1}`,
    composition: { x1 },
    injections: [
      { area1: r * (1 + e), area2: 1 },
      { area1: r * (1 - e), area2: 1 },
      { area1: r * (1 + e / 2), area2: 1 },
    ],
  }
})
const rf = fitCalibration({ model: 'response-factor', molarMasses: [58.08, 32.04], standards })
const lin = fitCalibration({ model: 'linear', molarMasses: [58.08, 32.04], standards })

describe('calibration plot', () => {
  it('draws the response factor as area ratio against mole ratio, line through the origin with slope k and a ±2u(k) band', () => {
    const p = calibrationPlotData(rf)
    const k = rf.coefficients[0]
    expect(p.standards.map((s) => s.x)).toEqual(standards.map((s) => s.composition.x1 / (1 - s.composition.x1)))
    const last = p.line.at(-1)!
    expect(last.y / last.x).toBeCloseTo(k, 12)
    expect(p.logScale).toBe(true)
    expect(p.line[0].x).toBeCloseTo(p.standards[0].x / 1.25, 12)
    const i = 20
    expect(p.upper[i].y - p.line[i].y).toBeCloseTo(2 * rf.standardErrors[0] * p.line[i].x, 12)
    expect(p.line[i].y - p.lower[i].y).toBeCloseTo(p.upper[i].y - p.line[i].y, 12)
  })

  it('draws a linear calibration as x1 against area fraction; its band is narrowest inside the standards', () => {
    const p = calibrationPlotData(lin)
    expect(p.xName).toBe('area fraction A₁/(A₁+A₂)')
    const widths = p.upper.map((u, i) => u.y - p.lower[i].y)
    const mid = widths[Math.floor(widths.length / 2)]
    expect(mid).toBeLessThan(widths[0])
    expect(mid).toBeLessThan(widths.at(-1)!)
    // at a standard's signal the line equals the engine's read-back
    const s = lin.residuals[2]
    const y = lin.coefficients[0] + lin.coefficients[1] * s.signal
    expect(y).toBeCloseTo(s.x1Predicted, 12)
  })
})

describe('standards against the replicate limit', () => {
  it('judges each standard’s RSD against the limit and keeps its residual', () => {
    const rows = standardReviews(rf, 0.005)
    expect(rows.map((r) => r.label)).toEqual(['S1', 'S2', 'S3', 'S4', 'S5'])
    for (const [i, r] of rows.entries()) {
      expect(r.residual).toBe(rf.residuals[i].residual)
      expect(r.withinLimit).toBe(rf.residuals[i].replicateRsd! <= 0.005)
    }
    // S1 was injected with ±0.4 %: sample RSD of (1.004, 0.996, 1.002)·r is 0.42 %
    expect(rows[0].replicateRsd).toBeCloseTo(0.0042, 4)
    expect(standardReviews(rf, 0.004)[0].withinLimit).toBe(false)
  })
})

describe('typical sample', () => {
  it('is read by the engine at the middle of the calibrated range with the method repeatability', () => {
    const t = typicalSample(rf)
    const rs = t.injections.map((i) => i.area1 / i.area2)
    const mean = (rs[0] + rs[1]) / 2
    const sd = Math.abs(rs[0] - rs[1]) / Math.SQRT2
    expect(sd / mean).toBeCloseTo(rf.repeatability!.ratioRsd, 12)
    expect(t.result).toEqual(compositionFromAreas(rf, { injections: t.injections }))
    const b = t.result.uncertaintyBudget
    expect(t.result.standardUncertainty).toBeCloseTo(Math.hypot(b.replicate, b.calibration, b.betweenStandards), 15)
    expect(t.result.outsideCalibratedRange).toBe(false)
  })
})
