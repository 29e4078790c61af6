import { describe, expect, it } from 'vitest'
import {
  NIOSH_REL_DBA,
  WHO_VENUE_LAEQ_DB,
  distanceLossDb,
  equivalentLevelDb,
  nioshPermittedMinutes,
  soundLevelDb,
} from '../../shared/engine/sound'
import { estimate } from '../../shared/engine/estimate'
import { columnRig, variant } from './rig-fixtures'

describe('sound level at a distance', () => {
  it('drops 6.02 dB per doubling of distance', () => {
    // Source: inverse-square law, 20·log10(2) = 6.02 dB
    expect(distanceLossDb(2) - distanceLossDb(1)).toBeCloseTo(6.0206, 4)
    expect(soundLevelDb(90, 1, 1, 8, 0) - soundLevelDb(90, 1, 1, 16, 0)).toBeCloseTo(6.0206, 4)
  })

  it('equals the sensitivity at 1 W and 1 m, +10 dB per tenfold power, +3 dB per doubled drivers', () => {
    // Source: definition of sensitivity (dB SPL at 1 W, 1 m). Drivers at different places add in
    // power across the A-weighted band: two equal incoherent sources are 10·log10(2) = 3.01 dB
    // above one (the textbook sum of incoherent levels, e.g. Kinsler et al., Fundamentals of
    // Acoustics), twelve are 10.79 dB above one, not the 21.58 dB of pressure addition.
    expect(soundLevelDb(88, 1, 1, 1, 0)).toBe(88)
    expect(soundLevelDb(88, 10, 1, 1, 0)).toBeCloseTo(98, 9)
    expect(soundLevelDb(88, 1, 2, 1, 0)).toBeCloseTo(91.01, 2)
    expect(soundLevelDb(88, 1, 12, 1, 0)).toBeCloseTo(98.79, 2)
    expect(soundLevelDb(88, 1, 1, 1, 3)).toBe(91)
  })

  it('reads a twelve-driver column at 5 m by power summation', () => {
    // Source: the power sum by hand: L = S + 10·log10(N·P_driver) − 20·log10(d); at 5 m twelve
    // 86 dB drivers at 0.5 W each give 86 + 10·log10(6) − 13.98 = 79.80 dB.
    expect(soundLevelDb(86, 0.5, 12, 5, 0)).toBeCloseTo(79.8, 2)
    // The column rig's figure follows the same sum from its own driver power (all 12 face).
    const result = estimate(variant(columnRig(), { listenerDistanceM: 5 }))
    const perDriverW = result.speakers.powerPerDriverW.average
    expect(result.splDb!.average).toBeCloseTo(
      86 + 10 * Math.log10(12 * perDriverW) - 20 * Math.log10(5),
      6,
    )
  })

  it('counts drivers of every channel, and more facing never reads quieter', () => {
    // Source: power summation over the drivers facing the listener: 6 of 12 facing is 3.01 dB
    // below all 12.
    const rig = columnRig()
    const all = estimate(rig)
    const half = estimate(variant(rig, { speakers: { ...rig.speakers, facingListener: 6 } }))
    expect(all.splDb!.average - half.splDb!.average).toBeCloseTo(3.01, 2)
  })

  it('never reads the peak below the average, even under 3 dB crest factor', () => {
    // Source: by definition a programme's peak level is at least its level while playing; a square
    // wave (crest factor 0 dB) has its peak equal to its rms.
    const result = estimate(
      variant(columnRig(), { programme: { crestFactorDb: 0, peakBelowClipDb: 6 } }),
    )
    expect(result.splDb!.peak).toBeGreaterThanOrEqual(result.splDb!.average)
  })

  it('counts pauses in the equivalent level', () => {
    // Source: definition of LAeq: half the time at L is L − 3.01 dB
    expect(equivalentLevelDb(90, 0.5)).toBeCloseTo(86.99, 2)
  })
})

describe('hearing', () => {
  it('permits 8 h at 85 dBA with a 3 dB exchange rate: 15 minutes at 100 dBA', () => {
    // Source: NIOSH 98-126, Criteria for a Recommended Standard: Occupational Noise Exposure
    expect(NIOSH_REL_DBA).toBe(85)
    expect(nioshPermittedMinutes(85)).toBe(480)
    expect(nioshPermittedMinutes(88)).toBeCloseTo(240, 9)
    expect(nioshPermittedMinutes(100)).toBeCloseTo(15, 9)
  })

  it('uses the WHO venue figure of 100 dB LAeq', () => {
    // Source: WHO Global standard for safe listening venues and events (2022): 100 dB LAeq,15 min
    expect(WHO_VENUE_LAEQ_DB).toBe(100)
  })

  it('estimates the rig at the listener and cautions above 85 dB', () => {
    // Source: inverse-square law and NIOSH 98-126 permitted time
    const close = estimate(variant(columnRig(), { listenerDistanceM: 1.5 }))
    expect(close.splDb).toBeDefined()
    expect(close.splDb!.peak).toBeGreaterThan(close.splDb!.average)
    expect(close.exposure!.permittedMinutes).toBeCloseTo(
      nioshPermittedMinutes(close.splDb!.average),
      9,
    )
    expect(close.warnings.map((warning) => warning.code)).toContain('hearing-caution')
    const far = estimate(variant(columnRig(), { listenerDistanceM: 3 }))
    expect(close.splDb!.average - far.splDb!.average).toBeCloseTo(6.02, 2)
  })

  it('is stricter with children present', () => {
    // Source: product cautions (from memory: guidance for children sits below adult figures)
    const request = variant(columnRig(), { listenerDistanceM: 3, childrenPresent: true })
    const result = estimate(request)
    expect(result.splDb!.average).toBeGreaterThan(80)
    expect(result.splDb!.average).toBeLessThan(85)
    const codes = result.warnings.map((warning) => warning.code)
    expect(codes).toContain('children-present')
    expect(codes).not.toContain('hearing-caution')
  })

  it('gives no sound level without a sensitivity', () => {
    // Source: docs/estimate-api.md: splDb only when sensitivity is given
    const rig = columnRig()
    const result = estimate(variant(rig, { speakers: { driverOhm: 8, parallel: 3, banks: 2 } }))
    expect(result.splDb).toBeUndefined()
    expect(result.exposure).toBeUndefined()
  })
})
