import { describe, expect, it } from 'vitest'
import { airlineClass, nominalWh } from '../../shared/engine/energy'
import { estimate } from '../../shared/engine/estimate'
import { columnRig, variant } from './rig-fixtures'

describe('energy and airline class', () => {
  it('rates energy as nominal V × Ah', () => {
    // Source: docs/model.md §1; common practice: an 18 V 5 Ah tool pack is labelled 90 Wh
    expect(nominalWh(18, 5)).toBe(90)
    expect(estimate(columnRig()).energyWh.nominal).toBeCloseTo(90, 9)
  })

  it('classes packs at 100 and 160 Wh', () => {
    // Source: IATA Dangerous Goods Regulations, lithium batteries: ≤ 100 Wh; > 100 Wh and
    // ≤ 160 Wh with airline approval; > 160 Wh not in passenger baggage
    expect(airlineClass(100, true)).toBe('up-to-100wh')
    expect(airlineClass(100.01, true)).toBe('100-to-160wh')
    expect(airlineClass(160, true)).toBe('100-to-160wh')
    expect(airlineClass(160.01, true)).toBe('over-160wh')
    // The same DGR Wh limits are the lithium battery rules: other chemistries get no Wh class.
    expect(airlineClass(50, false)).toBe('not-lithium')
    expect(airlineClass(500, false)).toBe('not-lithium')
  })

  it('warns about approval for a 108 Wh pack and refusal for a 180 Wh pack', () => {
    // Source: IATA DGR as above; 18 V × 6 Ah = 108 Wh, 18 V × 10 Ah = 180 Wh
    const rig = columnRig()
    const mid = estimate(variant(rig, { pack: { ...rig.pack, cellCapacityAh: 3 } }))
    expect(mid.airlineClass).toBe('100-to-160wh')
    expect(mid.warnings.map((warning) => warning.code)).toContain('airline-approval-needed')
    const big = estimate(variant(rig, { pack: { ...rig.pack, cellCapacityAh: 5 } }))
    expect(big.airlineClass).toBe('over-160wh')
    expect(big.warnings.map((warning) => warning.code)).toContain('airline-not-allowed')
  })
})
