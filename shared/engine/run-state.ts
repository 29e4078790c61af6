// The time-stepped run's state (docs/model.md §7): where the run is, the pack in the rig, the
// running totals and the records it writes (chart timeline, swaps, pack turns, segment ends).
import type { SegmentState, StopReason } from '../schemas/estimate'
import type { OperatingPoint, RigLoads, RunSegment } from './operating-point'
import { emptyOperatingPoint } from './operating-point'
import { packOpenCircuitV } from './pack'
import type { PackRunRecord, RunOptions, RunOutcome, RunTotals, SegmentEnd } from './run'
import { MAX_STEP_S } from './run-segments'
import { TimelineRecorder } from './timeline'

/** The run's mutable position. Kept in one object, not in closure-captured `let`s: V8 boxes a
 *  double on every write to a captured variable, which in the step loop meant garbage per step. */
interface RunPosition {
  elapsedS: number
  pack: number
  chargeAs: number
  soc: number
  packStartS: number
  packMusicS: number
  packLowestSoc: number
  supplyGuessV: number
  stepCount: number
  forceNextSample: boolean
  stopReason: StopReason | null
  // The latest step (or off-segment sample), for a pack's closing timeline point.
  lastVoltageV: number
  lastDrawW: number
  lastSupplyV: number
  lastState: SegmentState
  lastHeadroomPeakW: number
}

/**
 * The powered step under way. Its figures pass between the step's parts here, not as arguments:
 * V8 boxes a double passed to a function it does not inline, garbage on every step.
 */
interface PoweredStep {
  openCircuitV: number
  /** What is left of the segment. */
  remainingS: number
  /** The pack emptied within the step, which ended there. */
  emptied: boolean
}

/** Everything a run carries from step to step. */
export interface RunState {
  rig: RigLoads
  options: RunOptions
  capacityAs: number
  fullOpenCircuitV: number
  /** Solved into each step (one object, reused: no garbage per step). */
  point: OperatingPoint
  step: PoweredStep
  at: RunPosition
  totals: RunTotals
  timeline: TimelineRecorder | null
  swaps: RunOutcome['swaps']
  packRuns: PackRunRecord[]
  segmentEnds: SegmentEnd[]
  prefix: RunOutcome | null
}

export function startRun(
  rig: RigLoads,
  segments: readonly RunSegment[],
  options: RunOptions,
): RunState {
  const fullOpenCircuitV = packOpenCircuitV(rig.pack, 1)
  let expectedSamples = 0
  for (const segment of segments) expectedSamples += Math.ceil(segment.durationS / MAX_STEP_S)
  return {
    rig,
    options,
    capacityAs: rig.pack.capacityAh * 3600,
    fullOpenCircuitV,
    point: emptyOperatingPoint(),
    step: { openCircuitV: fullOpenCircuitV, remainingS: 0, emptied: false },
    at: {
      elapsedS: 0,
      pack: 1,
      chargeAs: 0,
      soc: 1,
      packStartS: 0,
      packMusicS: 0,
      packLowestSoc: 1,
      supplyGuessV: fullOpenCircuitV,
      stepCount: 0,
      forceNextSample: true,
      stopReason: null,
      lastVoltageV: fullOpenCircuitV,
      lastDrawW: 0,
      lastSupplyV: fullOpenCircuitV,
      lastState: segments[0]?.state ?? 'on',
      lastHeadroomPeakW: segments[0]?.headroomPeakW ?? 1,
    },
    totals: {
      chemicalJ: 0,
      deliveredJ: 0,
      packLossJ: 0,
      leadLossJ: 0,
      ampOutputJ: 0,
      ampLossJ: 0,
      accessoryJ: 0,
      converterLossJ: 0,
      chargedJ: 0,
      musicS: 0,
      poweredS: 0,
      poweredChargeAs: 0,
      onChargeAs: 0,
      onTerminalVs: 0,
      maxCurrentA: 0,
      lowestSoc: 1,
      minimumHeadroomRatio: Infinity,
      clipsFromS: null,
      lowestPlayingSupplyV: Infinity,
    },
    timeline: options.recordTimeline
      ? new TimelineRecorder(options.openEnded ? null : expectedSamples)
      : null,
    swaps: [],
    packRuns: [],
    segmentEnds: [],
    prefix: null,
  }
}
