import { fromPascal, PASCALS_PER } from '@ebullio/thermo'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { PA_PER, PRESSURE_CHOICES, roundShown, TEMPERATURE_CHOICES, usePreferencesStore } from './preferences'

type PressureChoiceName = (typeof PRESSURE_CHOICES)[number]['value']

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
})

describe('preferences: display units', () => {
  it('offers °F and psi beside the earlier units', () => {
    expect(TEMPERATURE_CHOICES.map((c) => c.label)).toEqual(['°C', 'K', '°F'])
    expect(PRESSURE_CHOICES.map((c) => c.value)).toEqual(['kPa', 'mmHg', 'bar', 'atm', 'psi'])
  })

  it('converts to °F by the definition t/°F = 1.8·(T/K − 273.15) + 32 (NIST SP 811, 2008 ed.; section from memory): water boils at 212 °F, 1 K is 1.8 °F', () => {
    const p = usePreferencesStore()
    p.temperatureUnit = 'F'
    expect(p.tFromK(373.15)).toBeCloseTo(212, 10)
    expect(p.tToK(32)).toBeCloseTo(273.15, 10)
    expect(p.fmtT(373.15)).toBe('212.00 °F')
    expect(p.dT(1)).toBeCloseTo(1.8, 12)
    expect(p.dTLabel()).toBe('°F')
  })

  it('shows a temperature difference ×1.8 in °F and unchanged in K and °C (a 1 K step is 1.8 °F by the definition of the scales, NIST SP 811, 2008 ed., from memory)', () => {
    const p = usePreferencesStore()
    expect(p.fmtDT(0.067)).toBe('0.067 K')
    expect(p.fmtDT(-0.093, 3, true)).toBe('−0.093 K')
    expect(p.fmtDT(-0.093)).toBe('−0.093 K')
    expect(p.fmtDT(-0.0001, 3, true)).toBe('+0.000 K')
    p.temperatureUnit = 'F'
    expect(p.fmtDT(0.067)).toBe('0.121 °F')
    expect(p.fmtDT(0.3, 2, true)).toBe('+0.54 °F')
    expect(p.fmtDT(null)).toBe('—')
    p.temperatureUnit = 'K'
    expect(p.fmtDT(0.3, 1)).toBe('0.3 K')
  })

  it('shows 1 atm as 14.696 psi (1 psi = 6894.757293168 Pa, NIST SP 811, 2008 ed., Appendix B.8, from memory)', () => {
    const p = usePreferencesStore()
    p.pressureUnit = 'psi'
    expect(p.fmtP(101325)).toBe('14.696 psi')
  })

  it('names the condition of a series: its temperature when isothermal, else its pressure, in the chosen units', () => {
    const p = usePreferencesStore()
    // an isothermal series has no nominal pressure; showing 0 kPa (as the list once did) would be a wrong number
    expect(p.fmtCondition({ nominalPressurePa: null, nominalTemperatureK: 328.15 })).toBe('55.00 °C (isothermal)')
    expect(p.fmtCondition({ nominalPressurePa: 101325, nominalTemperatureK: null })).toBe('101.33 kPa')
    expect(p.fmtCondition({ nominalPressurePa: 40000 })).toBe('40.00 kPa')
    expect(p.fmtCondition({ nominalPressurePa: null })).toBe('—')
    p.pressureUnit = 'mmHg'
    p.temperatureUnit = 'F'
    expect(p.fmtCondition({ nominalPressurePa: 101325 })).toBe('760.0 mmHg')
    expect(p.fmtCondition({ nominalPressurePa: null, nominalTemperatureK: 328.15 })).toBe('131.00 °F (isothermal)')
  })

  // Pascals per unit as printed in NIST SP 811 (2008 ed.), App. B.8 (7 significant figures, from memory).
  const PRINTED: [PressureChoiceName, number][] = [
    ['kPa', 1e3],
    ['mmHg', 1.333224e2],
    ['bar', 1e5],
    ['atm', 1.01325e5],
    ['psi', 6.894757e3],
  ]
  for (const [unit, pa] of PRINTED) {
    it(`converts ${unit} as the engine does, and as NIST SP 811 prints it (1 ${unit} = ${pa} Pa)`, () => {
      const p = usePreferencesStore()
      p.pressureUnit = unit
      expect(Math.abs(p.pToPa(1) / pa - 1)).toBeLessThan(5e-7)
      expect(p.pToPa(2.5)).toBe(2.5 * PASCALS_PER[unit])
      expect(p.pFromPa(87654.3)).toBeCloseTo(fromPascal(87654.3, unit), 12)
      expect(PA_PER[unit]).toBe(PASCALS_PER[unit])
    })
  }

  it('shows the standard atmosphere as 760.0 mmHg and 1.0133 bar', () => {
    const p = usePreferencesStore()
    p.pressureUnit = 'mmHg'
    expect(p.fmtP(101325)).toBe('760.0 mmHg')
    expect(p.pToPa(760)).toBeCloseTo(101325.0144354, 6) // 760 × 133.322387415: the mmHg is not quite the torr
  })

  it('rounds a pressure the same way in a field and in a label (101325 Pa → 1.0133 bar)', () => {
    const p = usePreferencesStore()
    p.pressureUnit = 'bar'
    expect(p.fmtP(101325)).toBe('1.0133 bar')
    expect(p.pShown(101325)).toBe(1.0133)
    expect(roundShown(101.325, 2)).toBe('101.33')
  })

  it('remembers °F and psi in this browser', async () => {
    const p = usePreferencesStore()
    p.temperatureUnit = 'F'
    p.pressureUnit = 'psi'
    await Promise.resolve()
    setActivePinia(createPinia())
    const again = usePreferencesStore()
    expect([again.temperatureUnit, again.pressureUnit]).toEqual(['F', 'psi'])
  })
})

describe('preferences: negative temperatures', () => {
  it('writes negatives with the true minus sign "−" (U+2212): −40 °C is −40 °F, the point where the scales meet (definition of the scales, NIST SP 811, 2008 ed., from memory)', () => {
    const p = usePreferencesStore()
    expect(p.fmtT(233.15)).toBe('−40.00 °C')
    p.temperatureUnit = 'F'
    expect(p.fmtT(233.15)).toBe('−40.00 °F')
    expect(p.fmtT(233.15, 0)).not.toContain('-')
  })

  it('never shows a sign on a value that rounds to zero', () => {
    const p = usePreferencesStore()
    expect(p.fmtT(273.149)).toBe('0.00 °C')
    expect(p.fmtDT(-0.0004)).toBe('0.000 K')
  })
})
