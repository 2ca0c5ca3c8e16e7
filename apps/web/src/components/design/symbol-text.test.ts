import { describe, expect, it } from 'vitest'
import { symbolParts } from './symbol-text'

describe('symbolParts', () => {
  it("sets the compositions of the engine's azeotrope message as symbols and keeps the rest as text", () => {
    // The message text of thermo's 'azeotrope-in-the-way' error (packages/thermo/src/columns/design-notes.ts).
    const parts = symbolParts(
      'The azeotrope at x1 = 0.7930 lies between xB = 0.05 and xD = 0.95: distillation at this pressure cannot cross it.',
    )
    expect(parts).toEqual([
      { text: 'The azeotrope at ' },
      { sym: 'x', sub: '1' },
      { text: ' = 0.7930 lies between ' },
      { sym: 'x', sub: 'B' },
      { text: ' = 0.05 and ' },
      { sym: 'x', sub: 'D' },
      { text: ' = 0.95: distillation at this pressure cannot cross it.' },
    ])
  })
  it('leaves words that merely contain the letters alone', () => {
    expect(symbolParts('max1 and xDx stay; Exit B')).toEqual([{ text: 'max1 and xDx stay; Exit B' }])
  })
})
