// The entry point: estimate(request) → result (engine.md §9). Pass a request that passed
// estimateRequestSchema; for such input the engine neither throws nor returns NaN or Infinity.
import type { ConverterResult, EstimateRequest, EstimateResult } from '../schemas/estimate'
import type { AmplifierModel } from './amplifier'
import {
  classABiasCurrentA,
  clipPowerPerSupplyV2,
  outputResistanceOhm,
  ratingExcessDb,
} from './amplifier'
import { capacityTemperatureFactor } from './chemistry'
import {
  accessoryLoad,
  converterAdvice,
  converterVerdict,
  feedFits,
  linearRegulatorHeatW,
} from './converters'
import { airlineClass, nominalWh } from './energy'
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
import {
  OPEN_RUN_LIMIT_MINUTES,
  emptyOperatingPoint,
  peakDemand,
  runRig,
  solveOperatingPoint,
} from './run'
import { equivalentLevelDb, nioshPermittedMinutes, WHO_VENUE_LAEQ_DB } from './sound'
import { driversPerChannel, loadOhm } from './speakers'
import { dropoutOnset } from './dropout'
import { ENGINE_VERSION } from './version'
import { reserveShortfall, reserveWarning } from './reserve'
import { listenerLevelDb, segmentResults } from './segment-levels'
import type { SpeakerLeadsModel } from './speaker-leads'
import { speakerLeadsModel } from './speaker-leads'
import { collectWarnings } from './warnings'

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
  // engine.md §4: a rating at 10 % THD is about 1 dB above the clean figure
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
  // output stays put while the pack sags and the headroom shrinks (engine.md §4, §7).
  const referenceClipW = amplifier.clipPowerPerV2 * packOpenCircuitV(pack, 1) ** 2
  const programmePeakW = peakPowerW(referenceClipW, resolved.programme.peakBelowClipDb)
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
    chargeW: segment.chargeW,
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

/** The segment that plays loudest on average (its level sets the sound figures), if any plays. */
function loudestSegment(segments: readonly RunSegment[]): RunSegment | null {
  let loudest: RunSegment | null = null
  for (const segment of segments) {
    if (segment.state !== 'on' || segment.playingShare <= 0) continue
    const averageW = segment.outputPerChannelW * segment.playingShare
    if (!loudest || averageW > loudest.outputPerChannelW * loudest.playingShare) loudest = segment
  }
  return loudest
}

/** Supply at the amplifier for a segment's average draw from a source, settling the output cap. */
function settledSupplyV(prepared: PreparedRig, sourceV: number, sourceOhm: number): number | null {
  const point = emptyOperatingPoint()
  let supplyV = sourceV
  for (let pass = 0; pass < 3; pass++) {
    const ok = solveOperatingPoint(
      prepared.rig,
      prepared.programmeSegment,
      sourceV,
      sourceOhm,
      supplyV,
      point,
    )
    if (!ok) return null
    supplyV = point.supplyV
  }
  return supplyV
}

const toWh = (joules: number) => joules / 3600
const perSecond = (total: number, seconds: number) => (seconds > 0 ? total / seconds : 0)

export interface EstimateOptions {
  /** Record the chart timeline (default true); a comparison of many packs can skip it. */
  timeline?: boolean
}

export function estimate(request: EstimateRequest, options: EstimateOptions = {}): EstimateResult {
  const prepared = prepareRig(request)
  const outcome = runPrepared(prepared, prepared.resolved.pack.count, options.timeline ?? true)
  return summarise(prepared, outcome)
}

/** The result of a run: clip, peak, converter, sound and warning figures around its outcome. */
export function summarise(prepared: PreparedRig, outcome: RunOutcome): EstimateResult {
  const { resolved, pack, rig } = prepared
  const amplifier = rig.amplifier

  // Clip power at full and at the end of discharge, under the programme's load.
  const fullOpenCircuitV = packOpenCircuitV(pack, 1)
  const fullSupplyV = settledSupplyV(prepared, fullOpenCircuitV, pack.resistanceOhm)
  // At cutoff the pack terminals sit at the cutoff voltage; only the lead drops further.
  const cutoffLeadSupplyV = settledSupplyV(prepared, pack.cutoffV, 0) ?? pack.cutoffV / 2
  const endSupplyV = Math.max(cutoffLeadSupplyV, amplifier.lockoutV ?? 0)
  const clipAt = (supplyV: number) => amplifier.clipPowerPerV2 * supplyV * supplyV

  // Peaks: the loudest segment's peaks as a sine burst at the lowest state of charge reached.
  const loudest = loudestSegment(prepared.segments)
  const peak = peakDemand(rig, loudest ? loudest.peakPerChannelW : 0, outcome.lowestSoc)
  const dropoutRisk =
    !peak.delivered || (amplifier.lockoutV !== null && peak.supplyV < amplifier.lockoutV)
  const timeline = outcome.timeline ? outcome.timeline.points() : []
  const dropout = dropoutRisk
    ? dropoutOnset(
        rig,
        loudest ? loudest.peakPerChannelW : 0,
        amplifier.lockoutV,
        outcome.lowestSoc,
        timeline,
      )
    : null

  // Accessories against the pack's window over the whole discharge (engine.md §6).
  const windowMaxV = fullOpenCircuitV
  const windowMinV = endSupplyV
  const converters: ConverterResult[] = resolved.accessories.map((accessory) => {
    const verdict = converterVerdict(
      windowMinV,
      windowMaxV,
      accessory.inputMinV,
      accessory.inputMaxV,
    )
    const load = accessoryLoad(accessory)
    const isLinear = accessory.feed === 'linear'
    const linearHeatW = isLinear
      ? linearRegulatorHeatW(windowMaxV, accessory.outputV, load.packCurrentA)
      : 0
    const packDrawW = isLinear ? windowMaxV * load.packCurrentA : load.packPowerW
    return {
      label: accessory.label,
      verdict,
      feed: accessory.feed,
      fits: feedFits(accessory, verdict, windowMinV, windowMaxV),
      advice: converterAdvice(accessory, verdict, windowMinV, windowMaxV),
      windowMinV,
      windowMaxV,
      suppliedV: accessory.feed === 'direct' ? windowMaxV : accessory.outputV,
      packDrawW,
      lossW: packDrawW - accessory.powerW,
      linearHeatW,
    }
  })

  // Sound at the listener (engine.md §8), from the loudest segment.
  const speakers = resolved.speakers
  const drivers = driversPerChannel(speakers)
  const speakerShare = prepared.speakerLeads.speakerShare
  let splDb: EstimateResult['splDb']
  let exposure: EstimateResult['exposure']
  if (speakers.sensitivityDb !== null && loudest) {
    const levelAt = (channelPowerW: number) => listenerLevelDb(prepared, channelPowerW)!
    const average = equivalentLevelDb(levelAt(loudest.outputPerChannelW), loudest.playingShare)
    splDb = { average, peak: levelAt(loudest.peakPerChannelW) }
    let dosePct: number | undefined
    if (resolved.schedule) {
      dosePct = 0
      for (const segment of prepared.segments) {
        if (segment.state !== 'on' || segment.playingShare <= 0) continue
        const level = equivalentLevelDb(levelAt(segment.outputPerChannelW), segment.playingShare)
        dosePct += (100 * segment.durationS) / 60 / nioshPermittedMinutes(level)
      }
    }
    exposure = {
      permittedMinutes: nioshPermittedMinutes(average),
      levelDb: average,
      ...(dosePct === undefined ? {} : { dosePct }),
      overWhoVenueLimit: average > WHO_VENUE_LAEQ_DB,
    }
  }

  const nominalPackWh = nominalWh(pack.nominalV, pack.ratedCapacityAh)
  const packClass = airlineClass(nominalPackWh)
  const averageOnCurrentA = perSecond(outcome.onChargeAs, outcome.musicS)
  const averageOnTerminalV = perSecond(outcome.onTerminalVs, outcome.musicS)
  const leadDropPct = {
    average:
      averageOnTerminalV > 0 ? (100 * averageOnCurrentA * rig.leadOhm) / averageOnTerminalV : 0,
    peak: peak.terminalV > 0 ? (100 * peak.currentA * rig.leadOhm) / peak.terminalV : 0,
  }
  const totalMinutes = prepared.segments.reduce((sum, segment) => sum + segment.durationS, 0) / 60
  const lasts = outcome.stopReason === 'schedule-end'
  const scheduleResult: EstimateResult['schedule'] = resolved.schedule
    ? {
        lasts,
        packsUsed: outcome.packsUsed,
        swaps: outcome.swaps,
        totalMinutes,
        stoppedAtMinute: lasts ? null : outcome.elapsedS / 60,
        segments: segmentResults(prepared, outcome),
        endSocPct: outcome.endSoc * 100,
        sparePacks: resolved.pack.count - outcome.packsUsed,
      }
    : undefined
  // Nothing played: no headroom figure to give, 0 keeps the result finite.
  const headroomMinimumDb = Number.isFinite(outcome.minimumHeadroomRatio)
    ? 10 * Math.log10(outcome.minimumHeadroomRatio)
    : 0

  const warnings = collectWarnings({
    chemistry: pack.chemistry,
    temperatureC: resolved.temperatureC,
    capacityFactor: capacityTemperatureFactor(pack.chemistry, resolved.temperatureC),
    loadOhm: prepared.speakerLoadOhm,
    minLoadOhm: resolved.amplifier.minLoadOhm,
    fullPackV: fullOpenCircuitV,
    cutoffSupplyV: cutoffLeadSupplyV,
    supplyMaxV: resolved.amplifier.supplyMaxV,
    lockoutV: amplifier.lockoutV,
    stopReason: outcome.stopReason,
    anyPackCannotDeliver: outcome.packRuns.some((run) => run.endReason === 'cannot-deliver'),
    lowestSocPct: outcome.lowestSoc * 100,
    maxAverageCurrentA: outcome.maxCurrentA,
    peakCurrentA: peak.currentA,
    maxDischargeA: resolved.pack.maxDischargeA,
    leadDropPct,
    leadAreaMm2: resolved.leads ? resolved.leads.areaMm2 : null,
    dropoutRisk,
    dropout,
    minPeakSupplyV: peak.supplyV,
    clipsFromMinute: outcome.clipsFromS === null ? null : outcome.clipsFromS / 60,
    converters,
    averageSplDb: splDb ? splDb.average : null,
    childrenPresent: resolved.childrenPresent,
    permittedMinutes: exposure ? exposure.permittedMinutes : null,
    schedule: scheduleResult
      ? {
          lasts,
          stoppedAtMinute: scheduleResult.stoppedAtMinute,
          totalMinutes,
        }
      : null,
    outputResistanceClamped: prepared.outputResistanceClamped,
    abEfficiencyGiven: amplifier.ampClass === 'ab' && resolved.amplifier.efficiencyGiven,
    nominalWh: nominalPackWh,
    airlineClass: packClass,
  })
  const reserve = reserveShortfall(prepared, outcome)
  if (reserve) warnings.push(reserveWarning(reserve))

  const massKg = resolved.pack.massKg
  return {
    engineVersion: ENGINE_VERSION,
    runtimeHours: outcome.elapsedS / 3600,
    stopReason: outcome.stopReason,
    musicHours: outcome.musicS / 3600,
    averageDrawW: perSecond(outcome.deliveredJ, outcome.poweredS),
    loadOhm: prepared.speakerLoadOhm,
    leadResistanceOhm: rig.leadOhm,
    energyWh: {
      nominal: nominalPackWh,
      delivered: toWh(outcome.deliveredJ),
      drawn: toWh(outcome.chemicalJ),
    },
    airlineClass: packClass,
    breakdownWh: {
      amplifierOutput: toWh(outcome.ampOutputJ),
      amplifierLoss: toWh(outcome.ampLossJ),
      accessories: toWh(outcome.accessoryJ),
      converterLoss: toWh(outcome.converterLossJ),
      leadLoss: toWh(outcome.leadLossJ),
      packLoss: toWh(outcome.packLossJ),
    },
    clipPowerW: {
      full: clipAt(fullSupplyV ?? fullOpenCircuitV / 2),
      cutoff: clipAt(endSupplyV),
    },
    peakCurrentA: peak.currentA,
    minPeakTerminalV: peak.supplyV,
    dropoutRisk,
    dropout,
    ...(splDb ? { splDb } : {}),
    ...(exposure ? { exposure } : {}),
    converters,
    warnings,
    timeline,
    ...(scheduleResult ? { schedule: scheduleResult } : {}),
    speakerLeads: {
      resistanceOhm: prepared.speakerLeads.resistanceOhm,
      lossPct: prepared.speakerLeads.lossPct,
    },
    pack: {
      ...(resolved.pack.label === undefined ? {} : { label: resolved.pack.label }),
      nominalV: pack.nominalV,
      fullV: pack.fullV,
      cutoffV: pack.cutoffV,
      ratedCapacityAh: pack.ratedCapacityAh,
      capacityAh: pack.capacityAh,
      resistanceOhm: pack.resistanceOhm,
      nominalWh: nominalPackWh,
      count: resolved.pack.count,
      ...(massKg === undefined ? {} : { massKg, whPerKg: nominalPackWh / massKg }),
    },
    amplifier: {
      outputResistanceOhm: amplifier.outputResistanceOhm,
      lockoutV: amplifier.lockoutV,
      supplyMaxV: resolved.amplifier.supplyMaxV,
      averageOutputW: perSecond(outcome.ampOutputJ, outcome.musicS),
    },
    speakers: {
      loadOhm: prepared.speakerLoadOhm,
      driversPerChannel: drivers,
      powerPerDriverW: {
        average: loudest ? (loudest.outputPerChannelW * speakerShare) / drivers : 0,
        peak: loudest ? (loudest.peakPerChannelW * speakerShare) / drivers : 0,
      },
    },
    leads: {
      resistanceOhm: rig.leadOhm,
      dropPct: leadDropPct,
      averageLossW: perSecond(outcome.leadLossJ, outcome.poweredS),
    },
    headroom: {
      minimumDb: headroomMinimumDb,
      clipsFromMinute: outcome.clipsFromS === null ? null : outcome.clipsFromS / 60,
    },
    averageCurrentA: perSecond(outcome.poweredChargeAs, outcome.poweredS),
    lowestSocPct: outcome.lowestSoc * 100,
    packRuns: outcome.packRuns,
    assumed: prepared.assumed,
  }
}
