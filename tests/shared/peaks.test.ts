// Peak supply current on a sustained bass note, and the voltages it leaves at the pack and at the
// amplifier. Each check names the outside rule it rests on.
import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { rippleShare } from '../../shared/engine/peaks'
import { awgToAreaMm2 } from '../../shared/units'
import type { EstimateRequestInput } from '../../shared/schemas/estimate'
import { columnRig, variant } from './rig-fixtures'

/**
 * One channel into 8 ohm from a stiff 5S li-ion pack (1 µΩ cells, no lead), playing for one minute
 * so the charge barely moves from full (21.0 V at rest): the supply is the pack's open-circuit
 * voltage, and the currents follow from the textbook formulas alone.
 */
function stiffRig(amplifier: Partial<EstimateRequestInput['amplifier']>) {
  return variant(columnRig(), {
    pack: {
      chemistry: 'li-ion',
      seriesCells: 5,
      parallelCells: 2,
      cellCapacityAh: 2.5,
      cellResistanceOhm: 1e-6,
    },
    leads: undefined,
    accessories: [],
    amplifier: {
      class: 'd',
      bridged: true,
      channels: 1,
      ratedPowerW: 20,
      ratedLoadOhm: 8,
      ratedSupplyV: 21,
      ratedThdPct: 1,
      idleCurrentA: 0,
      efficiency: 0.9,
      ...amplifier,
    },
    speakers: { driverOhm: 8, parallel: 1, banks: 1, sensitivityDb: 88 },
    programme: { crestFactorDb: 12, peakBelowClipDb: 6 },
    schedule: [{ label: 'Check', minutes: 1 }],
  })
}

/** The burst's sine power per channel: the programme's peak level, from the result. */
const burstW = (result: ReturnType<typeof estimate>) =>
  result.speakers.powerPerDriverW.peak * result.speakers.driversPerChannel

describe('peak supply current on a sustained bass note', () => {
  it('is twice the mean for a class D board', () => {
    // Source: trigonometric identity: a sine's power 2·P̄·sin²(ωt) = P̄·(1 − cos 2ωt) peaks at
    // twice its mean, so the supply current P_out(t)/(η·V) peaks at 2·P̄/(η·V).
    const result = estimate(stiffRig({ class: 'd' }))
    const supplyV = result.minPeakSupplyV
    expect(supplyV).toBeGreaterThan(20.9)
    const meanA = burstW(result) / (0.9 * supplyV)
    expect(result.peakCurrentA).toBeCloseTo(2 * meanA, 2)
  })

  it('is π/2 times the mean for a class AB board', () => {
    // Source: a sine's peak is √2 × its rms and its mean |i| is 2√2/π × its rms, so the peak of
    // |i_load| is π/2 × the mean; for 8 ohm the peak is √(2·P̄/8).
    const result = estimate(stiffRig({ class: 'ab', idleCurrentA: 0 }))
    const peakA = Math.sqrt((2 * burstW(result)) / 8)
    expect(result.peakCurrentA).toBeCloseTo(peakA, 3)
    const meanA = ((2 * Math.SQRT2) / Math.PI) * Math.sqrt(burstW(result) / 8)
    expect(result.peakCurrentA / meanA).toBeCloseTo(Math.PI / 2, 3)
  })

  it('is the constant bias for a class A board', () => {
    // Source: Boylestad & Nashelsky, ch. 12: class A draws its bias whatever it plays; 20 W at
    // 25 % from 21 V is a bias of 20 / (0.25 × 21) = 3.81 A.
    const result = estimate(stiffRig({ class: 'a', efficiency: 0.25 }))
    expect(result.peakCurrentA).toBeCloseTo(20 / (0.25 * 21), 2)
  })

  it('takes the whole run: a full pack plays its peaks unclipped at the most output', () => {
    // Source: P_clip ∝ V_s² (any amplifier text): at 0 dB below clipping a full pack swings the
    // most, so its peak current is not smaller than at the end, where the clip caps the burst.
    const rig = columnRig()
    const result = estimate(variant(rig, { programme: { crestFactorDb: 12, peakBelowClipDb: 0 } }))
    const full = estimate(
      variant(rig, {
        programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
        schedule: [{ label: 'Start', minutes: 1 }],
      }),
    )
    expect(result.peakCurrentA).toBeGreaterThanOrEqual(full.peakCurrentA - 1e-9)
  })

  it('reads the pack terminals and the amplifier a lead apart', () => {
    // Source: Ohm's law: the lead drops I·R_lead between the pack's terminals and the amplifier's.
    const result = estimate(variant(columnRig(), { leads: { awg: 22, lengthM: 3 } }))
    expect(result.minPeakTerminalV - result.minPeakSupplyV).toBeCloseTo(
      result.peakCurrentA * result.leadResistanceOhm,
      3,
    )
  })

  it('tells a 30 AWG lead from a thick one by at least what the lead alone drops', () => {
    // Source: Ohm's law; a constant-power load draws more, not less, through the thinner lead, so
    // the lowest supplies differ by at least I_thick × (R_thin − R_thick). 30 AWG is 0.0509 mm²,
    // 10 AWG 5.26 mm² (ASTM B258). Peaks 6 dB below clipping, so neither lead clips them.
    expect(awgToAreaMm2(30)).toBeCloseTo(0.0509, 3)
    const rig = variant(columnRig(), { programme: { crestFactorDb: 12, peakBelowClipDb: 6 } })
    const thin = estimate(variant(rig, { leads: { awg: 30, lengthM: 2 } }))
    const thick = estimate(variant(rig, { leads: { awg: 10, lengthM: 2 } }))
    expect(thin.headroom.minimumDb).toBeGreaterThan(0)
    const leadOnlyV = thick.peakCurrentA * (thin.leadResistanceOhm - thick.leadResistanceOhm)
    expect(thick.minPeakSupplyV - thin.minPeakSupplyV).toBeGreaterThanOrEqual(leadOnlyV - 1e-9)
    expect(leadOnlyV).toBeGreaterThan(1)
  })
})

describe('bulk capacitance on the board', () => {
  it('smooths an 80 Hz ripple only a little at 1,000 µF', () => {
    // Source: first-order low-pass of C across the source resistance R, |H| = 1/√(1 + (ωRC)²),
    // at twice a 40 Hz note: 0.1 ohm with 1,000 µF gives ωRC = 0.0503, |H| = 0.9987; and
    // ΔV = I·t/C: 3 A for 2.5 ms sags 1,000 µF by 7.5 V, more than a board can spare.
    expect(rippleShare(0.1, 1000e-6)).toBeCloseTo(
      1 / Math.sqrt(1 + (2 * Math.PI * 80 * 0.1 * 1e-3) ** 2),
      9,
    )
    expect(rippleShare(0.1, 1000e-6)).toBeGreaterThan(0.998)
    expect((3 * 2.5e-3) / 1000e-6).toBeCloseTo(7.5, 9)
    expect(rippleShare(0.1, 1)).toBeCloseTo(1 / Math.sqrt(1 + (2 * Math.PI * 80 * 0.1) ** 2), 9)
  })

  it('lowers the peak toward the mean, never below it, when the user gives it', () => {
    // Source: as above: a capacitor can carry only the ripple above the mean draw.
    const rig = columnRig()
    const bare = estimate(rig)
    const huge = estimate(
      variant(rig, { amplifier: { ...rig.amplifier, bulkCapacitanceUF: 1_000_000 } }),
    )
    expect(huge.peakCurrentA).toBeLessThan(bare.peakCurrentA)
    // Class D: the mean is half the peak (identity above), so the smoothed peak stays above it.
    expect(huge.peakCurrentA).toBeGreaterThan(bare.peakCurrentA / 2)
  })
})

describe('pack rating on peaks', () => {
  it('is a danger when the peak current passes the pack rating', () => {
    // Source: common practice: a pack's protection trips on current over its rating, peaks
    // included, and cells over their rating run hot.
    const rig = columnRig()
    const result = estimate(variant(rig, { pack: { ...rig.pack, maxDischargeA: 3 } }))
    expect(result.peakCurrentA).toBeGreaterThan(3)
    const found = result.warnings.find((warning) => warning.code === 'peak-current-over-rating')
    expect(found?.severity).toBe('danger')
    expect(found?.message).toMatch(/more cells in parallel/)
  })
})
