import type { TimelinePoint } from '../schemas/estimate'
import type { RigLoads } from './run'
import { peakDemand } from './run'

/**
 * When bass peaks start to mute the amplifier. A sustained peak (a sine burst at the programme's
 * peak level) pulls the supply down through the pack's and the lead's resistance; the pack's
 * open-circuit voltage falls with its state of charge, so below some charge every such peak
 * takes the supply under the lock-out and the music cuts out although the average draw still
 * runs. engine.md §7 takes the peak at the lowest charge reached, which near the end of any
 * lock-out-limited pack is always below the lock-out; the charge at which it starts says whether
 * that is the last minutes of a pack (swap a little early) or most of the day (change the rig).
 */
export interface DropoutOnset {
  /** Peaks cut out whenever the pack in use is below this state of charge. */
  belowSocPct: number
  /** First minute of the run at which that happens while playing, when the timeline was kept. */
  fromMinute: number | null
}

// Bisection to 0.01 % of charge: far finer than the OCV tables themselves.
const bisectionSteps = 14

export function dropoutOnset(
  rig: RigLoads,
  peakPerChannelW: number,
  lockoutV: number | null,
  lowestSocFraction: number,
  timeline: readonly TimelinePoint[],
): DropoutOnset | null {
  if (lockoutV === null || peakPerChannelW <= 0) return null
  const peaksHold = (socFraction: number) => {
    const peak = peakDemand(rig, peakPerChannelW, socFraction)
    return peak.delivered && peak.supplyV >= lockoutV
  }
  if (peaksHold(lowestSocFraction)) return null

  let belowFraction = 1
  if (peaksHold(1)) {
    // Invariant: peaks fail at `failing` and hold at `holding`; the OCV rises with charge.
    let failing = lowestSocFraction
    let holding = 1
    for (let step = 0; step < bisectionSteps; step++) {
      const middle = (failing + holding) / 2
      if (peaksHold(middle)) holding = middle
      else failing = middle
    }
    belowFraction = holding
  }
  const belowSocPct = belowFraction * 100
  const first = timeline.find((point) => point.state === 'on' && point.socPct < belowSocPct)
  return { belowSocPct, fromMinute: first ? first.minute : null }
}
