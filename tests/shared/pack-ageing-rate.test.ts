// Health and discharge rate: what a worn pack and a hard-driven lithium pack give.
import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { LITHIUM_RATE_LOSS_MAX, ageingResistanceFactor } from '../../shared/engine/pack'
import { columnRig, constantCurrentRig, variant } from './rig-fixtures'

describe('health raises resistance', () => {
  it('doubles the resistance at 80 % health, and leaves a measured resistance alone', () => {
    // Source: common practice: cell makers' cycle-life tests and battery standards call a cell
    // worn out at 80 % of its capacity or twice its new resistance; the rule links the two in a
    // straight line (ours), so 90 % health is 1.5 × and 100 % is 1 ×.
    expect(ageingResistanceFactor(100)).toBe(1)
    expect(ageingResistanceFactor(110)).toBe(1)
    expect(ageingResistanceFactor(90)).toBeCloseTo(1.5, 12)
    expect(ageingResistanceFactor(80)).toBeCloseTo(2, 12)
    const rig = columnRig()
    const fresh = estimate(rig)
    const worn = estimate(variant(rig, { pack: { ...rig.pack, healthPct: 80 } }))
    expect(worn.pack.resistanceOhm).toBeCloseTo(2 * fresh.pack.resistanceOhm, 12)
    expect(worn.pack.capacityAh).toBeCloseTo(0.8 * fresh.pack.capacityAh, 12)
    const measured = estimate(
      variant(rig, { pack: { ...rig.pack, healthPct: 80, cellResistanceOhm: 0.03 } }),
    )
    // 5S2P of 30 mΩ cells: 5 × 0.03 / 2 = 0.075 ohm (series and parallel resistors)
    expect(measured.pack.resistanceOhm).toBeCloseTo(0.075, 12)
  })
})

describe('lithium rate loss beyond I·R', () => {
  // 5S2P of 2.5 Ah li-ion, cut off low (2.5 V per cell) so the charge, not the voltage, ends the run.
  const pack = {
    chemistry: 'li-ion',
    seriesCells: 5,
    parallelCells: 2,
    cellCapacityAh: 2.5,
    cutoffCellV: 2.5,
  } as const

  it('gives the full label capacity at 0.2 C', () => {
    // Source: IEC 61960: li-ion capacity is rated at 0.2 C; 5 Ah at 1 A lasts 5 h.
    const result = estimate(constantCurrentRig(pack, 1))
    expect(result.runtimeHours).toBeCloseTo(5, 2)
  })

  it('loses 1–3 % at 1 C, as makers’ curves show beyond the I·R sag', () => {
    // Source: from memory: makers' discharge curves of power 18650 cells (Samsung SDI
    // INR18650-25R, Sony/Murata US18650VTC5) give about 1–3 % less at 1 C than at 0.2 C beyond
    // what their I·R sag explains; not the 8 % a Peukert exponent of 1.05 would take (5^0.05).
    const result = estimate(constantCurrentRig(pack, 5))
    const lossPct = 100 * (1 - result.runtimeHours / 1)
    expect(lossPct).toBeGreaterThanOrEqual(1)
    expect(lossPct).toBeLessThanOrEqual(3)
  })

  it('stays within 5 % at the highest rates', () => {
    // Source: from memory: the same datasheets at 8 C (20 A for a 2.5 Ah cell) still give over
    // 95 % of the rated capacity.
    expect(LITHIUM_RATE_LOSS_MAX).toBe(0.05)
    const result = estimate(constantCurrentRig(pack, 40))
    expect(result.runtimeHours * 40).toBeGreaterThanOrEqual(5 * 0.95 - 1e-6)
  })
})

describe('defaults that decide the figures', () => {
  it('idles a class AB board at 0.1–0.25 A unless told', () => {
    // Source: from memory: class AB power chips quiesce at 0.1–0.25 A
    const rig = columnRig()
    const result = estimate(variant(rig, { amplifier: { ...rig.amplifier, class: 'ab' } }))
    const idle = result.assumed.find((value) => value.field === 'amplifier.idleCurrentA')
    expect(idle?.value).toBeGreaterThanOrEqual(0.1)
    expect(idle?.value).toBeLessThanOrEqual(0.25)
  })

  it('gives lead-acid and NiMH packs no airline Wh class, and says so', () => {
    // Source: IATA DGR: the 100 Wh / 160 Wh limits are the lithium battery rules.
    const result = estimate(
      variant(columnRig(), {
        pack: { chemistry: 'lead-acid', seriesCells: 12, parallelCells: 1, cellCapacityAh: 20 },
      }),
    )
    expect(result.energyWh.nominal).toBeCloseTo(480, 9) // 24 V × 20 Ah
    expect(result.airlineClass).toBe('not-lithium')
    const codes = result.warnings.map((warning) => warning.code)
    expect(codes).not.toContain('airline-not-allowed')
    expect(codes).not.toContain('airline-approval-needed')
  })

  it('takes lead-acid clip power at the end at a voltage the run reaches, never above full', () => {
    // Source: from memory: the common 12 V AGM resting chart reads 11.8 V empty, above the
    // 10.5 V cutoff under load (common practice), so a run that empties the battery ends above
    // its cutoff: P_clip ∝ V_s² there, and never above the full figure.
    const rig = columnRig()
    const result = estimate(
      variant(rig, {
        pack: { chemistry: 'lead-acid', seriesCells: 6, parallelCells: 1, cellCapacityAh: 7 },
        leads: undefined,
        amplifier: { ...rig.amplifier, ratedSupplyV: 12 },
        programme: { crestFactorDb: 12, peakBelowClipDb: 10 },
      }),
    )
    expect(result.stopReason).toBe('pack-empty')
    expect(result.clipPowerW.cutoff).toBeLessThanOrEqual(result.clipPowerW.full)
    const cutoffClipW = result.clipPowerW.full * (10.5 / result.pack.fullV) ** 2
    expect(result.clipPowerW.cutoff).toBeGreaterThan(cutoffClipW)
  })
})
