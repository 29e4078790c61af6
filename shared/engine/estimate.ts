// The entry point: estimate(request) → result (docs/model.md §9). Pass a request that passed
// estimateRequestSchema; for such input the engine neither throws nor returns NaN or Infinity.
import type { ConverterResult, EstimateRequest, EstimateResult } from '../schemas/estimate'
import type { AmplifierModel } from './amplifier'
import {
  classABiasCurrentA,
  clipPowerPerSupplyV2,
  outputResistanceOhm,
  ratingExcessDb,
} from './amplifier'
import { CHEMISTRY_DATA, capacityTemperatureFactor } from './chemistry'
import {
  accessoryLoad,
  converterAdvice,
  feedFits,
  linearRegulatorHeatW,
  wiredVerdict,
} from './converters'
import { airlineClass, nominalWh } from './energy'
import { leadResistanceOhm } from './leads'
import type { SupplyFloor } from './dropout'
import type { PackModel } from './pack'
import { buildPack, packOpenCircuitV, socAtOpenCircuitV } from './pack'
import {
  averagePowerW,
  averageToClipRatioAtClipping,
  meanToRmsRatio,
  peakPowerW,
} from './programme'
import type { ResolvedRequest, ResolvedSegment } from './resolve'
import { resolveRequest } from './resolve'
import type { RigLoads, RunOutcome, RunSegment } from './run'
import { OPEN_RUN_LIMIT_MINUTES, emptyOperatingPoint, runRig, solveOperatingPoint } from './run'
import { peakEnvelope } from './peaks'
import { equivalentLevelDb, nioshPermittedMinutes, WHO_VENUE_LAEQ_DB } from './sound'
import { driversPerChannel, loadOhm } from './speakers'
import { dropoutOnset } from './dropout'
import type { DropoutOnset } from './dropout'
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

/** The programme's loudest bass note per channel over the run: a sine burst at the peaks of the
 *  playing segment that peaks highest, and never below its average (under 3 dB crest factor). */
function burstPerChannelW(segments: readonly RunSegment[]): number {
  let burstW = 0
  for (const segment of segments) {
    if (segment.state !== 'on' || segment.playingShare <= 0) continue
    burstW = Math.max(burstW, segment.peakPerChannelW, segment.outputPerChannelW)
  }
  return burstW
}

/** The parts that mute when the supply after the lead falls below their floor. */
function supplyFloors(resolved: ResolvedRequest, lockoutV: number | null): SupplyFloor[] {
  // Without a lock-out the amplifier still mutes where the pack cannot deliver the peak at all.
  const floors: SupplyFloor[] = [{ part: 'amplifier', floorV: lockoutV ?? 0 }]
  for (const accessory of resolved.accessories) {
    if (accessory.feed === 'direct')
      floors.push({ part: accessory.label, floorV: accessory.inputMinV })
  }
  return floors
}

/**
 * How deep the peaks are weighed. A day that ran its course stops at the charge it reached. A run
 * that stopped on a limit of the rig (lock-out, cutoff, an empty last pack, a pack that cannot
 * deliver) is weighed down to where the pack itself ends, its open-circuit voltage at the cutoff:
 * the safe side, and what keeps the figures monotone (a louder level or a thinner lead that stops
 * the run sooner never reads as easier peaks).
 */
function peaksDownToSoc(prepared: PreparedRig, outcome: RunOutcome): number {
  if (outcome.stopReason === 'schedule-end' || outcome.stopReason === 'time-limit') {
    return outcome.lowestSoc
  }
  return Math.min(outcome.lowestSoc, socAtOpenCircuitV(prepared.pack, prepared.pack.cutoffV))
}

/** Peak current and voltages over the whole run, and the first part to mute. */
function peakFigures(
  prepared: PreparedRig,
  outcome: RunOutcome,
  timeline: EstimateResult['timeline'],
): {
  peakCurrentA: number
  minPeakTerminalV: number
  minPeakSupplyV: number
  dropout: DropoutOnset | null
} {
  const { rig, resolved } = prepared
  const burstW = burstPerChannelW(prepared.segments)
  const downToSoc = peaksDownToSoc(prepared, outcome)
  const envelope = peakEnvelope(rig, burstW, downToSoc)
  const leads = resolved.leads
  const dropout = dropoutOnset(
    rig,
    burstW,
    supplyFloors(resolved, rig.amplifier.lockoutV),
    downToSoc,
    timeline,
    {
      lead: leads
        ? {
            lengthM: leads.lengthM,
            areaMm2: leads.areaMm2,
            resistanceForAreaOhm: (areaMm2) =>
              leadResistanceOhm({ ...leads, areaMm2 }, resolved.temperatureC),
          }
        : null,
      parallelCells: resolved.pack.parallelCells,
    },
  )
  return {
    peakCurrentA: envelope.peakCurrentA,
    minPeakTerminalV: envelope.minPeakTerminalV,
    minPeakSupplyV: envelope.minPeakSupplyV,
    dropout,
  }
}

/** Each accessory against the pack's window over the whole discharge, as it is wired. */
function converterResults(
  resolved: ResolvedRequest,
  windowMaxV: number,
  windowMinV: number,
): ConverterResult[] {
  return resolved.accessories.map((accessory) => {
    const verdict = wiredVerdict(accessory, windowMinV, windowMaxV)
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
}

/** Sound at the listener from the loudest segment, and the day's exposure. */
function soundFigures(
  prepared: PreparedRig,
  loudest: RunSegment | null,
): { splDb: EstimateResult['splDb']; exposure: EstimateResult['exposure'] } {
  const { resolved } = prepared
  const speakers = resolved.speakers
  if (speakers.sensitivityDb === null || !loudest) return { splDb: undefined, exposure: undefined }
  // Through the speaker leads' share, summed in power over the drivers facing the listener.
  const levelAt = (channelPowerW: number) => listenerLevelDb(prepared, channelPowerW) ?? 0
  const average = equivalentLevelDb(levelAt(loudest.outputPerChannelW), loudest.playingShare)
  // Peaks are at least the level while playing (a programme under 3 dB crest factor).
  const peak = levelAt(Math.max(loudest.peakPerChannelW, loudest.outputPerChannelW))
  let dosePct: number | undefined
  if (resolved.schedule) {
    dosePct = 0
    for (const segment of prepared.segments) {
      if (segment.state !== 'on' || segment.playingShare <= 0) continue
      const level = equivalentLevelDb(levelAt(segment.outputPerChannelW), segment.playingShare)
      dosePct += (100 * segment.durationS) / 60 / nioshPermittedMinutes(level)
    }
  }
  return {
    splDb: { average, peak },
    exposure: {
      permittedMinutes: nioshPermittedMinutes(average),
      levelDb: average,
      ...(dosePct === undefined ? {} : { dosePct }),
      overWhoVenueLimit: average > WHO_VENUE_LAEQ_DB,
    },
  }
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
  const fullClipW = clipAt(fullSupplyV ?? fullOpenCircuitV / 2)
  // The end of the discharge as the run reached it (a lead-acid run may stop on an empty pack
  // above its cutoff voltage): the lowest supply while playing, where anything played.
  const reachedEndSupplyV = Number.isFinite(outcome.lowestPlayingSupplyV)
    ? Math.max(outcome.lowestPlayingSupplyV, amplifier.lockoutV ?? 0)
    : endSupplyV

  const timeline = outcome.timeline ? outcome.timeline.points() : []
  const peaks = peakFigures(prepared, outcome, timeline)
  const dropoutRisk = peaks.dropout !== null
  const dropout = peaks.dropout

  // Accessories against the pack's window, its top straight off the charger.
  const converters = converterResults(resolved, pack.chargedV, endSupplyV)

  const loudest = loudestSegment(prepared.segments)
  const { splDb, exposure } = soundFigures(prepared, loudest)

  const nominalPackWh = nominalWh(pack.nominalV, pack.ratedCapacityAh)
  const packClass = airlineClass(nominalPackWh, CHEMISTRY_DATA[pack.chemistry].isLithium)
  const averageOnCurrentA = perSecond(outcome.onChargeAs, outcome.musicS)
  const averageOnTerminalV = perSecond(outcome.onTerminalVs, outcome.musicS)
  const leadDropPct = {
    average:
      averageOnTerminalV > 0 ? (100 * averageOnCurrentA * rig.leadOhm) / averageOnTerminalV : 0,
    peak:
      peaks.minPeakTerminalV > 0
        ? (100 * peaks.peakCurrentA * rig.leadOhm) / peaks.minPeakTerminalV
        : 0,
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
    chargedPackV: pack.chargedV,
    cutoffSupplyV: cutoffLeadSupplyV,
    supplyMaxV: resolved.amplifier.supplyMaxV,
    lockoutV: amplifier.lockoutV,
    stopReason: outcome.stopReason,
    anyPackCannotDeliver: outcome.packRuns.some((run) => run.endReason === 'cannot-deliver'),
    lowestSocPct: outcome.lowestSoc * 100,
    maxAverageCurrentA: outcome.maxCurrentA,
    peakCurrentA: peaks.peakCurrentA,
    maxDischargeA: resolved.pack.maxDischargeA,
    leadDropPct,
    leadAreaMm2: resolved.leads ? resolved.leads.areaMm2 : null,
    dropoutRisk,
    dropout,
    minPeakSupplyV: peaks.minPeakSupplyV,
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
    clipPowerW: { full: fullClipW, cutoff: Math.min(clipAt(reachedEndSupplyV), fullClipW) },
    peakCurrentA: peaks.peakCurrentA,
    minPeakTerminalV: peaks.minPeakTerminalV,
    minPeakSupplyV: peaks.minPeakSupplyV,
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
      chargedV: pack.chargedV,
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
      driversPerChannel: driversPerChannel(resolved.speakers),
      powerPerDriverW: {
        average: loudest
          ? (loudest.outputPerChannelW * prepared.speakerLeads.speakerShare) /
            driversPerChannel(resolved.speakers)
          : 0,
        peak: loudest
          ? (loudest.peakPerChannelW * prepared.speakerLeads.speakerShare) /
            driversPerChannel(resolved.speakers)
          : 0,
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
