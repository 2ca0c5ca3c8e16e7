import { describe, expect, it } from 'vitest'
import { calibrationModelLabel, coefficientsText, coverageText, rangeText, usedByText } from './calibration-text'

describe('calibration words', () => {
  it('names the models as chemists say them and keeps an unknown id', () => {
    expect(calibrationModelLabel('response-factor')).toBe('Relative response factor')
    expect(calibrationModelLabel('cubic')).toBe('cubic')
  })
  it('writes coefficients with their standard errors and the calibrated range', () => {
    expect(coefficientsText({ coefficientNames: ['k'], coefficients: [1.317562], standardErrors: [0.001312] })).toBe(
      'k = 1.31756 ± 0.0013',
    )
    expect(rangeText({ rangeMin: 0.02, rangeMax: 0.9851 })).toBe('x₁ 0.020–0.985')
    expect(usedByText(0)).toBe('used by no data set yet')
    expect(usedByText(2)).toBe('used by 2 data sets')
  })
  it('says which injections a partial sample rests on', () => {
    const full = { liquid: { used: 2, of: 2 }, vapour: { used: 2, of: 2 }, unreadRows: [] }
    expect(coverageText({ partial: false, errorRows: [], coverage: full })).toBeNull()
    expect(coverageText({ partial: true, errorRows: [10], coverage: { ...full, liquid: { used: 1, of: 2 } } })).toBe(
      'liquid: 1 of 2 injections used',
    )
    expect(
      coverageText({
        partial: true,
        errorRows: [5],
        coverage: { ...full, vapour: { used: 1, of: 1 }, unreadRows: [5] },
      }),
    ).toBe('line 5 not used (phase unreadable)')
  })
})
