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
    sentence:
      'Most information about the model parameters: usually toward the dilute ends, but not at the very ends, ' +
      'where T and y hardly depend on the parameters. Choose a range there to plan points anyway.',
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

/** Where to look: the whole composition range, either dilute end, or a range typed by the lab. */
export interface RangeChoice {
  value: 'whole' | 'dilute-1' | 'dilute-2' | 'custom'
  label: string
  range: [number, number] | null
}

/** Range presets; the dilute ends are x1 below 0.15 or above 0.85 (thermo's DILUTE_END; common practice, no source). */
export const RANGE_CHOICES: readonly RangeChoice[] = [
  { value: 'whole', label: 'Whole range', range: [0, 1] },
  { value: 'dilute-1', label: 'Little component 1 (x₁ 0–0.15)', range: [0, 0.15] },
  { value: 'dilute-2', label: 'Little component 2 (x₁ 0.85–1)', range: [0.85, 1] },
  { value: 'custom', label: 'From … to …', range: null },
]

/** The range to send, or the reason it cannot be sent (the API's own rule: within 0–1, at least 0.01 wide). */
export function rangeToSend(
  choice: RangeChoice['value'],
  from: number | null,
  to: number | null,
): { range: [number, number] } | { error: string } {
  const preset = RANGE_CHOICES.find((c) => c.value === choice)?.range
  if (preset) return { range: preset }
  if (from === null || to === null) return { error: 'Give both ends of the range (x₁ from 0 to 1).' }
  if (!(from >= 0 && to <= 1 && to - from >= 0.01 - 1e-12))
    return { error: 'The range must lie within x₁ = 0–1 and be at least 0.01 wide.' }
  return { range: [from, to] }
}
