// The time-stepped run's state and what it writes down (docs/model.md §7): where the run is, the
// pack in the rig, the running totals, the chart timeline, swaps, pack turns and segment ends.
import type { SegmentState, StopReason } from '../schemas/estimate'
import type { OperatingPoint, RigLoads, RunSegment } from './operating-point'
import { emptyOperatingPoint } from './operating-point'
import { packOpenCircuitV } from './pack'
import type {
  PackEndReason,
  PackRunRecord,
  RunOptions,
  RunOutcome,
  RunTotals,
  SegmentEnd,
} from './run'
import { TimelineRecorder } from './timeline'

export const MAX_STEP_S = 10 // docs/model.md §7: step ≤ 10 s of simulated time

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

/**
 * Keeps a point as the latest (a pack's closing chart point) and charts it: a 'forced' point
 * always, a 'step' on the timeline's stride or as the first of a segment or pack.
 */
export function keepPoint(
  run: RunState,
  voltageV: number,
  drawW: number,
  supplyV: number,
  state: SegmentState,
  headroomPeakW: number,
  kind: 'step' | 'forced',
): void {
  const at = run.at
  at.lastVoltageV = voltageV
  at.lastDrawW = drawW
  at.lastSupplyV = supplyV
  at.lastState = state
  at.lastHeadroomPeakW = headroomPeakW
  const timeline = run.timeline
  if (!timeline) return
  let forced = true
  if (kind === 'step') {
    const due = at.forceNextSample || at.stepCount % timeline.stride === 0
    at.stepCount++
    if (!due) return
    forced = at.forceNextSample
    at.forceNextSample = false
  }
  const clipW = run.rig.amplifier.clipPowerPerV2 * supplyV * supplyV
  timeline.push(
    at.elapsedS / 60,
    at.soc * 100,
    voltageV,
    drawW,
    10 * Math.log10(clipW / headroomPeakW),
    clipW,
    at.pack,
    state,
    forced,
  )
}

/** Records why the pack in use leaves the rig, with a closing chart point at its last state. */
export function closePackRun(run: RunState, endReason: PackEndReason): void {
  const at = run.at
  keepPoint(
    run,
    at.lastVoltageV,
    at.lastDrawW,
    at.lastSupplyV,
    at.lastState,
    at.lastHeadroomPeakW,
    'forced',
  )
  run.packRuns.push({
    pack: at.pack,
    startMinute: at.packStartS / 60,
    endMinute: at.elapsedS / 60,
    endReason,
    musicMinutes: at.packMusicS / 60,
    lowestSocPct: at.packLowestSoc * 100,
  })
}

/** The next pack, full, goes into the rig. */
export function swapIn(run: RunState): void {
  const at = run.at
  at.pack++
  at.chargeAs = 0
  at.soc = 1
  at.packStartS = at.elapsedS
  at.packMusicS = 0
  at.packLowestSoc = 1
  at.supplyGuessV = run.fullOpenCircuitV
  run.swaps.push({ atMinute: at.elapsedS / 60, pack: at.pack })
  at.forceNextSample = true
}

/** Records where segment `index` ended, once: the first call for it wins. */
export function endSegment(run: RunState, index: number): void {
  if (run.segmentEnds.length !== index) return
  run.segmentEnds.push({
    deliveredJ: run.totals.deliveredJ,
    chemicalJ: run.totals.chemicalJ,
    chargedJ: run.totals.chargedJ,
    elapsedS: run.at.elapsedS,
    pack: run.at.pack,
  })
}

/**
 * The run as it stands, ended for `stopReason`. A `snapshot` (the prefix outcome of
 * RunOptions.prefixPacks) copies the lists the run goes on writing, and has no timeline.
 */
export function outcomeOf(run: RunState, stopReason: StopReason, snapshot: boolean): RunOutcome {
  return {
    ...run.totals,
    stopReason,
    elapsedS: run.at.elapsedS,
    packsUsed: run.at.pack,
    endSoc: run.at.soc,
    segmentEnds: snapshot ? run.segmentEnds.slice() : run.segmentEnds,
    swaps: snapshot ? run.swaps.slice() : run.swaps,
    packRuns: snapshot ? run.packRuns.slice() : run.packRuns,
    timeline: snapshot ? null : run.timeline,
    prefix: snapshot ? null : run.prefix,
  }
}
