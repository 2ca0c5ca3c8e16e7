import { describe, expect, it } from 'vitest'
import { criticalSummary } from './component-properties-text'

describe('criticalSummary', () => {
  it('prints Pc in MPa, a true minus sign and only what is entered', () => {
    expect(
      criticalSummary({ Tc: 647.096, Pc: 22064000, omega: 0.3443, Vc: 55.948, tsonopoulosA: -0.0109, source: 's' }),
    ).toBe('Tc 647.1 K · Pc 22.06 MPa · ω 0.344 · Vc 55.95 cm³/mol · Tsonopoulos a −0.0109, b 0')
    expect(criticalSummary({ uniquacR: 0.92, source: 's' })).toBe('UNIQUAC r 0.92, q —')
    expect(criticalSummary({ source: 's' })).toBe('no values')
    expect(
      criticalSummary({ Tc: 647.096, dipole: 1.83, radiusOfGyration: 0.615, associationEta: 1.7, source: 's' }),
    ).toBe('Tc 647.1 K · μ 1.83 D · RD 0.615 Å · η 1.7')
  })
})
