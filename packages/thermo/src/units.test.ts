import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  fromKelvin,
  fromPascal,
  PASCALS_PER,
  PRESSURE_UNITS,
  temperatureDifferenceFromKelvin,
  toKelvin,
  toPascal,
} from './units.js'

// Conversion factors to the pascal as printed (7 significant figures) in NIST SP 811 (2008 ed.), App. B.8
// (from memory), and the exact definitions beside them (BIPM SI Brochure, 9th ed., 2019, Table 8).
const NIST_PASCALS_PER: [unit: keyof typeof PASCALS_PER, printed: number, relTol: number][] = [
  ['Pa', 1, 0],
  ['kPa', 1e3, 0],
  ['MPa', 1e6, 0],
  ['bar', 1.0e5, 0], // exact by definition
  ['mbar', 1.0e2, 0],
  ['atm', 1.01325e5, 0], // exact by definition
  ['mmHg', 1.333224e2, 5e-7],
  ['torr', 1.333224e2, 5e-7],
  ['psi', 6.894757e3, 5e-7],
]

describe('the pressure factor table', () => {
  for (const [unit, printed, relTol] of NIST_PASCALS_PER) {
    it(`1 ${unit} = ${printed} Pa (NIST SP 811)`, () => {
      expect(Math.abs(PASCALS_PER[unit] / printed - 1)).toBeLessThanOrEqual(relTol)
      expect(toPascal(1, unit)).toBe(PASCALS_PER[unit])
    })
  }

  it('keeps the digits beyond the printed ones: mmHg = 133.322387415 Pa, torr = 101325/760 Pa, psi = 6894.757293168 Pa (exact definitions)', () => {
    expect(PASCALS_PER.mmHg).toBeCloseTo(133.322387415, 9)
    expect(PASCALS_PER.torr).toBeCloseTo(133.32236842105263, 11)
    expect(PASCALS_PER.psi).toBeCloseTo(6894.757293168, 8)
    // the torr and the conventional mmHg differ by about 1.4e-7 relative (NIST SP 811, from memory): not one unit
    expect(PASCALS_PER.mmHg / PASCALS_PER.torr - 1).toBeCloseTo(1.4e-7, 8)
  })

  it('covers every unit the engine accepts, and nothing else', () => {
    expect([...PRESSURE_UNITS].sort()).toEqual(NIST_PASCALS_PER.map(([u]) => u).sort())
  })
})

describe('temperature scales', () => {
  // Fixed points by definition of the scales: T/K = t/°C + 273.15; t/°F = 1.8·t/°C + 32 (SI Brochure §2.3.1;
  // NIST SP 811, App. B.8, from memory). −40 is where °C and °F meet.
  const points: [K: number, C: number, F: number][] = [
    [273.15, 0, 32],
    [373.15, 100, 212],
    [233.15, -40, -40],
    [0, -273.15, -459.67],
  ]
  for (const [K, C, F] of points) {
    it(`${K} K = ${C} °C = ${F} °F`, () => {
      expect(toKelvin(C, 'C')).toBeCloseTo(K, 10)
      expect(toKelvin(F, 'F')).toBeCloseTo(K, 10)
      expect(fromKelvin(K, 'C')).toBeCloseTo(C, 10)
      expect(fromKelvin(K, 'F')).toBeCloseTo(F, 10)
      expect(fromKelvin(K, 'K')).toBe(K)
    })
  }

  it('a difference of 1 K is 1 °C and 1.8 °F', () => {
    expect(temperatureDifferenceFromKelvin(1, 'C')).toBe(1)
    expect(temperatureDifferenceFromKelvin(1, 'K')).toBe(1)
    expect(temperatureDifferenceFromKelvin(1, 'F')).toBeCloseTo(1.8, 12)
  })

  it('refuses an unknown temperature unit with the exact message', () => {
    expect(() => fromKelvin(300, 'R' as never)).toThrow('Unknown temperature unit "R"; use K, C or F.')
    expect(() => temperatureDifferenceFromKelvin(1, 'degC' as never)).toThrow('Unknown temperature unit "degC"')
  })
})

describe('round trips (property)', () => {
  it('fromPascal(toPascal(v, u), u) = v for every unit', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e9, max: 1e9, noNaN: true }), fc.constantFrom(...PRESSURE_UNITS), (v, u) => {
        expect(fromPascal(toPascal(v, u), u)).toBeCloseTo(v, Math.max(0, 10 - Math.ceil(Math.log10(Math.abs(v) + 1))))
      }),
    )
  })
  it('fromKelvin(toKelvin(v, u), u) = v for every scale', () => {
    fc.assert(
      fc.property(fc.double({ min: -500, max: 5000, noNaN: true }), fc.constantFrom('K', 'C', 'F' as const), (v, u) => {
        expect(fromKelvin(toKelvin(v, u), u)).toBeCloseTo(v, 9)
      }),
    )
  })
})
