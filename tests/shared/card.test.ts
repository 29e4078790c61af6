import { describe, expect, it } from 'vitest'
import { RESTATED_BY_CAUTIONS, buildRuntimeCard, type CardEvent } from '../../shared/card/build'
import { estimate } from '../../shared/engine'
import { MAX_STEP_S } from '../../shared/engine/run'
import type { EstimateRequest } from '../../shared/schemas/estimate'
import { columnRig, constantCurrentRig, variant } from './rig-fixtures'

const stepMinutes = MAX_STEP_S / 60

/**
 * Packs of 5 Ah (4S2P of 2.5 Ah cells, no rate effect) on a steady 1 A for a 12-hour day: each
 * pack lasts 5 h. Source: definition of the ampere-hour (5 Ah / 1 A = 5 h), at 25 °C where the
 * capacity factor is 1.
 */
const cratePack = {
  chemistry: 'li-ion',
  seriesCells: 4,
  parallelCells: 2,
  cellCapacityAh: 2.5,
  cutoffCellV: 2.8,
  peukertExponent: 1,
  label: 'Crate pack',
} as const

function steadyDay(count: number): EstimateRequest {
  return constantCurrentRig({ ...cratePack, count }, 1, {
    temperatureC: 25,
    schedule: [
      { label: 'Morning games', minutes: 360 },
      { label: 'Afternoon games', minutes: 360 },
    ],
  })
}

function planCard(request: EstimateRequest, event: CardEvent) {
  return buildRuntimeCard({
    title: 'Sports day',
    rigName: 'Crate rig',
    notes: 'Meet at the pavilion.',
    event,
    request,
    result: estimate(request),
  })
}

describe('the runtime card of a plan', () => {
  it('puts the swaps on the event clock', () => {
    const card = planCard(steadyDay(3), { date: '2026-06-13', startTime: '08:00' })
    // Source: definition of the ampere-hour: packs run out after 5 h and 10 h
    expect(card.swaps.map((swap) => swap.packIn)).toEqual([2, 3])
    expect(Math.abs(card.swaps[0]!.atMinute - 300)).toBeLessThanOrEqual(stepMinutes)
    expect(Math.abs(card.swaps[1]!.atMinute - 600)).toBeLessThanOrEqual(stepMinutes)
    // Source: clock arithmetic: 08:00 + 5 h = 13:00 and + 10 h = 18:00
    expect(card.swaps.map((swap) => swap.atLabel)).toEqual(['13:00', '18:00'])
    expect(card.timeLabel).toBe('08:00 to 20:00')
    // Source: the Gregorian calendar: 13 June 2026 is a Saturday
    expect(card.dateLabel).toBe('Saturday 13 June 2026')
    expect(card.segments.map((segment) => [segment.startLabel, segment.endLabel])).toEqual([
      ['08:00', '14:00'],
      ['14:00', '20:00'],
    ])
  })

  it('carries the clock past midnight with the day it falls on', () => {
    const card = planCard(steadyDay(3), { date: '2026-12-31', startTime: '22:00' })
    // Source: clock arithmetic: 22:00 + 5 h = 03:00 and + 10 h = 08:00 the next day
    expect(card.swaps.map((swap) => swap.atLabel)).toEqual(['03:00 (+1 day)', '08:00 (+1 day)'])
    expect(card.timeLabel).toBe('22:00 to 10:00 (+1 day)')
  })

  it('asks for the packs the day uses when those on hand last', () => {
    const card = planCard(steadyDay(3), { date: '2026-06-13', startTime: '08:00' })
    // Source: definition of the ampere-hour: 12 h at 1 A is 12 Ah, so three 5 Ah packs
    expect(card.runtime.lasts).toBe(true)
    expect(card.packs).toMatchObject({ bringCharged: 3, onHand: 3 })
    expect(card.packs.headline).toBe('Bring 3 charged packs.')
    expect(card.packs.packLabel).toBe('Crate pack: 14.4 V Li-ion, 4S2P, 5 Ah, 72 Wh')
  })

  it('asks for more packs than on hand when those do not last, and says when sound stops', () => {
    const card = planCard(steadyDay(2), { date: '2026-06-13', startTime: '08:00' })
    // Source: definition of the ampere-hour: two 5 Ah packs give 10 h of the 12 h day at 1 A;
    // a third covers it
    expect(card.runtime.lasts).toBe(false)
    expect(card.runtime.stopsAtLabel).toBe('18:00')
    expect(card.runtime.headline).toMatch(/^Does NOT last: sound stops at 18:00, 2 h 00 min before/)
    expect(card.packs).toMatchObject({ bringCharged: 3, onHand: 2 })
    expect(card.packs.headline).toBe(
      'Bring 3 charged packs: the 2 packs in the plan do not last the day.',
    )
    expect(card.warnings.map((warning) => warning.code)).toContain('schedule-short')
    // The card of a plan names the moment on the event clock, as the headline does.
    expect(card.warnings.find((warning) => warning.code === 'schedule-short')?.message).toMatch(
      /^The rig stops at about 18:00, 2 h 00 min before the schedule ends/,
    )
  })

  it('keeps the dangers and cautions, dangers first, and leaves the info notes on the bench', () => {
    // Source: common practice: 3 × 8 ohm in parallel ≈ 2.67 ohm, below a 4 ohm minimum load
    const request = variant(columnRig(), {
      amplifier: { ...columnRig().amplifier, minLoadOhm: 4 },
      speakers: { driverOhm: 8, parallel: 3, banks: 1, sensitivityDb: 95 },
      listenerDistanceM: 1,
    })
    const result = estimate(request)
    const card = buildRuntimeCard({ title: 'Bench rig', rigName: 'Bench rig', request, result })
    const kept = result.warnings.filter(
      (warning) => warning.severity !== 'info' && !RESTATED_BY_CAUTIONS.includes(warning.code),
    )
    expect(kept.length).toBeGreaterThan(1)
    expect(card.warnings.map((warning) => warning.code).sort()).toEqual(
      kept.map((warning) => warning.code).sort(),
    )
    expect(card.warnings[0]).toMatchObject({ code: 'load-below-minimum', severity: 'danger' })
    expect(card.warnings.map((warning) => warning.severity)).toEqual(
      [...card.warnings.map((warning) => warning.severity)].sort(),
    )
    // The lithium note is info on the bench; the card says it among its cautions instead.
    expect(card.warnings.map((warning) => warning.code)).not.toContain('lithium-safety')
    expect(card.cautions.map((caution) => caution.topic)).toEqual(['hearing', 'battery', 'wiring'])
    expect(card.cautions[1]!.title).toBe('Lithium packs')
    expect(card.rigLine).toContain('2.67 ohm load')
  })

  it('gives the permitted exposure time in the hearing caution above 85 dBA, and the children’s figure', () => {
    const request = variant(columnRig(), { listenerDistanceM: 1.5, childrenPresent: true })
    const result = estimate(request)
    const card = buildRuntimeCard({ title: 'Loud', rigName: 'Loud', request, result })
    expect(result.exposure!.levelDb).toBeGreaterThan(85)
    // Source: NIOSH 98-126: 8 h at 85 dBA, halved for every 3 dB above
    const permittedMinutes = Math.round(480 / 2 ** ((result.exposure!.levelDb - 85) / 3))
    const hours = Math.floor(permittedMinutes / 60)
    const minutes = String(permittedMinutes % 60).padStart(2, '0')
    const words = hours === 0 ? `${Number(minutes)} min` : `${hours} h ${minutes} min`
    const hearing = card.cautions[0]!.text
    expect(hearing).toContain(`under ${words} a day`)
    // The hearing warnings are said here once, with their figures, not again in the list.
    const codes = result.warnings.map((warning) => warning.code)
    expect(codes).toEqual(expect.arrayContaining(['hearing-caution', 'children-present']))
    expect(card.warnings.map((warning) => warning.code)).not.toContain('hearing-caution')
    expect(hearing).toContain(
      `${Math.round(result.exposure!.levelDb)} dB is above the 80 dB aimed at for them`,
    )
  })

  it('keeps the warning above the venue figure in the list', () => {
    // Source: WHO Global standard for safe listening venues (2022): 100 dB LAeq over 15 min
    // Half a metre from the column against a wall (6 dB boundary gain, common practice).
    const request = variant(columnRig(), { listenerDistanceM: 0.5, boundaryGainDb: 6 })
    const result = estimate(request)
    expect(result.exposure!.levelDb).toBeGreaterThan(100)
    const card = buildRuntimeCard({ title: 'Loud', rigName: 'Loud', request, result })
    expect(card.warnings[0]).toMatchObject({ code: 'hearing-over-venue-limit', severity: 'danger' })
  })
})

describe('the runtime card of a rig alone', () => {
  it('counts swaps from switching on, without a date', () => {
    const request = constantCurrentRig({ ...cratePack, count: 2 }, 1, { temperatureC: 25 })
    const card = buildRuntimeCard({
      title: 'Crate rig',
      rigName: 'Crate rig',
      request,
      result: estimate(request),
    })
    expect(card.kind).toBe('rig')
    expect(card.dateLabel).toBeNull()
    expect(card.runtime.lasts).toBeNull()
    // Source: definition of the ampere-hour: a 5 Ah pack at 1 A is empty after 5 h
    expect(card.swaps).toHaveLength(1)
    expect(card.swaps[0]!.atLabel).toBe('after 5 h 00 min')
    expect(card.packs.bringCharged).toBe(2)
  })
})

describe('the meter readings on the card', () => {
  function marketDay(listenerDistanceM: number) {
    return variant(columnRig(), {
      listenerDistanceM,
      schedule: [
        { label: 'Speeches', minutes: 30, peakBelowClipDb: 12, playingPct: 50 },
        { label: 'Lunch on the car charger', minutes: 60, state: 'charging', chargeW: 40 },
        { label: 'Band set', minutes: 60, peakBelowClipDb: 6 },
        { label: 'Finale', minutes: 15, peakBelowClipDb: 0 },
      ],
    })
  }
  const cardAt = (distanceM: number) =>
    planCard(marketDay(distanceM), { date: '2026-06-13', startTime: '10:00' })
  const reading = (meter: string | null) => Number(/about (\d+) dBA/.exec(meter ?? '')?.[1])

  it('says what a meter should read in each segment with music, at the audience', () => {
    const card = cardAt(10)
    const [speeches, lunch, band, finale] = card.segments
    expect(speeches!.meter).toMatch(/^Meter about \d+ dBA$/)
    expect(lunch!.meter).toBeNull()
    expect(lunch!.activity).toBe('Rig silent; its pack on the charger (40 W into it)')
    // Source: decibel arithmetic: peaks 6 dB nearer clipping at a fixed volume is 6 dB more on
    // the meter (whole dB after rounding each)
    expect(Math.abs(reading(finale!.meter) - reading(band!.meter) - 6)).toBeLessThanOrEqual(1)
  })

  it('tells the crew not to charge a lithium pack at the break below 0 °C, and why', () => {
    // Source: Samsung SDI ICR18650-26C specification, charge 0 to 45 °C; common practice: never
    // charge lithium below 0 °C. The plan is on the card's clock: the break starts at 10:30.
    const card = planCard(variant(marketDay(10), { temperatureC: -5 }), {
      date: '2026-12-12',
      startTime: '10:00',
    })
    expect(card.segments[1]!.activity).toBe(
      'Rig silent; do NOT charge its pack at -5 °C (23 °F) (see the warnings)',
    )
    const refused = card.warnings.find((w) => w.code === 'charge-temperature-out-of-range')
    expect(refused?.severity).toBe('danger')
    expect(refused?.message).toMatch(/The charging break at about 10:30 gives it no charge/)
    expect(card.cautions.find((caution) => caution.topic === 'battery')?.text).toMatch(
      /Charging at a break: only between 0 and 45 °C,/,
    )
  })

  it('reads about 10.5 dB less at 10 m than at 3 m', () => {
    // Source: inverse-square law in free field: 20·log10(10/3) = 10.46 dB (each reading rounded)
    const near = cardAt(3).segments[3]!
    const far = cardAt(10).segments[3]!
    expect([10, 11]).toContain(reading(near.meter) - reading(far.meter))
  })

  it('tells the crew to set the level by meter, and that the readings are estimates', () => {
    // Source: IEC 61672-1 (A-weighting, slow time weighting of sound level meters)
    const card = cardAt(10)
    expect(card.meterNote).toMatch(/A-weighted, slow/)
    expect(card.meterNote).toMatch(/free-field estimates/)
    expect(card.meterNote).toMatch(/10 m/)
    // A day that charges at a break gets the charging caution with the battery one.
    expect(card.cautions.find((caution) => caution.topic === 'battery')?.text).toMatch(
      /Charging at a break/,
    )
    // A silent day has no readings to give.
    const silent = planCard(steadyDay(3), { date: '2026-06-13', startTime: '08:00' })
    expect(silent.meterNote).toBeNull()
    expect(silent.segments.every((segment) => segment.meter === null)).toBe(true)
  })
})
