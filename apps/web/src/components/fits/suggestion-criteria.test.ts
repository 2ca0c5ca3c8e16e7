import { nextCompositionsQuerySchema, SUGGESTION_CRITERIA } from '@ebullio/schemas'
import { describe, expect, it } from 'vitest'
import {
  CRITERION_CHOICES,
  criterionLabel,
  rangeToSend,
  RANGE_CHOICES,
  suggestionsHeading,
} from './suggestion-criteria'

describe('suggestion criteria', () => {
  it('offers exactly the criteria the API accepts, its default first', () => {
    expect(CRITERION_CHOICES.map((c) => c.value)).toEqual([...SUGGESTION_CRITERIA])
    expect(nextCompositionsQuerySchema.parse({}).criterion).toBe(CRITERION_CHOICES[0].value)
  })

  it('says in one plain sentence what each picks', () => {
    expect(CRITERION_CHOICES[0].sentence).toBe('Largest uncertainty of the predicted vapour composition.')
    expect(CRITERION_CHOICES[1].sentence).toBe(
      'Most information about the model parameters: usually toward the dilute ends, but not at the very ends, ' +
        'where T and y hardly depend on the parameters. Choose a range there to plan points anyway.',
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

  it('sends a preset range as it is and checks a typed one by the API rule', () => {
    expect(RANGE_CHOICES.map((c) => c.range)).toEqual([[0, 1], [0, 0.15], [0.85, 1], null])
    expect(rangeToSend('dilute-2', null, null)).toEqual({ range: [0.85, 1] })
    expect(rangeToSend('custom', 0.6, 0.8)).toEqual({ range: [0.6, 0.8] })
    expect(rangeToSend('custom', 0.6, 0.605)).toEqual({
      error: 'The range must lie within x₁ = 0–1 and be at least 0.01 wide.',
    })
    expect(rangeToSend('custom', null, 0.5)).toEqual({ error: 'Give both ends of the range (x₁ from 0 to 1).' })
    // the same rule as the API's query schema
    expect(nextCompositionsQuerySchema.safeParse({ from: 0.6, to: 0.605 }).success).toBe(false)
    expect(nextCompositionsQuerySchema.safeParse({ from: 0.6, to: 0.8 }).success).toBe(true)
  })
})
