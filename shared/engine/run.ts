// The time-stepped run (docs/model.md §7): each step, draw → current → terminal voltage → charge
// removed → state of charge, over the schedule's segments, with swaps between packs on hand.
// This file is the run's public face: its options and outcome, and runRig. The steps and what
// they write down are in run-segments.ts, the run's state in run-state.ts, and the draw and the
// stop test in operating-point.ts.
import type { StopReason, SwapPolicy } from '../schemas/estimate'
import type { RigLoads, RunSegment } from './operating-point'
import { startRun } from './run-state'
import {
  chargeThrough,
  closePackRun,
  endSegment,
  outcomeOf,
  powerThrough,
  restThrough,
  swapAtBreakIfLow,
} from './run-segments'
import type { TimelineRecorder } from './timeline'

// The engine's other parts (estimate, peaks, dropout, reserve) reach the run through this file.
export type { OperatingPoint, RigLoads, RunSegment } from './operating-point'
export { emptyOperatingPoint, solveOperatingPoint } from './operating-point'
export { MAX_STEP_S } from './run-segments'

export const OPEN_RUN_LIMIT_MINUTES = 7 * 24 * 60 // ours: a run without a schedule stops at 7 days

export type PackEndReason = StopReason | 'swapped'

export interface PackRunRecord {
  pack: number
  startMinute: number
  endMinute: number
  endReason: PackEndReason
  musicMinutes: number
  lowestSocPct: number
}

export interface RunOptions {
  maxPacks: number
  swapPolicy: Required<SwapPolicy>
  recordTimeline: boolean
  /** No schedule: one open 'on' segment, ended by the time limit. */
  openEnded: boolean
  /** Also report the outcome with this many packs (see RunOutcome.prefix). */
  prefixPacks?: number
}

/** Running totals of a run; energy in joules. */
export interface RunTotals {
  /** Chemical energy drawn (∫OCV·I dt), at the terminals, and where it went. */
  chemicalJ: number
  deliveredJ: number
  packLossJ: number
  leadLossJ: number
  ampOutputJ: number
  ampLossJ: number
  accessoryJ: number
  converterLossJ: number
  /** Energy put into the packs at charging breaks (at their open-circuit voltage). */
  chargedJ: number
  musicS: number
  poweredS: number
  /** ∫I dt over powered time and over 'on' time, and ∫V_terminal dt over 'on' time. */
  poweredChargeAs: number
  onChargeAs: number
  onTerminalVs: number
  maxCurrentA: number
  lowestSoc: number
  /** Lowest clip/peak power ratio while playing (1 = peaks just at clipping); Infinity if none. */
  minimumHeadroomRatio: number
  clipsFromS: number | null
  /** Lowest supply at the amplifier while playing (Infinity if nothing played). */
  lowestPlayingSupplyV: number
}

/** The run's totals where a segment ended (or where the run stopped inside it). */
export interface SegmentEnd {
  deliveredJ: number
  chemicalJ: number
  chargedJ: number
  elapsedS: number
  /** The pack in the rig at that moment (1 is the first). */
  pack: number
}

export interface RunOutcome extends RunTotals {
  stopReason: StopReason
  elapsedS: number
  packsUsed: number
  /** State of charge (0..1) of the pack in the rig when the run ended. */
  endSoc: number
  /**
   * One entry per segment the run reached, in order; the run's totals as each ended. A swap at the
   * very end of a segment comes after its entry (the pack that ran it is the one named).
   */
  segmentEnds: SegmentEnd[]
  swaps: { atMinute: number; pack: number }[]
  packRuns: PackRunRecord[]
  timeline: TimelineRecorder | null
  /**
   * With `prefixPacks`: the outcome had only that many packs been on hand, when this longer run
   * went past them by swapping at a stop (the shorter run is then a prefix of this one).
   */
  prefix: RunOutcome | null
}

/**
 * Runs the rig through its segments until the schedule ends (or, open-ended, the time limit) or
 * a pack stops with no fresh one on hand that could take over (run-segments.ts, stopPack).
 */
export function runRig(
  rig: RigLoads,
  segments: readonly RunSegment[],
  options: RunOptions,
): RunOutcome {
  const run = startRun(rig, segments, options)
  for (let index = 0; index < segments.length && run.at.stopReason === null; index++) {
    const segment = segments[index]!
    if (index > 0) swapAtBreakIfLow(run, segment)
    if (segment.state === 'off') restThrough(run, segment)
    else if (segment.state === 'charging') chargeThrough(run, segment)
    else powerThrough(run, segment, index, index === segments.length - 1)
    endSegment(run, index)
  }
  if (run.at.stopReason !== null) return outcomeOf(run, run.at.stopReason, false)
  const endReason: StopReason = options.openEnded ? 'time-limit' : 'schedule-end'
  closePackRun(run, endReason)
  return outcomeOf(run, endReason, false)
}
