import { describe, expect, it } from 'vitest'
import { proseP } from './pressure-text'

// Conversions: BIPM SI Brochure, 9th ed. (2019), Table 8: 1 bar = 1e5 Pa, 1 atm = 101325 Pa.
const bar = { pFromPa: (P: number) => P / 1e5, pDecimals: () => 4, pLabel: () => 'bar' }
const kPa = { pFromPa: (P: number) => P / 1e3, pDecimals: () => 2, pLabel: () => 'kPa' }

describe('proseP', () => {
  it("drops trailing zeros but keeps the unit's rounding", () => {
    expect(proseP(bar, 4e6)).toBe('40 bar')
    expect(proseP(bar, 500)).toBe('0.005 bar')
    expect(proseP(bar, 5e6)).toBe('50 bar')
    expect(proseP(bar, 101325)).toBe('1.0133 bar')
    expect(proseP(kPa, 101325)).toBe('101.33 kPa')
    expect(proseP(kPa, 4e6)).toBe('4000 kPa')
    expect(proseP(kPa, 101300)).toBe('101.3 kPa')
  })
  it('shows a dash for a missing value', () => {
    expect(proseP(bar, null)).toBe('—')
    expect(proseP(bar, Number.NaN)).toBe('—')
  })
})
