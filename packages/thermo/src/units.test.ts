import { describe, expect, it } from 'vitest'
import { celsiusToKelvin, kelvinToCelsius } from './units.js'

describe('temperature conversion', () => {
  // 0 °C = 273.15 K by definition of the Celsius scale (SI Brochure, 9th ed., 2019, §2.3.1).
  it('converts the ice point', () => {
    expect(celsiusToKelvin(0)).toBe(273.15)
    expect(kelvinToCelsius(373.15)).toBeCloseTo(100, 12)
  })
})
