import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { nioshPermittedMinutes } from '../../shared/engine/sound'
import { columnRig, variant } from './rig-fixtures'

function festivalDay() {
  return variant(columnRig(), {
    schedule: [
      { label: 'Speeches', minutes: 30, peakBelowClipDb: 12, playingPct: 50 },
      { label: 'Band set', minutes: 60, peakBelowClipDb: 6 },
      { label: 'Break', minutes: 20, state: 'idle' },
      { label: 'Finale', minutes: 15, peakBelowClipDb: 0 },
    ],
  })
}

describe('sound level and permitted time per segment', () => {
  const result = estimate(festivalDay())
  const segments = result.schedule!.segments
  const [speeches, band, pause, finale] = segments

  it('starts each segment on the plan clock', () => {
    // Source: the plan itself: segments follow one another (30, 60, 20 and 15 minutes)
    expect(segments.map((segment) => segment.startMinute)).toEqual([0, 30, 90, 110])
    expect(segments.map((segment) => segment.minutes)).toEqual([30, 60, 20, 15])
  })

  it('plays the finale 6 dB louder than a set 6 dB further below clipping', () => {
    // Source: decibel arithmetic: with the volume fixed, 6 dB more electrical level is 6 dB more
    // sound pressure level (a linear system)
    expect(finale!.playingSplDb! - band!.playingSplDb!).toBeCloseTo(6, 9)
    // The loudest segment is the one the rig's own sound figure is taken from.
    expect(finale!.splDb).toBeCloseTo(result.splDb!.average, 9)
  })

  it('averages music playing half the time 3 dB below its playing level', () => {
    // Source: ISO 1996-1: LAeq is the energy average, 10·log10(0.5) = −3.01 dB
    expect(speeches!.splDb! - speeches!.playingSplDb!).toBeCloseTo(-3.0103, 4)
  })

  it('gives each loud segment the NIOSH permitted time at its level', () => {
    // Source: NIOSH 98-126: 85 dBA for 8 h, 3 dB exchange rate
    for (const segment of [speeches!, band!, finale!]) {
      expect(segment.permittedMinutes).toBeCloseTo(480 / 2 ** ((segment.splDb! - 85) / 3), 6)
    }
    expect(nioshPermittedMinutes(100)).toBeCloseTo(15, 9)
    // A louder segment is permitted less time.
    expect(finale!.permittedMinutes!).toBeLessThan(band!.permittedMinutes!)
  })

  it('gives silent segments a draw but no level, and adds up to the energy delivered', () => {
    // Source: conservation of energy: the segments' draws over their minutes are the day's total
    expect(pause!.splDb).toBeUndefined()
    expect(pause!.permittedMinutes).toBeUndefined()
    expect(pause!.drawW).toBeGreaterThan(0)
    expect(finale!.drawW).toBeGreaterThan(band!.drawW)
    const totalWh = segments.reduce(
      (sum, segment) => sum + (segment.drawW * segment.minutes) / 60,
      0,
    )
    expect(totalWh).toBeCloseTo(result.energyWh.delivered, 6)
  })

  it("gives no level without the drivers' sensitivity", () => {
    // Source: the level model needs a sensitivity at 1 W, 1 m; without it there is no figure
    const base = festivalDay()
    const quietUnknown = estimate(
      variant(base, { speakers: { driverOhm: 8, parallel: 3, banks: 2 } }),
    )
    for (const segment of quietUnknown.schedule!.segments) {
      expect(segment.splDb).toBeUndefined()
      expect(segment.playingSplDb).toBeUndefined()
    }
  })
})
