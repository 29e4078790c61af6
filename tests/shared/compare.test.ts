import { describe, expect, it } from 'vitest'
import { comparePacks } from '../../shared/engine/compare'
import { estimate } from '../../shared/engine/estimate'
import { packSchema } from '../../shared/schemas/estimate'
import type { PackSpec } from '../../shared/schemas/estimate'
import { columnRig, variant } from './rig-fixtures'

const toolPack = (parallelCells: number, extra: Partial<PackSpec> = {}): PackSpec =>
  packSchema.parse({
    chemistry: 'li-ion',
    seriesCells: 5,
    parallelCells,
    cellCapacityAh: 2.5,
    maxDischargeA: 20,
    count: 1,
    ...extra,
  })

const day = variant(columnRig(), {
  programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
  schedule: [
    { label: 'Morning', minutes: 240 },
    { label: 'Lunch', minutes: 60, state: 'idle' },
    { label: 'Afternoon', minutes: 240 },
  ],
})

describe('pack comparison', () => {
  it('gives one row per pack with the estimate figures', () => {
    // Source: common practice: an 18 V pack of 2 × 2.5 Ah cells is 90 Wh; 90 Wh over 0.6 kg is
    // 150 Wh/kg
    const packs = [
      toolPack(1, { label: 'Small' }),
      toolPack(2, { label: 'Large', massKg: 0.6, price: 90 }),
    ]
    const rows = comparePacks(day, packs)
    expect(rows).toHaveLength(2)
    const large = rows[1]!
    expect(large.label).toBe('Large')
    expect(large.nominalWh).toBeCloseTo(90, 9)
    expect(large.whPerKg).toBeCloseTo(150, 9)
    expect(large.airlineClass).toBe('up-to-100wh') // IATA: ≤ 100 Wh
    const direct = estimate(variant(day, { pack: packs[1]! }))
    expect(large.runtimeHours).toBe(direct.runtimeHours)
    expect(large.clipPowerCutoffW).toBe(direct.clipPowerW.cutoff)
    expect(large.headroomMinimumDb).toBe(direct.headroom.minimumDb)
    expect(large.costPerMusicHour).toBeCloseTo(90 / large.musicHoursPerCharge, 9)
    expect(large.converterNeeds[0]?.verdict).toBe('step-down')
    expect(large.convertersNeeded).toBe(1)
  })

  it('finds how many packs last the schedule', () => {
    // Source: engine.md §7: with swaps at once, the packs needed are those the run uses
    const rows = comparePacks(day, [toolPack(1), toolPack(1, { count: 2 })])
    const row = rows[0]!
    expect(row.lasts).toBe(false)
    expect(row.packsNeeded).toBeGreaterThan(1)
    // The row comes from one long run; it must agree with the estimate for the pack's own count.
    for (const [index, pack] of [toolPack(1), toolPack(1, { count: 2 })].entries()) {
      const own = estimate(variant(day, { pack }))
      expect(rows[index]!.runtimeHours).toBe(own.runtimeHours)
      expect(rows[index]!.stopReason).toBe(own.stopReason)
      expect(rows[index]!.peakCurrentA).toBe(own.peakCurrentA)
      expect(rows[index]!.warningCodes).toEqual(own.warnings.map((warning) => warning.code))
    }
    const enough = estimate(variant(day, { pack: toolPack(1, { count: row.packsNeeded! }) }))
    expect(enough.schedule!.lasts).toBe(true)
    const fewer = estimate(variant(day, { pack: toolPack(1, { count: row.packsNeeded! - 1 }) }))
    expect(fewer.schedule!.lasts).toBe(false)
  })

  it('ranks a larger pack as longer-running', () => {
    // Source: definition of the ampere-hour: more charge at the same draw runs longer
    const rows = comparePacks(variant(columnRig(), {}), [toolPack(1), toolPack(2), toolPack(3)])
    expect(rows[0]!.runtimeHours).toBeLessThan(rows[1]!.runtimeHours)
    expect(rows[1]!.runtimeHours).toBeLessThan(rows[2]!.runtimeHours)
    expect(rows[0]!.lasts).toBeNull()
    expect(rows[0]!.packsNeeded).toBeNull()
  })

  it('flags peak current over a pack rating', () => {
    // Source: product cautions: do not exceed the pack's discharge rating
    const rows = comparePacks(day, [toolPack(2, { maxDischargeA: 1 }), toolPack(2)])
    expect(rows[0]!.peakOverRating).toBe(true)
    expect(rows[1]!.peakOverRating).toBe(false)
  })
})
