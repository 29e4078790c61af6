import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { CHEMISTRY_DATA } from '../../shared/engine/chemistry'
import { interpolate } from '../../shared/engine/table'
import { columnRig, variant } from './rig-fixtures'

const thinLeadRig = () => {
  const rig = columnRig()
  return variant(rig, {
    leads: { awg: 24, lengthM: 3 },
    amplifier: { ...rig.amplifier, lockoutV: 15.5 },
    programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
  })
}

describe('when bass peaks start to mute the amplifier', () => {
  it('finds the charge at which a sustained peak just meets the lock-out', () => {
    // Source: Thevenin source model, V_supply = OCV(SoC) − I·(R_pack + R_lead) (any circuit
    // theory text): at the onset the open-circuit voltage less the peak current through the
    // pack and lead resistance equals the lock-out.
    const request = thinLeadRig()
    const result = estimate(request)
    expect(result.dropoutRisk).toBe(true)
    expect(result.dropout).not.toBeNull()
    const onset = result.dropout!
    const totalOhm = result.pack.resistanceOhm + result.leadResistanceOhm
    const openV =
      request.pack.seriesCells * interpolate(CHEMISTRY_DATA['li-ion'].ocvRows, onset.belowSocPct)
    // The peak current at the onset is at most the current that drops OCV to the lock-out.
    const currentAtOnsetA = (openV - 15.5) / totalOhm
    expect(currentAtOnsetA).toBeGreaterThan(0)
    expect(currentAtOnsetA).toBeGreaterThan(result.peakCurrentA * 0.8)
    expect(currentAtOnsetA).toBeLessThan(result.peakCurrentA * 1.25)
  })

  it('dates the onset on the run clock, before the run stops', () => {
    const result = estimate(thinLeadRig())
    const onset = result.dropout!
    expect(onset.fromMinute).not.toBeNull()
    expect(onset.fromMinute!).toBeLessThan(result.runtimeHours * 60)
    const point = result.timeline.find((entry) => entry.minute === onset.fromMinute)
    expect(point!.socPct).toBeLessThan(onset.belowSocPct)
  })

  it('reports no onset when peaks hold to the end through a thick, short lead', () => {
    // Common practice: a short 12 AWG lead and a lock-out well below the pack's cutoff.
    const rig = columnRig()
    const result = estimate(
      variant(rig, {
        leads: { awg: 12, lengthM: 0.3 },
        amplifier: { ...rig.amplifier, lockoutV: 8 },
      }),
    )
    expect(result.dropoutRisk).toBe(false)
    expect(result.dropout).toBeNull()
    const codes = result.warnings.map((warning) => warning.code)
    expect(codes).not.toContain('dropout-risk')
    expect(codes).not.toContain('dropout-near-empty')
  })
})
