import { describe, expect, it } from 'vitest'
import { refusalOf } from './refusal-text'

class FakeThermoError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message)
  }
}

describe('refusalOf', () => {
  it('explains an out-of-domain vapour pressure in the trade’s words', () => {
    const r = refusalOf(new FakeThermoError('out-of-domain', 'T + C ≤ 0'))
    expect(r?.heading).toBe('A vapour-pressure equation has no value at these conditions.')
  })

  it('names the decanter when the target lies across a two-liquid region', () => {
    const r = refusalOf(
      new FakeThermoError(
        'some-new-code',
        'x1 = 0.9 lies across the heterogeneous azeotrope; a decanter is needed to cross it',
      ),
    )
    expect(r?.heading).toBe('The liquid splits into two layers on the way to this target.')
    expect(r?.advice).toMatch(/decanter/)
  })

  it('leaves other errors to the engine’s own words', () => {
    expect(refusalOf(new FakeThermoError('no-convergence', 'The solver did not converge.'))).toBeNull()
    expect(refusalOf('oops')).toBeNull()
  })
})
