/** Words for calibrations and for what a run preview rests on, shared by the upload dialog, the record and point details. */
import { formatDate } from '../../utils/dates'
import type { CalibrationSummary, PreviewSample } from '../../api/uploads'

/** Display names of the calibration models (the API's ids are `response-factor`, `linear`, `quadratic`). */
export const CALIBRATION_MODEL_LABELS: Record<string, string> = {
  'response-factor': 'Relative response factor',
  linear: 'Linear in area fraction',
  quadratic: 'Quadratic in area fraction',
}

/** Human name of a calibration model; an unknown id is shown as it is. */
export const calibrationModelLabel = (model: string) => CALIBRATION_MODEL_LABELS[model] ?? model

/** "k = 1.31756 ± 0.0013" (coefficients to 6 significant digits, standard errors to 2). */
export function coefficientsText(
  c: Pick<CalibrationSummary, 'coefficientNames' | 'coefficients' | 'standardErrors'>,
): string {
  return c.coefficientNames
    .map((n, i) => `${n} = ${c.coefficients[i]?.toPrecision(6) ?? '—'} ± ${c.standardErrors[i]?.toPrecision(2) ?? '—'}`)
    .join(', ')
}

/** "Dec 1, 2026" in the reader's locale. */
export const calibrationDate = (iso: string) => formatDate(iso)

/** "x₁ 0.020–0.985" (mole fraction of component 1). */
export const rangeText = (c: Pick<CalibrationSummary, 'rangeMin' | 'rangeMax'>) =>
  `x₁ ${c.rangeMin.toFixed(3)}–${c.rangeMax.toFixed(3)}`

/** One line naming a calibration: file, date, GC method, model, coefficients ± u, range. */
export function calibrationLine(c: CalibrationSummary): string {
  return `${c.originalName} of ${calibrationDate(c.createdAt)} (${c.gcMethodName}): ${calibrationModelLabel(c.model)}, ${coefficientsText(c)}, ${rangeText(c)}`
}

/** "used by 1 data set" / "used by no data set yet". */
export const usedByText = (n: number) =>
  n === 0 ? 'used by no data set yet' : `used by ${n} data set${n === 1 ? '' : 's'}`

/**
 * What a partial sample rests on, e.g. "liquid: 1 of 2 injections used; line 5 not used (phase unreadable)";
 * null for a sample whose every line was used.
 */
export function coverageText(s: Pick<PreviewSample, 'coverage' | 'errorRows' | 'partial'>): string | null {
  if (!s.partial || !s.coverage) return null
  const parts: string[] = []
  for (const phase of ['liquid', 'vapour'] as const) {
    const c = s.coverage[phase]
    if (c.used < c.of) parts.push(`${phase}: ${c.used} of ${c.of} injection${c.of === 1 ? '' : 's'} used`)
  }
  const unread = s.coverage.unreadRows
  if (unread.length)
    parts.push(`line${unread.length === 1 ? '' : 's'} ${unread.join(', ')} not used (phase unreadable)`)
  if (!parts.length && s.errorRows?.length)
    parts.push(`error on line${s.errorRows.length === 1 ? '' : 's'} ${s.errorRows.join(', ')}`)
  return parts.join('; ')
}
