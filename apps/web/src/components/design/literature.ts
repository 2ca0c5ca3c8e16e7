/**
 * Literature data sets on a system's plots: a short legend name from the citation, and which sets belong on a
 * plot at a given pressure (isobaric T–x–y sets within 5 % of it; the others are listed, not drawn).
 */
import type { LiteratureSet } from '../../api/catalogue'
import type { LiteratureSeries } from '../plots'

/** A literature set is drawn on a plot at P when its nominal pressure is within this fraction of P. */
export const LITERATURE_PRESSURE_MATCH = 0.05

/** "Author 1987" (first author's surname, "et al." for several), else the data set's title. */
export function literatureName(s: Pick<LiteratureSet, 'citation' | 'title'>): string {
  const c = s.citation
  if (!c) return s.title
  const authors = c.authors
    .split(/,|;|\band\b/)
    .map((a) => a.trim())
    .filter(Boolean)
  const first = authors[0] ?? ''
  const surname =
    first
      .split(/\s+/)
      .filter((w) => !/^[A-Z]\.$/.test(w) && !/^([A-Z]\.)+$/.test(w))
      .pop() ?? first
  return `${surname}${authors.length > 1 ? ' et al.' : ''} ${c.year} (literature)`
}

/** Which sets are drawn at P (with their series) and which are only named, with the reason. */
export function literatureAt(
  sets: LiteratureSet[],
  P: number,
): { drawn: LiteratureSeries[]; notDrawn: { name: string; why: string }[] } {
  const drawn: LiteratureSeries[] = []
  const notDrawn: { name: string; why: string }[] = []
  const used = new Map<string, number>()
  for (const s of sets) {
    let name = literatureName(s)
    const n = (used.get(name) ?? 0) + 1
    used.set(name, n)
    if (n > 1) name = `${name} #${n}`
    if (s.layout !== 'txy') notDrawn.push({ name, why: 'not an isobaric T–x–y set' })
    else if (Math.abs(s.nominalPressurePa / P - 1) > LITERATURE_PRESSURE_MATCH)
      notDrawn.push({ name, why: 'measured at another pressure' })
    else
      drawn.push({
        name,
        points: s.points.filter((p) => !p.excluded).map((p) => ({ T: p.temperatureK, x1: p.x1, y1: p.y1 })),
      })
  }
  return { drawn, notDrawn }
}
