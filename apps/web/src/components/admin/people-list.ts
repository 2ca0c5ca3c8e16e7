/** Helpers of the admin people list: what the table's sort means for the server, the status filter's words. */

/** Status filter choices; the values are the API's `status` query. */
export const STATUS_OPTIONS: { value: 'active' | 'invited' | 'deactivated'; label: string }[] = [
  { value: 'active', label: 'Can sign in' },
  { value: 'invited', label: 'Invited, not yet signed in' },
  { value: 'deactivated', label: 'Deactivated' },
]

/**
 * The server's sort for a click on a table header: Name → `name`, E-mail → `email`; anything else (or the sort
 * switched off) falls back to name, ascending.
 * @param field the DataTable's sort field (the column's `field`)
 * @param order the DataTable's sort order (1 ascending, -1 descending, 0 or null none)
 */
export function sortFromTable(
  field: unknown,
  order: number | null | undefined,
): { sort: 'name' | 'email'; order: 'asc' | 'desc' } {
  const sort = field === 'email' ? 'email' : 'name'
  if (!order || (field !== 'email' && field !== 'displayName')) return { sort: 'name', order: 'asc' }
  return { sort, order: order < 0 ? 'desc' : 'asc' }
}
