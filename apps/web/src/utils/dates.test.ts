import { describe, expect, it } from 'vitest'
import { formatDate, formatDateTime } from './dates'

describe('date formatting', () => {
  it('writes missing or unreadable dates as a dash', () => {
    expect(formatDate(null)).toBe('—')
    expect(formatDateTime('not a date')).toBe('—')
  })
  it('writes a date the same way as the date part of a date-time', () => {
    const iso = '2026-12-01T19:28:00Z'
    expect(formatDateTime(iso).startsWith(formatDate(iso))).toBe(true)
  })
})
