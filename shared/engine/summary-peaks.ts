// Bass peaks over the whole run: the peak current, the lowest voltages after the lead and the
// first part to mute (docs/model.md §10, peak supply current and dropout).
import type { EstimateResult } from '../schemas/estimate'
import type { DropoutOnset, SupplyFloor } from './dropout'
import { dropoutOnset } from './dropout'
import type { PreparedRig } from './estimate'
import { leadResistanceOhm } from './leads'
import { socAtOpenCircuitV } from './pack'
import { peakEnvelope } from './peaks'
import type { ResolvedRequest } from './resolve'
import type { RunOutcome, RunSegment } from './run'

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

export interface PeakFigures {
  peakCurrentA: number
  minPeakTerminalV: number
  minPeakSupplyV: number
  /** The first part to mute on bass peaks; null when none does. */
  dropout: DropoutOnset | null
}

/** Peak current and voltages over the whole run, and the first part to mute. */
export function peakFigures(
  prepared: PreparedRig,
  outcome: RunOutcome,
  timeline: EstimateResult['timeline'],
): PeakFigures {
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
