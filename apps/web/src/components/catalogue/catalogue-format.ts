/** How the engineer's screens name a system and write a date, so the catalogue and a system's page agree. */

/** "acetone / methanol": component 1 first, as the lab screens write a system. */
export function systemName(names: readonly [string, string]): string {
  return `${names[0]} / ${names[1]}`
}

/** A calendar date in the browser's locale, as on every screen. */
export { formatDate } from '../../utils/dates'
