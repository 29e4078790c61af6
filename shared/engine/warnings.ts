// Warnings: stable kebab-case codes (screens and saved plans key on them), and messages that say
// what to change. Cautions defer to local codes and licensed practice where the work can hurt.
// The codes are in warning-catalogue.ts, the checks in warning-checks-*.ts, their words in
// warning-words.ts; this file runs the checks in the order the result lists them.
import type { ConverterResult, EstimateWarning, StopReason } from '../schemas/estimate'
import type { Chemistry } from './chemistry'
import type { DropoutOnset } from './dropout'
import {
  cannotDeliverWarnings,
  converterWarnings,
  dropoutWarnings,
  leadWarnings,
  loadWarnings,
  packCurrentWarnings,
  peaksClipWarnings,
  supplyRangeWarnings,
} from './warning-checks-electrical'
import {
  chargeTemperatureWarnings,
  datasheetWarnings,
  hearingWarnings,
  leadAcidDepthWarnings,
  runtimeLimitWarnings,
  safetyWarnings,
  scheduleShortWarnings,
  temperatureWarnings,
} from './warning-checks-use'

export { WARNING_CATALOGUE, warning } from './warning-catalogue'
export type { WarningCode } from './warning-catalogue'
export { LEAD_DROP_LIMIT_PCT, STRANDED_SOC_MINIMUM_PCT } from './warning-checks-electrical'
export { COLD_PACK_C, HOT_PACK_C, LEAD_ACID_DEEP_DISCHARGE_SOC } from './warning-checks-use'

/** Everything the warnings look at, already computed by the estimate. */
export interface WarningFacts {
  chemistry: Chemistry
  temperatureC: number
  capacityFactor: number
  loadOhm: number
  minLoadOhm: number
  /** Straight off the charger. */
  chargedPackV: number
  cutoffSupplyV: number
  supplyMaxV: number | null
  lockoutV: number | null
  stopReason: StopReason
  anyPackCannotDeliver: boolean
  lowestSocPct: number
  maxAverageCurrentA: number
  peakCurrentA: number
  maxDischargeA: number | null
  leadDropPct: { average: number; peak: number }
  /** The lead's cross-section; null without leads. */
  leadAreaMm2: number | null
  dropoutRisk: boolean
  dropout: DropoutOnset | null
  minPeakSupplyV: number
  clipsFromMinute: number | null
  converters: readonly ConverterResult[]
  averageSplDb: number | null
  childrenPresent: boolean
  permittedMinutes: number | null
  schedule: { lasts: boolean; stoppedAtMinute: number | null; totalMinutes: number } | null
  /**
   * The charging breaks (with power into the pack) at which the pack may not charge at this
   * temperature: how many, and the minute the first begins. Null when there are none.
   */
  refusedCharging: { breaks: number; firstAtMinute: number } | null
  outputResistanceClamped: boolean
  abEfficiencyGiven: boolean
  nominalWh: number
  airlineClass: string
}

/** One kind of check: the warnings it finds in the facts, none when all is well. */
type WarningCheck = (facts: WarningFacts) => EstimateWarning[]

// The order of the result: what stops the day first (and a charge the day cannot count on),
// then the dangers to the rig, then hearing,
// the pack's care, and the notes and cautions that hold for every rig of its kind.
const WARNING_CHECKS: readonly WarningCheck[] = [
  scheduleShortWarnings,
  chargeTemperatureWarnings,
  cannotDeliverWarnings,
  loadWarnings,
  supplyRangeWarnings,
  packCurrentWarnings,
  leadWarnings,
  dropoutWarnings,
  peaksClipWarnings,
  converterWarnings,
  hearingWarnings,
  leadAcidDepthWarnings,
  temperatureWarnings,
  runtimeLimitWarnings,
  datasheetWarnings,
  safetyWarnings,
]

export function collectWarnings(facts: WarningFacts): EstimateWarning[] {
  return WARNING_CHECKS.flatMap((check) => check(facts))
}
