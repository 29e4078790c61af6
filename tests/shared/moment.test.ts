import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine'
import { onEventClock, runMomentPhrase } from '../../shared/engine/moment'
import { clockLabel } from '../../shared/plans/clock'
import { columnRig, variant } from './rig-fixtures'

describe('moments of the run in warnings', () => {
  it('names a moment as hours and minutes since switching on', () => {
    // Source: arithmetic of hours and minutes: 598 min = 9 × 60 + 58; 45 min is under an hour
    expect(runMomentPhrase(598)).toBe('about 9 h 58 min into the run')
    expect(runMomentPhrase(45)).toBe('about 45 min into the run')
  })

  it('puts the moment on the event clock of a plan', () => {
    // Source: 24-hour clock (ISO 8601): 08:00 + 9 h 58 min = 17:58; 22:30 + 2 h = 00:30 next day
    const warning = { message: `Peaks clip ${runMomentPhrase(598)}.`, atMinute: 598 }
    expect(onEventClock(warning, (minute) => clockLabel('08:00', minute))).toBe(
      'Peaks clip at about 17:58.',
    )
    const late = { message: `Stops ${runMomentPhrase(120)}.`, atMinute: 120 }
    expect(onEventClock(late, (minute) => clockLabel('22:30', minute))).toBe(
      'Stops at about 00:30 (+1 day).',
    )
    // A message that names no moment is left as it is.
    expect(onEventClock({ message: 'Fuse the lead.' }, () => 'never')).toBe('Fuse the lead.')
  })

  it('says when a scheduled day stops in hours and minutes, never as a bare minute count', () => {
    // Source: definition of the ampere-hour, as in the run tests: one pack of a single string
    // cannot carry a 10 h day at full level, so the day stops early
    const rig = columnRig()
    const result = estimate(
      variant(rig, {
        pack: { ...rig.pack, parallelCells: 1, count: 2 },
        programme: { crestFactorDb: 9, peakBelowClipDb: 0 },
        schedule: [
          { label: 'Morning', minutes: 300 },
          { label: 'Afternoon', minutes: 300 },
        ],
      }),
    )
    const short = result.warnings.find((warning) => warning.code === 'schedule-short')!
    expect(short.atMinute).toBeCloseTo(result.schedule!.stoppedAtMinute!, 9)
    expect(short.message).toContain(runMomentPhrase(result.schedule!.stoppedAtMinute!))
    expect(short.message).not.toMatch(/minute \d/)
    expect(onEventClock(short, (minute) => clockLabel('08:00', minute))).toMatch(
      /^The rig stops at about \d\d:\d\d, /,
    )
  })
})
