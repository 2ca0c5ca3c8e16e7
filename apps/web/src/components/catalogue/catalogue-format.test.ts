import { describe, expect, it } from 'vitest'
import { formatDate as screensDate } from '../../utils/dates'
import { formatDate, systemName } from './catalogue-format'

describe('catalogue-format', () => {
  it('names a system with a slash, component 1 first', () => {
    expect(systemName(['acetone', 'methanol'])).toBe('acetone / methanol')
    expect(systemName(['methanol', 'acetone'])).toBe('methanol / acetone')
  })

  it('writes a missing or unreadable date as a dash', () => {
    expect(formatDate(null)).toBe('—')
    expect(formatDate('not a date')).toBe('—')
  })

  const resolved = new Intl.DateTimeFormat().resolvedOptions()
  it.runIf(resolved.locale === 'en-US')('writes a date in the medium style: 1 December 2026 is "Dec 1, 2026"', () => {
    expect(formatDate('2026-12-01T12:00:00Z')).toBe('Dec 1, 2026')
  })

  it('writes dates exactly as every other screen does', () => {
    for (const iso of ['2026-12-01T12:00:00Z', '2024-02-29T08:00:00Z']) expect(formatDate(iso)).toBe(screensDate(iso))
    expect(formatDate('2024-02-29T08:00:00Z')).toContain('2024')
  })
})
