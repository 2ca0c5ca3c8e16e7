import { describe, expect, it } from 'vitest'
import { equilibriumCurve } from './equilibrium-curve.js'
import { DESIGN_CAUTION } from './design-notes.js'
import { fenske } from './fenske.js'
import { mccabeThiele } from './mccabe-thiele.js'
import { minimumReflux } from './minimum-reflux.js'
import { huggingTable, margulesTable } from './test-curves.js'

const base = { xF: 0.45, q: 1, xD: 0.95, xB: 0.1 }

describe('mccabeThiele', () => {
  it('returns lines through (xD, xD), (xB, xB) meeting on the q-line, and the caution', () => {
    const r = mccabeThiele({ alpha: 2.5 }, { ...base, R: 4 })
    const { rectifying, stripping, intersection } = r.operatingLines
    expect(rectifying.slope * 0.95 + rectifying.intercept).toBeCloseTo(0.95, 14)
    expect(stripping.slope * 0.1 + stripping.intercept).toBeCloseTo(0.1, 14)
    expect(intersection!.x).toBeCloseTo(0.45, 14)
    expect(stripping.slope * intersection!.x + stripping.intercept).toBeCloseTo(intersection!.y, 14)
    expect(r.caution).toBe(DESIGN_CAUTION)
    expect(r.assumptions).toContain('constant molar overflow')
    expect(r.steps[0]).toEqual({ stage: 1, x: expect.closeTo(0.95 / (2.5 - 1.5 * 0.95), 14), y: 0.95, T: null })
  })

  it('accepts R as a multiple of Rmin and needs more stages closer to it', () => {
    const a = mccabeThiele({ alpha: 2.5 }, { ...base, R: { timesMinimum: 1.2 } })
    const b = mccabeThiele({ alpha: 2.5 }, { ...base, R: { timesMinimum: 2 } })
    expect(a.R).toBeCloseTo(1.2 * a.Rmin, 12)
    expect(a.fractionalStages).toBeGreaterThan(b.fractionalStages)
  })

  it('handles a subcooled and a vapour feed (the q-line pinch moves)', () => {
    const sub = minimumReflux({ alpha: 2.5 }, { xF: 0.45, q: 1.3, xD: 0.95 })
    const vap = minimumReflux({ alpha: 2.5 }, { xF: 0.45, q: 0, xD: 0.95 })
    expect(sub.feedPinch.x).toBeGreaterThan(0.45)
    expect(vap.feedPinch.y).toBeCloseTo(0.45, 12)
    expect(vap.Rmin).toBeGreaterThan(sub.Rmin)
    expect(mccabeThiele({ alpha: 2.5 }, { ...base, q: 0, R: 4 }).stages).toBeGreaterThan(0)
  })

  it.each([
    [
      { ...base, R: 1 },
      'R = 1.0000 is not above the minimum reflux Rmin = 1.2559 (pinch at x1 = 0.4500): the column cannot reach xD.',
    ],
    [
      { ...base, R: 0 },
      'R must be a positive reflux ratio L/D, Infinity for total reflux, or { timesMinimum }; got 0.',
    ],
    [{ ...base, R: { timesMinimum: 0.9 } }, 'R.timesMinimum must be a number greater than 1; got 0.9.'],
    [{ ...base, xB: 0.5, R: 4 }, 'The compositions must satisfy xB < xF < xD; got xB = 0.5, xF = 0.45, xD = 0.95.'],
    [{ ...base, xD: 1, R: 4 }, 'xD must be a mole fraction strictly between 0 and 1; got 1.'],
    [{ ...base, q: Number.NaN, R: 4 }, 'q must be a finite number (1 for a saturated-liquid feed); got NaN.'],
  ])('rejects %j', (spec, message) => {
    expect(() => mccabeThiele({ alpha: 2.5 }, spec)).toThrow(message)
  })
})

describe('unreachable targets end with a clear error', () => {
  // invented curve with a minimum-boiling azeotrope at x = 0.5 (symmetric Margules, equal vapour pressures)
  const azeo = { table: margulesTable(1.2, 1) }
  it('xD beyond an azeotrope', () => {
    expect(() => mccabeThiele(azeo, { xF: 0.3, q: 1, xD: 0.9, xB: 0.05, R: 10 })).toThrow(
      'The azeotrope at x1 = 0.5000 lies between xB = 0.05 and xD = 0.9: distillation at this pressure cannot cross it.',
    )
    expect(() => minimumReflux(azeo, { xF: 0.3, q: 1, xD: 0.9 })).toThrow(
      'The azeotrope at x1 = 0.5000 lies between xF = 0.3 and xD = 0.9',
    )
    expect(() => fenske(azeo, { xD: 0.9, xB: 0.05 })).toThrow(
      'The azeotrope at x1 = 0.5000 lies between xB = 0.05 and xD = 0.9',
    )
  })

  it('a stripping-section pinch raises Rmin above the rectifying value', () => {
    // invented curve hugging the diagonal at low x: the stripping line, not the rectifying one, sets Rmin
    const hug = { table: huggingTable() }
    const spec = { xF: 0.5, q: 1, xD: 0.9, xB: 0.05 }
    const rectifyingOnly = minimumReflux(hug, { xF: 0.5, q: 1, xD: 0.9 })
    const both = minimumReflux(hug, spec)
    expect(both.governs).toBe('stripping-tangent-pinch')
    expect(both.Rmin).toBeGreaterThan(rectifyingOnly.Rmin * 1.5)
    expect(() => mccabeThiele(hug, { ...spec, R: 3 })).toThrow(
      /^R = 3\.0000 is not above the minimum reflux Rmin = 4\.32\d\d \(stripping-tangent-pinch at x1 = 0\.0\d+\): the column cannot reach xD\.$/,
    )
    expect(mccabeThiele(hug, { ...spec, R: { timesMinimum: 1.2 } }).stages).toBeGreaterThan(50)
  })

  it('a separation needing more than MAX_STAGES stages stops instead of looping', () => {
    // Fenske: ln(998001)/ln(1.01) ≈ 1388 stages even at total reflux
    expect(() => mccabeThiele({ alpha: 1.01 }, { xF: 0.5, q: 1, xD: 0.999, xB: 0.001, R: Infinity })).toThrow(
      'More than 1000 theoretical stages are needed: even at total reflux the relative volatility is too close to 1 for this separation.',
    )
  })

  it('R just above Rmin needs more than MAX_STAGES stages', () => {
    expect(() =>
      mccabeThiele({ alpha: 1.05 }, { xF: 0.5, q: 1, xD: 0.999, xB: 0.001, R: { timesMinimum: 1.0001 } }),
    ).toThrow(/^More than 1000 theoretical stages are needed: R = \d+\.\d{4} is too close to Rmin = \d+\.\d{4}\.$/)
  })

  it('a multiple of a zero Rmin', () => {
    expect(() => mccabeThiele({ alpha: 3 }, { xF: 0.8, q: 1, xD: 0.85, xB: 0.1, R: { timesMinimum: 2 } })).toThrow(
      'Rmin is 0 for this feed and distillate, so R cannot be a multiple of it; give R as a number.',
    )
  })
})

describe('minimumReflux tangent pinch', () => {
  // invented alcohol–water-like curve: flattens towards the top, so the rectifying line touches it above the feed
  const bent = { table: margulesTable(1.6, 3.2) }
  it('reports the tangent pinch and the line really touches the curve there', () => {
    const curve = equilibriumCurve(bent)
    const r = minimumReflux(bent, { xF: 0.1, q: 1, xD: 0.85 })
    expect(r.governs).toBe('tangent-pinch')
    expect(r.touch.x).toBeGreaterThan(0.1)
    const s = r.Rmin / (r.Rmin + 1)
    const line = (x: number) => s * x + (1 - s) * 0.85
    expect(line(r.touch.x)).toBeCloseTo(curve.y(r.touch.x), 9)
    for (let x = 0.1; x < 0.85; x += 0.01) expect(line(x)).toBeLessThanOrEqual(curve.y(x) + 1e-9)
    expect(r.Rmin).toBeGreaterThan((0.85 - r.feedPinch.y) / (r.feedPinch.y - r.feedPinch.x))
  })

  it('the feed pinch governs for constant α', () => {
    const r = minimumReflux({ alpha: 2.5 }, { xF: 0.45, q: 1, xD: 0.95 })
    expect(r.governs).toBe('pinch')
    // Rmin = (xD − y')/(y' − x') with y' = 2.5·0.45/(1 + 1.5·0.45) (hand calculation)
    const y = 1.125 / 1.675
    expect(r.Rmin).toBeCloseTo((0.95 - y) / (y - 0.45), 12)
  })
})

describe('fenske', () => {
  it.each([
    [{ xD: 0.4, xB: 0.5 }, 'xD must be greater than xB; got xD = 0.4, xB = 0.5.'],
    [{ xD: 0.9, xB: 0 }, 'xB must be a mole fraction strictly between 0 and 1; got 0.'],
  ])('rejects %j', (spec, message) => {
    expect(() => fenske({ alpha: 2 }, spec)).toThrow(message)
  })
  it('says the reboiler is included', () => {
    const r = fenske({ alpha: 2 }, { xD: 0.9, xB: 0.1 })
    expect(r.includesReboiler).toBe(true)
    expect(r.Nmin).toBeCloseTo(Math.log(81) / Math.log(2), 12)
  })
})
