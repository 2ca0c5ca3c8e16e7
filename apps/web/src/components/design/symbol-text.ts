/**
 * Typography for the engine's messages: thermo writes compositions as plain "x1", "xD", "xB", "xF" (its
 * messages are also read in logs and the API); the screens set them as an italic x with a subscript.
 */

/** A run of plain text, or a symbol: an italic letter with a subscript. */
export type SymbolPart = { text: string } | { sym: string; sub: string }

const SYMBOL = /\b([xy])(1|2|D|B|F)\b/g

/** Split a message into plain text and composition symbols ("x1", "y1", "xD", "xB", "xF"). */
export function symbolParts(message: string): SymbolPart[] {
  const parts: SymbolPart[] = []
  let at = 0
  for (const m of message.matchAll(SYMBOL)) {
    if (m.index > at) parts.push({ text: message.slice(at, m.index) })
    parts.push({ sym: m[1], sub: m[2] })
    at = m.index + m[0].length
  }
  if (at < message.length) parts.push({ text: message.slice(at) })
  return parts
}
