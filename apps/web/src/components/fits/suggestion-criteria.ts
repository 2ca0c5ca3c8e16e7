/**
 * The two ways the server can rank where to measure next, in the panel's words, and the heading that
 * names which fit and criterion a list of suggestions came from.
 */
import type { SuggestionCriterionName } from '@ebullio/schemas'

/** One ranking criterion: the API value, a short label and one plain sentence saying what it picks. */
export interface CriterionChoice {
  value: SuggestionCriterionName
  label: string
  sentence: string
}

/** The criteria offered, the server's default ('sigma-y') first. */
export const CRITERION_CHOICES: readonly CriterionChoice[] = [
  { value: 'sigma-y', label: 'Sharpest curve', sentence: 'Largest uncertainty of the predicted vapour composition.' },
  {
    value: 'd-optimal',
    label: 'Best-pinned parameters',
    sentence: 'Most information about the model parameters — reaches the dilute ends, where γ∞ is fixed.',
  },
]

/** The short label of a criterion (the raw value if unknown, so a new server criterion still shows). */
export function criterionLabel(value: string): string {
  return CRITERION_CHOICES.find((c) => c.value === value)?.label ?? value
}

/** Panel heading naming the fit (its display label) and the criterion the listed suggestions come from. */
export function suggestionsHeading(fitName: string, criterion: string | null): string {
  if (!fitName || !criterion) return 'Fit uncertainty and where to measure next'
  return `Where to measure next for ${fitName}, by “${criterionLabel(criterion)}”`
}
