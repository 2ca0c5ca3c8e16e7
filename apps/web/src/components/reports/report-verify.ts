/** Words of the verify page (pure; tests beside). */

/** The report number as printed: R-000042. */
export const reportNumber = (n: number) => `R-${String(n).padStart(6, '0')}`

/** A SHA-256 in four groups of sixteen, as the report prints it. */
export const groupedDigest = (hex: string) => hex.match(/.{1,16}/g)?.join(' ') ?? hex

/**
 * Whether a digest typed or pasted from a printed copy equals the registered one: spaces, line breaks and
 * case are ignored; anything that is not 64 hexadecimal digits is 'incomplete'.
 */
export function compareTyped(typed: string, registered: string): 'empty' | 'incomplete' | 'equal' | 'different' {
  const t = typed.replace(/\s+/g, '').toLowerCase()
  if (!t) return 'empty'
  if (!/^[0-9a-f]{64}$/.test(t)) return 'incomplete'
  return t === registered.toLowerCase() ? 'equal' : 'different'
}
