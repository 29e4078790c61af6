// The result of a run: clip, peak, converter, sound and warning figures around its outcome, in the
// shape of the estimate contract (docs/model.md §9; docs/estimate-api.md names every field).
import type { ConverterResult, EstimateResult } from '../schemas/estimate'
import { CHEMISTRY_DATA } from './chemistry'
import { airlineClass, nominalWh } from './energy'
import type { PreparedRig } from './estimate'
import type { RunOutcome, RunSegment } from './run'
import { segmentResults } from './segment-levels'
import { driversPerChannel } from './speakers'
import type { ClipFigures } from './summary-clip'
import { clipFigures } from './summary-clip'
import { converterResults } from './summary-converters'
import type { PeakFigures } from './summary-peaks'
import { peakFigures } from './summary-peaks'
import { loudestSegment, soundFigures } from './summary-sound'
import { resultWarnings } from './summary-warnings'
import { ENGINE_VERSION } from './version'

/** The figures worked out around a run's outcome, before they are laid out as the result. */
export interface SummaryFigures {
  clip: ClipFigures
  peaks: PeakFigures
  converters: ConverterResult[]
  splDb: EstimateResult['splDb']
  exposure: EstimateResult['exposure']
  nominalPackWh: number
  airlineClass: EstimateResult['airlineClass']
  leadDropPct: EstimateResult['leads']['dropPct']
  schedule: EstimateResult['schedule']
}

const toWh = (joules: number) => joules / 3600
const perSecond = (total: number, seconds: number) => (seconds > 0 ? total / seconds : 0)

export function summarise(prepared: PreparedRig, outcome: RunOutcome): EstimateResult {
  const { pack } = prepared
  const timeline = outcome.timeline ? outcome.timeline.points() : []
  const clip = clipFigures(prepared, outcome)
  const peaks = peakFigures(prepared, outcome, timeline)
  const loudest = loudestSegment(prepared.segments)
  const nominalPackWh = nominalWh(pack.nominalV, pack.ratedCapacityAh)
  const figures: SummaryFigures = {
    clip,
    peaks,
    // Accessories against the pack's window, its top straight off the charger.
    converters: converterResults(prepared.resolved, pack.chargedV, clip.endSupplyV),
    ...soundFigures(prepared, loudest),
    nominalPackWh,
    airlineClass: airlineClass(nominalPackWh, CHEMISTRY_DATA[pack.chemistry].isLithium),
    leadDropPct: leadDropPct(prepared, outcome, peaks),
    schedule: scheduleFigures(prepared, outcome),
  }
  const warnings = resultWarnings(prepared, outcome, figures)
  return {
    engineVersion: ENGINE_VERSION,
    ...runFigures(prepared, outcome),
    energyWh: {
      nominal: nominalPackWh,
      delivered: toWh(outcome.deliveredJ),
      drawn: toWh(outcome.chemicalJ),
    },
    airlineClass: figures.airlineClass,
    breakdownWh: energyBreakdownWh(outcome),
    clipPowerW: clip.clipPowerW,
    peakCurrentA: peaks.peakCurrentA,
    minPeakTerminalV: peaks.minPeakTerminalV,
    minPeakSupplyV: peaks.minPeakSupplyV,
    dropoutRisk: peaks.dropout !== null,
    dropout: peaks.dropout,
    ...(figures.splDb ? { splDb: figures.splDb } : {}),
    ...(figures.exposure ? { exposure: figures.exposure } : {}),
    converters: figures.converters,
    warnings,
    timeline,
    ...(figures.schedule ? { schedule: figures.schedule } : {}),
    speakerLeads: {
      resistanceOhm: prepared.speakerLeads.resistanceOhm,
      lossPct: prepared.speakerLeads.lossPct,
    },
    pack: packSummary(prepared, nominalPackWh),
    amplifier: amplifierSummary(prepared, outcome),
    speakers: speakerSummary(prepared, loudest),
    leads: {
      resistanceOhm: prepared.rig.leadOhm,
      dropPct: figures.leadDropPct,
      averageLossW: perSecond(outcome.leadLossJ, outcome.poweredS),
    },
    ...endFigures(prepared, outcome),
  }
}

/** The run's length, why it stopped, and the draw and loads it ran on. */
function runFigures(prepared: PreparedRig, outcome: RunOutcome) {
  return {
    runtimeHours: outcome.elapsedS / 3600,
    stopReason: outcome.stopReason,
    musicHours: outcome.musicS / 3600,
    averageDrawW: perSecond(outcome.deliveredJ, outcome.poweredS),
    loadOhm: prepared.speakerLoadOhm,
    leadResistanceOhm: prepared.rig.leadOhm,
  }
}

/** Where the energy went, in Wh. */
function energyBreakdownWh(outcome: RunOutcome): EstimateResult['breakdownWh'] {
  return {
    amplifierOutput: toWh(outcome.ampOutputJ),
    amplifierLoss: toWh(outcome.ampLossJ),
    accessories: toWh(outcome.accessoryJ),
    converterLoss: toWh(outcome.converterLossJ),
    leadLoss: toWh(outcome.leadLossJ),
    packLoss: toWh(outcome.packLossJ),
  }
}

/** The lead's drop as a share of the pack's terminal voltage: I·R / V (docs/model.md §2). */
function leadDropPct(
  prepared: PreparedRig,
  outcome: RunOutcome,
  peaks: PeakFigures,
): EstimateResult['leads']['dropPct'] {
  const leadOhm = prepared.rig.leadOhm
  const dropPct = (currentA: number, terminalV: number) =>
    terminalV > 0 ? (100 * currentA * leadOhm) / terminalV : 0
  // The average while the music is on, not over idle and off segments.
  const averageOnCurrentA = perSecond(outcome.onChargeAs, outcome.musicS)
  const averageOnTerminalV = perSecond(outcome.onTerminalVs, outcome.musicS)
  return {
    average: dropPct(averageOnCurrentA, averageOnTerminalV),
    peak: dropPct(peaks.peakCurrentA, peaks.minPeakTerminalV),
  }
}

/** The day against its schedule; none for an open-ended run. */
function scheduleFigures(prepared: PreparedRig, outcome: RunOutcome): EstimateResult['schedule'] {
  if (!prepared.resolved.schedule) return undefined
  const totalMinutes = prepared.segments.reduce((sum, segment) => sum + segment.durationS, 0) / 60
  const lasts = outcome.stopReason === 'schedule-end'
  return {
    lasts,
    packsUsed: outcome.packsUsed,
    swaps: outcome.swaps,
    totalMinutes,
    stoppedAtMinute: lasts ? null : outcome.elapsedS / 60,
    segments: segmentResults(prepared, outcome),
    endSocPct: outcome.endSoc * 100,
    sparePacks: prepared.resolved.pack.count - outcome.packsUsed,
  }
}

function packSummary(prepared: PreparedRig, nominalPackWh: number): EstimateResult['pack'] {
  const { pack } = prepared
  const { label, massKg, count } = prepared.resolved.pack
  return {
    ...(label === undefined ? {} : { label }),
    nominalV: pack.nominalV,
    fullV: pack.fullV,
    chargedV: pack.chargedV,
    cutoffV: pack.cutoffV,
    ratedCapacityAh: pack.ratedCapacityAh,
    capacityAh: pack.capacityAh,
    resistanceOhm: pack.resistanceOhm,
    nominalWh: nominalPackWh,
    count,
    ...(massKg === undefined ? {} : { massKg, whPerKg: nominalPackWh / massKg }),
  }
}

function amplifierSummary(prepared: PreparedRig, outcome: RunOutcome): EstimateResult['amplifier'] {
  const amplifier = prepared.rig.amplifier
  return {
    outputResistanceOhm: amplifier.outputResistanceOhm,
    lockoutV: amplifier.lockoutV,
    supplyMaxV: prepared.resolved.amplifier.supplyMaxV,
    averageOutputW: perSecond(outcome.ampOutputJ, outcome.musicS),
  }
}

/** Each driver's share of the loudest segment, after the speaker leads take theirs. */
function speakerSummary(
  prepared: PreparedRig,
  loudest: RunSegment | null,
): EstimateResult['speakers'] {
  const drivers = driversPerChannel(prepared.resolved.speakers)
  const perDriverW = (channelW: number) => (channelW * prepared.speakerLeads.speakerShare) / drivers
  return {
    loadOhm: prepared.speakerLoadOhm,
    driversPerChannel: drivers,
    powerPerDriverW: {
      average: loudest ? perDriverW(loudest.outputPerChannelW) : 0,
      peak: loudest ? perDriverW(loudest.peakPerChannelW) : 0,
    },
  }
}

/** Headroom, the average current, the deepest charge, each pack's turn and the defaults taken. */
function endFigures(prepared: PreparedRig, outcome: RunOutcome) {
  return {
    headroom: {
      // Nothing played: no headroom figure to give, 0 keeps the result finite.
      minimumDb: Number.isFinite(outcome.minimumHeadroomRatio)
        ? 10 * Math.log10(outcome.minimumHeadroomRatio)
        : 0,
      clipsFromMinute: outcome.clipsFromS === null ? null : outcome.clipsFromS / 60,
    },
    averageCurrentA: perSecond(outcome.poweredChargeAs, outcome.poweredS),
    lowestSocPct: outcome.lowestSoc * 100,
    packRuns: outcome.packRuns,
    assumed: prepared.assumed,
  }
}
