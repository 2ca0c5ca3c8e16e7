import { describe, expect, it } from 'vitest'
import { auditDetails } from './audit-text'

describe('audit details in the record', () => {
  it('says which model was fitted, NRTL with its α, and on how many points', () => {
    expect(auditDetails('fit', 'run fit', { model: 'wilson', points: 10, converged: true })).toBe('Wilson, 10 points')
    expect(auditDetails('fit', 'run fit', { model: 'nrtl', alpha: 0.3, fitAlpha: false, points: 10 })).toBe(
      'NRTL, α = 0.3 held, 10 points',
    )
    expect(
      auditDetails('fit', 'run fit', { model: 'nrtl', alpha: 0.3, fitAlpha: true, points: 1, converged: false }),
    ).toBe('NRTL, α fitted from 0.3, 1 point, not converged')
  })

  it('names the sample and the reason of an exclusion, and the sample of an inclusion', () => {
    expect(
      auditDetails('point', 'exclude point', { excluded: true, reason: 'Septum leak suspected.', sample: 'MW-04' }),
    ).toBe('sample MW-04: Septum leak suspected.')
    expect(auditDetails('point', 'include point', { excluded: false, reason: null, sample: 'MW-04' })).toBe(
      'sample MW-04',
    )
  })

  it('names the model of a recommendation and adds nothing to lines without details', () => {
    expect(auditDetails('data_set', 'mark recommended fit', { recommendedFitId: 'f', model: 'van-laar' })).toBe(
      'Van Laar',
    )
    expect(auditDetails('data_set', 'submit', null)).toBe('')
  })
})
