// The entry point: estimate(request) → result (docs/model.md §9). Pass a request that passed
// estimateRequestSchema; for such input the engine neither throws nor returns NaN or Infinity.
import type { EstimateRequest, EstimateResult } from '../schemas/estimate'
import type { AmplifierModel } from './amplifier'
import {
  classABiasCurrentA,
  clipPowerPerSupplyV2,
  outputResistanceOhm,
  ratingExcessDb,
} from './amplifier'
import { chargingPermitted } from './charging'
import { accessoryLoad } from './converters'
import { leadResistanceOhm } from './leads'
import type { PackModel } from './pack'
import { buildPack, packOpenCircuitV } from './pack'
import {
  averagePowerW,
  averageToClipRatioAtClipping,
  meanToRmsRatio,
  peakPowerW,
} from './programme'
import type { ResolvedRequest, ResolvedSegment } from './resolve'
import { resolveRequest } from './resolve'
import type { RigLoads, RunOutcome, RunSegment } from './run'
import { OPEN_RUN_LIMIT_MINUTES, runRig } from './run'
import { loadOhm } from './speakers'
import type { SpeakerLeadsModel } from './speaker-leads'
import { speakerLeadsModel } from './speaker-leads'
import { summarise } from './summarise'

export { summarise } from './summarise'

/** Everything fixed for a run: built once per request, shared by estimate, compare and fixes. */
export interface PreparedRig {
  resolved: ResolvedRequest
  assumed: EstimateResult['assumed']
  pack: PackModel
  rig: RigLoads
  segments: RunSegment[]
  /** The request's programme as a segment: the level reference for loads and clip figures. */
  programmeSegment: RunSegment
  openEnded: boolean
  outputResistanceClamped: boolean
  /** The speakers' own load per channel, without the speaker leads. */
  speakerLoadOhm: number
  speakerLeads: SpeakerLeadsModel
}

export function prepareRig(request: EstimateRequest): PreparedRig {
  const { resolved, assumed } = resolveRequest(request)
  const temperatureC = resolved.temperatureC
  const pack = buildPack(resolved.pack, temperatureC)
  const leadOhm = resolved.leads ? leadResistanceOhm(resolved.leads, temperatureC) : 0
  const speakerLoadOhm = loadOhm(resolved.speakers)
  const speakerLeads = speakerLeadsModel(resolved.speakerLeads, speakerLoadOhm, temperatureC)
  // The amplifier drives the speaker leads and the speakers in series.
  const channelLoadOhm = speakerLoadOhm + speakerLeads.resistanceOhm
  const amp = resolved.amplifier
  // docs/model.md §4: a rating at 10 % THD is about 1 dB above the clean figure
  const cleanRatedPowerW = amp.ratedPowerW * 10 ** (-ratingExcessDb(amp.ratedThdPct) / 10)
  const output = outputResistanceOhm(
    cleanRatedPowerW,
    amp.ratedLoadOhm,
    amp.ratedSupplyV,
    amp.bridged,
  )
  const amplifier: AmplifierModel = {
    ampClass: amp.ampClass,
    channels: amp.channels,
    bridged: amp.bridged,
    loadOhm: channelLoadOhm,
    outputResistanceOhm: output.outputResistanceOhm,
    clipPowerPerV2: clipPowerPerSupplyV2(channelLoadOhm, output.outputResistanceOhm, amp.bridged),
    efficiency: amp.efficiency,
    idleCurrentA: amp.idleCurrentA,
    biasCurrentA:
      amp.ampClass === 'a'
        ? amp.channels * classABiasCurrentA(amp.ratedPowerW, amp.ratedSupplyV, amp.efficiency)
        : 0,
    lockoutV: amp.lockoutV,
    bulkCapacitanceF: amp.bulkCapacitanceF,
  }
  const linearCurrentA: number[] = []
  const linearDeviceW: number[] = []
  let switchingPackW = 0
  let switchingDeviceW = 0
  for (const accessory of resolved.accessories) {
    const load = accessoryLoad(accessory)
    if (accessory.feed === 'linear') {
      linearCurrentA.push(load.packCurrentA)
      linearDeviceW.push(load.devicePowerW)
    } else {
      switchingPackW += load.packPowerW
      switchingDeviceW += load.devicePowerW
    }
  }
  const rig: RigLoads = {
    pack,
    leadOhm,
    amplifier,
    switchingPackW,
    switchingDeviceW,
    linearCurrentA,
    linearDeviceW,
    linearCurrentTotalA: linearCurrentA.reduce((sum, value) => sum + value, 0),
  }

  // Levels are set against the clip power of a full pack at rest: a fixed volume setting, so the
  // output stays put while the pack sags and the headroom shrinks (docs/model.md §4, §7).
  const referenceClipW = amplifier.clipPowerPerV2 * packOpenCircuitV(pack, 1) ** 2
  const programmePeakW = peakPowerW(referenceClipW, resolved.programme.peakBelowClipDb)
  // Outside its charge temperature range the pack takes nothing at a charging break (charging.ts):
  // the rig stays silent and the result says why (warning 'charge-temperature-out-of-range').
  const chargeAllowed = chargingPermitted(pack.chemistry, temperatureC)
  const toRunSegment = (segment: ResolvedSegment): RunSegment => ({
    label: segment.label,
    state: segment.state,
    durationS: segment.minutes * 60,
    playingShare: segment.playingPct / 100,
    outputPerChannelW: averagePowerW(
      referenceClipW,
      segment.peakBelowClipDb,
      segment.crestFactorDb,
    ),
    peakPerChannelW: peakPowerW(referenceClipW, segment.peakBelowClipDb),
    averageToClipAtClipping: averageToClipRatioAtClipping(segment.crestFactorDb),
    meanToRms: meanToRmsRatio(segment.crestFactorDb),
    headroomPeakW:
      segment.state === 'on' ? peakPowerW(referenceClipW, segment.peakBelowClipDb) : programmePeakW,
    chargeW: chargeAllowed ? segment.chargeW : 0,
  })
  const programmeSegment = toRunSegment({
    label: 'programme',
    minutes: OPEN_RUN_LIMIT_MINUTES,
    state: 'on',
    ...resolved.programme,
    chargeW: 0,
  })
  const segments = resolved.schedule ? resolved.schedule.map(toRunSegment) : [programmeSegment]
  return {
    resolved,
    assumed,
    pack,
    rig,
    segments,
    programmeSegment,
    openEnded: resolved.schedule === null,
    outputResistanceClamped: output.clamped,
    speakerLoadOhm,
    speakerLeads,
  }
}

export function runPrepared(
  prepared: PreparedRig,
  maxPacks: number,
  recordTimeline: boolean,
  prefixPacks?: number,
): RunOutcome {
  return runRig(prepared.rig, prepared.segments, {
    maxPacks,
    swapPolicy: prepared.resolved.swapPolicy,
    recordTimeline,
    openEnded: prepared.openEnded,
    ...(prefixPacks === undefined ? {} : { prefixPacks }),
  })
}

export interface EstimateOptions {
  /** Record the chart timeline (default true); a comparison of many packs can skip it. */
  timeline?: boolean
}

export function estimate(request: EstimateRequest, options: EstimateOptions = {}): EstimateResult {
  const prepared = prepareRig(request)
  const outcome = runPrepared(prepared, prepared.resolved.pack.count, options.timeline ?? true)
  return summarise(prepared, outcome)
}
