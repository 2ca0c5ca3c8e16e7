import { describe, expect, it } from 'vitest'
import { compareTyped, groupedDigest, reportNumber } from './report-verify'

const D = '5d502c83e8ac93e5e75cd1fa5bce0dbc462addad8e86d48ce25f1baffd62511b'

describe('verify page words', () => {
  it('numbers reports as printed and groups a digest in four groups of sixteen', () => {
    expect(reportNumber(42)).toBe('R-000042')
    expect(groupedDigest(D)).toBe('5d502c83e8ac93e5 e75cd1fa5bce0dbc 462addad8e86d48c e25f1baffd62511b')
  })

  it('compares a digest copied from paper whatever its spacing and case', () => {
    expect(compareTyped(groupedDigest(D).toUpperCase(), D)).toBe('equal')
    expect(compareTyped(` ${D.slice(0, 32)}\n${D.slice(32)} `, D)).toBe('equal')
    expect(compareTyped(D.replace(/.$/, 'a'), D)).toBe('different')
    expect(compareTyped(D.slice(0, 60), D)).toBe('incomplete')
    expect(compareTyped('  ', D)).toBe('empty')
  })
})
