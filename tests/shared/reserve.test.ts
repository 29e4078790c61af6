import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import type { EstimateRequest } from '../../shared/schemas/estimate'
import { columnRig, constantCurrentRig, variant, TEN_AH_PACK } from './rig-fixtures'

function steadyDay(minutes: number, count = 1): EstimateRequest {
  return constantCurrentRig({ ...TEN_AH_PACK, count }, 1, {
    schedule: [{ label: 'Market', minutes }],
  })
}

const reserveWarnings = (request: EstimateRequest) =>
  estimate(request).warnings.filter((warning) => warning.code.includes('reserve'))

describe('reserve at the end of the day', () => {
  it('cautions when the last pack ends at 10 % with no spare', () => {
    // Source: definition of the ampere-hour (9 h at 1 A is 9 of 10 Ah, 10 % left); common
    // practice: end a day with about 20 % left
    const result = estimate(steadyDay(540))
    expect(result.schedule?.lasts).toBe(true)
    expect(result.schedule?.endSocPct).toBeCloseTo(10, 6)
    expect(result.schedule?.sparePacks).toBe(0)
    const [reserve] = result.warnings.filter((warning) => warning.code === 'reserve-low')
    expect(reserve?.severity).toBe('caution')
    expect(reserve?.message).toMatch(/about 10 %/)
    expect(reserve?.message).toMatch(/one more charged pack/)
    // The draw here does not depend on the level, so a quieter programme is no fix.
    expect(reserve?.message).toMatch(/quieter alone will not do it/)
  })

  it('stays silent at 21.7 % left, with a spare pack, or when the day does not last', () => {
    // Source: definition of the ampere-hour: 470 min at 1 A is 7.83 of 10 Ah, 21.7 % left
    expect(estimate(steadyDay(470)).schedule?.endSocPct).toBeCloseTo(21.67, 2)
    expect(reserveWarnings(steadyDay(470))).toEqual([])
    // A second charged pack never used is the reserve.
    expect(reserveWarnings(steadyDay(540, 2))).toEqual([])
    // 11 h cannot run on 10 Ah: the day-short warning speaks, not the reserve.
    const short = estimate(steadyDay(660))
    expect(short.schedule?.lasts).toBe(false)
    expect(short.warnings.map((warning) => warning.code)).not.toContain('reserve-low')
  })

  it('names the smallest whole-dB level drop that keeps 20 %', () => {
    // Source: common practice (20 % reserve); a level drop lowers the output power by
    // 10^(−dB/10), so some whole number of dB keeps the reserve and one less does not.
    const base = columnRig()
    const day = variant(base, {
      pack: { ...base.pack, count: 1 },
      schedule: [{ label: 'Set', minutes: 620, peakBelowClipDb: 3 }],
    })
    const [reserve] = reserveWarnings(day)
    const db = Number(/play (\d+) dB quieter/.exec(reserve?.message ?? '')?.[1])
    expect(db).toBeGreaterThanOrEqual(1)
    const quieterBy = (drop: number) =>
      variant(day, { schedule: [{ label: 'Set', minutes: 620, peakBelowClipDb: 3 + drop }] })
    expect(estimate(quieterBy(db)).schedule!.endSocPct).toBeGreaterThanOrEqual(20)
    expect(reserveWarnings(quieterBy(db))).toEqual([])
    expect(reserveWarnings(quieterBy(db - 1))).toHaveLength(1)
  })
})
