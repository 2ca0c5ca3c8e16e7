import { nextCompositionsQuerySchema, SUGGESTION_CRITERIA } from '@ebullio/schemas'
import { describe, expect, it } from 'vitest'
import { CRITERION_CHOICES, criterionLabel, suggestionsHeading } from './suggestion-criteria'

describe('suggestion criteria', () => {
  it('offers exactly the criteria the API accepts, its default first', () => {
    expect(CRITERION_CHOICES.map((c) => c.value)).toEqual([...SUGGESTION_CRITERIA])
    expect(nextCompositionsQuerySchema.parse({}).criterion).toBe(CRITERION_CHOICES[0].value)
  })

  it('says in one plain sentence what each picks', () => {
    expect(CRITERION_CHOICES[0].sentence).toBe('Largest uncertainty of the predicted vapour composition.')
    expect(CRITERION_CHOICES[1].sentence).toBe(
      'Most information about the model parameters — reaches the dilute ends, where γ∞ is fixed.',
    )
  })

  it('names the fit and the criterion of the list in the heading', () => {
    expect(suggestionsHeading('Wilson', 'd-optimal')).toBe(
      'Where to measure next for Wilson, by “Best-pinned parameters”',
    )
    expect(suggestionsHeading('NRTL (α fitted)', 'sigma-y')).toBe(
      'Where to measure next for NRTL (α fitted), by “Sharpest curve”',
    )
    expect(suggestionsHeading('', null)).toBe('Fit uncertainty and where to measure next')
    expect(criterionLabel('other')).toBe('other')
  })

  it('refuses an unknown criterion with the message the API gives', () => {
    const r = nextCompositionsQuerySchema.safeParse({ criterion: 'widest' })
    expect(r.success).toBe(false)
    expect(r.error?.issues[0].message).toBe("The criterion must be 'sigma-y' or 'd-optimal'")
  })
})
