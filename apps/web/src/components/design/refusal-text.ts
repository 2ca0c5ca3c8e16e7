/**
 * A design calculation the engine refuses, said in the trade's words: what stands in the way and what an engineer
 * would do about it. The engine's own message follows the heading unchanged.
 */

export interface Refusal {
  /** one sentence: what is in the way */
  heading: string
  /** what to do instead */
  advice: string
}

const SPLIT_CODES = ['liquid-split', 'heterogeneous-azeotrope', 'two-liquid-region', 'decanter-needed']

/** The heading and advice for a refusal the screens know; null for any other engine error (its words stand alone). */
export function refusalOf(e: unknown): Refusal | null {
  const code = (e as { code?: unknown })?.code
  const message = e instanceof Error ? e.message : ''
  if (code === 'out-of-domain')
    return {
      heading: 'A vapour-pressure equation has no value at these conditions.',
      advice:
        'The temperature lies beyond what the Antoine constants can describe. Choose a pressure at which both components boil inside their equations’ stated ranges.',
    }
  if (
    (typeof code === 'string' && SPLIT_CODES.includes(code)) ||
    /decanter|two liquid|two-liquid|heterogeneous/i.test(message)
  )
    return {
      heading: 'The liquid splits into two layers on the way to this target.',
      advice:
        'A plain column cannot step across a heterogeneous azeotrope: the condensed overhead separates into two layers, and a decanter (with a second column for the other layer) is what crosses it. Keep the targets on one side of the two-liquid region, or plan a decanter.',
    }
  return null
}
