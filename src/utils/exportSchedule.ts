import { createEvents, type DateArray, type EventAttributes } from 'ics'
import Papa from 'papaparse'
import { addDays, eventClock } from '@shared/plans/clock'
import type { ScheduleSegment } from '@shared/schemas/estimate'

// The day's swap schedule as files for the crew: a spreadsheet (CSV) and a calendar (iCalendar,
// RFC 5545) with a reminder before each swap. Times are the event's local wall clock ("floating"
// times in iCalendar terms), as the plan gives them.

export interface ScheduleExport {
  planName: string
  /** YYYY-MM-DD and HH:MM, local to the event. */
  date: string
  startTime: string
  schedule: readonly ScheduleSegment[]
  swaps: readonly { atMinute: number; pack: number }[]
  /** Minute the sound stops early when the day does not last, or null when it lasts. */
  stoppedAtMinute: number | null
  /**
   * The day's temperature is outside the pack's charge range (the result's warning
   * 'charge-temperature-out-of-range'): its charging breaks must not charge. Absent: false.
   */
  chargingRefused?: boolean
  /** Makes calendar entries stable across exports (a re-import updates, not duplicates). */
  uidPrefix: string
}

export const DEFAULT_REMINDER_MINUTES = 10 // ours: time to fetch a pack and change it between songs

const STATE_WORDS = {
  on: 'playing',
  idle: 'on, not playing',
  off: 'off',
  charging: 'silent, pack on the charger',
} as const

// A charging break the engine refuses at the day's temperature: the crew must not charge either.
const REFUSED_CHARGING_WORDS =
  "silent, do NOT charge the pack at this temperature: see the plan's warnings"

/**
 * A segment's state in words; a charging break says the power into the pack, or that it must not
 * charge (`chargingRefused`).
 */
function segmentWords(segment: ScheduleSegment, chargingRefused: boolean): string {
  const state = segment.state ?? 'on'
  if (state === 'charging' && chargingRefused) return REFUSED_CHARGING_WORDS
  return state === 'charging' && segment.chargeW !== undefined
    ? `${STATE_WORDS.charging} at ${segment.chargeW} W`
    : STATE_WORDS[state]
}

interface ScheduleRow {
  minute: number
  event: string
  detail: string
  pack: number
}

/** Segment starts, swaps and the end of the day, in time order (a swap before its segment). */
function scheduleRows(plan: ScheduleExport): ScheduleRow[] {
  const packAt = (minute: number) =>
    1 + plan.swaps.filter((swap) => swap.atMinute <= minute + 1e-6).length
  const rows: ScheduleRow[] = []
  let minute = 0
  for (const segment of plan.schedule) {
    if (plan.stoppedAtMinute !== null && minute > plan.stoppedAtMinute) break
    const state = segmentWords(segment, plan.chargingRefused ?? false)
    rows.push({
      minute,
      event: 'Segment',
      detail: `${segment.label} (${state})`,
      pack: packAt(minute),
    })
    minute += segment.minutes
  }
  for (const swap of plan.swaps) {
    rows.push({
      minute: swap.atMinute,
      event: 'Swap',
      detail: `Put in charged pack ${swap.pack}`,
      pack: swap.pack,
    })
  }
  rows.sort((a, b) => a.minute - b.minute || (a.event === 'Swap' ? -1 : b.event === 'Swap' ? 1 : 0))
  const end = plan.stoppedAtMinute ?? minute
  rows.push({
    minute: end,
    event: plan.stoppedAtMinute === null ? 'End' : 'Sound stops',
    detail:
      plan.stoppedAtMinute === null
        ? 'End of the plan'
        : 'The packs on hand run out here: bring more or play quieter',
    pack: packAt(end),
  })
  return rows
}

function localDateTime(plan: ScheduleExport, minute: number) {
  const { dayOffset, clockTime } = eventClock(plan.startTime, minute)
  return { date: addDays(plan.date, dayOffset), time: clockTime }
}

/**
 * CSV of the day. Cells that a spreadsheet would read as a formula (starting with = + - @, tab
 * or carriage return) get a leading apostrophe and every cell is quoted: OWASP, "CSV Injection".
 * The pattern tests only the first character (papaparse's own one misses text with line breaks).
 */
const FORMULA_START = /^[=+\-@\t\r]/
export function scheduleCsv(plan: ScheduleExport): string {
  const rows = scheduleRows(plan).map((row) => {
    const at = localDateTime(plan, row.minute)
    return [at.date, at.time, Math.floor(row.minute + 1e-6), row.event, row.detail, row.pack]
  })
  return Papa.unparse(
    {
      fields: ['Date', 'Time', 'Minutes from start', 'Event', 'Detail', 'Pack in the rig'],
      data: [[plan.planName, '', '', 'Plan', '', ''], ...rows],
    },
    { escapeFormulae: FORMULA_START, quotes: true, newline: '\r\n' },
  )
}

function dateArray(plan: ScheduleExport, minute: number): DateArray {
  const at = localDateTime(plan, minute)
  const [year = 1970, month = 1, day = 1] = at.date.split('-').map(Number)
  const [hour = 0, minutes = 0] = at.time.split(':').map(Number)
  return [year, month, day, hour, minutes]
}

/** An iCalendar file: the day as one entry, and one entry per swap with a reminder before it. */
export function scheduleIcs(
  plan: ScheduleExport,
  reminderMinutes = DEFAULT_REMINDER_MINUTES,
): string {
  const local = { startInputType: 'local', startOutputType: 'local' } as const
  const totalMinutes = plan.schedule.reduce((sum, segment) => sum + segment.minutes, 0)
  const events: EventAttributes[] = [
    {
      ...local,
      uid: `${plan.uidPrefix}-day@loudhour`,
      title: plan.planName,
      description: plan.schedule
        .map(
          (segment) =>
            `${segment.label}: ${segment.minutes} min, ${segmentWords(segment, plan.chargingRefused ?? false)}`,
        )
        .join('\n'),
      start: dateArray(plan, 0),
      duration: { minutes: Math.max(1, Math.round(totalMinutes)) },
    },
    ...plan.swaps.map((swap): EventAttributes => ({
      ...local,
      uid: `${plan.uidPrefix}-swap-${swap.pack}@loudhour`,
      title: `Swap to charged pack ${swap.pack}: ${plan.planName}`,
      description: `Put in charged pack ${swap.pack}. Lithium packs: never crush, short or charge one that is damaged or cold.`,
      start: dateArray(plan, swap.atMinute),
      duration: { minutes: 5 },
      alarms: [
        {
          action: 'display',
          description: `In ${reminderMinutes} minutes: swap to charged pack ${swap.pack}`,
          trigger: { minutes: reminderMinutes, before: true },
        },
      ],
    })),
  ]
  const { error, value } = createEvents(events, { productId: 'loudhour/plans' })
  if (error || !value) throw new Error(`The calendar file could not be made: ${error?.message}`)
  return value
}

/** "saturday-market-2026-06-13.csv" */
export function scheduleFileName(plan: ScheduleExport, extension: 'csv' | 'ics'): string {
  const slug = plan.planName
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
  return `${slug || 'plan'}-${plan.date}.${extension}`
}
