import { describe, expect, it } from 'vitest'
import { chargeAh, chargingCurrentA, powerIntoPackW } from '../../shared/engine/charging'
import { estimate } from '../../shared/engine/estimate'
import { estimateResultSchema } from '../../shared/schemas/estimate'
import type { EstimateRequestInput } from '../../shared/schemas/estimate'
import { constantCurrentRig, TEN_AH_PACK } from './rig-fixtures'

/** 5 h at 1 A (half the pack), then a charging break, then an hour of the same draw. */
function dayWithBreak(chargeW: number, breakMinutes: number, count = 1) {
  const schedule: EstimateRequestInput['schedule'] = [
    { label: 'Morning', minutes: 300 },
    { label: 'Car charger at lunch', minutes: breakMinutes, state: 'charging', chargeW },
    { label: 'Evening', minutes: 60 },
  ]
  return constantCurrentRig({ ...TEN_AH_PACK, count }, 1, { schedule })
}

describe('charging during the day', () => {
  it('turns 51 W into 2.76 A at 18.5 V and 1.38 A at 37 V', () => {
    // Source: definition of electric power, P = V·I, so I = P / V
    expect(chargingCurrentA(51, 18.5)).toBeCloseTo(2.757, 3)
    expect(chargingCurrentA(51, 37)).toBeCloseTo(1.378, 3)
  })

  it('puts P·t/V into a pack: 51 W for an hour at 18.5 V is 2.76 Ah', () => {
    // Source: definitions of power and charge, P = V·I and Q = I·t
    expect(chargeAh(51, 18.5, 60, 10)).toBeCloseTo(51 / 18.5, 12)
    expect(chargeAh(51, 18.5, 60, 10)).toBeCloseTo(2.757, 3)
    // Twice the time, twice the charge; twice the voltage, half the charge.
    expect(chargeAh(51, 18.5, 120, 10)).toBeCloseTo(2 * 2.757, 3)
    expect(chargeAh(51, 37, 60, 10)).toBeCloseTo(2.757 / 2, 3)
  })

  it('stops at full: never more than the room left in the pack', () => {
    // Source: a pack holds its capacity and no more (definition of state of charge)
    expect(chargeAh(200, 20, 60, 1.5)).toBe(1.5)
    expect(chargeAh(200, 20, 60, 0)).toBe(0)
    expect(chargeAh(0, 20, 60, 5)).toBe(0)
  })

  it('gives the pack 51 W from a 60 W socket through an 85 % charger: 51 Wh in an hour', () => {
    // Source: definition of efficiency, η = P_out / P_in; E = P·t
    expect(powerIntoPackW(60, 0.85)).toBeCloseTo(51, 12)
    const wh = powerIntoPackW(60, 0.85) * 1 // one hour
    expect(wh).toBeCloseTo(51, 12)
    expect(chargeAh(powerIntoPackW(60, 0.85), 18.5, 60, 10) * 18.5).toBeCloseTo(51, 9)
  })

  it('raises a half-empty 4S pack by 12.8–13.9 % with 20 W for an hour', () => {
    // Source: Q = P·t/V with a resting NMC cell between 3.6 and 3.9 V from half to two-thirds
    // charge (common practice: the flat middle of the curve around its 3.6–3.7 V nominal), so
    // 4 cells take 20 W·1 h / (15.6 to 14.4 V) = 1.28 to 1.39 Ah of the 10 Ah pack.
    const result = estimate(dayWithBreak(20, 60))
    expect(estimateResultSchema.safeParse(result).success).toBe(true)
    expect(result.schedule?.lasts).toBe(true)
    // 5 Ah out in the morning, 1 Ah in the evening: 40 % left without the break.
    const endPct = result.schedule!.endSocPct
    expect(endPct).toBeGreaterThan(40 + 12.8)
    expect(endPct).toBeLessThan(40 + 13.9)
    const lunch = result.schedule!.segments[1]!
    expect(lunch.state).toBe('charging')
    expect(lunch.startMinute).toBe(300)
    // Power goes into the pack, 20 W for the whole hour (the pack never fills): a negative draw.
    expect(lunch.drawW).toBeCloseTo(-20, 9)
    const terminals = result.timeline.filter((point) => point.state === 'charging')
    // A charging pack sits above its resting voltage at its terminals (by I·R): above 4 × 3.75 V,
    // the resting voltage of a half-full NMC cell (from memory).
    expect(Math.min(...terminals.map((point) => point.voltageV))).toBeGreaterThan(4 * 3.75)
    expect(lunch.splDb).toBeUndefined()
    // Silent: the break is not music.
    expect(result.musicHours).toBeCloseTo(6, 9)
  })

  it('charges up to full and no further', () => {
    // Source: definition of state of charge (100 % is full); 200 W for 2 h is far more than 5 Ah
    const result = estimate(dayWithBreak(200, 120))
    const charging = result.timeline.filter((point) => point.state === 'charging')
    expect(charging.length).toBeGreaterThan(1)
    expect(Math.max(...charging.map((point) => point.socPct))).toBeCloseTo(100, 9)
    // Full at the end of the break, then 1 Ah out of 10 in the evening.
    expect(result.schedule!.endSocPct).toBeCloseTo(90, 1)
  })

  it('needs a charging power for a charging segment', () => {
    // Source: the request contract; a charging break without a power is not a plan
    const request = {
      ...dayWithBreak(20, 60),
      schedule: [{ label: 'Lunch', minutes: 60, state: 'charging' }],
    }
    expect(() => constantCurrentRig(TEN_AH_PACK, 1, request as never)).toThrow(/charging power/)
  })
})
