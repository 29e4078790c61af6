import { describe, expect, it } from 'vitest'
import {
  chargeAh,
  chargingCurrentA,
  chargingPermitted,
  powerIntoPackW,
} from '../../shared/engine/charging'
import { estimate } from '../../shared/engine/estimate'
import { estimateResultSchema } from '../../shared/schemas/estimate'
import type { EstimateRequestInput } from '../../shared/schemas/estimate'
import { constantCurrentRig, TEN_AH_PACK } from './rig-fixtures'

/**
 * 5 h at 1 A (half the pack), then a charging break, then `eveningMinutes` of the same draw;
 * `extra` sets the day's temperature or another pack.
 */
function dayWithBreak(
  chargeW: number,
  breakMinutes: number,
  extra: Partial<EstimateRequestInput> = {},
  eveningMinutes = 60,
) {
  const schedule: EstimateRequestInput['schedule'] = [
    { label: 'Morning', minutes: 300 },
    { label: 'Car charger at lunch', minutes: breakMinutes, state: 'charging', chargeW },
    { label: 'Evening', minutes: eveningMinutes },
  ]
  return constantCurrentRig(TEN_AH_PACK, 1, { schedule, ...extra })
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

/** The charging break of a result: its segment and the state of charge across it. */
function lunchOf(result: ReturnType<typeof estimate>) {
  const lunch = result.schedule!.segments[1]!
  const charging = result.timeline.filter((point) => point.state === 'charging')
  const socPcts = charging.map((point) => point.socPct)
  return { lunch, gainedPct: Math.max(...socPcts) - Math.min(...socPcts) }
}

const codesOf = (result: ReturnType<typeof estimate>) =>
  result.warnings.map((warning) => warning.code)

// A 6-cell 10 Ah lead-acid battery (a "12 V" one: common practice, 6 × 2 V cells).
const LEAD_ACID_PACK = {
  chemistry: 'lead-acid',
  seriesCells: 6,
  parallelCells: 1,
  cellCapacityAh: 10,
  peukertExponent: 1,
} as const satisfies EstimateRequestInput['pack']

describe('charging only within the charge temperature range', () => {
  it('allows li-ion from 0 to 45 °C, ends included, and lead-acid in the cold', () => {
    // Source: Samsung SDI ICR18650-26C specification, charge 0 to 45 °C; Panasonic NCR18650B
    // charge 0 to +45 °C (from memory); common practice: never charge lithium below 0 °C
    expect(chargingPermitted('li-ion', -5)).toBe(false)
    expect(chargingPermitted('li-ion', -0.5)).toBe(false)
    expect(chargingPermitted('li-ion', 0)).toBe(true)
    expect(chargingPermitted('li-ion', 20)).toBe(true)
    expect(chargingPermitted('li-ion', 45)).toBe(true)
    expect(chargingPermitted('li-ion', 46)).toBe(false)
    // Source: LiFePO4 and NiMH makers also start charging at 0 °C (from memory)
    expect(chargingPermitted('lifepo4', -1)).toBe(false)
    expect(chargingPermitted('nimh', -1)).toBe(false)
    // Source: common practice: lead-acid charges below 0 °C with a temperature-compensated voltage
    expect(chargingPermitted('lead-acid', -5)).toBe(true)
  })

  it('gives a li-ion pack no charge at a break at −5 °C and says why, as a danger', () => {
    // Source: common practice and makers' datasheets (Samsung SDI ICR18650-26C: charge 0 to 45 °C)
    const result = estimate(dayWithBreak(20, 60, { temperatureC: -5 }))
    const { lunch, gainedPct } = lunchOf(result)
    // No power goes into the pack: the state of charge holds across the break.
    expect(lunch.drawW).toBeCloseTo(0, 9)
    expect(gainedPct).toBeCloseTo(0, 9)
    // Conservation of charge (Q = I·t): 5 h + 1 h at 1 A take 6 Ah out and nothing comes back.
    const leftPct = 100 * (1 - 6 / result.pack.capacityAh)
    expect(result.schedule!.endSocPct).toBeCloseTo(leftPct, 6)
    const refused = result.warnings.find((w) => w.code === 'charge-temperature-out-of-range')
    expect(refused?.severity).toBe('danger')
    expect(refused?.atMinute).toBe(300)
    expect(refused?.message).toMatch(/-5 °C/)
    expect(refused?.message).toMatch(/between 0 and 45 °C/)
    expect(refused?.message).toMatch(/warm it to above 0 °C/)
    expect(refused?.message).toMatch(/bring a charged pack instead/)
  })

  it('charges as before at 20 °C: Q = P·t/V, and no warning', () => {
    // Source: P = V·I and Q = I·t; 20 W for an hour into a half-full 4S NMC pack resting at
    // 14.4–15.6 V (common practice: 3.6–3.9 V a cell in the middle of the curve) is 1.28–1.39 Ah
    const result = estimate(dayWithBreak(20, 60, { temperatureC: 20 }))
    const { lunch, gainedPct } = lunchOf(result)
    expect(lunch.drawW).toBeCloseTo(-20, 9)
    const capacityAh = result.pack.capacityAh
    expect(gainedPct).toBeGreaterThan((100 * 1.28) / capacityAh)
    expect(gainedPct).toBeLessThan((100 * 1.39) / capacityAh)
    expect(codesOf(result)).not.toContain('charge-temperature-out-of-range')
  })

  it('charges at exactly 0 °C: the datasheet range includes its ends', () => {
    // Source: Samsung SDI ICR18650-26C specification, charge 0 to 45 °C
    const { lunch } = lunchOf(estimate(dayWithBreak(20, 60, { temperatureC: 0 })))
    expect(lunch.drawW).toBeCloseTo(-20, 9)
  })

  it('gives no charge above 45 °C and says to let the pack cool', () => {
    // Source: Samsung SDI ICR18650-26C specification, charge 0 to 45 °C
    const result = estimate(dayWithBreak(20, 60, { temperatureC: 50 }))
    expect(lunchOf(result).lunch.drawW).toBeCloseTo(0, 9)
    const refused = result.warnings.find((w) => w.code === 'charge-temperature-out-of-range')
    expect(refused?.message).toMatch(/cool in the shade to below 45 °C/)
  })

  it('still charges a lead-acid battery at −5 °C', () => {
    // Source: common practice: lead-acid is charged below 0 °C with a temperature-compensated
    // voltage; 20 W into the battery for the hour (P = V·I)
    const result = estimate(dayWithBreak(20, 60, { temperatureC: -5, pack: LEAD_ACID_PACK }))
    expect(lunchOf(result).lunch.drawW).toBeCloseTo(-20, 9)
    expect(codesOf(result)).not.toContain('charge-temperature-out-of-range')
  })

  it('shows the lost charge in the figures of a day that relied on it', () => {
    // Source: Q = I·t: 5 h + 6 h at 1 A is 11 Ah, more than the 10 Ah rated pack holds even at
    // 25 °C (IEC 61960 rating), so without the break's charge one pack cannot last; 200 W for
    // 2 h is far more than the 5 Ah of room after the morning (P = V·I, under 17 V a 4S pack)
    const warm = estimate(dayWithBreak(200, 120, { temperatureC: 20 }, 360))
    expect(warm.schedule!.lasts).toBe(true)
    const cold = estimate(dayWithBreak(200, 120, { temperatureC: -5 }, 360))
    expect(cold.schedule!.lasts).toBe(false)
    expect(codesOf(cold).slice(0, 2)).toEqual(['schedule-short', 'charge-temperature-out-of-range'])
    // With a second pack on hand the day lasts, on a swap the warm day does not need.
    const twoPacks = { pack: { ...TEN_AH_PACK, count: 2 } }
    const coldTwo = estimate(dayWithBreak(200, 120, { temperatureC: -5, ...twoPacks }, 360))
    expect(coldTwo.schedule!.lasts).toBe(true)
    expect(coldTwo.schedule!.packsUsed).toBe(2)
    expect(
      estimate(dayWithBreak(200, 120, { temperatureC: 20, ...twoPacks }, 360)).schedule!.packsUsed,
    ).toBe(1)
  })
})
