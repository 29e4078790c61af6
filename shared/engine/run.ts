// The time-stepped run (docs/model.md §7): each step, draw → current → terminal voltage → charge
// removed → state of charge, over the schedule's segments, with swaps between packs on hand.
import type { SegmentState, StopReason, SwapPolicy } from '../schemas/estimate'
import type { AmplifierModel } from './amplifier'
import { amplifierConstantCurrentA, amplifierConstantPowerW } from './amplifier'
import type { PackModel } from './pack'
import {
  CANNOT_DELIVER,
  chargeRateA as packChargeRateA,
  mixedLoadCurrentA,
  packOpenCircuitV,
} from './pack'
import { chargeAh } from './charging'
import { TimelineRecorder } from './timeline'

export const MAX_STEP_S = 10 // docs/model.md §7: step ≤ 10 s of simulated time
export const OPEN_RUN_LIMIT_MINUTES = 7 * 24 * 60 // ours: a run without a schedule stops at 7 days

export interface RunSegment {
  label: string
  state: SegmentState
  durationS: number
  /** 0..1: the programme's share of the segment's time. */
  playingShare: number
  /** Wanted average output per channel while playing (fixed gain: it does not sag with the pack). */
  outputPerChannelW: number
  /** Sine-equivalent power of the programme's peaks per channel. */
  peakPerChannelW: number
  /** Largest average/clip ratio with peaks at clipping, 2·10^(−CF/10). */
  averageToClipAtClipping: number
  meanToRms: number
  /** Peak power the timeline's headroom is measured against (the request's programme when idle). */
  headroomPeakW: number
  /** Power into the pack in a 'charging' segment (the rig is silent); 0 otherwise. */
  chargeW: number
}

export interface RigLoads {
  pack: PackModel
  leadOhm: number
  amplifier: AmplifierModel
  /** Direct and switching-fed accessories: constant power from the supply, and what they use. */
  switchingPackW: number
  switchingDeviceW: number
  /** Linear-fed accessories: each passes its device current. */
  linearCurrentA: readonly number[]
  linearDeviceW: readonly number[]
  linearCurrentTotalA: number
}

export interface OperatingPoint {
  currentA: number
  terminalV: number
  /** At the amplifier and accessories, after the lead. */
  supplyV: number
  ampInputW: number
  ampOutputW: number
  accessoryPackW: number
  accessoryDeviceW: number
}

export function emptyOperatingPoint(): OperatingPoint {
  return {
    currentA: 0,
    terminalV: 0,
    supplyV: 0,
    ampInputW: 0,
    ampOutputW: 0,
    accessoryPackW: 0,
    accessoryDeviceW: 0,
  }
}

/**
 * The rig's draw from a source (open-circuit `sourceV` through `sourceOhm` ahead of the pack
 * terminals, then the lead). The output of a playing amplifier is capped at what the supply
 * can swing, using `supplyGuessV` (the previous step's supply). Writes into `out`; returns false
 * when the source cannot deliver the power at all.
 */
export function solveOperatingPoint(
  rig: RigLoads,
  segment: RunSegment,
  sourceV: number,
  sourceOhm: number,
  supplyGuessV: number,
  out: OperatingPoint,
): boolean {
  if (segment.state === 'off' || segment.state === 'charging') {
    out.currentA = 0
    out.terminalV = sourceV
    out.supplyV = sourceV
    out.ampInputW = out.ampOutputW = out.accessoryPackW = out.accessoryDeviceW = 0
    return true
  }
  const amplifier = rig.amplifier
  let outputPerChannelW = 0
  if (segment.state === 'on' && segment.playingShare > 0) {
    const ceilingW =
      segment.averageToClipAtClipping * amplifier.clipPowerPerV2 * supplyGuessV * supplyGuessV
    outputPerChannelW = Math.min(segment.outputPerChannelW, ceilingW)
  }
  const averageOutputW = amplifier.channels * outputPerChannelW * segment.playingShare
  const ampCurrentA = amplifierConstantCurrentA(
    amplifier,
    outputPerChannelW,
    segment.playingShare,
    segment.meanToRms,
  )
  const ampPowerW = amplifierConstantPowerW(amplifier, averageOutputW)
  const totalOhm = sourceOhm + rig.leadOhm
  const currentA = mixedLoadCurrentA(
    sourceV,
    totalOhm,
    ampCurrentA + rig.linearCurrentTotalA,
    ampPowerW + rig.switchingPackW,
  )
  if (currentA === CANNOT_DELIVER) return false
  const terminalV = sourceV - currentA * sourceOhm
  const supplyV = terminalV - currentA * rig.leadOhm
  const ampInputW = supplyV * ampCurrentA + ampPowerW
  let linearDeviceW = 0
  for (let i = 0; i < rig.linearCurrentA.length; i++) {
    // A regulator in dropout passes what it can: its device gets at most V·I.
    linearDeviceW += Math.min(rig.linearDeviceW[i]!, supplyV * rig.linearCurrentA[i]!)
  }
  out.currentA = currentA
  out.terminalV = terminalV
  out.supplyV = supplyV
  out.ampInputW = ampInputW
  // Never more out than in (class A far below its rated supply).
  out.ampOutputW = Math.min(averageOutputW, ampInputW)
  out.accessoryPackW = rig.switchingPackW + supplyV * rig.linearCurrentTotalA
  out.accessoryDeviceW = rig.switchingDeviceW + linearDeviceW
  return true
}

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
  forceNextSample: boolean
  stopReason: StopReason | null
  // The latest step (or off-segment sample), for a pack's closing timeline point.
  lastVoltageV: number
  lastDrawW: number
  lastSupplyV: number
  lastState: SegmentState
  lastHeadroomPeakW: number
}

export function runRig(
  rig: RigLoads,
  segments: readonly RunSegment[],
  options: RunOptions,
): RunOutcome {
  const pack = rig.pack
  const capacityAs = pack.capacityAh * 3600
  const lockoutV = rig.amplifier.lockoutV
  const fullOpenCircuitV = packOpenCircuitV(pack, 1)
  const point = emptyOperatingPoint()
  let expectedSamples = 0
  for (const segment of segments) expectedSamples += Math.ceil(segment.durationS / MAX_STEP_S)
  const timeline = options.recordTimeline
    ? new TimelineRecorder(options.openEnded ? null : expectedSamples)
    : null
  const swaps: RunOutcome['swaps'] = []
  const packRuns: PackRunRecord[] = []
  const at: RunPosition = {
    elapsedS: 0,
    pack: 1,
    chargeAs: 0,
    soc: 1,
    packStartS: 0,
    packMusicS: 0,
    packLowestSoc: 1,
    supplyGuessV: fullOpenCircuitV,
    forceNextSample: true,
    stopReason: null,
    lastVoltageV: fullOpenCircuitV,
    lastDrawW: 0,
    lastSupplyV: fullOpenCircuitV,
    lastState: segments[0]?.state ?? 'on',
    lastHeadroomPeakW: segments[0]?.headroomPeakW ?? 1,
  }

  const totals: RunTotals = {
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
  }
  let prefix: RunOutcome | null = null
  let stepCount = 0
  const segmentEnds: SegmentEnd[] = []
  /** Records where segment `index` ended, once: the first call for it wins. */
  const endSegment = (index: number) => {
    if (segmentEnds.length !== index) return
    segmentEnds.push({
      deliveredJ: totals.deliveredJ,
      chemicalJ: totals.chemicalJ,
      chargedJ: totals.chargedJ,
      elapsedS: at.elapsedS,
      pack: at.pack,
    })
  }

  const sample = (
    voltageV: number,
    drawW: number,
    supplyV: number,
    state: SegmentState,
    headroomPeakW: number,
    forced: boolean,
  ) => {
    at.lastVoltageV = voltageV
    at.lastDrawW = drawW
    at.lastSupplyV = supplyV
    at.lastState = state
    at.lastHeadroomPeakW = headroomPeakW
    if (!timeline) return
    const clipW = rig.amplifier.clipPowerPerV2 * supplyV * supplyV
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
  const closePackRun = (endReason: PackEndReason) => {
    sample(at.lastVoltageV, at.lastDrawW, at.lastSupplyV, at.lastState, at.lastHeadroomPeakW, true)
    packRuns.push({
      pack: at.pack,
      startMinute: at.packStartS / 60,
      endMinute: at.elapsedS / 60,
      endReason,
      musicMinutes: at.packMusicS / 60,
      lowestSocPct: at.packLowestSoc * 100,
    })
  }

  const swapIn = () => {
    at.pack++
    at.chargeAs = 0
    at.soc = 1
    at.packStartS = at.elapsedS
    at.packMusicS = 0
    at.packLowestSoc = 1
    at.supplyGuessV = fullOpenCircuitV
    swaps.push({ atMinute: at.elapsedS / 60, pack: at.pack })
    at.forceNextSample = true
  }

  /** Why a fresh pack could not run this segment either, or null if it can. */
  const freshPackStop = (segment: RunSegment): StopReason | null => {
    const ok = solveOperatingPoint(
      rig,
      segment,
      fullOpenCircuitV,
      pack.resistanceOhm,
      fullOpenCircuitV,
      point,
    )
    if (!ok) return 'cannot-deliver'
    if (point.terminalV < pack.cutoffV) return 'pack-cutoff'
    if (lockoutV !== null && point.supplyV < lockoutV) return 'amp-lockout'
    return null
  }

  /** A pack stopped: swap in the next if one is left and could run; false ends the run. */
  const handleStop = (reason: StopReason, segment: RunSegment): boolean => {
    closePackRun(reason)
    if (at.pack < options.maxPacks && freshPackStop(segment) === null) {
      if (at.pack === options.prefixPacks) {
        prefix = {
          ...totals,
          stopReason: reason,
          elapsedS: at.elapsedS,
          packsUsed: at.pack,
          endSoc: at.soc,
          segmentEnds: segmentEnds.slice(),
          swaps: swaps.slice(),
          packRuns: packRuns.slice(),
          timeline: null,
          prefix: null,
        }
      }
      swapIn()
      return true
    }
    at.stopReason = reason
    return false
  }

  /** A charging break: the rig is silent and the pack in it gains charge, up to full. */
  const chargeThrough = (segment: RunSegment) => {
    at.forceNextSample = true
    let remainingS = segment.durationS
    while (remainingS > 1e-9) {
      const stepS = remainingS < MAX_STEP_S ? remainingS : MAX_STEP_S
      const openV = packOpenCircuitV(pack, at.soc)
      const gainedAs = chargeAh(segment.chargeW, openV, stepS / 60, at.chargeAs / 3600) * 3600
      const currentA = gainedAs / stepS
      // At the terminals a charging pack sits above its open-circuit voltage by I·R; the draw
      // shown is minus the power stored, chargeW until the pack is full.
      const terminalV = openV + currentA * pack.resistanceOhm
      if (timeline && (at.forceNextSample || stepCount % timeline.stride === 0)) {
        const forced = at.forceNextSample
        at.forceNextSample = false
        sample(terminalV, -openV * currentA, terminalV, 'charging', segment.headroomPeakW, forced)
      }
      stepCount++
      totals.chargedJ += openV * gainedAs
      at.chargeAs = Math.max(0, at.chargeAs - gainedAs)
      at.soc = 1 - at.chargeAs / capacityAs
      at.elapsedS += stepS
      remainingS -= stepS
    }
    const openV = packOpenCircuitV(pack, at.soc)
    sample(openV, 0, openV, 'charging', segment.headroomPeakW, true)
    at.forceNextSample = true
  }

  segmentLoop: for (let s = 0; s < segments.length; s++) {
    const segment = segments[s]!
    if (
      s > 0 &&
      segment.state !== 'charging' && // the pack in the rig is the one that charges
      options.swapPolicy.mode === 'at-break-below' &&
      at.soc * 100 < options.swapPolicy.belowSocPct &&
      at.pack < options.maxPacks
    ) {
      closePackRun('swapped')
      swapIn()
    }
    if (segment.state === 'off') {
      const openV = packOpenCircuitV(pack, at.soc)
      sample(openV, 0, openV, 'off', segment.headroomPeakW, true)
      at.elapsedS += segment.durationS
      sample(openV, 0, openV, 'off', segment.headroomPeakW, true)
      at.forceNextSample = true
      endSegment(s)
      continue
    }
    if (segment.state === 'charging') {
      chargeThrough(segment)
      endSegment(s)
      continue
    }
    at.forceNextSample = true
    const playing = segment.state === 'on'
    let remainingS = segment.durationS
    while (remainingS > 1e-9) {
      const openV = packOpenCircuitV(pack, at.soc)
      let stop: StopReason | null = null
      if (!solveOperatingPoint(rig, segment, openV, pack.resistanceOhm, at.supplyGuessV, point)) {
        stop = 'cannot-deliver'
      } else if (point.terminalV < pack.cutoffV) {
        stop = 'pack-cutoff'
      } else if (lockoutV !== null && point.supplyV < lockoutV) {
        stop = 'amp-lockout'
      }
      if (stop !== null) {
        if (!handleStop(stop, segment)) {
          endSegment(s)
          break segmentLoop
        }
        continue
      }
      const currentA = point.currentA
      const terminalV = point.terminalV
      at.supplyGuessV = point.supplyV
      at.lastVoltageV = terminalV
      at.lastDrawW = terminalV * currentA
      at.lastSupplyV = point.supplyV
      at.lastState = segment.state
      at.lastHeadroomPeakW = segment.headroomPeakW
      if (timeline && (at.forceNextSample || stepCount % timeline.stride === 0)) {
        sample(
          terminalV,
          terminalV * currentA,
          point.supplyV,
          segment.state,
          segment.headroomPeakW,
          at.forceNextSample,
        )
        at.forceNextSample = false
      }
      stepCount++

      let stepS = remainingS < MAX_STEP_S ? remainingS : MAX_STEP_S
      const chargeRateA = packChargeRateA(pack, currentA)
      let emptied = false
      if (chargeRateA > 0 && at.chargeAs + chargeRateA * stepS >= capacityAs) {
        stepS = (capacityAs - at.chargeAs) / chargeRateA
        emptied = true
      }
      totals.chemicalJ += openV * currentA * stepS
      totals.deliveredJ += terminalV * currentA * stepS
      totals.packLossJ += currentA * currentA * pack.resistanceOhm * stepS
      totals.leadLossJ += currentA * currentA * rig.leadOhm * stepS
      totals.ampOutputJ += point.ampOutputW * stepS
      totals.ampLossJ += (point.ampInputW - point.ampOutputW) * stepS
      totals.accessoryJ += point.accessoryDeviceW * stepS
      totals.converterLossJ += (point.accessoryPackW - point.accessoryDeviceW) * stepS
      totals.poweredS += stepS
      totals.poweredChargeAs += currentA * stepS
      if (currentA > totals.maxCurrentA) totals.maxCurrentA = currentA
      if (playing) {
        totals.musicS += stepS
        at.packMusicS += stepS
        totals.onChargeAs += currentA * stepS
        totals.onTerminalVs += terminalV * stepS
        if (segment.playingShare > 0) {
          const ratio =
            (rig.amplifier.clipPowerPerV2 * point.supplyV * point.supplyV) / segment.peakPerChannelW
          if (ratio < totals.minimumHeadroomRatio) totals.minimumHeadroomRatio = ratio
          if (ratio < 1 && totals.clipsFromS === null) totals.clipsFromS = at.elapsedS
          if (point.supplyV < totals.lowestPlayingSupplyV)
            totals.lowestPlayingSupplyV = point.supplyV
        }
      }
      at.chargeAs = emptied ? capacityAs : at.chargeAs + chargeRateA * stepS
      const soc = emptied ? 0 : 1 - at.chargeAs / capacityAs
      at.soc = soc
      if (soc < at.packLowestSoc) at.packLowestSoc = soc
      if (soc < totals.lowestSoc) totals.lowestSoc = soc
      at.elapsedS += stepS
      remainingS -= stepS
      if (remainingS <= 1e-9) endSegment(s)
      // A pack that empties exactly as the schedule ends needs no successor.
      const workLeft = remainingS > 1e-9 || s < segments.length - 1
      if (emptied && workLeft && !handleStop('pack-empty', segment)) {
        endSegment(s)
        break segmentLoop
      }
    }
    endSegment(s)
  }

  const finalReason: StopReason =
    at.stopReason ?? (options.openEnded ? 'time-limit' : 'schedule-end')
  if (at.stopReason === null) closePackRun(finalReason)

  return {
    ...totals,
    stopReason: finalReason,
    elapsedS: at.elapsedS,
    packsUsed: at.pack,
    endSoc: at.soc,
    segmentEnds,
    swaps,
    packRuns,
    timeline,
    prefix,
  }
}
