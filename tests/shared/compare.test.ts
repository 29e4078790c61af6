import { describe, expect, it } from 'vitest'
import { comparePacks, packWindowSuits } from '../../shared/engine/compare'
import { estimate } from '../../shared/engine/estimate'
import { packSchema } from '../../shared/schemas/estimate'
import type { EstimateRequest, PackSpec } from '../../shared/schemas/estimate'
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
    // Source: docs/model.md §7: with swaps at once, the packs needed are those the run uses
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

describe('whether a pack fits the rig', () => {
  const rig = columnRig()
  const fitsOf = (request: EstimateRequest, packs: PackSpec[]) =>
    comparePacks(request, packs).map(({ fits, problems }) => ({ fits, problems }))

  it('fits a "20 V max" pack to a board rated to 26 V, and refuses a "40 V max" one', () => {
    // Common practice: li-ion cells are full at 4.20 V, so 5 in series give 21 V off the
    // charger (under the board's 26 V) and 10 in series give 42 V (over it).
    const [small, large] = fitsOf(rig, [toolPack(2), toolPack(2, { seriesCells: 10 })])
    expect(small).toEqual({ fits: true, problems: [] })
    expect(large!.fits).toBe(false)
    expect(large!.problems.length).toBeGreaterThan(0)
    // Each reason is one of the estimate's own dangers, in its own words.
    const dangers = estimate(variant(rig, { pack: toolPack(2, { seriesCells: 10 }) }))
      .warnings.filter((warning) => warning.severity === 'danger')
      .map(({ code, message }) => ({ code, message }))
    expect(dangers).toEqual(expect.arrayContaining(large!.problems))
  })

  it('keeps a pack that fits but does not last the day: that is the "lasts" column', () => {
    // Definition of the ampere-hour: one 5S1P pack (45 Wh) cannot carry a 480-minute day at this
    // level; that is a matter of packs on hand, not of the pack harming the rig.
    const [row] = comparePacks(day, [toolPack(1)])
    expect(row!.lasts).toBe(false)
    expect(row!.fits).toBe(true)
  })

  it('keeps a li-ion pack on a frosty day with a charging break: the break counts no charge', () => {
    // Source: makers' datasheets (Samsung SDI ICR18650-26C: charge 0 to 45 °C) forbid charging
    // li-ion below 0 °C, so the break adds nothing; that is the "lasts" column's business, not
    // a part over its rating (common practice: a 5S2P tool pack suits a board rated to 26 V).
    const frosty = variant(day, {
      temperatureC: -5,
      schedule: [
        { label: 'Morning', minutes: 120 },
        { label: 'Car charger', minutes: 60, state: 'charging', chargeW: 40 },
        { label: 'Afternoon', minutes: 60 },
      ],
    })
    const [row] = comparePacks(frosty, [toolPack(2)])
    expect(row!.fits).toBe(true)
    expect(row!.problems).toEqual([])
    // The estimate with that pack does carry the refusal, as a danger the plan page shows.
    const codes = estimate(variant(frosty, { pack: toolPack(2) })).warnings.map((w) => w.code)
    expect(codes).toContain('charge-temperature-out-of-range')
  })

  it('refuses a pack that puts a directly fed part over its maximum', () => {
    // Common practice: 5 li-ion cells in series are 21 V off the charger; a part wired straight
    // to the pack with a 15 V maximum would see 6 V too much.
    const request = variant(rig, {
      accessories: [{ label: 'Mixer', powerW: 3, inputMinV: 9, inputMaxV: 15, feed: 'direct' }],
    })
    const [row] = fitsOf(request, [toolPack(2)])
    expect(row!.fits).toBe(false)
    expect(row!.problems).toContainEqual({
      code: expect.any(String),
      message: expect.stringContaining('"Mixer"'),
    })
  })

  it('refuses a pack that leaves a directly fed part under its minimum', () => {
    // Common practice: li-ion tool packs cut at 3.0 V per cell, 15 V for 5 in series, below a
    // part that needs 16 V.
    const request = variant(rig, {
      accessories: [{ label: 'Mixer', powerW: 3, inputMinV: 16, inputMaxV: 30, feed: 'direct' }],
    })
    const [row] = fitsOf(request, [toolPack(2)])
    expect(row!.fits).toBe(false)
    expect(row!.problems).toContainEqual({
      code: expect.any(String),
      message: expect.stringContaining('"Mixer"'),
    })
  })

  it('refuses a pack whose full voltage is under the amplifier lock-out', () => {
    // Common practice: a "12 V max" pack is 3 li-ion cells, 12.6 V full: below a 14 V lock-out
    // the board never plays.
    const request = variant(rig, { amplifier: { ...rig.amplifier, lockoutV: 14 } })
    const [row] = fitsOf(request, [toolPack(2, { seriesCells: 3 })])
    expect(row!.fits).toBe(false)
    expect(row!.problems.map((problem) => problem.code)).toContain('stops-at-once')
  })

  it('refuses a pack that cannot deliver the rig’s power', () => {
    // Maximum power transfer: a source of E and R gives at most E²/4R (any circuit text). Five
    // 2 Ω cells in series are 10 Ω; at 21 V that is 11 W, under what two 50 W channels ask.
    const [row] = fitsOf(variant(rig, { programme: { crestFactorDb: 3, peakBelowClipDb: 0 } }), [
      toolPack(1, { cellResistanceOhm: 2 }),
    ])
    expect(row!.fits).toBe(false)
    expect(row!.problems.map((problem) => problem.code)).toContain('cannot-deliver')
  })
})

describe('which packs a comparison starts from', () => {
  it('keeps packs whose window, full to cutoff, sits within the board’s 8–26 V', () => {
    // Common practice: li-ion is full at 4.20 V and cut at 3.0 V per cell; lead-acid is full at
    // about 2.4 V and cut at 1.75 V per cell (10.5 V for a 12 V block).
    const rig = columnRig()
    expect(packWindowSuits(rig, toolPack(2))).toBe(true) // 21 V – 15 V
    expect(packWindowSuits(rig, toolPack(2, { seriesCells: 10 }))).toBe(false) // 42 V > 26 V
    expect(packWindowSuits(rig, toolPack(2, { seriesCells: 2 }))).toBe(false) // 6 V < 8 V
    const block = packSchema.parse({
      chemistry: 'lead-acid',
      seriesCells: 6,
      parallelCells: 1,
      cellCapacityAh: 7,
    })
    expect(packWindowSuits(rig, block)).toBe(true)
  })

  it('leaves out packs that a directly fed part cannot take', () => {
    // Common practice: 5 li-ion cells are 21 V full, over a directly fed 15 V part.
    const request = variant(columnRig(), {
      accessories: [{ label: 'Mixer', powerW: 3, inputMinV: 9, inputMaxV: 15, feed: 'direct' }],
    })
    expect(packWindowSuits(request, toolPack(2))).toBe(false)
    expect(packWindowSuits(request, toolPack(2, { seriesCells: 3 }))).toBe(true) // 12.6 V – 9 V
  })
})
