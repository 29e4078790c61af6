// A reserve at the end of the day: a plan that lasts on paper but ends with the last pack nearly
// flat has no margin for a colder day, an older pack or a louder crowd.
import type { EstimateWarning } from '../schemas/estimate'
import type { PreparedRig } from './estimate'
import type { RunOutcome, RunSegment } from './run'
import { runRig } from './run'
import { warning } from './warnings'

// common practice: end a day with about 20 % left, a margin for a colder day or an older pack
// that also keeps the pack out of the steep last part of its discharge curve
export const RESERVE_FLOOR_PCT = 20
// ours: beyond 30 dB quieter the music is no longer the plan; say that a level change will not do
export const MAX_RESERVE_DROP_DB = 30

export interface ReserveShortfall {
  endSocPct: number
  /** Smallest whole-dB drop of every level that keeps the reserve; null if 30 dB will not do. */
  quieterDb: number | null
}

/** Keeps the reserve: lasts and ends at or above the floor, or with a spare pack never used. */
function keepsReserve(outcome: RunOutcome, packsOnHand: number): boolean {
  return (
    outcome.stopReason === 'schedule-end' &&
    (outcome.endSoc * 100 >= RESERVE_FLOOR_PCT || outcome.packsUsed < packsOnHand)
  )
}

/** Every segment's level lowered by `db` (power ratio 10^(−dB/10)), as a volume knob does. */
function quieterSegments(segments: readonly RunSegment[], db: number): RunSegment[] {
  const factor = 10 ** (-db / 10)
  return segments.map((segment) =>
    segment.state === 'on'
      ? {
          ...segment,
          outputPerChannelW: segment.outputPerChannelW * factor,
          peakPerChannelW: segment.peakPerChannelW * factor,
          headroomPeakW: segment.headroomPeakW * factor,
        }
      : segment,
  )
}

/**
 * The reserve check: null when the day does not last (another warning says so), keeps the reserve,
 * or has no schedule. Otherwise the charge left and the level drop that would keep 20 %.
 */
export function reserveShortfall(
  prepared: PreparedRig,
  outcome: RunOutcome,
): ReserveShortfall | null {
  if (prepared.openEnded || outcome.stopReason !== 'schedule-end') return null
  const packsOnHand = prepared.resolved.pack.count
  if (keepsReserve(outcome, packsOnHand)) return null
  const keepsAt = (db: number) =>
    keepsReserve(
      runRig(prepared.rig, quieterSegments(prepared.segments, db), {
        maxPacks: packsOnHand,
        swapPolicy: prepared.resolved.swapPolicy,
        recordTimeline: false,
        openEnded: false,
      }),
      packsOnHand,
    )
  let quieterDb: number | null = null
  // Less level never shortens a run (a property test holds the engine to it): bisect whole dB.
  if (keepsAt(MAX_RESERVE_DROP_DB)) {
    let tooLittle = 0
    let enough = MAX_RESERVE_DROP_DB
    while (enough - tooLittle > 1) {
      const middle = Math.floor((tooLittle + enough) / 2)
      if (keepsAt(middle)) enough = middle
      else tooLittle = middle
    }
    quieterDb = enough
  }
  return { endSocPct: outcome.endSoc * 100, quieterDb }
}

export function reserveWarning(shortfall: ReserveShortfall): EstimateWarning {
  const fix =
    shortfall.quieterDb === null
      ? 'Bring one more charged pack; playing quieter alone will not do it, as the idle and accessory draw use most of the pack.'
      : `Bring one more charged pack, or play ${shortfall.quieterDb} dB quieter throughout.`
  return warning(
    'reserve-low',
    `The day lasts, but the last pack ends at about ${Math.round(shortfall.endSocPct)} % with no spare left, under the ${RESERVE_FLOOR_PCT} % worth keeping for a colder day or an older pack. ${fix}`,
  )
}
