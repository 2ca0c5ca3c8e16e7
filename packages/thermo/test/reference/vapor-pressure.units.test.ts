import { describe, expect, it } from 'vitest'
import { fromKelvin, fromPascal, toKelvin, toPascal } from '../../src/index.js'

// Unit definitions: BIPM SI Brochure, 9th ed. (2019), Table 8 (bar, mmHg = 133.322 Pa, the °C offset);
// the standard atmosphere = 101325 Pa exactly and torr = 101325/760 Pa (definitions); the conventional
// millimetre of mercury 133.322387415 Pa and the psi 6894.757 Pa from NIST SP 811 (2008), App. B.8 (from memory).
const cases: [string, number, number, number][] = [
  ['1 atm', toPascal(1, 'atm'), 101325, 0],
  ['760 torr', toPascal(760, 'torr'), 101325, 1e-9],
  ['760 mmHg', toPascal(760, 'mmHg'), 101325.01, 0.01],
  ['1 bar', toPascal(1, 'bar'), 1e5, 0],
  ['1 psi', toPascal(1, 'psi'), 6894.757, 0.001],
  ['101.325 kPa', toPascal(101.325, 'kPa'), 101325, 1e-9],
  ['0 °C', toKelvin(0, 'C'), 273.15, 1e-12],
  ['212 °F', toKelvin(212, 'F'), 373.15, 1e-9],
  ['300 K in °C', fromKelvin(300, 'C'), 26.85, 1e-9],
  ['101325 Pa in mmHg', fromPascal(101325, 'mmHg'), 760, 2e-4],
]

describe('unit conversion at the edges', () => {
  for (const [what, got, expected, tol] of cases) {
    it(`${what} = ${expected}`, () => expect(Math.abs(got - expected)).toBeLessThanOrEqual(tol))
  }
  it('an unknown unit is refused with an exact message', () => {
    expect(() => toPascal(1, 'inHg' as never)).toThrow(
      'Unknown pressure unit "inHg"; use Pa, kPa, MPa, bar, mbar, atm, mmHg, torr, psi.',
    )
    expect(() => toKelvin(1, 'R' as never)).toThrow('Unknown temperature unit "R"; use K, C or F.')
  })
})
