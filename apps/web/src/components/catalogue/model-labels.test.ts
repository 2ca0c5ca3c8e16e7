import { describe, expect, it } from 'vitest'
import { parameterText } from './model-labels'

describe('parameterText', () => {
  // Wilson acetone/methanol parameters near the vetted reference in /work/shared/reference-values.md (−677 / 2440 J/mol).
  it('writes both energies of a model with the same decimals and a true minus sign', () => {
    expect(
      parameterText([
        { name: 'a12', value: -670.123 },
        { name: 'a21', value: 2448.04 },
      ]),
    ).toBe('a12 = −670.1 J/mol, a21 = 2448.0 J/mol')
  })
  it('gives dimensionless parameters four significant figures on the larger, the same decimals on both', () => {
    expect(
      parameterText([
        { name: 'A12', value: 0.58123 },
        { name: 'A21', value: 1.2 },
      ]),
    ).toBe('A12 = 0.581, A21 = 1.200')
  })
  it('keeps NRTL α (written α) apart from the energies, and never writes "−0.0"', () => {
    expect(
      parameterText([
        { name: 'b12', value: 2094.2 },
        { name: 'b21', value: -0.01 },
        { name: 'alpha', value: 0.5081 },
      ]),
    ).toBe('b12 = 2094.2 J/mol, b21 = 0.0 J/mol, α = 0.5081')
  })
})
