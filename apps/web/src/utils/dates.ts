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

/**
 * How long ago, in at most two units: "under a minute", "7 min", "3 h 5 min", "2 d 4 h". A moment in the future
 * (a clock a little ahead) counts as "under a minute"; missing or unreadable is "—".
 */
export function formatAge(iso: string | Date | null | undefined, now: Date = new Date()): string {
  const d = parse(iso)
  if (!d) return '—'
  const minutes = Math.floor((now.getTime() - d.getTime()) / 60_000)
  if (minutes < 1) return 'under a minute'
  if (minutes < 60) return `${minutes} min`
  const hours = Math.floor(minutes / 60)
  if (hours < 24) return minutes % 60 ? `${hours} h ${minutes % 60} min` : `${hours} h`
  const days = Math.floor(hours / 24)
  return hours % 24 ? `${days} d ${hours % 24} h` : `${days} d`
}
