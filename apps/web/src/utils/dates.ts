/** One way to write dates and times on every screen, in the browser's locale ("Dec 1, 2026", "Dec 1, 2026, 7:28 PM"). */
const DATE = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' })
const DATE_TIME = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' })

function parse(iso: string | Date | null | undefined): Date | null {
  if (!iso) return null
  const d = iso instanceof Date ? iso : new Date(iso)
  return Number.isNaN(d.getTime()) ? null : d
}

/** A calendar date; "—" when missing or unreadable. */
export function formatDate(iso: string | Date | null | undefined): string {
  const d = parse(iso)
  return d ? DATE.format(d) : '—'
}

/** A date with the time of day; "—" when missing or unreadable. */
export function formatDateTime(iso: string | Date | null | undefined): string {
  const d = parse(iso)
  return d ? DATE_TIME.format(d) : '—'
}
