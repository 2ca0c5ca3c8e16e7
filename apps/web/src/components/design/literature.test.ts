import { describe, expect, it } from 'vitest'
import { literatureAt, literatureName } from './literature'

const citation = {
  authors: 'A. B. Author, C. Second',
  title: 'VLE',
  source: 'J. Invented Data',
  year: 1987,
  volume: null,
  pages: null,
  doi: null,
  table: null,
}
const set = (o: Partial<Parameters<typeof literatureAt>[0][number]> = {}) => ({
  dataSetId: 'd1',
  title: 'Lit',
  version: 1,
  state: 'draft',
  layout: 'txy',
  nominalPressurePa: 101325,
  citation,
  points: [
    { id: 'p1', sampleLabel: 'L1', temperatureK: 340, pressurePa: 101325, x1: 0.3, y1: 0.5, excluded: false },
    { id: 'p2', sampleLabel: 'L2', temperatureK: 338, pressurePa: 101325, x1: 0.4, y1: 0.6, excluded: true },
  ],
  ...o,
})

describe('literature on a system plot', () => {
  it('names a set by its first author and year, or by its title without a citation', () => {
    expect(literatureName(set())).toBe('Author et al. 1987 (literature)')
    expect(literatureName(set({ citation: { ...citation, authors: 'Smith' } }))).toBe('Smith 1987 (literature)')
    expect(literatureName(set({ citation: null, title: '<b>Old table</b>' }))).toBe('<b>Old table</b>')
  })

  it('draws the included points of sets within 5 % of the pressure and names the others with the reason', () => {
    const r = literatureAt(
      [set(), set({ nominalPressurePa: 50000 }), set({ layout: 'pxy', citation: { ...citation, year: 1990 } })],
      101325,
    )
    expect(r.drawn).toEqual([{ name: 'Author et al. 1987 (literature)', points: [{ T: 340, x1: 0.3, y1: 0.5 }] }])
    expect(r.notDrawn).toEqual([
      { name: 'Author et al. 1987 (literature) #2', why: 'measured at another pressure' },
      { name: 'Author et al. 1990 (literature)', why: 'not an isobaric T–x–y set' },
    ])
  })
})
