/**
 * Ranking of a name / CAS / formula search: an exact match first, then a match at the start of a name
 * (or of a word in it, so "ethanol" finds "ethanol" before "2-methoxyethanol" and "methanol"), then anything
 * containing the text. Pure SQL fragments; `%` and `_` typed by the user match themselves.
 */
import { sql, type RawBuilder } from 'kysely'

/** The text as a LIKE pattern that matches it literally. */
export function likeLiteral(q: string): string {
  return q.replace(/[\\%_]/g, (c) => `\\${c}`)
}

/** 0 exact, 1 prefix (of the name or a word in it), 2 contained, 3 no match — for one component's columns. */
export function componentRank(prefix: string, q: string): RawBuilder<number> {
  const name = sql.ref(`${prefix}name`)
  const cas = sql.ref(`${prefix}cas_number`)
  const formula = sql.ref(`${prefix}formula`)
  const lit = likeLiteral(q)
  return sql<number>`case
    when lower(${name}) = lower(${q}) or ${cas} = ${q} or lower(${formula}) = lower(${q}) then 0
    when ${name} ilike ${lit + '%'} or ${name} ilike ${'% ' + lit + '%'} or ${name} ilike ${'%-' + lit + '%'}
      or ${cas} like ${lit + '%'} or ${formula} ilike ${lit + '%'} then 1
    when ${name} ilike ${'%' + lit + '%'} or ${cas} like ${'%' + lit + '%'} or ${formula} ilike ${'%' + lit + '%'} then 2
    else 3 end`
}
