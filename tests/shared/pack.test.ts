import { describe, expect, it } from 'vitest'
import {
  CANNOT_DELIVER,
  buildPack,
  constantPowerCurrentA,
  mixedLoadCurrentA,
  packOpenCircuitV,
  peukertChargeRateA,
  peukertRuntimeHours,
} from '../../shared/engine/pack'
import type { PackInputs } from '../../shared/engine/pack'

const toolPack: PackInputs = {
  chemistry: 'li-ion',
  seriesCells: 5,
  parallelCells: 2,
  cellCapacityAh: 2.5,
  cellResistanceOhm: 0.03,
  cutoffCellV: 3,
  healthPct: 100,
  peukertExponent: 1.05,
}

describe('pack derivation', () => {
  it('makes a "20 V max" tool pack 18 V nominal and 21 V full', () => {
    // Source: common practice: "20 V max" tool packs are 5 li-ion cells in series, 18 V nominal
    const pack = buildPack(toolPack, 25)
    expect(pack.nominalV).toBeCloseTo(18, 9)
    expect(pack.fullV).toBeCloseTo(21, 9)
    expect(packOpenCircuitV(pack, 1)).toBeCloseTo(21, 9)
    expect(pack.cutoffV).toBeCloseTo(15, 9)
  })

  it('scales capacity by parallel cells, health and temperature, resistance by s/p', () => {
    // Source: docs/model.md §1: capacity = p × cell Ah × health × temperature factor;
    // resistance = s × cell resistance / p (series resistances add, parallel ones divide)
    const pack = buildPack({ ...toolPack, healthPct: 80 }, 25)
    expect(pack.ratedCapacityAh).toBe(5)
    expect(pack.capacityAh).toBeCloseTo(4, 9)
    expect(pack.resistanceOhm).toBeCloseTo(0.075, 9)
    const cold = buildPack(toolPack, 0)
    expect(cold.capacityAh).toBeLessThan(5)
    expect(cold.resistanceOhm).toBeGreaterThan(0.075)
  })
})

describe('constant-power current with sag', () => {
  it('takes the smaller root of R·I² − E·I + P = 0', () => {
    // Source: the quadratic formula: I = (E − √(E² − 4RP)) / 2R = (12 − √104) / 0.2 = 9.0098 A,
    // and the terminal power V·I = (E − I·R)·I must equal P
    const currentA = constantPowerCurrentA(12, 0.1, 100)
    expect(currentA).toBeCloseTo((12 - Math.sqrt(104)) / 0.2, 9)
    expect((12 - currentA * 0.1) * currentA).toBeCloseTo(100, 9)
  })

  it('is I = P/E with no resistance', () => {
    // Source: P = V·I (definition of electric power)
    expect(constantPowerCurrentA(12, 0, 60)).toBe(5)
  })

  it('cannot deliver more than E²/4R', () => {
    // Source: maximum power transfer theorem: at most E²/4R = 36 W from 12 V through 1 ohm,
    // reached at I = E/2R = 6 A
    expect(constantPowerCurrentA(12, 1, 36)).toBeCloseTo(6, 9)
    expect(constantPowerCurrentA(12, 1, 36.01)).toBe(CANNOT_DELIVER)
  })

  it('adds a constant-current part ahead of the constant-power part', () => {
    // Source: Kirchhoff's voltage law: with 1 A fixed and 10 W through 0.5 ohm from 12 V,
    // the load voltage V = 12 − 0.5·I and V·(I − 1) = 10 W
    const currentA = mixedLoadCurrentA(12, 0.5, 1, 10)
    const loadV = 12 - 0.5 * currentA
    expect(loadV * (currentA - 1)).toBeCloseTo(10, 9)
  })
})

describe('Peukert', () => {
  it('runs a 100 Ah / 20 h battery with k = 1.2 for 20 h at 5 A and 8.7 h at 10 A', () => {
    // Source: Peukert's law t = H·(C/(I·H))^k: at the rated 5 A, exactly 20 h;
    // at 10 A, 20 × 0.5^1.2 = 8.706 h
    expect(peukertRuntimeHours(100, 20, 5, 1.2)).toBeCloseTo(20, 9)
    expect(peukertRuntimeHours(100, 20, 10, 1.2)).toBeCloseTo(8.706, 3)
  })

  it('draws charge at I·(I/I_rated)^(k−1), matching the closed form', () => {
    // Source: docs/model.md §1: dQ = I·(I/I_rated)^(k−1)·dt; 100 Ah over that rate equals Peukert's t
    expect(100 / peukertChargeRateA(5, 5, 1.2)).toBeCloseTo(20, 9)
    expect(100 / peukertChargeRateA(10, 5, 1.2)).toBeCloseTo(
      peukertRuntimeHours(100, 20, 10, 1.2),
      9,
    )
    expect(peukertChargeRateA(7, 5, 1)).toBe(7)
  })

  it('gives no more than the rated capacity below the rated current', () => {
    // Common practice: Peukert's law is fitted from the rated (20-hour) current upwards; a
    // 100 Ah battery at 1 A still holds 100 Ah, not the 138 Ah the bare formula would give.
    expect(100 / peukertChargeRateA(1, 5, 1.2)).toBeCloseTo(100, 9)
    expect(peukertRuntimeHours(100, 20, 1, 1.2)).toBeGreaterThan(100)
  })
})
