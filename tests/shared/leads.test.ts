import { describe, expect, it } from 'vitest'
import {
  COPPER_RESISTIVITY_OHM_M,
  conductorResistanceOhmPerKm,
  copperResistivityOhmM,
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
    // Source: ASTM B258 diameter with IEC 60028 resistivity (issue 3 item 5: 18 AWG ≈ 20.95 Ω/km);
    // wire tables give 10 AWG 3.277 Ω/km
    expect(conductorResistanceOhmPerKm(awgToAreaMm2(18), 20)).toBeCloseTo(20.95, 1)
    expect(conductorResistanceOhmPerKm(awgToAreaMm2(10), 20)).toBeCloseTo(3.277, 2)
  })

  it('counts the round trip 2L and adds the connector allowance', () => {
    // Source: engine.md §2: R = ρ(T)·2L/A plus a connector/fuse allowance; a two-conductor lead
    // carries the current out and back
    const area = awgToAreaMm2(18)
    const bare = leadResistanceOhm({ areaMm2: area, lengthM: 1, connectorOhm: 0 }, 20)
    expect(bare).toBeCloseTo(2 * 0.02095, 4)
    const withConnectors = leadResistanceOhm({ areaMm2: area, lengthM: 1, connectorOhm: 0.005 }, 20)
    expect(withConnectors - bare).toBeCloseTo(0.005, 12)
  })
})
