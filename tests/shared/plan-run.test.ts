import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { estimate, prepareRig, runPrepared } from '../../shared/engine'
import { MAX_STEP_S } from '../../shared/engine/run'
import { clockTimeAfter } from '../../shared/plans/clock'
import { segmentEnergies } from '../../shared/plans/segment-energy'
import type { EstimateRequest, ScheduleSegment } from '../../shared/schemas/estimate'
import { columnRig, constantCurrentRig, variant } from './rig-fixtures'

// A day's run as an event plan uses it: segments on, idle and off, swaps between packs on hand,
// and the energy of each segment.

const stepMinutes = MAX_STEP_S / 60

/** Two 4 Ah packs (4S2P of 2 Ah cells, no rate effect) under a steady 1 A while powered. */
function steadyAmpDay(schedule: ScheduleSegment[], count = 2) {
  return constantCurrentRig(
    {
      chemistry: 'li-ion',
      seriesCells: 4,
      parallelCells: 2,
      cellCapacityAh: 2,
      cutoffCellV: 2.8,
      peukertExponent: 1,
      count,
    },
    1,
    { schedule },
  )
}

const playingNothing = { state: 'on', playingPct: 0 } as const

describe('a day with an off segment', () => {
  it('does not drain the pack while off: the swap comes one off-segment later', () => {
    // Source: definition of the ampere-hour: 4 Ah at 1 A lasts 240 powered minutes. Off draws
    // nothing (docs/model.md §7), so the 120 minutes off move the swap from minute 240 to 360.
    const day = estimate(
      steadyAmpDay([
        { label: 'Morning', minutes: 180, ...playingNothing },
        { label: 'Lunch, rig off', minutes: 120, state: 'off' },
        { label: 'Afternoon', minutes: 180, ...playingNothing },
      ]),
    )
    expect(day.schedule!.lasts).toBe(true)
    expect(day.schedule!.swaps).toHaveLength(1)
    expect(Math.abs(day.schedule!.swaps[0]!.atMinute - 360)).toBeLessThanOrEqual(stepMinutes)
    // 08:00 + 6 h is 14:00 on the event clock (ISO 8601 time of day arithmetic).
    expect(clockTimeAfter('08:00', day.schedule!.swaps[0]!.atMinute + 1e-3)).toBe('14:00')
    // The second pack gives the last 120 minutes: 2 Ah of its 4 Ah, so it ends half full.
    const last = day.timeline[day.timeline.length - 1]!
    expect(last.pack).toBe(2)
    expect(last.socPct).toBeCloseTo(50, 0)
    // Across the lunch the state of charge holds and nothing is drawn.
    const lunch = day.timeline.filter((point) => point.state === 'off')
    expect(lunch.length).toBeGreaterThanOrEqual(2)
    expect(new Set(lunch.map((point) => point.socPct)).size).toBe(1)
    expect(lunch.every((point) => point.drawW === 0)).toBe(true)
  })

  it('costs no energy: the same day without the break draws the same', () => {
    // Source: conservation of energy: the off segment moves the later draw in time, unchanged.
    const rig = columnRig()
    const music = { peakBelowClipDb: 2, crestFactorDb: 9, playingPct: 90 }
    const withBreak = estimate(
      variant(rig, {
        schedule: [
          { label: 'Morning', minutes: 150, ...music },
          { label: 'Lunch', minutes: 45, state: 'off' },
          { label: 'Afternoon', minutes: 150, ...music },
        ],
      }),
    )
    const straight = estimate(
      variant(rig, {
        schedule: [
          { label: 'Morning', minutes: 150, ...music },
          { label: 'Afternoon', minutes: 150, ...music },
        ],
      }),
    )
    expect(withBreak.runtimeHours - straight.runtimeHours).toBeCloseTo(45 / 60, 9)
    expect(withBreak.energyWh.drawn).toBeCloseTo(straight.energyWh.drawn, 6)
    expect(withBreak.lowestSocPct).toBeCloseTo(straight.lowestSocPct, 6)
  })
})

describe('energy across a day with swaps', () => {
  const rig = columnRig()
  const request = variant(rig, {
    pack: { ...rig.pack, parallelCells: 1, count: 6 },
    schedule: [
      { label: 'Set-up', minutes: 30, state: 'idle' },
      { label: 'Morning', minutes: 200, peakBelowClipDb: 0, crestFactorDb: 9 },
      { label: 'Lunch', minutes: 60, state: 'off' },
      { label: 'Afternoon', minutes: 200, peakBelowClipDb: 0, crestFactorDb: 9 },
    ],
  })
  const day = estimate(request)
  const segments = segmentEnergies(request)

  it('needs swaps, and lasts on the packs on hand', () => {
    expect(day.schedule!.lasts).toBe(true)
    expect(day.schedule!.swaps.length).toBeGreaterThanOrEqual(1)
  })

  it('accounts for all the chemical energy drawn, over every pack', () => {
    // Source: conservation of energy: what leaves the cells is the amplifier's output and loss,
    // the accessories and their converters, and the I²R in leads and packs (docs/model.md §9:
    // within 0.1 %).
    const breakdown = Object.values(day.breakdownWh).reduce((sum, wh) => sum + wh, 0)
    expect(Math.abs(breakdown - day.energyWh.drawn) / day.energyWh.drawn).toBeLessThan(0.001)
    expect(day.energyWh.delivered).toBeCloseTo(day.energyWh.drawn - day.breakdownWh.packLoss, 6)
  })

  it('splits the day into segment energies that add up to the day', () => {
    // Source: conservation of energy: the segments' shares sum to the run's total.
    const delivered = segments.reduce((sum, segment) => sum + segment.deliveredWh, 0)
    const drawn = segments.reduce((sum, segment) => sum + segment.drawnWh, 0)
    expect(delivered).toBeCloseTo(day.energyWh.delivered, 6)
    expect(drawn).toBeCloseTo(day.energyWh.drawn, 6)
    const lunch = segments.find((segment) => segment.state === 'off')!
    expect(lunch.deliveredWh).toBe(0)
    expect(lunch.ranMinutes).toBeCloseTo(60, 9)
    // Idle draws a little, music much more (docs/model.md §4: idle current only).
    const [setUp, morning] = segments
    expect(setUp!.averageDrawW).toBeGreaterThan(0)
    expect(morning!.averageDrawW).toBeGreaterThan(5 * setUp!.averageDrawW)
    expect(segments[segments.length - 1]!.packAtEnd).toBe(day.schedule!.packsUsed)
  })

  it('gives each fresh pack a full charge at its swap', () => {
    for (const swap of day.schedule!.swaps) {
      const after = day.timeline.find((point) => point.pack === swap.pack)!
      expect(after.minute).toBeCloseTo(swap.atMinute, 6)
      expect(after.socPct).toBeCloseTo(100, 6)
    }
  })
})

describe('segment energies when the day does not last', () => {
  it('stops in the segment where the packs run out and puts nothing after it', () => {
    // Source: definition of the ampere-hour: one 4 Ah pack at 1 A lasts 240 minutes, inside
    // the second 180-minute segment.
    const request = steadyAmpDay(
      [
        { label: 'Morning', minutes: 180, ...playingNothing },
        { label: 'Afternoon', minutes: 180, ...playingNothing },
        { label: 'Evening', minutes: 60, ...playingNothing },
      ],
      1,
    )
    const rows = segmentEnergies(request)
    expect(rows.map((row) => Math.round(row.ranMinutes))).toEqual([180, 60, 0])
    expect(rows[2]!.deliveredWh).toBe(0)
    expect(rows[1]!.startMinute).toBe(180)
  })
})

/**
 * The long way round, as a check: run the day on each prefix of the schedule (segments 1..k); the
 * totals at the end of prefix k are those at the end of segment k, since each prefix is the same
 * deterministic run cut short.
 */
function energiesByPrefixRuns(request: EstimateRequest) {
  const prepared = prepareRig(request)
  const rows: { ranS: number; deliveredJ: number; chemicalJ: number; pack: number }[] = []
  let before = { deliveredJ: 0, chemicalJ: 0, elapsedS: 0, pack: 1 }
  let stopped = false
  for (let index = 0; index < prepared.segments.length; index++) {
    let after = before
    if (!stopped) {
      const outcome = runPrepared(
        { ...prepared, segments: prepared.segments.slice(0, index + 1) },
        prepared.resolved.pack.count,
        false,
      )
      after = { ...outcome, pack: outcome.packsUsed }
      stopped = outcome.stopReason !== 'schedule-end'
    }
    rows.push({
      ranS: after.elapsedS - before.elapsedS,
      deliveredJ: after.deliveredJ - before.deliveredJ,
      chemicalJ: after.chemicalJ - before.chemicalJ,
      pack: after.pack,
    })
    before = after
  }
  return rows
}

describe('segment energies from one run', () => {
  const segmentArbitrary = fc.record({
    label: fc.constant('Segment'),
    minutes: fc.integer({ min: 1, max: 300 }),
    state: fc.constantFrom('on', 'idle', 'off'),
    peakBelowClipDb: fc.double({ min: 0, max: 12, noNaN: true }),
  })
  const dayArbitrary = fc.record({
    schedule: fc.array(segmentArbitrary, { minLength: 1, maxLength: 6 }),
    count: fc.integer({ min: 1, max: 3 }),
    cellCapacityAh: fc.double({ min: 0.5, max: 3, noNaN: true }),
    swapAtBreak: fc.boolean(),
  })

  it('name the pack that ran a segment when it empties exactly as the segment ends', () => {
    // Source: definition of the ampere-hour: a 4 Ah pack at 1 A lasts exactly 240 minutes, so the
    // first pack empties as the morning ends and the second runs the afternoon.
    const request = steadyAmpDay([
      { label: 'Morning', minutes: 240, ...playingNothing },
      { label: 'Afternoon', minutes: 60, ...playingNothing },
    ])
    const rows = segmentEnergies(request)
    expect(rows.map((row) => row.packAtEnd)).toEqual([1, 2])
    expect(rows.map((row) => row.ranMinutes)).toEqual([240, 60])
    expect(energiesByPrefixRuns(request).map((row) => row.pack)).toEqual([1, 2])
  })

  it('match running each prefix of the schedule, over random days', () => {
    // Source: ours (the definition above): a segment's share is the difference between the run's
    // totals at its end and at its start.
    fc.assert(
      fc.property(dayArbitrary, (day) => {
        const base = columnRig()
        const request = variant(base, {
          pack: { ...base.pack, count: day.count, cellCapacityAh: day.cellCapacityAh },
          schedule: day.schedule,
          swapPolicy: day.swapAtBreak
            ? { mode: 'at-break-below', belowSocPct: 40 }
            : { mode: 'when-empty' },
        })
        const rows = segmentEnergies(request)
        const expected = energiesByPrefixRuns(request)
        expect(rows).toHaveLength(expected.length)
        rows.forEach((row, index) => {
          const reference = expected[index]!
          expect(row.ranMinutes).toBeCloseTo(reference.ranS / 60, 9)
          expect(row.deliveredWh).toBeCloseTo(reference.deliveredJ / 3600, 9)
          expect(row.drawnWh).toBeCloseTo(reference.chemicalJ / 3600, 9)
          expect(row.packAtEnd).toBe(reference.pack)
        })
      }),
      { numRuns: 60, seed: Number(process.env.PROPERTY_SEED ?? 20261202) },
    )
  }, 60_000)
})
