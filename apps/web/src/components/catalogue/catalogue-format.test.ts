import { describe, expect, it } from 'vitest'
import { formatDate, systemName } from './catalogue-format'

describe('catalogue-format', () => {
  it('names a system with a slash, component 1 first', () => {
    expect(systemName(['acetone', 'methanol'])).toBe('acetone / methanol')
  })
  it('writes a missing or unreadable date as a dash', () => {
    expect(formatDate(null)).toBe('—')
    expect(formatDate('not a date')).toBe('—')
  })
  it('writes a date in the medium style of the browser locale', () => {
    const iso = '2026-12-01T12:00:00Z'
    expect(formatDate(iso)).toBe(new Date(iso).toLocaleDateString(undefined, { dateStyle: 'medium' }))
  })
})
