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
    // Source: engine.md §6: direct OK / step-down / step-up / buck-boost / over the maximum at full
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
  it('takes P/η + converter idle from the pack', () => {
    // Source: engine.md §6: pack draw = P/η + converter idle
    const load = accessoryLoad({
      label: 'Receiver',
      powerW: 2,
      inputMinV: 4.75,
      inputMaxV: 5.25,
      feed: 'buck',
      outputV: 5,
      efficiency: 0.9,
      idleW: 0.05,
    })
    expect(load.packPowerW).toBeCloseTo(2 / 0.9 + 0.05, 12)
    expect(load.devicePowerW).toBe(2)
  })

  it('runs a linear regulator at V_out/V_in and sheds (V_in − V_out)·I as heat', () => {
    // Source: engine.md §6; Ohm's law: 5 V at 0.5 A from 12 V is 41.7 % efficient, 3.5 W of heat
    expect(linearRegulatorEfficiency(12, 5)).toBeCloseTo(5 / 12, 12)
    expect(linearRegulatorHeatW(12, 5, 0.5)).toBeCloseTo(3.5, 12)
    const load = accessoryLoad({ ...linearPreamp, efficiency: 1, idleW: 0 })
    expect(load.packCurrentA).toBeCloseTo(0.5, 12)
  })

  it('reports linear heat, the window and a plain-words fix in the estimate', () => {
    // Source: engine.md §6: (21 V − 5 V) × 0.5 A = 8 W at full charge, far over what a bare
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
    // Source: engine.md §6 verdict "over the device's maximum at full charge": 21 V > 18 V
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
})
