import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { applyPatch, suggestFixes } from '../../shared/engine/suggestions'
import { packSchema } from '../../shared/schemas/estimate'
import { columnRig, variant } from './rig-fixtures'

const rig = columnRig()
const shortDay = variant(rig, {
  pack: { ...rig.pack, parallelCells: 1, count: 1 },
  programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
  schedule: [
    { label: 'Morning', minutes: 240 },
    { label: 'Afternoon', minutes: 240 },
  ],
})
const lasts = (request: Parameters<typeof estimate>[0]) => estimate(request).schedule!.lasts

describe('fix suggestions', () => {
  it('finds the smallest whole-dB level drop that makes the schedule last', () => {
    // Source: docs/model.md §5: each dB lower cuts the output by 10^(−0.1); "smallest" means one
    // dB less would not do
    expect(lasts(shortDay)).toBe(false)
    const fixes = suggestFixes(shortDay)
    expect(fixes.lasts).toBe(false)
    const drop = fixes.levelDrop!
    expect(drop.db).toBeGreaterThanOrEqual(1)
    expect(lasts(applyPatch(shortDay, drop.patch))).toBe(true)
    if (drop.db > 1) {
      const lessPatch = {
        programme: { ...shortDay.programme, peakBelowClipDb: drop.db - 1 },
      }
      expect(lasts(applyPatch(shortDay, lessPatch))).toBe(false)
    }
  })

  it('counts the extra packs needed', () => {
    // Source: docs/model.md §7: packs swapped at once as each runs out
    const fixes = suggestFixes(shortDay)
    const extra = fixes.extraPacks!
    expect(extra.count).toBeGreaterThanOrEqual(1)
    expect(lasts(applyPatch(shortDay, extra.patch))).toBe(true)
    const oneFewer = { pack: { ...shortDay.pack, count: shortDay.pack.count! + extra.count - 1 } }
    expect(lasts(applyPatch(shortDay, oneFewer))).toBe(false)
  })

  it('picks the smallest larger candidate pack that lasts', () => {
    // Source: definition of the ampere-hour: more cells in parallel at the same draw last longer
    const candidates = [1, 2, 3, 4].map((parallelCells) =>
      packSchema.parse({
        chemistry: 'li-ion',
        seriesCells: 5,
        parallelCells,
        cellCapacityAh: 2.5,
        label: `${parallelCells}P`,
      }),
    )
    const fixes = suggestFixes(shortDay, candidates)
    const larger = fixes.largerPack!
    expect(larger.label).not.toBe('1P')
    expect(lasts(applyPatch(shortDay, larger.patch))).toBe(true)
    const smallerIndex = larger.index - 1
    if (smallerIndex > 0) {
      expect(
        lasts(applyPatch(shortDay, { pack: { ...candidates[smallerIndex]!, count: 1 } })),
      ).toBe(false)
    }
  })

  it('never offers a larger pack that does not fit the rig', () => {
    // Source: product cautions: a pack's maximum continuous discharge is not to be exceeded
    // (makers' datasheets). A 4P pack rated for 0.5 A would carry the day but the rig draws
    // more than that on average, so the next pack that fits (5P, rated 40 A) is offered instead.
    const candidates = [
      { parallelCells: 4, maxDischargeA: 0.5 },
      { parallelCells: 5, maxDischargeA: 40 },
    ].map(({ parallelCells, maxDischargeA }) =>
      packSchema.parse({
        chemistry: 'li-ion',
        seriesCells: 5,
        parallelCells,
        cellCapacityAh: 2.5,
        maxDischargeA,
        label: `${parallelCells}P`,
      }),
    )
    const tooWeak = applyPatch(shortDay, { pack: { ...candidates[0]!, count: 1 } })
    expect(lasts(tooWeak)).toBe(true)
    expect(estimate(tooWeak).warnings.some((warning) => warning.severity === 'danger')).toBe(true)
    expect(suggestFixes(shortDay, candidates).largerPack?.label).toBe('5P')
  })

  it('suggests nothing when the plan lasts', () => {
    // Source: ours: nothing to fix
    const fixes = suggestFixes(variant(shortDay, { pack: { ...shortDay.pack, count: 4 } }))
    expect(fixes).toEqual({ lasts: true, levelDrop: null, extraPacks: null, largerPack: null })
  })
})
