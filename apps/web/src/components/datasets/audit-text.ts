/** What an audit line of a data set says beyond its action: the model of a fit, the sample of an exclusion. */
import { MODEL_LABELS } from '../fits/fit-helpers'

type After = Record<string, unknown>
const str = (v: unknown) => (typeof v === 'string' && v.trim() ? v : null)
const modelName = (m: unknown) => (typeof m === 'string' ? (MODEL_LABELS[m as keyof typeof MODEL_LABELS] ?? m) : null)

/**
 * Details of a fit, point or recommendation audit line from its `after` record, "" when there is nothing to add:
 * "NRTL, α fitted from 0.3, 10 points", "sample MW-04: Septum leak suspected", "Wilson".
 */
export function auditDetails(entity: string, action: string, after: unknown): string {
  if (!after || typeof after !== 'object') return ''
  const a = after as After
  if (entity === 'fit') {
    const parts = [modelName(a.model)]
    if (a.model === 'nrtl' && typeof a.alpha === 'number')
      parts.push(a.fitAlpha === true ? `α fitted from ${a.alpha}` : `α = ${a.alpha} held`)
    if (typeof a.points === 'number') parts.push(`${a.points} point${a.points === 1 ? '' : 's'}`)
    if (a.converged === false) parts.push('not converged')
    return parts.filter(Boolean).join(', ')
  }
  if (entity === 'point') {
    const sample = str(a.sample)
    const reason = action === 'exclude point' ? str(a.reason) : null
    return [sample ? `sample ${sample}` : null, reason].filter(Boolean).join(': ')
  }
  if (action === 'mark recommended fit') return modelName(a.model) ?? ''
  return ''
}
