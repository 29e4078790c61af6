import Papa from 'papaparse'
import { describe, expect, it } from 'vitest'
import {
  scheduleCsv,
  scheduleFileName,
  scheduleIcs,
  type ScheduleExport,
} from '@/utils/exportSchedule'

const plan: ScheduleExport = {
  planName: 'Saturday market',
  date: '2026-06-13',
  startTime: '08:00',
  schedule: [
    { label: 'Set-up', minutes: 30, state: 'idle' },
    { label: '=HYPERLINK("http://bad.example","x")', minutes: 180, state: 'on' },
    { label: '+1 and more', minutes: 30, state: 'off' },
    { label: '-2 cheers', minutes: 60 },
    { label: '@SUM(A1)', minutes: 30 },
    { label: '=cmd\nsecond line', minutes: 30 },
  ],
  swaps: [{ atMinute: 240, pack: 2 }],
  stoppedAtMinute: null,
  uidPrefix: 'test-plan-1',
}

describe('the swap schedule as CSV', () => {
  const rows = Papa.parse<string[]>(scheduleCsv(plan), { skipEmptyLines: true }).data

  it('defuses every cell a spreadsheet would run as a formula', () => {
    // Source: OWASP, "CSV Injection": prefix cells starting with = + - @ (and tab, carriage
    // return) with a single quote, and quote every cell.
    const details = rows.map((row) => row[4] ?? '')
    for (const dangerous of ['=HYPERLINK', '+1 and', '-2 cheers', '@SUM', '=cmd']) {
      const cell = details.find((detail) => detail.includes(dangerous))
      expect(cell, dangerous).toBeDefined()
      expect(cell!.startsWith("'")).toBe(true)
    }
    for (const row of rows) for (const cell of row) expect(cell).not.toMatch(/^[=+\-@\t\r]/)
    // Every field is quoted in the raw text (RFC 4180 quoting, with "" inside).
    expect(scheduleCsv(plan)).toContain('"\'=HYPERLINK(""http://bad.example"",""x"")')
  })

  it('lists segments and swaps on the event clock, the swap before its segment', () => {
    expect(rows[0]).toEqual([
      'Date',
      'Time',
      'Minutes from start',
      'Event',
      'Detail',
      'Pack in the rig',
    ])
    const events = rows.slice(2).map((row) => [row[1], row[3], row[5]])
    expect(events).toEqual([
      ['08:00', 'Segment', '1'],
      ['08:30', 'Segment', '1'],
      ['11:30', 'Segment', '1'],
      ['12:00', 'Swap', '2'],
      ['12:00', 'Segment', '2'],
      ['13:00', 'Segment', '2'],
      ['13:30', 'Segment', '2'],
      ['14:00', 'End', '2'],
    ])
  })

  it('names the file after the plan and its date', () => {
    expect(scheduleFileName(plan, 'csv')).toBe('saturday-market-2026-06-13.csv')
  })
})

/** RFC 5545 content lines, unfolded (§3.1: CRLF followed by one space or tab continues a line). */
function contentLines(text: string): string[] {
  return text
    .replace(/\r\n[ \t]/g, '')
    .split('\r\n')
    .filter((line) => line !== '')
}

interface Component {
  name: string
  properties: Map<string, string[]>
  children: Component[]
}

/** A strict reader for the parts of RFC 5545 the file uses: nesting and NAME[;params]:value. */
function parseCalendar(text: string): Component {
  const stack: Component[] = []
  let root: Component | undefined
  for (const line of contentLines(text)) {
    const match = /^([A-Z][A-Z0-9-]*)(;[^:]*)?:(.*)$/.exec(line)
    if (!match) throw new Error(`Not an iCalendar content line: ${line}`)
    const [, name, , value = ''] = match
    if (name === 'BEGIN') {
      const component: Component = { name: value, properties: new Map(), children: [] }
      stack[stack.length - 1]?.children.push(component)
      stack.push(component)
      root ??= component
    } else if (name === 'END') {
      const closed = stack.pop()
      if (closed?.name !== value) throw new Error(`END:${value} closes ${closed?.name}`)
    } else {
      const current = stack[stack.length - 1]
      if (!current) throw new Error(`Property outside a component: ${line}`)
      current.properties.set(name!, [...(current.properties.get(name!) ?? []), value])
    }
  }
  if (!root || stack.length > 0) throw new Error('Unbalanced BEGIN/END')
  return root
}

describe('the swap schedule as iCalendar', () => {
  const text = scheduleIcs(plan, 15)
  const calendar = parseCalendar(text)
  const events = calendar.children.filter((child) => child.name === 'VEVENT')

  it('is a well-formed calendar with CRLF lines of at most 75 octets', () => {
    // Source: RFC 5545 §3.1 (CRLF line breaks, lines folded at 75 octets), §3.4 (VCALENDAR),
    // §3.7.3 (PRODID) and §3.7.4 (VERSION:2.0).
    expect(calendar.name).toBe('VCALENDAR')
    expect(calendar.properties.get('VERSION')).toEqual(['2.0'])
    expect(calendar.properties.get('PRODID')).toBeDefined()
    for (const line of text.split('\r\n')) {
      expect(new TextEncoder().encode(line).length).toBeLessThanOrEqual(75)
    }
    expect(text.replace(/\r\n/g, '')).not.toContain('\n')
  })

  it('has the day and one entry per swap, at local wall-clock times', () => {
    // Source: RFC 5545 §3.3.5: a date-time without Z or TZID is a floating local time.
    expect(events).toHaveLength(2)
    expect(events.map((event) => event.properties.get('DTSTART')?.[0])).toEqual([
      '20260613T080000',
      '20260613T120000',
    ])
    for (const event of events) expect(event.properties.get('UID')).toHaveLength(1)
  })

  it('reminds the crew before each swap with a display alarm', () => {
    // Source: RFC 5545 §3.6.6: a DISPLAY alarm needs ACTION, TRIGGER and DESCRIPTION;
    // "-PT15M" is 15 minutes before the start (§3.8.6.3, §3.3.6).
    const swap = events[1]!
    const alarms = swap.children.filter((child) => child.name === 'VALARM')
    expect(alarms).toHaveLength(1)
    const alarm = alarms[0]!
    expect(alarm.properties.get('ACTION')).toEqual(['DISPLAY'])
    expect(alarm.properties.get('TRIGGER')).toEqual(['-PT15M'])
    expect(alarm.properties.get('DESCRIPTION')?.[0]).toContain('pack 2')
    expect(events[0]!.children).toEqual([])
  })

  it('puts a day past midnight on the next date', () => {
    const late = scheduleIcs({ ...plan, startTime: '22:00', swaps: [{ atMinute: 150, pack: 2 }] })
    const starts = parseCalendar(late)
      .children.filter((child) => child.name === 'VEVENT')
      .map((event) => event.properties.get('DTSTART')?.[0])
    expect(starts).toEqual(['20260613T220000', '20260614T003000'])
  })
})

describe('a charging break in the exports', () => {
  /** A morning, then a 45-minute break on a 40 W charger from 10:00; its CSV row and calendar. */
  function chargingBreak(chargingRefused: boolean) {
    const day: ScheduleExport = {
      ...plan,
      schedule: [
        { label: 'Morning', minutes: 120 },
        { label: 'Car charger', minutes: 45, state: 'charging', chargeW: 40 },
      ],
      swaps: [],
      chargingRefused,
    }
    const rows = Papa.parse<string[]>(scheduleCsv(day), { skipEmptyLines: true }).data
    // RFC 5545 §3.1: long lines are folded with CRLF and a space; unfold before reading.
    const unfolded = scheduleIcs(day).replace(/\r\n[ \t]/g, '')
    return { charging: rows.find((row) => row[4]?.startsWith('Car charger')), unfolded }
  }

  it('says the rig is silent and the power going into the pack', () => {
    // Source: the plan itself: a 45-minute break on a 40 W charger from 10:00
    const { charging, unfolded } = chargingBreak(false)
    expect(charging?.[1]).toBe('10:00')
    expect(charging?.[4]).toBe('Car charger (silent, pack on the charger at 40 W)')
    expect(unfolded).toContain('Car charger: 45 min\\, silent\\, pack on the charger at 40 W')
  })

  it("says not to charge when the day is outside the pack's charge temperature range", () => {
    // Source: common practice (makers' datasheets): never charge lithium below 0 °C; the plan's
    // result then carries the warning charge-temperature-out-of-range
    const { charging, unfolded } = chargingBreak(true)
    expect(charging?.[4]).toMatch(/do NOT charge the pack/)
    expect(charging?.[4]).not.toMatch(/on the charger/)
    expect(unfolded).toContain('do NOT charge the pack')
  })
})
