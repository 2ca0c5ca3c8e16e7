import { describe, expect, it } from 'vitest'
import { heldRows, jointLabel, lastReturn, parameterUnit, statText, valueWithError } from './joint-fit-format'

describe('joint-fit format', () => {
  it('names a joint set in the lab screens’ style, merging notes into the parentheses', () => {
    const f = { model: 'nrtl' as const, members: [{}, {}] as never, options: { temperatureDependent: true } }
    expect(jointLabel(f)).toBe('NRTL (joint, 2 data sets)')
    expect(jointLabel(f, 'recommended for the system')).toBe('NRTL (joint, 2 data sets; recommended for the system)')
    expect(jointLabel({ ...f, model: 'wilson', options: { temperatureDependent: false } })).toBe(
      'Wilson (joint, constant energies, 2 data sets)',
    )
  })
  it('names a joint UNIQUAC set and lists its held r and q (from the components) beside the fitted energies', () => {
    const f = { model: 'uniquac' as const, members: [{}, {}, {}] as never, options: { temperatureDependent: true } }
    expect(jointLabel(f)).toBe('UNIQUAC (joint, 3 data sets)')
    const activity = { kind: 'uniquac', a12: 1590.6, a21: -300.1, a12T: 9.8, a21T: -6.2, r1: 2.5735, r2: 1.4311 }
    const parameters = ['a12', 'a21', 'a12T', 'a21T'].map((name) => ({ name, value: 0, standardError: 1 }))
    expect(heldRows({ activity: { ...activity, q1: 2.336, q2: 1.432 }, parameters })).toEqual([
      { name: 'q1', shown: '2.3360', unit: '1' },
      { name: 'q2', shown: '1.4320', unit: '1' },
      { name: 'r1', shown: '2.5735', unit: '1' },
      { name: 'r2', shown: '1.4311', unit: '1' },
    ])
    const wilson = { kind: 'wilson', a12: 1, a21: 2, V1: 74.05, V2: 40.73 }
    expect(heldRows({ activity: wilson, parameters: parameters.slice(0, 2) })).toEqual([
      { name: 'V1', shown: '74.050', unit: 'cm³/mol' },
      { name: 'V2', shown: '40.730', unit: 'cm³/mol' },
    ])
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

describe('a member statistic', () => {
  it('gives a bias too small to show no sign, and signs the others with the true minus', () => {
    expect(statText(-0.00002, 4, true)).toBe('0.0000')
    expect(statText(0.00002, 4, true)).toBe('0.0000')
    expect(statText(-0.0002, 4, true)).toBe('−0.0002')
    expect(statText(0.064, 3, true)).toBe('+0.064')
    expect(statText(162.94, 1)).toBe('162.9')
    expect(statText(null, 1)).toBe('—')
    expect(statText(Number.NaN, 1)).toBe('—')
  })
})
