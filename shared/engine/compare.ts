// One rig and plan against many packs, one row per pack (for the pack comparison screen).
import type {
  AirlineClass,
  ConverterVerdict,
  EstimateRequest,
  EstimateResult,
  PackSpec,
  StopReason,
} from '../schemas/estimate'
import type { CompareRequest, CompareRow } from '../schemas/compare'
import { CHEMISTRY_DATA } from './chemistry'
import { prepareRig, runPrepared, summarise } from './estimate'
import { resolveRequest } from './resolve'
import type { RunOutcome } from './run'

/** Most packs the "packs needed" search will try (the schema's limit on packs on hand). */
export const MAX_PACKS_SEARCHED = 50

/** Why a pack cannot go in the rig, in the warnings' own shape. */
export interface FitProblem {
  code: string
  message: string
}

export interface PackComparisonRow {
  index: number
  label: string | null
  /** False when the pack would harm a part, starve one, or cannot carry the rig (see fitProblems). */
  fits: boolean
  problems: FitProblem[]
  runtimeHours: number
  stopReason: StopReason
  /** With a schedule: whether the packs on hand last it; null without a schedule. */
  lasts: boolean | null
  /** With a schedule: packs needed to last it, null when more than 50 would not do (or no schedule). */
  packsNeeded: number | null
  /** Hours of music one full charge gives (extrapolated from the charge used if the plan ended first). */
  musicHoursPerCharge: number
  nominalWh: number
  /** Energy out of the packs over the run (all packs used). */
  deliveredWh: number
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

/**
 * Whether a pack's voltage window (full off the charger down to its cutoff) sits inside what the
 * rig's amplifier and its directly fed parts take: the candidates a comparison starts from. A
 * quick screen on the figures given; the full answer is the row's `fits`.
 */
export function packWindowSuits(request: EstimateRequest, pack: PackSpec): boolean {
  const chemistry = CHEMISTRY_DATA[pack.chemistry]
  // Common practice: a pack is full at the chemistry's charge voltage per cell.
  const fullV = pack.seriesCells * chemistry.fullCellV
  const cutoffV = pack.seriesCells * (pack.cutoffCellV ?? chemistry.cutoffCellV)
  const { amplifier } = resolveRequest(request).resolved
  if (amplifier.supplyMaxV !== null && fullV > amplifier.supplyMaxV) return false
  if (amplifier.lockoutV !== null && cutoffV < amplifier.lockoutV) return false
  return (request.accessories ?? []).every(
    (part) => part.feed !== 'direct' || (fullV <= part.inputMaxV && cutoffV >= part.inputMinV),
  )
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

// ours: a rig that stops within its first minute of music on a fresh pack cannot run on it at all.
const STOPS_AT_ONCE_MINUTES = 1

// Dangers that are not about the pack and the rig's parts: a day too long for the packs on hand
// is the `lasts` column, and a level over a hearing limit is the rig's level, fixed by playing
// quieter on any pack. Every other danger, including ones added later, makes a pack not fit.
// Dangers about the day, not about a pack harming the rig's parts: a day that falls short is the
// "lasts" column, and a charging break refused for the temperature already counts no charge in
// that column's figures (the plan page says why).
const NOT_ABOUT_FIT = new Set([
  'schedule-short',
  'hearing-over-venue-limit',
  'charge-temperature-out-of-range',
])

const stopsAtOnceText: Partial<Record<StopReason, string>> = {
  'amp-lockout':
    "the amplifier's lock-out is above what this pack gives under the rig's load: use a pack with more cells in series",
  'pack-cutoff':
    "the pack falls to its cutoff under the rig's load at once: use a pack with more cells in series or in parallel",
}

/**
 * Why a pack does not fit the rig (docs/estimate-api.md, "Comparing packs"); empty when it fits.
 * A pack does not fit when the estimate with it carries a danger about the rig's parts (a part
 * over its maximum, a current over a rating, music cutting out on peaks, …), when a part's feed
 * does not suit the pack's window (over its maximum or under its minimum at some point of the
 * run; a direct feed fits only a `direct-ok` verdict, so `over-max` on a direct feed is one
 * case, while a part behind a converter that suits the window never sees the pack), when the
 * pack cannot deliver the rig's power, or when the rig stops within its first minute of music.
 * Each problem is the estimate's own warning where there is one.
 */
export function fitProblems(result: EstimateResult): FitProblem[] {
  const problems: FitProblem[] = []
  const add = (problem: FitProblem) => {
    if (!problems.some((kept) => kept.code === problem.code && kept.message === problem.message))
      problems.push({ code: problem.code, message: problem.message })
  }
  for (const warning of result.warnings) {
    if (warning.severity === 'danger' && !NOT_ABOUT_FIT.has(warning.code)) add(warning)
  }
  for (const converter of result.converters) {
    if (converter.fits) continue
    const named = result.warnings.find((warning) =>
      warning.message.includes(`"${converter.label}"`),
    )
    add(
      named ?? {
        code: converter.feed === 'direct' ? 'accessory-out-of-range' : 'converter-mismatch',
        message: `"${converter.label}": ${converter.advice}`,
      },
    )
  }
  if (
    result.stopReason === 'cannot-deliver' &&
    !problems.some((p) => p.code === 'cannot-deliver')
  ) {
    add({
      code: 'cannot-deliver',
      message:
        "This pack cannot deliver the rig's power: its voltage would collapse under the load. Use a pack with more cells in parallel, or play quieter.",
    })
  }
  const stopsAtOnce = stopsAtOnceText[result.stopReason]
  if (stopsAtOnce && result.musicHours * 60 < STOPS_AT_ONCE_MINUTES) {
    add({
      code: 'stops-at-once',
      message: `The rig stops within its first minute of music on this pack: ${stopsAtOnce}.`,
    })
  }
  return problems
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
    const problems = fitProblems(result)
    return {
      index,
      label: pack.label ?? null,
      fits: problems.length === 0,
      problems,
      runtimeHours: result.runtimeHours,
      stopReason: result.stopReason,
      lasts,
      packsNeeded,
      musicHoursPerCharge,
      nominalWh: result.pack.nominalWh,
      deliveredWh: result.energyWh.delivered,
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

/** `POST /api/v1/compare` (docs/estimate-api.md): the rows of comparePacks in the contract's shape. */
export function compareForApi(body: CompareRequest): { rows: CompareRow[] } {
  return {
    rows: comparePacks(body.rig, body.packs).map((row) => ({
      fits: row.fits,
      problems: row.problems,
      runtimeHours: row.runtimeHours,
      ...(row.lasts === null ? {} : { lasts: row.lasts }),
      energyWh: { nominal: row.nominalWh, delivered: row.deliveredWh },
      ...(row.whPerKg === null ? {} : { whPerKg: row.whPerKg }),
      ...(row.costPerMusicHour === null ? {} : { costPerHour: row.costPerMusicHour }),
      minimumHeadroomDb: row.headroomMinimumDb,
      airlineClass: row.airlineClass,
      converterNeeds: row.converterNeeds,
    })),
  }
}
