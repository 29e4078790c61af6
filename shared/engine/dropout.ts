import type { TimelinePoint } from '../schemas/estimate'
import { awgToAreaMm2 } from '../units'
import type { RigLoads } from './run'
import { peakDemand } from './peaks'

/**
 * When bass peaks start to mute a part. A sustained peak pulls the supply at the amplifier down
 * through the pack's and the lead's resistance; the pack's open-circuit voltage falls with its
 * charge, so below some charge every such peak takes the supply under a part's floor (the
 * amplifier's lock-out, or the minimum input of an accessory fed directly from the same lead) and
 * the music cuts out although the average draw still runs. The charge at which it starts says
 * whether that is the last minutes of a pack (swap a little early) or most of the day (change the
 * rig), and the fixes say by how much.
 */
export interface DropoutOnset {
  /** Peaks cut out whenever the pack in use is below this state of charge. */
  belowSocPct: number
  /** First minute of the run at which that happens while playing, when the timeline was kept. */
  fromMinute: number | null
  /** 'amplifier' or the accessory's label. */
  part: string
  floorV: number
  fix: DropoutFix
}

export interface DropoutFix {
  /** The thinnest lead of the same length that clears it (null: none does, or no lead given). */
  lead: { awg: number; areaMm2: number; lengthM: number } | null
  /** Whole dB quieter that clears it (null: not within 60 dB). */
  quieterDb: number | null
  /** Cells in parallel that clear it (null: not within the schema's 100). */
  parallelCells: number | null
}

/** A part that mutes when the supply at the amplifier end of the lead falls below its floor. */
export interface SupplyFloor {
  part: string
  floorV: number
}

/** What the fixes may vary: the lead's length and build, and the pack's parallel cells. */
export interface FixContext {
  lead: {
    lengthM: number
    areaMm2: number
    resistanceForAreaOhm: (areaMm2: number) => number
  } | null
  parallelCells: number
}

// Bisection to 0.01 % of charge: far finer than the OCV tables themselves.
const bisectionSteps = 14
// ours: peaks that mute only in a pack's last 15 % are a reason to swap early, not to change the
// rig, so the fixes aim to keep peaks up to there (or to the lowest charge the run reaches)
export const DROPOUT_NEAR_EMPTY_SOC_PCT = 15
// ours: onsets in the last 2 % of a pack are within the OCV tables' own error: no risk reported
export const DROPOUT_NEGLIGIBLE_SOC_PCT = 2
const MAX_QUIETER_DB = 60 // the schema's ceiling for the level
const MAX_PARALLEL_CELLS = 100 // the schema's ceiling
// AWG from 30 (thin hook-up wire) to 4/0 (-3), the sizes the lead field accepts in practice
const THINNEST_AWG = 30
const THICKEST_AWG = -3

function peaksHold(rig: RigLoads, burstW: number, floorV: number, socFraction: number): boolean {
  const peak = peakDemand(rig, burstW, socFraction)
  return peak.delivered && peak.supplyV >= floorV
}

/** The charge (fraction) below which peaks fail, given that they fail at `failingSoc`. */
function onsetFraction(rig: RigLoads, burstW: number, floorV: number, failingSoc: number): number {
  if (!peaksHold(rig, burstW, floorV, 1)) return 1
  // Invariant: peaks fail at `failing` and hold at `holding`; the OCV rises with charge.
  let failing = failingSoc
  let holding = 1
  for (let step = 0; step < bisectionSteps; step++) {
    const middle = (failing + holding) / 2
    if (peaksHold(rig, burstW, floorV, middle)) holding = middle
    else failing = middle
  }
  return holding
}

function dropoutFix(
  rig: RigLoads,
  burstW: number,
  floorV: number,
  targetSoc: number,
  context: FixContext,
): DropoutFix {
  const holds = (changed: RigLoads, watts = burstW) => peaksHold(changed, watts, floorV, targetSoc)
  let lead: DropoutFix['lead'] = null
  if (context.lead) {
    const given = context.lead
    for (let awg = THINNEST_AWG; awg >= THICKEST_AWG && lead === null; awg--) {
      const areaMm2 = awgToAreaMm2(awg)
      if (areaMm2 <= given.areaMm2) continue
      if (holds({ ...rig, leadOhm: given.resistanceForAreaOhm(areaMm2) })) {
        lead = { awg, areaMm2, lengthM: given.lengthM }
      }
    }
  }
  let quieterDb: number | null = null
  for (let db = 1; db <= MAX_QUIETER_DB && quieterDb === null; db++) {
    if (holds(rig, burstW * 10 ** (-db / 10))) quieterDb = db
  }
  let parallelCells: number | null = null
  const p = context.parallelCells
  for (let more = p + 1; more <= MAX_PARALLEL_CELLS && parallelCells === null; more++) {
    const pack = { ...rig.pack, resistanceOhm: (rig.pack.resistanceOhm * p) / more }
    if (holds({ ...rig, pack })) parallelCells = more
  }
  return { lead, quieterDb, parallelCells }
}

/**
 * The first part to mute on bass peaks over the run, or null when peaks hold for every part down
 * to the lowest charge reached (or fail only in the pack's negligible last few percent).
 */
export function dropoutOnset(
  rig: RigLoads,
  burstPerChannelW: number,
  floors: readonly SupplyFloor[],
  lowestSocFraction: number,
  timeline: readonly TimelinePoint[],
  context: FixContext,
): DropoutOnset | null {
  if (burstPerChannelW <= 0) return null
  let first: { floor: SupplyFloor; fraction: number } | null = null
  for (const floor of floors) {
    if (peaksHold(rig, burstPerChannelW, floor.floorV, lowestSocFraction)) continue
    const fraction = onsetFraction(rig, burstPerChannelW, floor.floorV, lowestSocFraction)
    if (!first || fraction > first.fraction) first = { floor, fraction }
  }
  if (!first || first.fraction * 100 < DROPOUT_NEGLIGIBLE_SOC_PCT) return null
  const belowSocPct = first.fraction * 100
  const point = timeline.find((entry) => entry.state === 'on' && entry.socPct < belowSocPct)
  // A dropout over much of the pack is fixed when it is pushed into the last 15 %; one already
  // there is fixed when it is gone (under 2 %, no risk).
  const targetPct =
    belowSocPct < DROPOUT_NEAR_EMPTY_SOC_PCT
      ? DROPOUT_NEGLIGIBLE_SOC_PCT
      : DROPOUT_NEAR_EMPTY_SOC_PCT
  const targetSoc = Math.max(lowestSocFraction, targetPct / 100)
  // The fix must clear every part, so aim at the highest floor.
  const floorV = Math.max(...floors.map((floor) => floor.floorV))
  return {
    belowSocPct,
    fromMinute: point ? point.minute : null,
    part: first.floor.part,
    floorV: first.floor.floorV,
    fix: dropoutFix(rig, burstPerChannelW, floorV, targetSoc, context),
  }
}
