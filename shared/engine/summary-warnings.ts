// The warnings of a result: the facts the checks read, taken from the run and its figures, and
// the reserve at the end of the day after them.
import type { EstimateWarning } from '../schemas/estimate'
import { chargingPermitted } from './charging'
import { capacityTemperatureFactor } from './chemistry'
import type { PreparedRig } from './estimate'
import { reserveShortfall, reserveWarning } from './reserve'
import type { RunOutcome } from './run'
import type { SummaryFigures } from './summarise'
import type { WarningFacts } from './warnings'
import { collectWarnings } from './warnings'

export function resultWarnings(
  prepared: PreparedRig,
  outcome: RunOutcome,
  figures: SummaryFigures,
): EstimateWarning[] {
  const warnings = collectWarnings(warningFacts(prepared, outcome, figures))
  const reserve = reserveShortfall(prepared, outcome)
  if (reserve) warnings.push(reserveWarning(reserve))
  return warnings
}

function warningFacts(
  prepared: PreparedRig,
  outcome: RunOutcome,
  figures: SummaryFigures,
): WarningFacts {
  const { resolved, pack } = prepared
  const amplifier = prepared.rig.amplifier
  const { peaks, schedule, splDb, exposure } = figures
  return {
    chemistry: pack.chemistry,
    temperatureC: resolved.temperatureC,
    capacityFactor: capacityTemperatureFactor(pack.chemistry, resolved.temperatureC),
    loadOhm: prepared.speakerLoadOhm,
    minLoadOhm: resolved.amplifier.minLoadOhm,
    chargedPackV: pack.chargedV,
    cutoffSupplyV: figures.clip.cutoffSupplyV,
    supplyMaxV: resolved.amplifier.supplyMaxV,
    lockoutV: amplifier.lockoutV,
    stopReason: outcome.stopReason,
    anyPackCannotDeliver: outcome.packRuns.some((run) => run.endReason === 'cannot-deliver'),
    lowestSocPct: outcome.lowestSoc * 100,
    maxAverageCurrentA: outcome.maxCurrentA,
    peakCurrentA: peaks.peakCurrentA,
    maxDischargeA: resolved.pack.maxDischargeA,
    leadDropPct: figures.leadDropPct,
    leadAreaMm2: resolved.leads ? resolved.leads.areaMm2 : null,
    dropoutRisk: peaks.dropout !== null,
    dropout: peaks.dropout,
    minPeakSupplyV: peaks.minPeakSupplyV,
    clipsFromMinute: outcome.clipsFromS === null ? null : outcome.clipsFromS / 60,
    converters: figures.converters,
    averageSplDb: splDb ? splDb.average : null,
    childrenPresent: resolved.childrenPresent,
    permittedMinutes: exposure ? exposure.permittedMinutes : null,
    schedule: schedule
      ? {
          lasts: schedule.lasts,
          stoppedAtMinute: schedule.stoppedAtMinute,
          totalMinutes: schedule.totalMinutes,
        }
      : null,
    refusedCharging: refusedCharging(prepared),
    outputResistanceClamped: prepared.outputResistanceClamped,
    abEfficiencyGiven: amplifier.ampClass === 'ab' && resolved.amplifier.efficiencyGiven,
    nominalWh: figures.nominalPackWh,
    airlineClass: figures.airlineClass,
  }
}

/**
 * The charging breaks with power into the pack at which it may not charge at the day's
 * temperature (prepareRig gives them no power): how many, and where the first begins.
 */
function refusedCharging(prepared: PreparedRig): WarningFacts['refusedCharging'] {
  const { resolved } = prepared
  if (chargingPermitted(prepared.pack.chemistry, resolved.temperatureC)) return null
  let breaks = 0
  let firstAtMinute = 0
  let startMinute = 0
  for (const segment of resolved.schedule ?? []) {
    if (segment.state === 'charging' && segment.chargeW > 0) {
      if (breaks === 0) firstAtMinute = startMinute
      breaks++
    }
    startMinute += segment.minutes
  }
  return breaks === 0 ? null : { breaks, firstAtMinute }
}
