// One rig and plan against many packs, one row per pack (for the pack comparison screen).
import type {
  AirlineClass,
  ConverterVerdict,
  EstimateRequest,
  PackSpec,
  StopReason,
} from '../schemas/estimate'
import { prepareRig, runPrepared, summarise } from './estimate'
import type { RunOutcome } from './run'

/** Most packs the "packs needed" search will try (the schema's limit on packs on hand). */
export const MAX_PACKS_SEARCHED = 50

export interface PackComparisonRow {
  index: number
  label: string | null
  runtimeHours: number
  stopReason: StopReason
  /** With a schedule: whether the packs on hand last it; null without a schedule. */
  lasts: boolean | null
  /** With a schedule: packs needed to last it, null when more than 50 would not do (or no schedule). */
  packsNeeded: number | null
  /** Hours of music one full charge gives (extrapolated from the charge used if the plan ended first). */
  musicHoursPerCharge: number
  nominalWh: number
  massKg: number | null
  whPerKg: number | null
  price: number | null
  /** Price over the hours of music one charge gives. */
  costPerMusicHour: number | null
  clipPowerFullW: number
  clipPowerCutoffW: number
  /** The least headroom of the programme's peaks below clipping over the run (negative: clips). */
  headroomMinimumDb: number
  converterNeeds: { label: string; verdict: ConverterVerdict; fits: boolean; advice: string }[]
  /** Accessories that cannot be wired straight to this pack. */
  convertersNeeded: number
  airlineClass: AirlineClass
  peakCurrentA: number
  maxDischargeA: number | null
  peakOverRating: boolean | null
  dropoutRisk: boolean
  warningCodes: string[]
}

/** Packs needed to last the schedule: null without a schedule or when 50 would not do. */
export function packsNeededForSchedule(request: EstimateRequest): number | null {
  if (!request.schedule) return null
  return packsNeeded(runPrepared(prepareRig(request), MAX_PACKS_SEARCHED, false))
}

function packsNeeded(longRun: RunOutcome): number | null {
  return longRun.stopReason === 'schedule-end' ? longRun.packsUsed : null
}

/**
 * The estimate with the pack's own count and, with a schedule, the packs needed, from one run
 * where it can: with packs swapped as each stops, the run with `count` packs is a prefix of the
 * run with 50 (a second run only when a planned break swap breaks that).
 */
function estimateWithPacksNeeded(request: EstimateRequest) {
  const prepared = prepareRig(request)
  const count = prepared.resolved.pack.count
  if (prepared.openEnded) {
    return { result: summarise(prepared, runPrepared(prepared, count, false)), packsNeeded: null }
  }
  const longRun = runPrepared(prepared, MAX_PACKS_SEARCHED, false, count)
  const ownRun =
    longRun.packsUsed <= count ? longRun : (longRun.prefix ?? runPrepared(prepared, count, false))
  return { result: summarise(prepared, ownRun), packsNeeded: packsNeeded(longRun) }
}

export function comparePacks(
  request: EstimateRequest,
  packs: readonly PackSpec[],
): PackComparisonRow[] {
  return packs.map((pack, index) => {
    const { result, packsNeeded } = estimateWithPacksNeeded({ ...request, pack })
    const lasts = result.schedule ? result.schedule.lasts : null
    const first = result.packRuns[0]
    const ranOut =
      first !== undefined && first.endReason !== 'schedule-end' && first.endReason !== 'swapped'
    const chargeUsed = first ? 1 - first.lowestSocPct / 100 : 0
    const musicHoursPerCharge = !first
      ? 0
      : ranOut
        ? first.musicMinutes / 60
        : chargeUsed > 0
          ? first.musicMinutes / 60 / chargeUsed
          : 0
    const massKg = pack.massKg ?? null
    const price = pack.price ?? null
    const maxDischargeA = pack.maxDischargeA ?? null
    return {
      index,
      label: pack.label ?? null,
      runtimeHours: result.runtimeHours,
      stopReason: result.stopReason,
      lasts,
      packsNeeded,
      musicHoursPerCharge,
      nominalWh: result.pack.nominalWh,
      massKg,
      whPerKg: massKg === null ? null : result.pack.nominalWh / massKg,
      price,
      costPerMusicHour:
        price === null || musicHoursPerCharge <= 0 ? null : price / musicHoursPerCharge,
      clipPowerFullW: result.clipPowerW.full,
      clipPowerCutoffW: result.clipPowerW.cutoff,
      headroomMinimumDb: result.headroom.minimumDb,
      converterNeeds: result.converters.map(({ label, verdict, fits, advice }) => ({
        label,
        verdict,
        fits,
        advice,
      })),
      convertersNeeded: result.converters.filter((converter) => converter.verdict !== 'direct-ok')
        .length,
      airlineClass: result.airlineClass,
      peakCurrentA: result.peakCurrentA,
      maxDischargeA,
      peakOverRating: maxDischargeA === null ? null : result.peakCurrentA > maxDischargeA,
      dropoutRisk: result.dropoutRisk,
      warningCodes: result.warnings.map((warning) => warning.code),
    }
  })
}
