import { describe, expect, it } from 'vitest'
import { studentT975, studentTQuantile } from './student-t.js'

// Upper critical values of Student's t: NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.2
// "Critical Values of the Student's t Distribution" (printed to 3 decimals; copied from memory), and the same quantiles to full
// precision from scipy 1.17.1 (`scipy.stats.t.ppf`), frozen here. Columns: ν, p, handbook, scipy.
const TABLE: [dof: number, p: number, handbook: number, scipy: number][] = [
  [1, 0.975, 12.706, 12.706204736174694],
  [2, 0.975, 4.303, 4.302652729749462],
  [3, 0.975, 3.182, 3.1824463052837078],
  [4, 0.975, 2.776, 2.7764451051977934],
  [5, 0.975, 2.571, 2.5705818356363146],
  [6, 0.975, 2.447, 2.4469118511449786],
  [7, 0.975, 2.365, 2.364624251592784],
  [8, 0.975, 2.306, 2.306004135204166],
  [10, 0.975, 2.228, 2.228138851986274],
  [15, 0.975, 2.131, 2.131449545559776],
  [20, 0.975, 2.086, 2.085963447265864],
  [30, 0.975, 2.042, 2.0422724563012378],
  [40, 0.975, 2.021, 2.021075390306273],
  [60, 0.975, 2.0, 2.0002978220142604],
  [100, 0.975, 1.984, 1.9839715185235518],
  [1, 0.95, 6.314, 6.313751514675037],
  [5, 0.95, 2.015, 2.0150483733330233],
  [12, 0.95, 1.782, 1.782287555649319],
  [25, 0.95, 1.708, 1.7081407612518986],
  [2, 0.995, 9.925, 9.924843200918287],
  [9, 0.995, 3.25, 3.249835541592126],
  [100, 0.995, 2.626, 2.6258905214380173],
]

describe('Student-t quantiles', () => {
  for (const [dof, p, handbook, scipy] of TABLE) {
    it(`t(${p}, ${dof}) = ${handbook} (NIST/SEMATECH table; scipy ${scipy})`, () => {
      const t = studentTQuantile(p, dof)
      expect(Math.abs(t - handbook)).toBeLessThanOrEqual(0.0005)
      expect(Math.abs(t / scipy - 1)).toBeLessThan(1e-11)
      expect(studentTQuantile(1 - p, dof)).toBeCloseTo(-t, 10) // the distribution is symmetric
    })
  }

  it('is not the normal 1.96 for small samples, and tends to it for large ones', () => {
    expect(studentT975(3)).toBeGreaterThan(3.18)
    expect(studentT975(29)).toBeCloseTo(2.045229642132703, 9) // scipy 1.17.1
    expect(studentT975(31)).toBeCloseTo(2.039513446396408, 9) // scipy 1.17.1: beyond the old table's end
    expect(studentT975(100000)).toBeCloseTo(1.9599877075346095, 9) // scipy 1.17.1
  })

  it('has no critical value without degrees of freedom', () => {
    expect(studentT975(0)).toBe(Infinity)
  })

  it('refuses a probability outside (0, 1) or a fractional number of degrees of freedom with exact messages', () => {
    expect(() => studentTQuantile(1, 3)).toThrow('The probability must lie strictly between 0 and 1; got 1.')
    expect(() => studentTQuantile(0.9, 2.5)).toThrow(
      'The degrees of freedom must be a whole number of at least 1; got 2.5.',
    )
  })
  it('refuses the edges p = 0 and ν = 0 too, as invalid input', () => {
    for (const [p, dof, message] of [
      [0, 3, 'The probability must lie strictly between 0 and 1; got 0.'],
      [0.975, 0, 'The degrees of freedom must be a whole number of at least 1; got 0.'],
    ] as const) {
      let caught: unknown
      try {
        studentTQuantile(p, dof)
      } catch (e) {
        caught = e
      }
      expect(caught).toMatchObject({ name: 'ThermoError', code: 'invalid-input', message })
    }
  })
  it('gives a finite critical value from the first degree of freedom on', () => {
    expect(studentT975(1)).toBeCloseTo(12.706204736174694, 9) // scipy 1.17.1
  })
})
