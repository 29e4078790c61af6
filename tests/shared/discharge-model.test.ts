import { describe, expect, it } from 'vitest'
import {
  dischargeLimitsOf,
  modelConstantCurrentDischarge,
} from '../../shared/engine/discharge-model'
import type { PackSpec } from '../../shared/schemas/estimate'

// A "40 V max" tool pack: 10 Li-ion cells in series, 2 in parallel (common practice).
const toolPack: PackSpec = {
  chemistry: 'li-ion',
  seriesCells: 10,
  parallelCells: 2,
  cellCapacityAh: 2.5,
  cellResistanceOhm: 0.022,
}

describe('what a log is measured against', () => {
  it('takes the cutoff as series cells × cutoff per cell, the engine default when unset', () => {
    // common practice: Li-ion packs cut at 3.0 V per cell, 10 cells → 30 V; rated 2 × 2.5 Ah.
    expect(dischargeLimitsOf(toolPack)).toEqual({ cutoffV: 30, ratedAh: 5 })
    expect(dischargeLimitsOf({ ...toolPack, cutoffCellV: 2.8 }).cutoffV).toBeCloseTo(28, 10)
  })
})

describe('the model under a constant current', () => {
  it('starts at the full open-circuit voltage less I·R of the pack', () => {
    // Ohm's law; pack resistance = s × r / p for cells in series and parallel (any circuit text):
    // 10 × 0.022 / 2 = 0.11 Ω, so 2 A sags 0.22 V from 10 × 4.2 V.
    const model = modelConstantCurrentDischarge(toolPack, 2)
    expect(model.points[0]!.voltageV).toBeCloseTo(42 - 0.22, 10)
    expect(model.stopReason).toBe('pack-cutoff')
    expect(model.points[model.points.length - 1]!.voltageV).toBeCloseTo(30, 10)
    expect(model.deliveredAh).toBeLessThan(5)
  })

  it('delivers the capacity × health as I × t when it runs to empty without Peukert loss', () => {
    // Source: definition of the ampere-hour. k = 1 and a cutoff below the emptied cell's voltage,
    // so the run ends when 80 % of 2.5 Ah has gone: 2 Ah at 1 A, 2 h.
    const pack: PackSpec = {
      ...toolPack,
      seriesCells: 1,
      parallelCells: 1,
      cutoffCellV: 2.5,
      healthPct: 80,
      peukertExponent: 1,
    }
    const model = modelConstantCurrentDischarge(pack, 1)
    expect(model.stopReason).toBe('pack-empty')
    expect(model.deliveredAh).toBeCloseTo(2, 10)
    expect(model.points[model.points.length - 1]!.minute).toBeCloseTo(120, 8)
  })

  it('runs out at the time of Peukert’s law for a lead-acid battery', () => {
    // Source: Peukert's law t = H·(C/(I·H))^k (Peukert 1897; engine.md §1), C20 rating.
    const battery: PackSpec = {
      chemistry: 'lead-acid',
      seriesCells: 6,
      parallelCells: 1,
      cellCapacityAh: 7,
      cutoffCellV: 1.5,
      peukertExponent: 1.2,
    }
    const model = modelConstantCurrentDischarge(battery, 2)
    expect(model.stopReason).toBe('pack-empty')
    const hours = 20 * (7 / (2 * 20)) ** 1.2 // about 2.45 h
    expect(model.points[model.points.length - 1]!.minute).toBeCloseTo(hours * 60, 6)
    expect(model.deliveredAh).toBeCloseTo(2 * hours, 8)
  })

  it('draws nothing for no current', () => {
    expect(modelConstantCurrentDischarge(toolPack, 0).points).toEqual([])
  })
})
