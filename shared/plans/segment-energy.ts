// Energy per segment of a day, from one run: the run notes its totals as each segment ends
// (RunOutcome.segmentEnds), and the differences are the segments' shares, so they add up to the
// day's total exactly.
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
  const { segmentEnds } = runPrepared(prepared, prepared.resolved.pack.count, false)
  const rows: SegmentEnergy[] = []
  let startMinute = 0
  let before = { deliveredJ: 0, chemicalJ: 0, elapsedS: 0, pack: 1 }
  for (let index = 0; index < schedule.length; index++) {
    const segment = schedule[index]!
    // Segments after the run stopped get nothing; the pack named is the one it stopped with.
    const after = segmentEnds[index] ?? before
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
      packAtEnd: after.pack,
    })
    startMinute += segment.minutes
    before = after
  }
  return rows
}
