import { describe, expect, it } from 'vitest'
import { jointLabel, lastReturn, parameterUnit, valueWithError } from './joint-fit-format'

describe('joint-fit format', () => {
  it('names a joint set in the lab screens’ style, merging notes into the parentheses', () => {
    const f = { model: 'nrtl' as const, members: [{}, {}] as never, options: { temperatureDependent: true } }
    expect(jointLabel(f)).toBe('NRTL (joint, 2 data sets)')
    expect(jointLabel(f, 'recommended for the system')).toBe('NRTL (joint, 2 data sets; recommended for the system)')
    expect(jointLabel({ ...f, model: 'wilson', options: { temperatureDependent: false } })).toBe(
      'Wilson (joint, constant energies, 2 data sets)',
    )
  })
  it('gives energies J/mol and their temperature terms J/(mol·K)', () => {
    expect(['b12', 'a21', 'b21T', 'a12T', 'alpha'].map(parameterUnit)).toEqual([
      'J/mol',
      'J/mol',
      'J/(mol·K)',
      'J/(mol·K)',
      '1',
    ])
  })
  it('rounds a value to its standard error (2 significant figures), with a true minus sign', () => {
    expect(valueWithError(1234.5678, 12.34)).toBe('1235 ± 12')
    expect(valueWithError(-3.14159, 0.0271)).toBe('−3.142 ± 0.027')
    expect(valueWithError(2.5, null)).toBe('2.5000')
  })
})

describe('the latest return for rework', () => {
  const sig = (meaning: 'approved' | 'returned for rework', reason: string) =>
    ({ meaning, reason, signerName: 'R', signedAt: '2026-12-04T05:00:00Z' }) as never
  it('is the last signature that returned the set, its reason as written; null when never returned', () => {
    expect(lastReturn({ signatures: [] })).toBeNull()
    expect(lastReturn({ signatures: [sig('approved', 'ok')] })).toBeNull()
    const r = lastReturn({
      signatures: [
        sig('returned for rework', 'first'),
        sig('returned for rework', '<b>second</b>\u0007'),
        sig('approved', 'ok'),
      ],
    })
    expect(r?.reason).toBe('<b>second</b>\u0007')
  })
})
