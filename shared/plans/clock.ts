// The event clock: a plan starts at a local HH:MM and every engine minute maps onto it, so the
// swap times the server stores and the ones the browser draws are the same strings.

const MINUTES_PER_DAY = 24 * 60

/** HH:MM on the 24-hour clock, 00:00 to 23:59 (ISO 8601 extended format, local time). */
export const CLOCK_TIME_PATTERN = /^([01][0-9]|2[0-3]):[0-5][0-9]$/

/** Minutes after midnight of an HH:MM time; call with a time that matched CLOCK_TIME_PATTERN. */
export function minutesAfterMidnight(clockTime: string): number {
  const [hours = 0, minutes = 0] = clockTime.split(':').map(Number)
  return hours * 60 + minutes
}

// Fractions of a minute are dropped, so a swap is never shown later than the pack runs out; the
// allowance keeps a segment edge computed as 209.9999999 on 210.
const SUM_ALLOWANCE_MINUTES = 1e-6

/** Whole days and the HH:MM reached `minutes` after `startTime` (down to the whole minute). */
export function eventClock(
  startTime: string,
  minutes: number,
): { dayOffset: number; clockTime: string } {
  const total = minutesAfterMidnight(startTime) + Math.floor(minutes + SUM_ALLOWANCE_MINUTES)
  const dayOffset = Math.floor(total / MINUTES_PER_DAY)
  const ofDay = total - dayOffset * MINUTES_PER_DAY
  const pad = (value: number) => String(value).padStart(2, '0')
  return { dayOffset, clockTime: `${pad(Math.floor(ofDay / 60))}:${pad(ofDay % 60)}` }
}

/** The event clock at `minutes` after an HH:MM start, wrapping past midnight. */
export function clockTimeAfter(startTime: string, minutes: number): string {
  return eventClock(startTime, minutes).clockTime
}

/** "14:30", or "00:30 (+1 day)" once the plan runs past midnight. */
export function clockLabel(startTime: string, minutes: number): string {
  const { dayOffset, clockTime } = eventClock(startTime, minutes)
  if (dayOffset === 0) return clockTime
  return `${clockTime} (+${dayOffset} day${dayOffset === 1 ? '' : 's'})`
}

/** A real calendar date in YYYY-MM-DD (not 2026-02-30). */
export function isCalendarDate(date: string): boolean {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date)
  if (!match) return false
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])]
  const parsed = new Date(Date.UTC(year, month - 1, day))
  return (
    parsed.getUTCFullYear() === year &&
    parsed.getUTCMonth() === month - 1 &&
    parsed.getUTCDate() === day
  )
}

/** The calendar date `dayOffset` days after a YYYY-MM-DD date. */
export function addDays(date: string, dayOffset: number): string {
  const [year = 1970, month = 1, day = 1] = date.split('-').map(Number)
  return new Date(Date.UTC(year, month - 1, day + dayOffset)).toISOString().slice(0, 10)
}
