import { describe, expect, it } from 'vitest'
import {
  PROGRAMME_PRESETS,
  SINE_CREST_FACTOR_DB,
  averagePowerW,
  meanToRmsRatio,
  peakPowerW,
} from '../../shared/engine/programme'

describe('programme and level', () => {
  it('gives the clip power for a sine with its peaks at clipping', () => {
    // Source: docs/model.md §5: a sine (CF 3.01 dB) at L = 0 gives P_clip; 20·log10(√2) = 3.0103 dB
    expect(SINE_CREST_FACTOR_DB).toBeCloseTo(3.0103, 4)
    expect(averagePowerW(40, 0, SINE_CREST_FACTOR_DB)).toBeCloseTo(40, 9)
  })

  it('gives one-eighth power at a 12 dB crest factor', () => {
    // Source: US FTC 16 CFR 432 (one-eighth power preconditioning); IEC 62368-1 uses 1/8 too
    expect(averagePowerW(100, 0, 12) / 100).toBeCloseTo(1 / 8, 2)
  })

  it('lowers the average 10·log10 per dB of level and keeps peaks at P_clip·10^(−L/10)', () => {
    // Source: definition of the decibel for power ratios (docs/model.md "Units")
    expect(10 * Math.log10(averagePowerW(100, 0, 12) / averagePowerW(100, 6, 12))).toBeCloseTo(6, 9)
    expect(peakPowerW(100, 3)).toBeCloseTo(50.12, 2)
  })

  it('uses mean|v|/rms of 0.900 for a sine and 0.798 for Gaussian programme', () => {
    // Source: docs/model.md §4: sine 2√2/π ≈ 0.900, Gaussian √(2/π) ≈ 0.798
    expect(meanToRmsRatio(3.01)).toBeCloseTo(0.9003, 4)
    expect(meanToRmsRatio(12)).toBeCloseTo(0.7979, 4)
    const between = meanToRmsRatio(4.5)
    expect(between).toBeLessThan(0.9003)
    expect(between).toBeGreaterThan(0.7979)
  })

  it('offers presets inside the usual crest-factor ranges', () => {
    // Source: docs/model.md §5 (common practice, from memory): sine 3 dB, dense pop/dance 8–10 dB,
    // rock/pop 12–14 dB, speech 12–15 dB, acoustic/jazz/classical 15–20 dB
    const ranges: Record<string, [number, number]> = {
      'sine-tone': [3, 3.02],
      'dense-dance': [8, 10],
      'rock-pop': [12, 14],
      speech: [12, 15],
      acoustic: [15, 20],
    }
    expect(new Set(PROGRAMME_PRESETS.map((preset) => preset.id)).size).toBe(
      PROGRAMME_PRESETS.length,
    )
    for (const preset of PROGRAMME_PRESETS) {
      const range = ranges[preset.id]
      expect(range, preset.id).toBeDefined()
      expect(preset.crestFactorDb).toBeGreaterThanOrEqual(range![0])
      expect(preset.crestFactorDb).toBeLessThanOrEqual(range![1])
      expect(preset.label.length).toBeGreaterThan(0)
    }
  })
})
