// The event model: charge time on a venue charger, the pool of packs over the day, and what the
// crew must bring. Each expected value is worked by hand beside it.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  chargeHoursToFull,
  socAfterChargingPct,
  type ChargeablePack,
} from '../../shared/engine/charging'
import { simulatePool, type PoolDemand } from '../../shared/events/pool'
import { runEvent, type EventPlanInput } from '../../shared/events/run-event'
import { packKindKey } from '../../shared/events/pack-kinds'
import { exampleRigs } from '../../shared/library'
import type { EstimateRequest } from '../../shared/schemas/estimate'

const toolPack5Ah = { chemistry: 'li-ion' as const, seriesCells: 5, capacityAh: 5 }

describe('charge time on a charger (chargeHoursToFull)', () => {
  it('fills a 5 Ah "18 V" tool pack from empty at 50 W in about 1.8 h', () => {
    // Hand arithmetic (energy = charge × voltage, time = energy / power): 5 Ah × 18 V nominal
    // (5 × 3.6 V, common practice) = 90 Wh; 90 Wh / 50 W = 1.8 h. The model charges at the
    // open-circuit voltage, which averages a little above nominal over a charge, so within 5 %.
    const hours = chargeHoursToFull(toolPack5Ah, 0, 50)
    expect(hours).toBeGreaterThan(1.8 * 0.95)
    expect(hours).toBeLessThan(1.8 * 1.05)
  })

  it('fills a 12 V 18 Ah lead-acid battery from empty at 20 W in about 10.8 h', () => {
    // 18 Ah × 12 V nominal (6 × 2 V cells, common practice) = 216 Wh; 216 Wh / 20 W = 10.8 h.
    const hours = chargeHoursToFull(
      { chemistry: 'lead-acid', seriesCells: 6, capacityAh: 18 },
      0,
      20,
    )
    expect(hours).toBeGreaterThan(10.8 * 0.95)
    expect(hours).toBeLessThan(10.8 * 1.05)
  })

  it('takes half the power twice as long, and nothing from full', () => {
    // I = P / V: at a given voltage, charge per hour is proportional to power (Ohm's law, P = V·I).
    const at50W = chargeHoursToFull(toolPack5Ah, 20, 50)
    expect(chargeHoursToFull(toolPack5Ah, 20, 25)).toBeCloseTo(2 * at50W, 9)
    expect(chargeHoursToFull(toolPack5Ah, 100, 50)).toBe(0)
  })

  it('needs more than half the time for the top half of a lithium pack', () => {
    // From memory: a li-ion cell rests near 3.75 V at half charge and 4.2 V when full, above the
    // 3.6 V average of the bottom half, so each ampere-hour of the top half takes more watt-hours.
    const full = chargeHoursToFull(toolPack5Ah, 0, 50)
    expect(chargeHoursToFull(toolPack5Ah, 50, 50)).toBeGreaterThan(full / 2)
  })

  it('walks back: the charge after the full time is 100 %, after half of it between 40 and 60 %', () => {
    const full = chargeHoursToFull(toolPack5Ah, 0, 50)
    expect(socAfterChargingPct(toolPack5Ah, 0, 50, full)).toBeCloseTo(100, 6)
    const half = socAfterChargingPct(toolPack5Ah, 0, 50, full / 2)
    expect(half).toBeGreaterThan(40)
    expect(half).toBeLessThan(60)
  })
})

// One rig, three one-hour turns from 08:00 (minute 480), each pack coming back empty.
const threeTurns: PoolDemand = {
  kindKey: 'tool',
  turns: [
    { startMinute: 480, endMinute: 540, endSocPct: 0 },
    { startMinute: 540, endMinute: 600, endSocPct: 0 },
    { startMinute: 600, endMinute: 660, endSocPct: 0 },
  ],
}
const packs = new Map([['tool', toolPack5Ah]])

describe('the pool over the day (simulatePool)', () => {
  it('runs short at 10:00 with two packs and a 50 W charger: the first pack is still charging', () => {
    // Pack 1 leaves at 09:00 (minute 540) and needs about 1.8 h = 108 min at 50 W (above), so it
    // is full near 10:48; the third turn at 10:00 finds the box empty.
    const outcome = simulatePool({
      demands: [threeTurns],
      packs,
      counts: new Map([['tool', 2]]),
      chargers: [{ powerW: 50, slots: 1, kindKeys: ['tool'] }],
      endMinute: 660,
    })
    expect(outcome.demands[0]!.shortAtMinute).toBe(600)
    expect(outcome.demands[0]!.waitedOnCharger).toBe(true)
    const first = outcome.sessions[0]!
    expect(first.onMinute).toBe(540)
    expect(first.offMinute).toBeGreaterThan(540 + 108 * 0.95)
    expect(first.offMinute).toBeLessThan(540 + 108 * 1.05)
  })

  it('lasts with two packs when the charger gives 100 W: pack 1 is full again before 10:00', () => {
    // 90 Wh / 100 W = 0.9 h = 54 min (within 5 %): back by about 09:54, before the 10:00 swap.
    const outcome = simulatePool({
      demands: [threeTurns],
      packs,
      counts: new Map([['tool', 2]]),
      chargers: [{ powerW: 100, slots: 1, kindKeys: ['tool'] }],
      endMinute: 660,
    })
    expect(outcome.demands[0]!.shortAtMinute).toBeNull()
    expect(outcome.demands[0]!.served.map((turn) => turn.packNumber)).toEqual([1, 2, 1])
  })

  it('queues a pack for a busy one-slot charger and counts the wait', () => {
    // Two rigs swap at 09:00; one slot: the second pack waits until the first is full (~54 min).
    const second: PoolDemand = { ...threeTurns, turns: threeTurns.turns.slice(0, 2) }
    const outcome = simulatePool({
      demands: [{ ...threeTurns, turns: threeTurns.turns.slice(0, 2) }, second],
      packs,
      counts: new Map([['tool', 4]]),
      chargers: [{ powerW: 100, slots: 1, kindKeys: ['tool'] }],
      // The day ends as both rigs finish at 10:00: the packs they give back then stay off.
      endMinute: 600,
    })
    expect(outcome.sessions).toHaveLength(2)
    expect(outcome.sessions[1]!.onMinute).toBeCloseTo(outcome.sessions[0]!.offMinute!, 9)
    expect(outcome.longestQueueMinutes).toBeGreaterThan(54 * 0.95)
    expect(outcome.longestQueueMinutes).toBeLessThan(54 * 1.05)
  })

  it('never charges a kind on a charger that does not fit it', () => {
    const outcome = simulatePool({
      demands: [threeTurns],
      packs,
      counts: new Map([['tool', 2]]),
      chargers: [{ powerW: 500, slots: 4, kindKeys: ['cart'] }],
      endMinute: 660,
    })
    expect(outcome.sessions).toHaveLength(0)
    expect(outcome.demands[0]!.shortAtMinute).toBe(600)
    expect(outcome.demands[0]!.waitedOnCharger).toBe(true)
  })

  it('property: adding a pack to the pool never makes an event fail', () => {
    const turnArbitrary = fc.record({
      lengthMinutes: fc.integer({ min: 5, max: 240 }),
      endSocPct: fc.double({ min: 0, max: 100, noNaN: true }),
    })
    const demandArbitrary = fc.record({
      kindKey: fc.constantFrom('a', 'b'),
      startMinute: fc.integer({ min: 0, max: 600 }),
      turns: fc.array(turnArbitrary, { minLength: 1, maxLength: 6 }),
    })
    fc.assert(
      fc.property(
        fc.array(demandArbitrary, { minLength: 1, maxLength: 4 }),
        fc.array(
          fc.record({
            powerW: fc.double({ min: 5, max: 300, noNaN: true }),
            slots: fc.integer({ min: 1, max: 3 }),
            kindKeys: fc.subarray(['a', 'b'], { minLength: 1 }),
          }),
          { maxLength: 3 },
        ),
        fc.integer({ min: 0, max: 6 }),
        fc.integer({ min: 0, max: 6 }),
        fc.constantFrom('a', 'b'),
        (rawDemands, chargers, countA, countB, added) => {
          const demands: PoolDemand[] = rawDemands.map((raw) => {
            let minute = raw.startMinute
            return {
              kindKey: raw.kindKey,
              turns: raw.turns.map((turn) => {
                const startMinute = minute
                minute += turn.lengthMinutes
                return { startMinute, endMinute: minute, endSocPct: turn.endSocPct }
              }),
            }
          })
          const endMinute = Math.max(...demands.map((demand) => demand.turns.at(-1)!.endMinute))
          const input = {
            demands,
            packs: new Map<string, ChargeablePack>([
              ['a', toolPack5Ah],
              ['b', { chemistry: 'lead-acid' as const, seriesCells: 6, capacityAh: 18 }],
            ]),
            chargers,
            endMinute,
          }
          const lasts = (counts: Map<string, number>) =>
            simulatePool({ ...input, counts }).demands.every(
              (demand) => demand.shortAtMinute === null,
            )
          const fewer = new Map([
            ['a', countA],
            ['b', countB],
          ])
          const more = new Map(fewer).set(added, fewer.get(added)! + 1)
          if (lasts(fewer)) expect(lasts(more)).toBe(true)
        },
      ),
      { numRuns: 200 },
    )
  })
})

// The market column rig on small 5S1P 2.5 Ah packs (about 45 Wh each), so that a loud day from
// 08:00 to 14:00 takes several packs.
function smallPackMarketPlan(request: Partial<EstimateRequest>): EventPlanInput {
  const rig = exampleRigs[0]!
  return {
    planId: 1,
    planName: rig.label,
    rigName: rig.label,
    startTime: '08:00',
    request: {
      ...rig.rig,
      pack: { ...rig.rig.pack, parallelCells: 1, cellCapacityAh: 2.5 },
      ...request,
    } as EstimateRequest,
  }
}

const loudDay: Partial<EstimateRequest> = {
  temperatureC: 12,
  schedule: [
    {
      label: 'Music',
      minutes: 360,
      state: 'on',
      peakBelowClipDb: 0,
      crestFactorDb: 9,
      playingPct: 100,
    },
  ],
}

describe('the event answer (runEvent)', () => {
  const market = smallPackMarketPlan(loudDay)
  const kind = packKindKey(market.request.pack)

  it('gives each pack a turn on the event clock and the fewest packs to bring', () => {
    const answer = runEvent([market], { pool: [{ kind, count: 10 }], chargers: [] })
    const rig = answer.rigs[0]!
    expect(rig.lasts).toBe(true)
    expect(rig.startMinute).toBe(8 * 60)
    expect(rig.turns[0]!.startMinute).toBe(8 * 60)
    expect(rig.turns.at(-1)!.endMinute).toBe(14 * 60)
    // Without chargers every turn needs its own charged pack.
    expect(answer.kinds[0]!.toBring).toBe(rig.turns.length)
    expect(rig.turns.length).toBeGreaterThan(1)
    expect(rig.swapMinutes).toEqual(rig.turns.slice(1).map((turn) => turn.startMinute))
  })

  it('says the rig stops when the pool is one pack short, with what to change', () => {
    const needed = runEvent([market], { pool: [{ kind, count: 10 }], chargers: [] }).kinds[0]!
      .toBring
    const answer = runEvent([market], { pool: [{ kind, count: needed - 1 }], chargers: [] })
    expect(answer.lasts).toBe(false)
    expect(answer.rigs[0]!.stopReason).toMatch(/Bring more packs/)
    expect(answer.cautions.map((caution) => caution.code)).toContain('event-pool-short')
  })

  /** The market plan on days at these temperatures, `count` packs and a 200 W mains charger. */
  function onMains(temperaturesC: readonly number[], count: number) {
    const plans = temperaturesC.map((temperatureC, index) => ({
      ...smallPackMarketPlan({ ...loudDay, temperatureC }),
      planId: index + 1,
    }))
    const chargers = [{ label: 'Mains', powerW: 200, slots: 2, packKinds: [kind] }]
    const answer = runEvent(plans, { pool: [{ kind, count }], chargers })
    const caution = answer.cautions.find((item) => item.code === 'event-lithium-charge-temperature')
    return { answer, caution }
  }

  it('keeps lithium packs off the chargers below 0 °C and says so as a danger', () => {
    // Common practice (lithium cell makers' datasheets): charge only between 0 °C and 45 °C.
    const { answer, caution } = onMains([-5], 2)
    expect(answer.sessions).toHaveLength(0)
    expect(caution?.severity).toBe('danger')
    expect(caution?.message).toMatch(/at -5 °C, the coldest temperature/)
    expect(caution?.message).toMatch(/warm them to above 0 °C/)
  })

  it('keeps lithium packs off the chargers above 45 °C, and says to charge them cooler', () => {
    // Source: Samsung SDI ICR18650-26C specification, charge 0 to 45 °C
    const { answer, caution } = onMains([50], 2)
    expect(answer.sessions).toHaveLength(0)
    expect(caution?.severity).toBe('danger')
    expect(caution?.message).toMatch(/at 50 °C, the hottest temperature/)
    expect(caution?.message).toMatch(/0 to 45 °C/)
    // Without the chargers' help two packs cannot last a day that takes more turns than that.
    expect(answer.lasts).toBe(false)
  })

  it('keeps them off all day when one plan of the day is outside the range (the safe side)', () => {
    // Source: Samsung SDI ICR18650-26C specification, charge 0 to 45 °C. The event has no
    // temperature of its own: each plan's stands for the venue's air in its part of the day, so
    // the chargers must suit the coldest and the hottest of them.
    const { answer, caution } = onMains([15, 50], 4)
    expect(answer.sessions).toHaveLength(0)
    expect(answer.coldestC).toBe(15)
    expect(caution?.message).toMatch(/at 50 °C, the hottest temperature/)
    // The same two plans on a mild day both: the chargers work.
    expect(onMains([15, 15], 4).answer.sessions.length).toBeGreaterThan(0)
  })

  it("names a plan's refused charging break on the plan's clock among the rig's dangers", () => {
    // Source: common practice: never charge lithium below 0 °C. The plan starts at 08:00 and
    // breaks to charge after 2 h of music, so the break is at 10:00.
    const cold = smallPackMarketPlan({
      temperatureC: -5,
      schedule: [
        { label: 'Music', minutes: 120, state: 'on' },
        { label: 'Car charger', minutes: 60, state: 'charging', chargeW: 40 },
        { label: 'Music', minutes: 120, state: 'on' },
      ],
    })
    const answer = runEvent([cold], { pool: [{ kind, count: 6 }], chargers: [] })
    const rig = answer.rigs[0]!
    expect(rig.lasts).toBe(false)
    expect(rig.dangers.join(' ')).toMatch(/The charging break at about 10:00 gives it no charge/)
  })

  it('charges lithium packs at exactly 0 °C: the datasheet range includes its ends', () => {
    // Source: Samsung SDI ICR18650-26C specification, charge 0 to 45 °C
    const { answer, caution } = onMains([0], 2)
    expect(answer.sessions.length).toBeGreaterThan(0)
    expect(caution).toBeUndefined()
  })

  it('needs fewer packs with a charger at the venue than without', () => {
    const without = runEvent([market], { pool: [{ kind, count: 10 }], chargers: [] })
    const withCharger = runEvent([market], {
      pool: [{ kind, count: 10 }],
      chargers: [{ label: 'Mains', powerW: 300, slots: 2, packKinds: [kind] }],
    })
    expect(withCharger.kinds[0]!.toBring).toBeLessThan(without.kinds[0]!.toBring)
    expect(withCharger.sessions.length).toBeGreaterThan(0)
  })

  it('draws the pool from full at the start and lower at the end of a day without charging', () => {
    const answer = runEvent([market], { pool: [{ kind, count: 10 }], chargers: [] })
    expect(answer.pool[0]!.socPct).toBeCloseTo(100, 6)
    expect(answer.pool.at(-1)!.socPct).toBeLessThan(100)
    for (const point of answer.pool) {
      expect(Number.isFinite(point.socPct)).toBe(true)
      expect(point.socPct).toBeGreaterThanOrEqual(0)
      expect(point.socPct).toBeLessThanOrEqual(100)
    }
  })
})
