// Energy per segment of a day. The engine reports a run's totals; running it on each prefix of
// the schedule (segments 1..k) gives the totals at the end of segment k, and the differences are
// the segments' shares. Each prefix run is the same deterministic run cut short, so the shares add
// up to the day's total exactly. Cost grows with segments × steps: fine for a day's plan.
import { prepareRig, runPrepared } from '../engine'
import type { EstimateRequest, SegmentState } from '../schemas/estimate'

export interface SegmentEnergy {
  index: number
  label: string
  state: SegmentState
  /** Planned start and length, in minutes from the start of the day. */
  startMinute: number
  plannedMinutes: number
  /** Minutes the rig actually ran in this segment (less where it stopped). */
  ranMinutes: number
  /** Out of the pack terminals, and drawn from the cells (terminal energy plus loss inside). */
  deliveredWh: number
  drawnWh: number
  /** Average power out of the packs over the minutes run. */
  averageDrawW: number
  /** The pack in the rig when the segment ended (1 is the first). */
  packAtEnd: number
}

export function segmentEnergies(request: EstimateRequest): SegmentEnergy[] {
  const prepared = prepareRig(request)
  const schedule = prepared.resolved.schedule
  if (!schedule) return []
  const rows: SegmentEnergy[] = []
  let startMinute = 0
  let before = { deliveredJ: 0, chemicalJ: 0, elapsedS: 0 }
  let stopped = false
  for (let index = 0; index < schedule.length; index++) {
    const segment = schedule[index]!
    let after = before
    let packAtEnd = rows[rows.length - 1]?.packAtEnd ?? 1
    if (!stopped) {
      const outcome = runPrepared(
        { ...prepared, segments: prepared.segments.slice(0, index + 1) },
        prepared.resolved.pack.count,
        false,
      )
      after = outcome
      packAtEnd = outcome.packsUsed
      stopped = outcome.stopReason !== 'schedule-end'
    }
    const ranS = after.elapsedS - before.elapsedS
    const deliveredJ = after.deliveredJ - before.deliveredJ
    rows.push({
      index,
      label: segment.label,
      state: segment.state,
      startMinute,
      plannedMinutes: segment.minutes,
      ranMinutes: ranS / 60,
      deliveredWh: deliveredJ / 3600,
      drawnWh: (after.chemicalJ - before.chemicalJ) / 3600,
      averageDrawW: ranS > 0 ? deliveredJ / ranS : 0,
      packAtEnd,
    })
    startMinute += segment.minutes
    before = after
  }
  return rows
}
