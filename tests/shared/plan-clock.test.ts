import { describe, expect, it } from 'vitest'
import {
  addDays,
  clockLabel,
  clockTimeAfter,
  isCalendarDate,
  minutesAfterMidnight,
} from '../../shared/plans/clock'

// The event clock of a plan. Source: ISO 8601 (24-hour time of day HH:MM, calendar date
// YYYY-MM-DD) and the Gregorian leap-year rule (every 4th year, not centuries unless by 400).

describe('the event clock', () => {
  it('adds minutes to a start time and wraps past midnight', () => {
    expect(minutesAfterMidnight('08:00')).toBe(480)
    expect(clockTimeAfter('08:00', 360)).toBe('14:00')
    expect(clockTimeAfter('22:00', 150)).toBe('00:30')
    expect(clockLabel('22:00', 150)).toBe('00:30 (+1 day)')
    expect(clockLabel('08:00', 60 * 24 * 2 + 5)).toBe('08:05 (+2 days)')
  })

  it('drops the seconds, so a swap is never shown after the pack runs out', () => {
    expect(clockTimeAfter('08:00', 249.83)).toBe('12:09')
    // A segment edge summed as 209.99999999 is still 210 minutes.
    expect(clockTimeAfter('08:00', 209.99999999)).toBe('11:30')
  })

  it('knows real calendar dates', () => {
    expect(isCalendarDate('2026-06-13')).toBe(true)
    expect(isCalendarDate('2024-02-29')).toBe(true)
    expect(isCalendarDate('2026-02-29')).toBe(false)
    expect(isCalendarDate('1900-02-29')).toBe(false)
    expect(isCalendarDate('2000-02-29')).toBe(true)
    expect(isCalendarDate('2026-13-01')).toBe(false)
    expect(isCalendarDate('2026-6-13')).toBe(false)
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01')
  })
})
