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

describe('which part mutes on bass peaks, and the fix in numbers', () => {
  // A player fed directly from the lead, with a 16 V minimum input: it browns out before the
  // amplifier (lock-out 8 V) when bass peaks pull the supply through a thin 3 m lead.
  const playerRig = () => {
    const rig = columnRig()
    return variant(rig, {
      leads: { awg: 24, lengthM: 3 },
      amplifier: { ...rig.amplifier, lockoutV: 8 },
      accessories: [{ label: 'Player', powerW: 2, inputMinV: 16, inputMaxV: 24, feed: 'direct' }],
      programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
    })
  }

  it('names a directly fed part whose minimum input the peaks cross', () => {
    // Source: Thevenin source model (any circuit theory text): every part on the lead sees the
    // same supply, OCV − I·(R_pack + R_lead), so the part with the highest floor mutes first.
    const result = estimate(playerRig())
    expect(result.dropoutRisk).toBe(true)
    expect(result.dropout!.part).toBe('Player')
    expect(result.dropout!.floorV).toBe(16)
    expect(result.minPeakSupplyV).toBeLessThan(16)
    const found = result.warnings.find((warning) => warning.code === 'dropout-risk')
    expect(found?.severity).toBe('danger')
    expect(found?.message).toMatch(/"Player"/)
    expect(found?.message).toMatch(/16\.0 V minimum input/)
    expect(found?.message).toMatch(/below about \d+ % charge/)
  })

  it('gives fixes that clear it, each the least that does', () => {
    // Source: the warning's own promise, checked against the rule it states: with the fix the
    // peaks stay above the floor down to 15 % charge (or the run's end); one step less does not.
    const request = playerRig()
    const { fix } = estimate(request).dropout!
    const aboveFloorAt15 = (changed: typeof request) => {
      const onset = estimate(changed).dropout
      return onset === null || onset.belowSocPct < 15
    }
    expect(fix.lead).not.toBeNull()
    expect(fix.lead!.lengthM).toBe(3)
    expect(fix.lead!.awg).toBeLessThan(24)
    expect(aboveFloorAt15(variant(request, { leads: { awg: fix.lead!.awg, lengthM: 3 } }))).toBe(
      true,
    )
    expect(
      aboveFloorAt15(variant(request, { leads: { awg: fix.lead!.awg + 1, lengthM: 3 } })),
    ).toBe(false)
    expect(fix.quieterDb).not.toBeNull()
    const quieter = (db: number) =>
      variant(request, { programme: { crestFactorDb: 12, peakBelowClipDb: db } })
    expect(aboveFloorAt15(quieter(fix.quieterDb!))).toBe(true)
    expect(aboveFloorAt15(quieter(fix.quieterDb! - 1))).toBe(false)
    // The 24 AWG lead's 0.5 ohm alone (ASTM B258, 3 m each way) drops the supply under 16 V on
    // these peaks, so no number of cells in parallel clears it: none is offered.
    expect(fix.parallelCells).toBeNull()
    const message = estimate(request).warnings.find((w) => w.code === 'dropout-risk')!.message
    expect(message).toContain(`${fix.lead!.awg} AWG) at 3.0 m`)
    expect(message).toContain(`lower the level by ${fix.quieterDb} dB`)
    expect(message).not.toContain('cells in parallel')
  })

  it('offers more cells in parallel where the pack itself sags', () => {
    // Source: pack resistance = s × cell resistance / p (series and parallel resistors): worn
    // 0.2 ohm cells in 5S2P are 0.5 ohm; more cells in parallel divide it.
    const rig = columnRig()
    const request = variant(rig, {
      leads: { awg: 12, lengthM: 0.5 },
      pack: { ...rig.pack, cellResistanceOhm: 0.2 },
      amplifier: { ...rig.amplifier, lockoutV: 15.5 },
      programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
    })
    const result = estimate(request)
    expect(result.pack.resistanceOhm).toBeCloseTo(0.5, 9)
    const cells = result.dropout!.fix.parallelCells!
    expect(cells).toBeGreaterThan(2)
    const onsetWith = (parallelCells: number) =>
      estimate(variant(request, { pack: { ...request.pack, parallelCells } })).dropout
    const cleared = onsetWith(cells)
    expect(cleared === null || cleared.belowSocPct < 15).toBe(true)
    expect(onsetWith(cells - 1)!.belowSocPct).toBeGreaterThanOrEqual(15)
    const message = result.warnings.find((w) => w.code === 'dropout-risk')!.message
    expect(message).toContain(`use a pack with ${cells} cells in parallel`)
  })

  it('says so when even a full pack cannot hold the peaks', () => {
    // Source: Thevenin source model: a full 5S pack (21 V at rest) through 3 m of 28 AWG
    // (about 1.4 ohm round trip, ASTM B258) sags far under an 18 V lock-out at 0 dB.
    const rig = columnRig()
    const result = estimate(
      variant(rig, {
        leads: { awg: 28, lengthM: 3 },
        amplifier: { ...rig.amplifier, lockoutV: 18 },
        programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
      }),
    )
    expect(result.dropout!.belowSocPct).toBe(100)
    expect(result.dropout!.part).toBe('amplifier')
    const found = result.warnings.find((warning) => warning.code === 'dropout-risk')
    expect(found?.message).toMatch(/even from a full pack/)
  })
})
