import { describe, expect, it } from 'vitest'
import {
  CHEMISTRIES,
  CHEMISTRY_DATA,
  capacityTemperatureFactor,
  cellOpenCircuitV,
  defaultCellResistanceOhm,
  resistanceTemperatureFactor,
} from '../../shared/engine/chemistry'

describe('chemistry tables', () => {
  it('gives a 12 V lead-acid battery 12.7 V resting when full and about 12.2 V at half', () => {
    // Source: the common AGM resting-voltage charts (from memory; tables differ
    // by ±0.15 V)
    expect(6 * cellOpenCircuitV('lead-acid', 100)).toBeCloseTo(12.7, 2)
    expect(Math.abs(6 * cellOpenCircuitV('lead-acid', 50) - 12.2)).toBeLessThanOrEqual(0.15)
  })

  it('gives li-ion cells 3.6 V nominal and 4.2 V full', () => {
    // Source: common practice: "18 V" tool packs are 5 × 3.6 V cells charged to 4.2 V each
    expect(CHEMISTRY_DATA['li-ion'].nominalCellV).toBe(3.6)
    expect(cellOpenCircuitV('li-ion', 100)).toBe(4.2)
  })

  it('gives LiFePO4 3.2 V and NiMH 1.2 V nominal', () => {
    // Source: common practice: 12.8 V LiFePO4 packs are 4 × 3.2 V; NiMH cells are 1.2 V
    expect(CHEMISTRY_DATA.lifepo4.nominalCellV).toBe(3.2)
    expect(CHEMISTRY_DATA.nimh.nominalCellV).toBe(1.2)
  })

  it.each(CHEMISTRIES)('%s: open-circuit voltage rises with state of charge', (chemistry) => {
    // Source: from memory: every cell's OCV rises monotonically with its state of charge
    const rows = CHEMISTRY_DATA[chemistry].ocvRows
    expect(rows[0]?.[0]).toBe(0)
    expect(rows[rows.length - 1]?.[0]).toBe(100)
    for (let i = 1; i < rows.length; i++) expect(rows[i]![1]).toBeGreaterThan(rows[i - 1]![1])
    // The nominal voltage sits between cutoff and full (common practice).
    const data = CHEMISTRY_DATA[chemistry]
    expect(data.nominalCellV).toBeGreaterThan(data.cutoffCellV)
    expect(data.nominalCellV).toBeLessThan(data.fullCellV)
  })

  it.each(CHEMISTRIES)('%s: the cold costs capacity and raises resistance', (chemistry) => {
    // Source: from memory: makers' curves rate cells at 25 °C; capacity falls and resistance rises
    // as the cell cools
    expect(capacityTemperatureFactor(chemistry, 25)).toBe(1)
    expect(resistanceTemperatureFactor(chemistry, 25)).toBe(1)
    expect(capacityTemperatureFactor(chemistry, 0)).toBeLessThan(1)
    expect(capacityTemperatureFactor(chemistry, -20)).toBeLessThan(
      capacityTemperatureFactor(chemistry, 0),
    )
    expect(resistanceTemperatureFactor(chemistry, -20)).toBeGreaterThan(
      resistanceTemperatureFactor(chemistry, 0),
    )
  })

  it('defaults a 2.5 Ah li-ion cell to about 30 mΩ and uses Peukert k 1.2 for lead-acid', () => {
    // Source: from memory: 18650 power cells measure 20–40 mΩ DC; lead-acid k 1.1–1.3 (common
    // practice). Lithium gets no Peukert on top of its I·R sag (makers' curves lose only 1–3 %
    // at 1 C beyond it, from memory), but a small rate loss instead.
    expect(defaultCellResistanceOhm('li-ion', 2.5)).toBeCloseTo(0.03, 6)
    expect(CHEMISTRY_DATA['lead-acid'].peukertExponent).toBe(1.2)
    expect(CHEMISTRY_DATA['li-ion'].peukertExponent).toBe(1)
    expect(CHEMISTRY_DATA['li-ion'].rateLossPerC).toBe(0.02)
  })

  it("checks maximum voltages against the charger's end voltage per cell", () => {
    // Source: common practice charge end voltages: 4.20 V li-ion, 3.65 V LiFePO4, 2.45 V lead-acid
    // (14.7 V for a 12 V AGM), 1.45 V NiMH
    expect(CHEMISTRY_DATA['li-ion'].chargedCellV).toBe(4.2)
    expect(CHEMISTRY_DATA.lifepo4.chargedCellV).toBe(3.65)
    expect(CHEMISTRY_DATA['lead-acid'].chargedCellV).toBe(2.45)
    expect(CHEMISTRY_DATA.nimh.chargedCellV).toBe(1.45)
  })
})
