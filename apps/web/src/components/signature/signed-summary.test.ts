import { describe, expect, it } from 'vitest'
import { fitParametersText, parameterText } from './signed-summary'

describe('signed parameter words', () => {
  // units as thermo stores them (docs/csv-formats.md): Wilson/NRTL energies J/mol, Margules/Van Laar and α dimensionless
  it('puts a space and the unit after every parameter', () => {
    expect(parameterText({ name: 'a12', value: -686.4823, standardError: 65.31 })).toBe('a12 = -686.482 ± 65.3 J/mol')
    expect(parameterText({ name: 'A12', value: 0.58123, standardError: 0.0121 })).toBe(
      'A12 = 0.581230 ± 0.0121 (dimensionless)',
    )
    // thermo holds a fitted α at its bound (0.1–0.7) with no standard error
    expect(parameterText({ name: 'alpha', value: 0.7, standardError: null, atBound: true })).toBe(
      'α = 0.700000 (at bound) (dimensionless)',
    )
  })
  it("names NRTL's held α", () => {
    const f = {
      model: 'nrtl' as const,
      options: { alpha: 0.3 },
      parameters: [
        { name: 'b12', value: 2094, standardError: 40 },
        { name: 'b21', value: 7385, standardError: 90 },
      ],
    }
    expect(fitParametersText(f)).toBe(
      'b12 = 2094.00 ± 40.0 J/mol, b21 = 7385.00 ± 90.0 J/mol, α = 0.3 held (dimensionless)',
    )
    expect(
      fitParametersText({ ...f, parameters: [...f.parameters, { name: 'alpha', value: 0.5081, standardError: 0.02 }] }),
    ).toContain('α = 0.508100 ± 0.0200 (dimensionless)')
  })
})
