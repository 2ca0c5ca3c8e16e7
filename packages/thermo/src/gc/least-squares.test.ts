import { describe, expect, it } from 'vitest'
import { leastSquares } from './least-squares.js'

describe('ordinary least squares', () => {
  // Anscombe's first data set (F. J. Anscombe, "Graphs in statistical analysis", The American Statistician 27
  // (1973) 17–21): published fit y = 3.00 + 0.500·x with standard errors 1.12 and 0.118; full digits from
  // numpy 2.4.6 (`numpy.linalg.lstsq`, s² = Σr²/(n − 2), covariance s²·(XᵀX)⁻¹), frozen here.
  const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5]
  const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68]

  it('reproduces the published straight line, its standard errors and s²', () => {
    const fit = leastSquares(
      x.map((v) => [1, v]),
      y,
    )
    expect(fit.coefficients[0]).toBeCloseTo(3.0000909090909094, 10)
    expect(fit.coefficients[1]).toBeCloseTo(0.5000909090909093, 10)
    expect(fit.standardErrors[0]).toBeCloseTo(1.1247467908086437, 10)
    expect(fit.standardErrors[1]).toBeCloseTo(0.11790550059563407, 10)
    expect(fit.residualVariance).toBeCloseTo(1.5291877777777778, 10)
    expect(fit.degreesOfFreedom).toBe(9)
    expect(fit.residuals.reduce((s, r) => s + r, 0)).toBeCloseTo(0, 10) // with an intercept the residuals sum to 0
    expect(fit.covariance[0][1]).toBe(fit.covariance[1][0])
  })

  it('refuses standards that cannot determine the coefficients', () => {
    expect(() =>
      leastSquares(
        [
          [1, 2],
          [1, 2],
          [1, 2],
        ],
        [1, 2, 3],
      ),
    ).toThrow('The standards do not determine the calibration: their area ratios are too alike.')
    expect(() =>
      leastSquares(
        [
          [1, 2],
          [1, 2 + 1e-9],
          [1, 2 - 1e-9],
        ],
        [1, 2, 3],
      ),
    ).toThrow('The standards do not determine the calibration')
  })
})
