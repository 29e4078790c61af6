// What each kind of segment does to the pack in the rig, step by step (docs/model.md §7, §12):
// at rest it keeps its charge, on a charger it gains charge, powered it gives charge until the
// segment ends or the pack stops. A stopped pack makes way for the next one on hand, if any.
// What the steps write down (chart points, pack turns, swaps, segment ends) is here too: the step
// loop calls it every step, and a call within one module costs less than one across modules
// (the engine bench runs under vitest, whose module wrapper reads each imported name per call).
import type { SegmentState, StopReason } from '../schemas/estimate'
import { chargeAh } from './charging'
import { operatingStop, type RunSegment } from './operating-point'
import { chargeRateA as packChargeRateA, packOpenCircuitV } from './pack'
import type { PackEndReason, RunOutcome } from './run'
import type { RunState } from './run-state'

export const MAX_STEP_S = 10 // docs/model.md §7: step ≤ 10 s of simulated time

// Ours: time left in a segment below this is the rounding of the step subtractions, not time.
const SEGMENT_DONE_S = 1e-9

/**
 * The one place a pack stops (docs/model.md §7, "Stops"). It leaves the rig; the next pack on
 * hand comes in when a fresh one could run this segment. Otherwise the run ends here.
 */
export function stopPack(run: RunState, reason: StopReason, segment: RunSegment): void {
  const { at, options } = run
  closePackRun(run, reason)
  const fullV = run.fullOpenCircuitV
  if (
    at.pack < options.maxPacks &&
    operatingStop(run.rig, segment, fullV, fullV, run.point) === null
  ) {
    if (at.pack === options.prefixPacks) run.prefix = outcomeOf(run, reason, true)
    swapIn(run)
    return
  }
  at.stopReason = reason
}

/** At a break (not a charging one: the pack in the rig is the one that charges), the swap policy
 *  may bring in a fresh pack early. */
export function swapAtBreakIfLow(run: RunState, segment: RunSegment): void {
  const policy = run.options.swapPolicy
  if (
    segment.state !== 'charging' &&
    policy.mode === 'at-break-below' &&
    run.at.soc * 100 < policy.belowSocPct &&
    run.at.pack < run.options.maxPacks
  ) {
    closePackRun(run, 'swapped')
    swapIn(run)
  }
}

/** An 'off' segment: nothing is drawn; the pack rests at its open-circuit voltage. */
export function restThrough(run: RunState, segment: RunSegment): void {
  const openCircuitV = packOpenCircuitV(run.rig.pack, run.at.soc)
  keepPoint(run, openCircuitV, 0, openCircuitV, 'off', segment.headroomPeakW, 'forced')
  run.at.elapsedS += segment.durationS
  keepPoint(run, openCircuitV, 0, openCircuitV, 'off', segment.headroomPeakW, 'forced')
  run.at.forceNextSample = true
}

/** A charging break: the rig is silent and the pack in it gains charge, up to full. */
export function chargeThrough(run: RunState, segment: RunSegment): void {
  const { at, totals } = run
  const pack = run.rig.pack
  at.forceNextSample = true
  let remainingS = segment.durationS
  while (remainingS > SEGMENT_DONE_S) {
    const stepS = remainingS < MAX_STEP_S ? remainingS : MAX_STEP_S
    const openCircuitV = packOpenCircuitV(pack, at.soc)
    const gainedAs = chargeAh(segment.chargeW, openCircuitV, stepS / 60, at.chargeAs / 3600) * 3600
    const currentA = gainedAs / stepS
    // At the terminals a charging pack sits above its open-circuit voltage by I·R; the draw
    // shown is minus the power stored, chargeW until the pack is full.
    const terminalV = openCircuitV + currentA * pack.resistanceOhm
    keepPoint(
      run,
      terminalV,
      -openCircuitV * currentA,
      terminalV,
      'charging',
      segment.headroomPeakW,
      'step',
    )
    totals.chargedJ += openCircuitV * gainedAs
    at.chargeAs = Math.max(0, at.chargeAs - gainedAs)
    at.soc = 1 - at.chargeAs / run.capacityAs
    at.elapsedS += stepS
    remainingS -= stepS
  }
  const openCircuitV = packOpenCircuitV(pack, at.soc)
  keepPoint(run, openCircuitV, 0, openCircuitV, 'charging', segment.headroomPeakW, 'forced')
  at.forceNextSample = true
}

/**
 * An 'on' or 'idle' segment (`index` in the schedule): steps of at most MAX_STEP_S until it ends
 * or the run stops. A pack that stops mid-step makes way (stopPack) and the step is tried again.
 */
export function powerThrough(
  run: RunState,
  segment: RunSegment,
  index: number,
  isLastSegment: boolean,
): void {
  const { at, point, step } = run
  const pack = run.rig.pack
  at.forceNextSample = true
  step.remainingS = segment.durationS
  while (step.remainingS > SEGMENT_DONE_S && at.stopReason === null) {
    step.openCircuitV = packOpenCircuitV(pack, at.soc)
    const stop = operatingStop(run.rig, segment, step.openCircuitV, at.supplyGuessV, point)
    if (stop !== null) {
      stopPack(run, stop, segment)
      continue
    }
    at.supplyGuessV = point.supplyV
    keepPoint(
      run,
      point.terminalV,
      point.terminalV * point.currentA,
      point.supplyV,
      segment.state,
      segment.headroomPeakW,
      'step',
    )
    takePoweredStep(run, segment)
    if (step.remainingS <= SEGMENT_DONE_S) endSegment(run, index)
    // A pack that empties exactly as the schedule ends needs no successor.
    const workLeft = step.remainingS > SEGMENT_DONE_S || !isLastSegment
    if (step.emptied && workLeft) stopPack(run, 'pack-empty', segment)
  }
}

/**
 * One powered step at the operating point just solved: at most MAX_STEP_S, ending early where
 * the pack empties; its energy, charge and time go into the totals (docs/model.md §7, "Outputs":
 * the energy breakdown sums to the chemical energy drawn, ∫OCV·I dt), and its charge leaves the
 * pack at the Peukert rate (pack.ts, chargeRateA).
 */
function takePoweredStep(run: RunState, segment: RunSegment): void {
  const { at, totals, point, step } = run
  const pack = run.rig.pack
  const currentA = point.currentA
  const terminalV = point.terminalV
  const chargeRateA = packChargeRateA(pack, currentA)
  let stepS = step.remainingS < MAX_STEP_S ? step.remainingS : MAX_STEP_S
  const emptied = chargeRateA > 0 && at.chargeAs + chargeRateA * stepS >= run.capacityAs
  if (emptied) stepS = (run.capacityAs - at.chargeAs) / chargeRateA

  totals.chemicalJ += step.openCircuitV * currentA * stepS
  totals.deliveredJ += terminalV * currentA * stepS
  totals.packLossJ += currentA * currentA * pack.resistanceOhm * stepS
  totals.leadLossJ += currentA * currentA * run.rig.leadOhm * stepS
  totals.ampOutputJ += point.ampOutputW * stepS
  totals.ampLossJ += (point.ampInputW - point.ampOutputW) * stepS
  totals.accessoryJ += point.accessoryDeviceW * stepS
  totals.converterLossJ += (point.accessoryPackW - point.accessoryDeviceW) * stepS
  totals.poweredS += stepS
  totals.poweredChargeAs += currentA * stepS
  if (currentA > totals.maxCurrentA) totals.maxCurrentA = currentA
  if (segment.state === 'on') {
    totals.musicS += stepS
    at.packMusicS += stepS
    totals.onChargeAs += currentA * stepS
    totals.onTerminalVs += terminalV * stepS
    if (segment.playingShare > 0) {
      // Headroom: the clip power at this supply over the programme's peak power.
      const headroomRatio =
        (run.rig.amplifier.clipPowerPerV2 * point.supplyV * point.supplyV) / segment.peakPerChannelW
      if (headroomRatio < totals.minimumHeadroomRatio) totals.minimumHeadroomRatio = headroomRatio
      if (headroomRatio < 1 && totals.clipsFromS === null) totals.clipsFromS = at.elapsedS
      if (point.supplyV < totals.lowestPlayingSupplyV) totals.lowestPlayingSupplyV = point.supplyV
    }
  }

  at.chargeAs = emptied ? run.capacityAs : at.chargeAs + chargeRateA * stepS
  const soc = emptied ? 0 : 1 - at.chargeAs / run.capacityAs
  at.soc = soc
  if (soc < at.packLowestSoc) at.packLowestSoc = soc
  if (soc < totals.lowestSoc) totals.lowestSoc = soc
  at.elapsedS += stepS
  step.remainingS -= stepS
  step.emptied = emptied
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
