import { ApiError } from '../../api/client'

/**
 * What the server said about the vapour model, to show beside it: missing component data, the engine's refusal of
 * the assembled model, or a checked field of the choice (η12, its source, the correlation). Null for other errors.
 */
export function vapourProblem(e: unknown): string | null {
  if (!(e instanceof ApiError)) return null
  if (e.code === 'missing_critical_data' || e.code === 'invalid_vapour_model') return e.message
  const mine = Object.entries(e.fieldErrors()).filter(([path]) => path.startsWith('vaporModel'))
  return mine.length ? mine.map(([, m]) => m).join(' ') : null
}
