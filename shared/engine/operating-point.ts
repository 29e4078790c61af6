// The rig's draw from its pack at one moment (docs/model.md §1, §4, §6): the current, the
// voltages at the terminals and at the amplifier, and where the power goes. The time-stepped run
// (run.ts), the peak figures and the dropout check all solve it here.
import type { SegmentState, StopReason } from '../schemas/estimate'
import type { AmplifierModel } from './amplifier'
import { amplifierConstantCurrentA, amplifierConstantPowerW } from './amplifier'
import type { PackModel } from './pack'
import { CANNOT_DELIVER, mixedLoadCurrentA } from './pack'

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

/**
 * Why the rig's pack, at open-circuit `openCircuitV`, cannot run `segment` (docs/model.md §7,
 * "Stops"), or null when it can: the pack cannot deliver the power, its terminals fall below
 * its cutoff, or the supply after the lead falls below the amplifier's lock-out. Solves into
 * `out`. The one test of a pack in the rig: each step's, and a fresh pack's before a swap.
 */
export function operatingStop(
  rig: RigLoads,
  segment: RunSegment,
  openCircuitV: number,
  supplyGuessV: number,
  out: OperatingPoint,
): StopReason | null {
  const pack = rig.pack
  if (!solveOperatingPoint(rig, segment, openCircuitV, pack.resistanceOhm, supplyGuessV, out)) {
    return 'cannot-deliver'
  }
  if (out.terminalV < pack.cutoffV) return 'pack-cutoff'
  const lockoutV = rig.amplifier.lockoutV
  if (lockoutV !== null && out.supplyV < lockoutV) return 'amp-lockout'
  return null
}
