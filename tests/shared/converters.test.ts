import { describe, expect, it } from 'vitest'
import {
  accessoryLoad,
  converterVerdict,
  feedFits,
  linearRegulatorEfficiency,
  linearRegulatorHeatW,
} from '../../shared/engine/converters'
import type { AccessoryInputs } from '../../shared/engine/converters'
import { estimate } from '../../shared/engine/estimate'
import { columnRig, variant } from './rig-fixtures'

// A "20 V max" tool pack runs from 21 V full down to 15 V at cutoff (common practice: 5 × 4.2 V
// and 5 × 3.0 V).
const windowMinV = 15
const windowMaxV = 21
// A 5 V preamp drawing 0.5 A through a linear regulator.
const linearPreamp = {
  label: 'Preamp',
  powerW: 2.5,
  inputMinV: 4.5,
  inputMaxV: 5.5,
  feed: 'linear',
  outputV: 5,
} as const

describe('converter verdicts over the whole discharge', () => {
  it('sorts devices by their input range against the pack window', () => {
    // Source: docs/model.md §6: direct OK / step-down / step-up / buck-boost / over the maximum at full
    expect(converterVerdict(windowMinV, windowMaxV, 12, 24)).toBe('direct-ok')
    expect(converterVerdict(windowMinV, windowMaxV, 4.75, 5.25)).toBe('step-down') // USB 5 V ± 5 %
    expect(converterVerdict(windowMinV, windowMaxV, 9, 18)).toBe('over-max')
    expect(converterVerdict(windowMinV, windowMaxV, 22, 26)).toBe('step-up')
    expect(converterVerdict(windowMinV, windowMaxV, 16, 20)).toBe('buck-boost')
  })

  it('checks the chosen feed against the window', () => {
    // Source: common practice: a buck needs its input above its output, a boost below
    const device: AccessoryInputs = {
      label: 'Mixer',
      powerW: 3,
      inputMinV: 11,
      inputMaxV: 13,
      feed: 'buck',
      outputV: 12,
      efficiency: 0.9,
      idleW: 0.05,
      exposedInput: null,
    }
    expect(feedFits(device, 'over-max', windowMinV, windowMaxV)).toBe(true)
    expect(feedFits({ ...device, feed: 'boost' }, 'over-max', windowMinV, windowMaxV)).toBe(false)
    expect(feedFits({ ...device, feed: 'direct' }, 'over-max', windowMinV, windowMaxV)).toBe(false)
    expect(feedFits({ ...device, feed: 'buck-boost' }, 'over-max', windowMinV, windowMaxV)).toBe(
      true,
    )
  })
})

describe('accessory draw', () => {
  it('takes P/η from the pack, the idle draw only as the floor of the loss', () => {
    // Source: a converter datasheet's efficiency at a load already counts all its losses there,
    // idle losses included (common practice), so 2 W at 90 % draws 2/0.9 = 2.222 W, not 2.272 W;
    // at 0.1 W the 0.05 W no-load draw is the larger loss: 0.15 W.
    const receiver = {
      label: 'Receiver',
      powerW: 2,
      inputMinV: 4.75,
      inputMaxV: 5.25,
      feed: 'buck' as const,
      outputV: 5,
      efficiency: 0.9,
      idleW: 0.05,
      exposedInput: null,
    }
    const load = accessoryLoad(receiver)
    expect(load.packPowerW).toBeCloseTo(2 / 0.9, 12)
    expect(load.devicePowerW).toBe(2)
    expect(accessoryLoad({ ...receiver, powerW: 0.1 }).packPowerW).toBeCloseTo(0.15, 12)
  })

  it('runs a linear regulator at V_out/V_in and sheds (V_in − V_out)·I as heat', () => {
    // Source: docs/model.md §6; Ohm's law: 5 V at 0.5 A from 12 V is 41.7 % efficient, 3.5 W of heat
    expect(linearRegulatorEfficiency(12, 5)).toBeCloseTo(5 / 12, 12)
    expect(linearRegulatorHeatW(12, 5, 0.5)).toBeCloseTo(3.5, 12)
    const load = accessoryLoad({ ...linearPreamp, efficiency: 1, idleW: 0, exposedInput: null })
    expect(load.packCurrentA).toBeCloseTo(0.5, 12)
  })

  it('reports linear heat, the window and a plain-words fix in the estimate', () => {
    // Source: docs/model.md §6: (21 V − 5 V) × 0.5 A = 8 W at full charge, far over what a bare
    // regulator sheds (from memory: about 1 W)
    const result = estimate(
      variant(columnRig(), {
        accessories: [linearPreamp],
      }),
    )
    const preamp = result.converters[0]!
    expect(preamp.linearHeatW).toBeCloseTo(8, 6)
    expect(preamp.windowMaxV).toBeCloseTo(21, 9)
    expect(preamp.verdict).toBe('step-down')
    expect(preamp.advice).toMatch(/step-down/)
    expect(result.warnings.map((warning) => warning.code)).toContain('linear-regulator-hot')
  })

  it('flags a directly wired device that a full pack overdrives', () => {
    // Source: docs/model.md §6 verdict "over the device's maximum at full charge": 21 V > 18 V
    const result = estimate(
      variant(columnRig(), {
        accessories: [{ label: 'Mixer', powerW: 3, inputMinV: 9, inputMaxV: 18, feed: 'direct' }],
      }),
    )
    expect(result.converters[0]!.verdict).toBe('over-max')
    expect(result.warnings.find((warning) => warning.code === 'accessory-over-max')?.severity).toBe(
      'danger',
    )
  })

  it("checks an isolated feed against its module's input range, off the charger", () => {
    // Source: the column's 5S li-ion pack reads 5 × 4.20 = 21.0 V straight off the charger
    // (common practice); a module rated 9–18 V in is over its maximum there, one rated 9–36 V
    // (a common 4:1 wide-input class, from memory) is not.
    const preamp = {
      label: 'Preamp',
      powerW: 2,
      inputMinV: 10.8,
      inputMaxV: 13.2,
      feed: 'isolated' as const,
      outputV: 12,
    }
    const narrow = estimate(
      variant(columnRig(), {
        accessories: [{ ...preamp, converterInputMinV: 9, converterInputMaxV: 18 }],
      }),
    )
    expect(narrow.converters[0]!.verdict).toBe('over-max')
    expect(narrow.converters[0]!.fits).toBe(false)
    expect(narrow.converters[0]!.advice).toMatch(/21\.0 V/)
    const overMax = narrow.warnings.find((warning) => warning.code === 'accessory-over-max')
    expect(overMax?.severity).toBe('danger')
    const wide = estimate(
      variant(columnRig(), {
        accessories: [{ ...preamp, converterInputMinV: 9, converterInputMaxV: 36 }],
      }),
    )
    expect(wide.converters[0]!.fits).toBe(true)
    expect(wide.warnings.map((warning) => warning.code)).not.toContain('accessory-over-max')
  })

  it('takes an isolated module of unknown range as passing the pack through, the safe side', () => {
    // Source: common practice: small isolated modules are often unregulated, their output
    // following the input; a 12 V preamp (10.8–13.2 V) on a 21 V pack is then over its maximum.
    const result = estimate(
      variant(columnRig(), {
        accessories: [
          {
            label: 'Preamp',
            powerW: 2,
            inputMinV: 10.8,
            inputMaxV: 13.2,
            feed: 'isolated',
            outputV: 12,
          },
        ],
      }),
    )
    expect(result.converters[0]!.verdict).toBe('over-max')
    expect(result.assumed.map((value) => value.field)).toContain('accessories.0.converterInputMaxV')
  })

  it('checks every chemistry straight off the charger, not at rest', () => {
    // Source: common practice charge end voltages: 4 × 3.65 = 14.6 V LiFePO4, 6 × 2.45 = 14.7 V
    // lead-acid (a "12 V" AGM absorbing), 10 × 1.45 = 14.5 V NiMH: each over a 14.0 V maximum,
    // though each rests below it (13.6, 12.7 and 14.0 V).
    const packs = [
      { chemistry: 'lifepo4', seriesCells: 4, parallelCells: 1, cellCapacityAh: 6 },
      { chemistry: 'lead-acid', seriesCells: 6, parallelCells: 1, cellCapacityAh: 7 },
      { chemistry: 'nimh', seriesCells: 10, parallelCells: 1, cellCapacityAh: 2 },
    ] as const
    for (const pack of packs) {
      const result = estimate(
        variant(columnRig(), {
          pack,
          accessories: [
            { label: 'Player', powerW: 2, inputMinV: 9, inputMaxV: 14, feed: 'direct' },
          ],
        }),
      )
      expect(result.converters[0]!.verdict).toBe('over-max')
      expect(result.warnings.find((w) => w.code === 'accessory-over-max')?.severity).toBe('danger')
    }
  })
})
