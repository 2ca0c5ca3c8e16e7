import { describe, expect, it } from 'vitest'
import { equilibriumCurve } from './equilibrium-curve.js'
import { monotoneSpline } from './monotone-spline.js'
import { margulesTable } from './test-curves.js'

describe('equilibriumCurve', () => {
  it('constant α: y(x) and x(y) are inverse and α is constant', () => {
    const c = equilibriumCurve({ alpha: 2.5 })
    expect(c.y(0.4)).toBeCloseTo(1 / 1.6, 14)
    expect(c.x(c.y(0.37))).toBeCloseTo(0.37, 14)
    expect(c.alpha(0.8)).toBe(2.5)
    expect(c.T(0.5)).toBeNull()
    expect(c.azeotropes).toEqual([])
  })

  it('a table is interpolated monotonically, passes its rows, adds the ends and inverts exactly', () => {
    const rows = [
      { x: 0.059, y: 0.271 },
      { x: 0.145, y: 0.521 },
      { x: 0.254, y: 0.701 },
      { x: 0.398, y: 0.836 },
      { x: 0.594, y: 0.925 },
      { x: 0.867, y: 0.984 },
    ]
    const c = equilibriumCurve({ table: rows })
    rows.forEach((r) => expect(c.y(r.x)).toBeCloseTo(r.y, 14))
    expect(c.y(0)).toBe(0)
    expect(c.y(1)).toBe(1)
    for (let x = 0.01; x < 1; x += 0.01) {
      expect(c.y(x + 0.005)).toBeGreaterThan(c.y(x))
      expect(c.x(c.y(x))).toBeCloseTo(x, 12)
    }
  })

  it('finds the azeotrope of a Margules table', () => {
    // symmetric Margules A = 1.2 with equal vapour pressures: azeotrope at x = 0.5 by symmetry
    expect(equilibriumCurve({ table: margulesTable(1.2, 1) }).azeotropes[0]).toBeCloseTo(0.5, 6)
  })

  it('the monotone spline reproduces a cubic-free straight line exactly', () => {
    const s = monotoneSpline([0, 0.3, 1], [0, 0.6, 2])
    expect(s.at(0.77)).toBeCloseTo(1.54, 14)
    expect(s.inverse(1.54)).toBeCloseTo(0.77, 14)
  })

  it.each([
    [
      { alpha: 1 },
      'The relative volatility alpha must be a number greater than 1 (component 1 the more volatile); got 1.',
    ],
    [
      { alpha: Number.NaN },
      'The relative volatility alpha must be a number greater than 1 (component 1 the more volatile); got NaN.',
    ],
    [{ table: [{ x: 0.2, y: 0.4 }] }, 'The equilibrium table needs at least 2 rows.'],
    [
      {
        table: [
          { x: 0.2, y: 0.4 },
          { x: 0.1, y: 0.5 },
        ],
      },
      'Equilibrium table row 2: x and y must both increase from row to row.',
    ],
    [
      {
        table: [
          { x: 0.2, y: 1.4 },
          { x: 0.3, y: 0.5 },
        ],
      },
      'Equilibrium table row 1: x and y must be mole fractions between 0 and 1 and T, if given, a positive number of kelvins.',
    ],
    [{}, 'Give the equilibrium as { alpha }, { system, P } or { table }.'],
  ])('rejects %j', (source, message) => {
    expect(() => equilibriumCurve(source as never)).toThrow(message)
  })
})
