/** How the engineer's screens name a system and write a date, so the catalogue and a system's page agree. */

/** "acetone / methanol": component 1 first, as the lab screens write a system. */
export function systemName(names: readonly [string, string]): string {
  return `${names[0]} / ${names[1]}`
}

const DATE = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' })

/** A calendar date in the browser's locale, medium style ("Dec 1, 2026" in English); "—" when missing. */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—'
  const d = new Date(iso)
  return Number.isNaN(d.getTime()) ? '—' : DATE.format(d)
}
