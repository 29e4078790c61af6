// The words of the warnings: figures, wire sizes, stop reasons and the dropout message with its
// fixes in numbers (docs/model.md §10: the part, the charge from which it happens, the fix).
import type { StopReason } from '../schemas/estimate'
import { areaMm2ToAwg } from '../units'
import type { DropoutOnset } from './dropout'
import { DROPOUT_NEAR_EMPTY_SOC_PCT } from './dropout'
import { runMomentPhrase } from './moment'
import type { WarningCode } from './warning-catalogue'

export const fixed = (value: number, digits = 1) => value.toFixed(digits)

/**
 * A cross-section in both systems, "1.5 mm² (15 AWG)": the nearest gauge, or for a size to fit at
 * least, the next thicker one (a lower number).
 */
export function wireSize(areaMm2: number, atLeast = false): string {
  const area = areaMm2 < 1 ? areaMm2.toFixed(2) : fixed(areaMm2)
  const awg = areaMm2ToAwg(areaMm2)
  return `${area} mm² (${atLeast ? Math.floor(awg + 1e-6) : Math.round(awg)} AWG)`
}

export function stopInWords(reason: StopReason): string {
  switch (reason) {
    case 'pack-cutoff':
      return 'the last pack reaches its cutoff voltage'
    case 'cannot-deliver':
      return 'the pack cannot deliver the power'
    case 'amp-lockout':
      return 'the amplifier mutes at its lock-out voltage'
    case 'pack-empty':
      return 'the last pack is empty'
    case 'schedule-end':
      return 'the schedule ends'
    case 'time-limit':
      return 'the 7-day limit is reached'
  }
}

/** Who mutes, in words. */
function partInWords(part: string): string {
  return part === 'amplifier' ? 'the amplifier' : `"${part}"`
}

function floorInWords(onset: DropoutOnset): string {
  // No lock-out given: the floor is the pack's own limit, the most power it can deliver.
  if (onset.floorV <= 0) return 'what the pack can deliver'
  return onset.part === 'amplifier'
    ? `its ${fixed(onset.floorV)} V lock-out`
    : `its ${fixed(onset.floorV)} V minimum input`
}

/** The fixes in numbers, as one clause: "fit a lead of …, play 3 dB quieter, or …". */
function dropoutFixes(onset: DropoutOnset): string {
  const fixes: string[] = []
  const { lead, quieterDb, parallelCells } = onset.fix
  if (lead) {
    fixes.push(`fit a lead of at least ${wireSize(lead.areaMm2, true)} at ${fixed(lead.lengthM)} m`)
  }
  if (quieterDb !== null) fixes.push(`lower the level by ${quieterDb} dB`)
  if (parallelCells !== null) fixes.push(`use a pack with ${parallelCells} cells in parallel`)
  if (fixes.length === 0)
    return 'change the rig: a higher-voltage pack or a part with a lower floor'
  if (fixes.length === 1) return fixes[0]!
  return `${fixes.slice(0, -1).join(', ')}, or ${fixes[fixes.length - 1]}`
}

/** The part that mutes on bass peaks, from what charge, and the fix in numbers. */
export function dropoutWarning(onset: DropoutOnset, minPeakSupplyV: number): [WarningCode, string] {
  const when = onset.fromMinute !== null ? ` (${runMomentPhrase(onset.fromMinute)})` : ''
  const who = partInWords(onset.part)
  const charge = Math.round(onset.belowSocPct)
  if (onset.belowSocPct < DROPOUT_NEAR_EMPTY_SOC_PCT) {
    return [
      'dropout-near-empty',
      `Once a pack is below about ${charge} % charge${when}, bass peaks pull the supply under ${floorInWords(onset)} and ${who} may cut out: swap packs a little before then, or ${dropoutFixes(onset)}.`,
    ]
  }
  const from =
    onset.belowSocPct >= 100
      ? ' even from a full pack'
      : ` once a pack is below about ${charge} % charge${when}`
  return [
    'dropout-risk',
    `On bass peaks the supply at the amplifier falls to ${fixed(minPeakSupplyV)} V, under ${floorInWords(onset)}${from}, so ${who} cuts out and the music stops: ${dropoutFixes(onset)}.`,
  ]
}
