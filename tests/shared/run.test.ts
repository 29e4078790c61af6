import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { peukertRuntimeHours } from '../../shared/engine/pack'
import { MAX_STEP_S, OPEN_RUN_LIMIT_MINUTES } from '../../shared/engine/run'
import { estimateResultSchema } from '../../shared/schemas/estimate'
import { columnRig, constantCurrentRig, variant } from './rig-fixtures'

const stepHours = MAX_STEP_S / 3600

describe('time-stepped run', () => {
  it('runs a 10 Ah pack for 10 h at a steady 1 A', () => {
    // Source: definition of the ampere-hour (Peukert exponent 1: no rate effect)
    const result = estimate(
      constantCurrentRig(
        {
          chemistry: 'li-ion',
          seriesCells: 4,
          parallelCells: 4,
          cellCapacityAh: 2.5,
          cutoffCellV: 2.8,
          peukertExponent: 1,
        },
        1,
      ),
    )
    expect(result.stopReason).toBe('pack-empty')
    expect(Math.abs(result.runtimeHours - 10)).toBeLessThanOrEqual(stepHours)
    expect(result.averageCurrentA).toBeCloseTo(1, 9)
  })

  it('runs a 100 Ah / 20 h lead-acid battery with k = 1.2 for 20 h at 5 A and 8.7 h at 10 A', () => {
    // Source: Peukert's law t = H·(C/(I·H))^k; the 20-hour rate (C20) of
    // lead-acid labels (common practice)
    const battery = {
      chemistry: 'lead-acid' as const,
      seriesCells: 6,
      parallelCells: 1,
      cellCapacityAh: 100,
      peukertExponent: 1.2,
    }
    const slow = estimate(constantCurrentRig(battery, 5))
    expect(slow.stopReason).toBe('pack-empty')
    expect(Math.abs(slow.runtimeHours - 20)).toBeLessThanOrEqual(stepHours)
    const fast = estimate(constantCurrentRig(battery, 10))
    expect(Math.abs(fast.runtimeHours - peukertRuntimeHours(100, 20, 10, 1.2))).toBeLessThanOrEqual(
      stepHours,
    )
    // Source: common practice: below 50 % shortens a lead-acid battery's life
    expect(slow.warnings.map((warning) => warning.code)).toContain('lead-acid-deep-discharge')
  })

  it('swaps packs at once as each runs out and lists every swap', () => {
    // Source: docs/model.md §7: with several packs on hand the next comes in when one runs out;
    // three identical 5 Ah packs at 1 A give 3 × 5 h (definition of the ampere-hour)
    const result = estimate(
      constantCurrentRig(
        {
          chemistry: 'li-ion',
          seriesCells: 4,
          parallelCells: 2,
          cellCapacityAh: 2.5,
          cutoffCellV: 2.8,
          peukertExponent: 1,
          count: 3,
        },
        1,
      ),
    )
    expect(result.packRuns.map((run) => run.endReason)).toEqual([
      'pack-empty',
      'pack-empty',
      'pack-empty',
    ])
    expect(Math.abs(result.runtimeHours - 15)).toBeLessThanOrEqual(3 * stepHours)
    expect(result.packRuns[1]!.startMinute).toBeCloseTo(result.packRuns[0]!.endMinute, 9)
  })

  it('follows a schedule with idle and off segments', () => {
    // Source: docs/model.md §7/§9: idle draws the amplifier's idle current and accessories; off draws
    // nothing, so the state of charge holds
    const request = variant(columnRig(), {
      schedule: [
        { label: 'Set-up check', minutes: 30, state: 'idle' },
        { label: 'Games', minutes: 120, peakBelowClipDb: 6, playingPct: 70 },
        { label: 'Lunch', minutes: 60, state: 'off' },
        { label: 'Finale', minutes: 60 },
      ],
    })
    const result = estimate(request)
    expect(result.stopReason).toBe('schedule-end')
    expect(result.schedule).toMatchObject({
      lasts: true,
      packsUsed: 1,
      swaps: [],
      totalMinutes: 270,
      stoppedAtMinute: null,
    })
    expect(result.runtimeHours).toBeCloseTo(4.5, 9)
    expect(result.musicHours).toBeCloseTo(3, 9)
    const lunch = result.timeline.filter((point) => point.state === 'off')
    expect(lunch.length).toBeGreaterThanOrEqual(2)
    expect(new Set(lunch.map((point) => point.socPct)).size).toBe(1)
    expect(lunch.every((point) => point.drawW === 0)).toBe(true)
  })

  it('stops when the packs run out before the schedule ends, and says when', () => {
    // Source: docs/model.md §9: schedule.lasts is false and every swap time is listed
    const rig = columnRig()
    const request = variant(rig, {
      pack: { ...rig.pack, parallelCells: 1, count: 2 },
      programme: { crestFactorDb: 9, peakBelowClipDb: 0 },
      schedule: [
        { label: 'Morning', minutes: 300 },
        { label: 'Afternoon', minutes: 300 },
      ],
    })
    const result = estimate(request)
    expect(result.schedule!.lasts).toBe(false)
    expect(result.schedule!.packsUsed).toBe(2)
    expect(result.schedule!.swaps).toHaveLength(1)
    expect(result.schedule!.swaps[0]!.pack).toBe(2)
    expect(result.schedule!.stoppedAtMinute).toBeCloseTo(result.runtimeHours * 60, 9)
    expect(['pack-cutoff', 'pack-empty']).toContain(result.stopReason)
    expect(result.warnings.find((warning) => warning.code === 'schedule-short')?.severity).toBe(
      'danger',
    )
  })

  it('swaps at the first break below the threshold with the at-break-below policy', () => {
    // Source: ours (a plan feature): swap between segments once a pack is below the threshold
    const rig = columnRig()
    const request = variant(rig, {
      pack: { ...rig.pack, count: 2 },
      programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
      schedule: [
        { label: 'One', minutes: 180 },
        { label: 'Two', minutes: 180 },
        { label: 'Three', minutes: 60 },
      ],
      swapPolicy: { mode: 'at-break-below', belowSocPct: 60 },
    })
    const result = estimate(request)
    expect(result.packRuns[0]!.endReason).toBe('swapped')
    expect([180, 360]).toContain(result.schedule!.swaps[0]!.atMinute)
  })

  it('names every stop reason', () => {
    // Source: docs/model.md §7: pack cutoff, cannot deliver, amplifier lock-out, pack empty
    const rig = columnRig()
    const loud = { crestFactorDb: 3.01, peakBelowClipDb: 0 }
    const weak = estimate(
      variant(rig, {
        pack: { ...rig.pack, parallelCells: 1, cellResistanceOhm: 1.5 },
        programme: loud,
      }),
    )
    expect(weak.stopReason).toBe('cannot-deliver')
    expect(weak.runtimeHours).toBe(0)
    expect(weak.warnings.map((warning) => warning.code)).toContain('cannot-deliver')
    expect(estimateResultSchema.safeParse(weak).success).toBe(true)

    const lockout = estimate(
      variant(rig, { amplifier: { ...rig.amplifier, lockoutV: 17.5 }, programme: loud }),
    )
    expect(lockout.stopReason).toBe('amp-lockout')
    expect(lockout.lowestSocPct).toBeGreaterThan(5)
    expect(lockout.warnings.map((warning) => warning.code)).toContain('lockout-above-cutoff')

    const cutoff = estimate(variant(rig, { programme: loud }))
    expect(cutoff.stopReason).toBe('pack-cutoff')
  })

  it('stops an endless run cleanly at 7 days', () => {
    // Source: ours: a run without a schedule is capped at 7 days of simulated time
    const result = estimate(
      constantCurrentRig(
        { chemistry: 'lead-acid', seriesCells: 6, parallelCells: 1, cellCapacityAh: 1000 },
        0.01,
      ),
    )
    expect(result.stopReason).toBe('time-limit')
    expect(result.runtimeHours * 60).toBeCloseTo(OPEN_RUN_LIMIT_MINUTES, 6)
    expect(result.timeline.length).toBeLessThanOrEqual(500)
    expect(result.warnings.map((warning) => warning.code)).toContain('runtime-limit')
  })

  it('keeps the timeline within 500 points from the start to the stop', () => {
    // Source: docs/model.md §7: ≤ 500 points for charts
    const result = estimate(columnRig())
    expect(result.timeline.length).toBeLessThanOrEqual(500)
    expect(result.timeline.length).toBeGreaterThan(100)
    expect(result.timeline[0]!.minute).toBe(0)
    expect(result.timeline[0]!.socPct).toBe(100)
    expect(result.timeline.at(-1)!.minute).toBeCloseTo(result.runtimeHours * 60, 9)
    expect(new Set(result.timeline.map((point) => point.pack))).toEqual(new Set([1, 2, 3]))
  })

  it('adds up the Wh breakdown to the chemical energy drawn', () => {
    // Source: docs/model.md §9: the breakdown sums to the chemical energy drawn within 0.1 %
    // (conservation of energy: E·I = I²R_pack + I²R_lead + load power)
    const result = estimate(columnRig())
    const parts = Object.values(result.breakdownWh).reduce((sum, value) => sum + value, 0)
    expect(Math.abs(parts - result.energyWh.drawn) / result.energyWh.drawn).toBeLessThan(0.001)
    expect(result.energyWh.delivered).toBeCloseTo(
      result.energyWh.drawn - result.breakdownWh.packLoss,
      6,
    )
  })

  it('finds a dropout risk on bass peaks through a thin lead', () => {
    // Source: docs/model.md §7: peaks as a sustained sine burst at the lowest state of charge, through
    // pack and lead resistance; 24 AWG over 3 m is about 0.5 ohm round trip (ASTM B258, IEC 60028)
    const rig = columnRig()
    const result = estimate(
      variant(rig, {
        leads: { awg: 24, lengthM: 3 },
        amplifier: { ...rig.amplifier, lockoutV: 16 },
        programme: { crestFactorDb: 12, peakBelowClipDb: 0 },
      }),
    )
    expect(result.leadResistanceOhm).toBeGreaterThan(0.5)
    expect(result.dropoutRisk).toBe(true)
    expect(result.minPeakTerminalV).toBeLessThan(16)
    expect(result.dropout).not.toBeNull()
    const codes = result.warnings.map((warning) => warning.code)
    expect(codes.some((code) => code === 'dropout-risk' || code === 'dropout-near-empty')).toBe(
      true,
    )
    expect(result.leads.dropPct.peak).toBeGreaterThan(result.leads.dropPct.average)
  })
})
