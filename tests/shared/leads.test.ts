import { describe, expect, it } from 'vitest'
import {
  COPPER_RESISTIVITY_OHM_M,
  conductorResistanceOhmPerKm,
  copperResistivityOhmM,
  leadAreaForCurrentMm2,
  leadCurrentRatingA,
  leadResistanceOhm,
} from '../../shared/engine/leads'
import { awgToAreaMm2 } from '../../shared/units'

describe('leads', () => {
  it('uses annealed copper at 1.7241e-8 ohm·m and α = 0.00393 /K', () => {
    // Source: IEC 60028 (international annealed copper standard)
    expect(COPPER_RESISTIVITY_OHM_M).toBe(1.7241e-8)
    expect(copperResistivityOhmM(20)).toBe(1.7241e-8)
    expect(copperResistivityOhmM(30)).toBeCloseTo(1.7241e-8 * 1.0393, 15)
  })

  it('gives 18 AWG about 20.95 ohm/km and 10 AWG about 3.28 ohm/km at 20 °C', () => {
    // Source: ASTM B258 diameter with IEC 60028 resistivity (18 AWG ≈ 20.95 Ω/km);
    // wire tables give 10 AWG 3.277 Ω/km
    expect(conductorResistanceOhmPerKm(awgToAreaMm2(18), 20)).toBeCloseTo(20.95, 1)
    expect(conductorResistanceOhmPerKm(awgToAreaMm2(10), 20)).toBeCloseTo(3.277, 2)
  })

  it('counts the round trip 2L and adds the connector allowance', () => {
    // Source: docs/model.md §2: R = ρ(T)·2L/A plus a connector/fuse allowance; a two-conductor lead
    // carries the current out and back
    const area = awgToAreaMm2(18)
    const bare = leadResistanceOhm({ areaMm2: area, lengthM: 1, connectorOhm: 0 }, 20)
    expect(bare).toBeCloseTo(2 * 0.02095, 4)
    const withConnectors = leadResistanceOhm({ areaMm2: area, lengthM: 1, connectorOhm: 0.005 }, 20)
    expect(withConnectors - bare).toBeCloseTo(0.005, 12)
  })

  it('rates cords by cross-section as IEC 60335-1 does for supply cords', () => {
    // Source: IEC 60335-1 Table 11 (from memory): 0.75 mm² up to 6 A, 1 mm² 10 A, 1.5 mm² 16 A,
    // 2.5 mm² 25 A, 4 mm² 32 A.
    expect(leadCurrentRatingA(0.75)).toBe(6)
    expect(leadCurrentRatingA(1)).toBe(10)
    expect(leadCurrentRatingA(1.5)).toBe(16)
    expect(leadCurrentRatingA(2.5)).toBe(25)
    expect(leadCurrentRatingA(4)).toBe(32)
    // Between sizes, the thinner one's rating; the size to fit is the next one up.
    expect(leadCurrentRatingA(2)).toBe(16)
    expect(leadAreaForCurrentMm2(7.5)).toBe(1)
    expect(leadAreaForCurrentMm2(16)).toBe(1.5)
  })

  it('rates gauges close to the flexible-cord ampacity of the US electrical code', () => {
    // Source: NFPA 70 (NEC) Table 400.5(A)(1), two current-carrying conductors (from memory):
    // 18 AWG 10 A, 16 AWG 13 A, 14 AWG 18 A, 12 AWG 25 A, 10 AWG 30 A.
    const necA: [number, number][] = [
      [18, 10],
      [16, 13],
      [14, 18],
      [12, 25],
      [10, 30],
    ]
    for (const [awg, ampacityA] of necA) {
      const ratingA = leadCurrentRatingA(awgToAreaMm2(awg))
      // The two codes differ by a few amperes; ours never goes more than 10 % above the NEC's
      // figure, nor below half of it.
      expect(ratingA).toBeLessThanOrEqual(ampacityA * 1.1)
      expect(ratingA).toBeGreaterThan(ampacityA / 2)
    }
  })

  it("rates thin hook-up wire by the table's current density, well under an ampere at 26 AWG", () => {
    // Source: ours (6 A/mm², the density of the table's 0.5 mm² row); common practice tables
    // give 26 AWG in a bundle well under 1 A for power.
    expect(leadCurrentRatingA(awgToAreaMm2(26))).toBeCloseTo(0.77, 2)
  })
})
