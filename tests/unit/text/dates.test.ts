import { describe, it, expect } from 'vitest'
import { formatDay, formatMoment } from '../../../shared/text/dates'

// The form "2 Dec 2026, 00:23 UTC" is the one the product asks for; the calendar facts
// (a leap day, the last minute of a year) are common practice.
describe('dates people read the same everywhere', () => {
  it('the day, the month by name and the year, in UTC, never a numeric day/month', () => {
    expect(formatDay('2026-12-02T00:23:00Z')).toBe('2 Dec 2026')
    expect(formatMoment('2026-12-02T00:23:00Z')).toBe('2 Dec 2026, 00:23 UTC')
    expect(formatMoment('2026-12-02T00:23:00Z')).not.toMatch(/\d+\/\d+\/\d+/)
  })
  it('keeps UTC whatever the offset written in the input', () => {
    expect(formatMoment('2026-12-01T23:59:00-05:00')).toBe('2 Dec 2026, 04:59 UTC')
    expect(formatMoment('2024-02-29T12:05:00Z')).toBe('29 Feb 2024, 12:05 UTC')
    expect(formatMoment('2025-12-31T23:59:59Z')).toBe('31 Dec 2025, 23:59 UTC')
  })
  it('a missing or unreadable date is a dash, not "Invalid Date"', () => {
    expect(formatDay(null)).toBe('—')
    expect(formatMoment(undefined)).toBe('—')
    expect(formatMoment('not a date')).toBe('—')
  })
})
