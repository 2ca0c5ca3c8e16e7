import { describe, expect, it } from 'vitest'
import { formatAge, formatDate, formatDateTime } from './dates'

// The screens write dates in the browser's locale and time zone. The exact text is checked where the test runs
// in en-US and UTC (the default of Node and of this project's machines); elsewhere the checks on content still run.
const resolved = new Intl.DateTimeFormat().resolvedOptions()
const enUsUtc = resolved.locale === 'en-US' && resolved.timeZone === 'UTC'

describe('date formatting', () => {
  it('writes missing or unreadable dates as a dash', () => {
    expect(formatDate(null)).toBe('—')
    expect(formatDate(undefined)).toBe('—')
    expect(formatDate('')).toBe('—')
    expect(formatDateTime('not a date')).toBe('—')
  })

  it.runIf(enUsUtc)('writes 1 December 2026 as "Dec 1, 2026" and 19:28 UTC as "7:28 PM"', () => {
    expect(formatDate('2026-12-01T19:28:00Z')).toBe('Dec 1, 2026')
    expect(formatDateTime('2026-12-01T19:28:00Z')).toBe('Dec 1, 2026, 7:28 PM')
    expect(formatDate(new Date(Date.UTC(2025, 0, 31, 12)))).toBe('Jan 31, 2025')
  })

  it('tells days, months and years apart, and shows the year', () => {
    const noon = (d: string) => formatDate(`${d}T12:00:00Z`) // noon UTC is the same day in every time zone
    expect(noon('2026-12-01')).toContain('2026')
    expect(noon('2026-12-01')).toContain('1')
    expect(new Set([noon('2026-12-01'), noon('2026-12-02'), noon('2026-11-01'), noon('2025-12-01')]).size).toBe(4)
  })

  it('writes a date the same way as the date part of a date-time, and the time of day after it', () => {
    const iso = '2026-12-01T12:28:00Z'
    const dt = formatDateTime(iso)
    expect(dt.startsWith(formatDate(iso))).toBe(true)
    expect(dt.length).toBeGreaterThan(formatDate(iso).length)
    expect(dt).toContain('28') // the minutes
    expect(formatDateTime('2026-12-01T12:29:00Z')).not.toBe(dt)
  })
})

describe('age of a message', () => {
  const now = new Date('2026-12-03T12:00:00Z')
  const ago = (ms: number) => formatAge(new Date(now.getTime() - ms), now)
  it('counts down to the minute, in at most two units', () => {
    expect(ago(59_000)).toBe('under a minute')
    expect(ago(-5_000)).toBe('under a minute')
    expect(ago(60_000)).toBe('1 min')
    expect(ago(59 * 60_000 + 59_000)).toBe('59 min')
    expect(ago(3 * 3.6e6)).toBe('3 h')
    expect(ago(3 * 3.6e6 + 5 * 60_000)).toBe('3 h 5 min')
    expect(ago(2 * 86.4e6 + 4 * 3.6e6 + 30 * 60_000)).toBe('2 d 4 h')
    expect(ago(7 * 86.4e6)).toBe('7 d')
    expect(formatAge(null, now)).toBe('—')
  })
})
