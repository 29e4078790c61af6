// The amplifier's clip power at full charge and at the end of the discharge, under the
// programme's load, and the supply it sees at the pack's cutoff (docs/model.md §4).
import type { EstimateResult } from '../schemas/estimate'
import type { PreparedRig } from './estimate'
import { packOpenCircuitV } from './pack'
import type { RunOutcome } from './run'
import { emptyOperatingPoint, solveOperatingPoint } from './run'

export interface ClipFigures {
  clipPowerW: EstimateResult['clipPowerW']
  /** The supply after the lead with the pack's terminals at its cutoff voltage. */
  cutoffSupplyV: number
  /** The lowest supply the amplifier plays on: that at cutoff, or its lock-out if higher. */
  endSupplyV: number
}

export function clipFigures(prepared: PreparedRig, outcome: RunOutcome): ClipFigures {
  const { pack } = prepared
  const { clipPowerPerV2, lockoutV } = prepared.rig.amplifier
  const clipAtW = (supplyV: number) => clipPowerPerV2 * supplyV * supplyV
  const fullOpenCircuitV = packOpenCircuitV(pack, 1)
  const fullSupplyV = settledSupplyV(prepared, fullOpenCircuitV, pack.resistanceOhm)
  // At cutoff the pack terminals sit at the cutoff voltage; only the lead drops further.
  const cutoffSupplyV = settledSupplyV(prepared, pack.cutoffV, 0) ?? pack.cutoffV / 2
  const endSupplyV = Math.max(cutoffSupplyV, lockoutV ?? 0)
  const fullClipW = clipAtW(fullSupplyV ?? fullOpenCircuitV / 2)
  // The end of the discharge as the run reached it (a lead-acid run may stop on an empty pack
  // above its cutoff voltage): the lowest supply while playing, where anything played.
  const reachedEndSupplyV = Number.isFinite(outcome.lowestPlayingSupplyV)
    ? Math.max(outcome.lowestPlayingSupplyV, lockoutV ?? 0)
    : endSupplyV
  return {
    clipPowerW: { full: fullClipW, cutoff: Math.min(clipAtW(reachedEndSupplyV), fullClipW) },
    cutoffSupplyV,
    endSupplyV,
  }
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
