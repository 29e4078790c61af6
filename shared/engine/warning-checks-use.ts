// The warnings about the rig in use: the schedule, hearing, the pack's charge and temperature,
// the limits of the run, datasheet figures the engine reads its own way, and handling and travel.
// Each check reads the facts and gives its warnings, in the order a reader should meet them.
import { durationWords } from '../card/format'
import type { EstimateWarning } from '../schemas/estimate'
import { CHEMISTRY_DATA } from './chemistry'
import { runMomentPhrase } from './moment'
import { CHILDREN_CAUTION_DB, NIOSH_REL_DBA, WHO_VENUE_LAEQ_DB } from './sound'
import { warning } from './warning-catalogue'
import { fixed, stopInWords } from './warning-words'
import type { WarningFacts } from './warnings'

export const LEAD_ACID_DEEP_DISCHARGE_SOC = 0.5 // common practice: below 50 % shortens AGM life
export const COLD_PACK_C = 5 // ours: where the cold costs enough capacity to mention
export const HOT_PACK_C = 45 // common practice: lithium makers' upper discharge range starts near here

/** A schedule the packs on hand do not last, with when and why the rig stops. */
export function scheduleShortWarnings(facts: WarningFacts): EstimateWarning[] {
  const schedule = facts.schedule
  if (!schedule || schedule.lasts || schedule.stoppedAtMinute === null) return []
  const stoppedAtMinute = schedule.stoppedAtMinute
  const shortByMinutes = schedule.totalMinutes - stoppedAtMinute
  return [
    warning(
      'schedule-short',
      `The rig stops ${runMomentPhrase(stoppedAtMinute)}, ${durationWords(shortByMinutes)} before the schedule ends, because ${stopInWords(facts.stopReason)}: bring more charged packs, lower the level, or use a larger pack.`,
      stoppedAtMinute,
    ),
  ]
}

/**
 * Charging breaks at a temperature outside the pack's charge range (chemistry.ts,
 * chargeTemperatureC): the run gives the pack nothing there, so the figures count no charge from
 * them; the message says why and what to change instead.
 */
export function chargeTemperatureWarnings(facts: WarningFacts): EstimateWarning[] {
  const refused = facts.refusedCharging
  const range = CHEMISTRY_DATA[facts.chemistry].chargeTemperatureC
  if (!refused || !range) return []
  const temperatureC = fixed(facts.temperatureC, 0)
  const breaks =
    refused.breaks === 1
      ? `The charging break ${runMomentPhrase(refused.firstAtMinute)} gives`
      : `The ${refused.breaks} charging breaks (the first ${runMomentPhrase(refused.firstAtMinute)}) give`
  const fix =
    facts.temperatureC < range.minC
      ? `Charge the pack indoors or warm it to above ${range.minC} °C before it goes on the charger`
      : `Let the pack cool in the shade to below ${range.maxC} °C before it goes on the charger`
  return [
    warning(
      'charge-temperature-out-of-range',
      `At ${temperatureC} °C the pack must not be charged: ${CHEMISTRY_DATA[facts.chemistry].label} packs charge only between ${range.minC} and ${range.maxC} °C. ${breaks} it no charge, and the figures here count none. ${fix}, or bring a charged pack instead.`,
      refused.firstAtMinute,
    ),
  ]
}

/** The level at the listener against NIOSH's REL and the WHO venue figure (docs/model.md §8). */
export function hearingWarnings(facts: WarningFacts): EstimateWarning[] {
  const splDb = facts.averageSplDb
  if (splDb === null) return []
  const found: EstimateWarning[] = []
  const levelDb = Math.round(splDb)
  const permitted =
    facts.permittedMinutes === null
      ? ''
      : ` (NIOSH permits about ${Math.round(facts.permittedMinutes)} minutes a day)`
  if (splDb > WHO_VENUE_LAEQ_DB) {
    found.push(
      warning(
        'hearing-over-venue-limit',
        `The estimated level at the listener is ${levelDb} dB, above the WHO venue figure of 100 dB LAeq over 15 minutes${permitted}: lower the level or move the audience back. Follow local rules.`,
      ),
    )
  } else if (splDb > NIOSH_REL_DBA) {
    found.push(
      warning(
        'hearing-caution',
        `The estimated level at the listener is ${levelDb} dB, above 85 dBA${permitted}: lower the level, keep people back from the speakers, or offer hearing protection. Follow local rules.`,
      ),
    )
  }
  if (facts.childrenPresent && splDb > CHILDREN_CAUTION_DB) {
    found.push(
      warning(
        'children-present',
        `Children are present: the estimated ${levelDb} dB is above the stricter ${CHILDREN_CAUTION_DB} dB aimed at for them. Lower the level, keep children well back from the speakers, and follow local rules.`,
      ),
    )
  }
  // docs/model.md §8: free-field estimates; the screen asks for a meter reading on the day.
  found.push(
    warning(
      'sound-level-estimate',
      'Sound levels are free-field estimates for a steady programme: measure with a sound level meter on the day.',
    ),
  )
  return found
}

export function leadAcidDepthWarnings(facts: WarningFacts): EstimateWarning[] {
  const deepPct = LEAD_ACID_DEEP_DISCHARGE_SOC * 100
  if (facts.chemistry !== 'lead-acid' || !(facts.lowestSocPct < deepPct)) return []
  return [
    warning(
      'lead-acid-deep-discharge',
      `The lead-acid pack is drawn down to ${Math.round(facts.lowestSocPct)} %: bring another battery or a larger one to stay above 50 %, which keeps it healthy for longer.`,
    ),
  ]
}

export function temperatureWarnings(facts: WarningFacts): EstimateWarning[] {
  const temperatureC = fixed(facts.temperatureC, 0)
  if (facts.temperatureC < COLD_PACK_C) {
    const charge = CHEMISTRY_DATA[facts.chemistry].isLithium
      ? ' Never charge lithium packs below 0 °C.'
      : ''
    return [
      warning(
        'cold-pack',
        `At ${temperatureC} °C the pack gives about ${Math.round(facts.capacityFactor * 100)} % of its capacity and sags more: keep packs warm until use, or bring more.${charge}`,
      ),
    ]
  }
  if (facts.temperatureC > HOT_PACK_C) {
    return [
      warning(
        'hot-pack',
        `At ${temperatureC} °C packs age fast and lithium packs get nearer their limits: keep them in the shade and out of closed cars.`,
      ),
    ]
  }
  return []
}

export function runtimeLimitWarnings(facts: WarningFacts): EstimateWarning[] {
  if (facts.stopReason !== 'time-limit') return []
  return [
    warning(
      'runtime-limit',
      'The rig runs for more than 7 days on these packs; the run stops there. Add a schedule for a real plan.',
    ),
  ]
}

/** Datasheet figures the engine reads its own way (docs/model.md §4, §10 Ratings). */
export function datasheetWarnings(facts: WarningFacts): EstimateWarning[] {
  const found: EstimateWarning[] = []
  if (facts.outputResistanceClamped) {
    found.push(
      warning(
        'rated-power-above-ideal',
        "The amplifier's rated power is more than its rated supply can swing into the rated load: check the datasheet figures (it may be a 10 % THD rating; set ratedThdPct).",
      ),
    )
  }
  if (facts.abEfficiencyGiven) {
    found.push(
      warning(
        'efficiency-not-used',
        'Class AB efficiency follows from the supply voltage and the output swing, so the efficiency entered is not used.',
      ),
    )
  }
  return found
}

/** Handling cautions by chemistry, and for lithium the air-travel class (IATA). */
export function safetyWarnings(facts: WarningFacts): EstimateWarning[] {
  if (CHEMISTRY_DATA[facts.chemistry].isLithium) {
    return [
      warning(
        'lithium-safety',
        "Lithium packs are a fire risk when crushed, shorted or charged in the cold: fuse the lead close to the pack, stay within its discharge rating, and follow the maker's and local rules.",
      ),
      ...airlineWarnings(facts),
    ]
  }
  if (facts.chemistry === 'lead-acid') {
    return [
      warning(
        'lead-acid-safety',
        'Lead-acid batteries vent gas when charged: charge them in a ventilated place, fuse the lead close to the battery, and follow local rules.',
      ),
    ]
  }
  return []
}

function airlineWarnings(facts: WarningFacts): EstimateWarning[] {
  const packWh = Math.round(facts.nominalWh)
  if (facts.airlineClass === '100-to-160wh') {
    return [
      warning(
        'airline-approval-needed',
        `Each pack holds ${packWh} Wh: ask the airline for approval before flying with it, and carry it in the cabin with its terminals covered (IATA: over 100 Wh, up to 160 Wh).`,
      ),
    ]
  }
  if (facts.airlineClass === 'over-160wh') {
    return [
      warning(
        'airline-not-allowed',
        `Each pack holds ${packWh} Wh, over 160 Wh: it may not travel in passenger baggage (IATA); ship it as cargo or use smaller packs.`,
      ),
    ]
  }
  return []
}
