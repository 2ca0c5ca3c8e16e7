import { describe, expect, it } from 'vitest'
import { casCheckDigitOk, componentFormSchema } from './lab-admin.js'

// CAS numbers of common solvents as registered (CAS Registry; from memory, and each passes the published
// check-digit rule, which is common practice, no source).
describe('CAS check digit', () => {
  it.each([
    ['7732-18-5', true], // water
    ['67-64-1', true], // acetone
    ['67-56-1', true], // methanol
    ['110-54-3', true], // n-hexane
    ['67-64-2', false],
    ['7732-18-4', false],
  ])('%s → %s', (cas, ok) => expect(casCheckDigitOk(cas)).toBe(ok))

  it('names the bad check digit in the form message', () => {
    const r = componentFormSchema.safeParse({
      name: 'acetone',
      casNumber: '67-64-2',
      formula: null,
      molarMass: 58.08,
      liquidMolarVolume: null,
    })
    expect(r.success).toBe(false)
    expect(r.error?.issues[0].message).toBe('The CAS number is not valid (its check digit does not match).')
  })

  it('accepts an empty CAS number as none', () => {
    const r = componentFormSchema.parse({
      name: 'x',
      casNumber: '',
      formula: '',
      molarMass: 10,
      liquidMolarVolume: null,
    })
    expect(r.casNumber).toBeNull()
    expect(r.formula).toBeNull()
  })
})
