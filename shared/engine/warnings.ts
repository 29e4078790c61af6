// Warnings: stable kebab-case codes (screens and saved plans key on them), and messages that say
// what to change. Cautions defer to local codes and licensed practice where the work can hurt.
import type { ConverterResult, EstimateWarning, Severity, StopReason } from '../schemas/estimate'
import { durationWords } from '../card/format'
import { areaMm2ToAwg } from '../units'
import type { Chemistry } from './chemistry'
import { CHEMISTRY_DATA } from './chemistry'
import { LINEAR_HEAT_LIMIT_W } from './converters'
import { leadAreaForCurrentMm2, leadCurrentRatingA } from './leads'
import { runMomentPhrase } from './moment'
import type { DropoutOnset } from './dropout'
import { DROPOUT_NEAR_EMPTY_SOC_PCT } from './dropout'
import { IMPEDANCE_DIP_FACTOR } from './speakers'
import { CHILDREN_CAUTION_DB, NIOSH_REL_DBA, WHO_VENUE_LAEQ_DB } from './sound'

export const LEAD_DROP_LIMIT_PCT = 3 // common practice: keep DC supply leads under 3 % drop
export const LEAD_ACID_DEEP_DISCHARGE_SOC = 0.5 // common practice: below 50 % shortens AGM life
export const COLD_PACK_C = 5 // ours: where the cold costs enough capacity to mention
// ours: a lock-out that leaves under 2 % of the pack unused is within the tables' own error
export const STRANDED_SOC_MINIMUM_PCT = 2
export const HOT_PACK_C = 45 // common practice: lithium makers' upper discharge range starts near here

export const WARNING_CATALOGUE = {
  'load-below-minimum': {
    severity: 'danger',
    meaning: "The load per channel is below the amplifier's minimum load.",
  },
  'impedance-dips': {
    severity: 'info',
    meaning:
      "The load is within 25 % of the amplifier's minimum; real impedance dips below nominal.",
  },
  'supply-over-max': {
    severity: 'danger',
    meaning: "A pack straight off the charger is above the amplifier's maximum supply voltage.",
  },
  'supply-range-unknown': {
    severity: 'info',
    meaning: "The amplifier's supply range or lock-out is not given, so they are not checked.",
  },
  'lockout-above-cutoff': {
    severity: 'caution',
    meaning: 'The amplifier mutes before the pack reaches its cutoff: energy is left unused.',
  },
  'cannot-deliver': {
    severity: 'danger',
    meaning: 'The pack cannot deliver the power asked of it through its resistance and the lead.',
  },
  'current-over-rating': {
    severity: 'danger',
    meaning: "The average current is above the pack's maximum continuous discharge.",
  },
  'peak-current-over-rating': {
    severity: 'danger',
    meaning: "The current on programme peaks is above the pack's maximum continuous discharge.",
  },
  'pack-rating-unknown': {
    severity: 'info',
    meaning: "The pack's maximum discharge current is not given, so currents are not checked.",
  },
  'lead-over-rating': {
    severity: 'danger',
    meaning: 'The lead carries more current than a cord of its size is rated for: it runs hot.',
  },
  'lead-drop-high': {
    severity: 'caution',
    meaning: 'The lead loses more than 3 % of the pack voltage at the average draw.',
  },
  'dropout-risk': {
    severity: 'danger',
    meaning:
      "On bass peaks the supply falls below the amplifier's lock-out or a directly fed part's minimum: music cuts out.",
  },
  'dropout-near-empty': {
    severity: 'caution',
    meaning:
      "Near the end of each pack, bass peaks take the supply below the amplifier's lock-out or a directly fed part's minimum.",
  },
  'peaks-clip': {
    severity: 'caution',
    meaning: 'As the pack sags the programme peaks reach clipping.',
  },
  'linear-regulator-hot': {
    severity: 'caution',
    meaning: 'A linear regulator sheds more than about 1 W of heat.',
  },
  'accessory-over-max': {
    severity: 'danger',
    meaning:
      'An accessory or its converter sees more than its maximum input voltage with a pack straight off the charger.',
  },
  'accessory-under-min': {
    severity: 'danger',
    meaning: 'A directly fed accessory sees less than its minimum input voltage late in the run.',
  },
  'converter-mismatch': {
    severity: 'danger',
    meaning: "The chosen converter does not suit the pack's voltage window.",
  },
  'hearing-caution': {
    severity: 'caution',
    meaning: 'The estimated level at the listener is above 85 dBA (NIOSH REL).',
  },
  'hearing-over-venue-limit': {
    severity: 'danger',
    meaning: 'The estimated level is above the WHO venue figure of 100 dB LAeq over 15 minutes.',
  },
  'children-present': {
    severity: 'caution',
    meaning:
      'Children are present and the level is above the stricter caution for them (80 dB, from memory).',
  },
  'sound-level-estimate': {
    severity: 'info',
    meaning: 'Sound levels are free-field estimates.',
  },
  'lead-acid-deep-discharge': {
    severity: 'caution',
    meaning: 'A lead-acid pack is drawn below 50 % state of charge.',
  },
  'cold-pack': { severity: 'caution', meaning: 'The pack is below 5 °C: less capacity, more sag.' },
  'hot-pack': { severity: 'caution', meaning: 'The pack is above 45 °C.' },
  'schedule-short': {
    severity: 'danger',
    meaning: 'The packs on hand do not last the schedule.',
  },
  'reserve-low': {
    severity: 'caution',
    meaning: 'The day lasts but ends below 20 % in the last pack, with no spare left.',
  },
  'runtime-limit': {
    severity: 'info',
    meaning: 'The run without a schedule reached the 7-day limit of simulated time.',
  },
  'rated-power-above-ideal': {
    severity: 'info',
    meaning:
      "The amplifier's rating is above what its supply can swing; output resistance taken as 0.",
  },
  'efficiency-not-used': {
    severity: 'info',
    meaning:
      'Class AB efficiency follows from the supply and the swing; the figure given is not used.',
  },
  'lithium-safety': { severity: 'info', meaning: 'Usual cautions for lithium packs.' },
  'lead-acid-safety': { severity: 'info', meaning: 'Usual cautions for lead-acid batteries.' },
  'airline-approval-needed': {
    severity: 'info',
    meaning: "Lithium pack over 100 Wh and up to 160 Wh: air travel needs the airline's approval.",
  },
  'airline-not-allowed': {
    severity: 'info',
    meaning: 'Lithium pack over 160 Wh: not allowed in passenger baggage.',
  },
} as const satisfies Record<string, { severity: Severity; meaning: string }>

export type WarningCode = keyof typeof WARNING_CATALOGUE

export function warning(code: WarningCode, message: string, atMinute?: number): EstimateWarning {
  const found = { code, message, severity: WARNING_CATALOGUE[code].severity }
  return atMinute === undefined ? found : { ...found, atMinute }
}

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
  outputResistanceClamped: boolean
  abEfficiencyGiven: boolean
  nominalWh: number
  airlineClass: string
}

const fixed = (value: number, digits = 1) => value.toFixed(digits)

/**
 * A cross-section in both systems, "1.5 mm² (15 AWG)": the nearest gauge, or for a size to fit at
 * least, the next thicker one (a lower number).
 */
function wireSize(areaMm2: number, atLeast = false): string {
  const area = areaMm2 < 1 ? areaMm2.toFixed(2) : fixed(areaMm2)
  const awg = areaMm2ToAwg(areaMm2)
  return `${area} mm² (${atLeast ? Math.floor(awg + 1e-6) : Math.round(awg)} AWG)`
}

function stopInWords(reason: StopReason): string {
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
function dropoutWarning(onset: DropoutOnset, minPeakSupplyV: number): [WarningCode, string] {
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

export function collectWarnings(facts: WarningFacts): EstimateWarning[] {
  const warnings: EstimateWarning[] = []
  const add = (code: WarningCode, message: string, atMinute?: number) =>
    warnings.push(warning(code, message, atMinute))
  const chemistry = CHEMISTRY_DATA[facts.chemistry]

  if (facts.schedule && !facts.schedule.lasts && facts.schedule.stoppedAtMinute !== null) {
    add(
      'schedule-short',
      `The rig stops ${runMomentPhrase(facts.schedule.stoppedAtMinute)}, ${durationWords(facts.schedule.totalMinutes - facts.schedule.stoppedAtMinute)} before the schedule ends, because ${stopInWords(facts.stopReason)}: bring more charged packs, lower the level, or use a larger pack.`,
      facts.schedule.stoppedAtMinute,
    )
  }
  if (facts.anyPackCannotDeliver || facts.stopReason === 'cannot-deliver') {
    add(
      'cannot-deliver',
      'The pack cannot deliver the power asked of it through its own resistance and the lead: lower the level, use a pack with more cells in parallel or a higher voltage, or a thicker, shorter lead.',
    )
  }
  if (facts.loadOhm < facts.minLoadOhm) {
    add(
      'load-below-minimum',
      `The load is ${fixed(facts.loadOhm, 2)} ohm per channel, below the amplifier's minimum of ${fixed(facts.minLoadOhm, 2)} ohm: wire fewer drivers in parallel or more banks in series.`,
    )
  } else if (facts.loadOhm * IMPEDANCE_DIP_FACTOR < facts.minLoadOhm) {
    add(
      'impedance-dips',
      `The load is ${fixed(facts.loadOhm, 2)} ohm per channel, close to the amplifier's minimum of ${fixed(facts.minLoadOhm, 2)} ohm; real impedance dips below nominal, so watch the amplifier's temperature or raise the load.`,
    )
  }
  if (facts.supplyMaxV !== null && facts.chargedPackV > facts.supplyMaxV) {
    add(
      'supply-over-max',
      `A pack straight off the charger gives ${fixed(facts.chargedPackV)} V, above the amplifier's maximum supply of ${fixed(facts.supplyMaxV)} V, which can destroy it: use a pack with fewer cells in series or an amplifier rated for it.`,
    )
  }
  if (facts.supplyMaxV === null || facts.lockoutV === null) {
    add(
      'supply-range-unknown',
      "Enter the amplifier's supply range and lock-out voltage from its datasheet so the pack voltage can be checked against them.",
    )
  }
  // A lock-out that only just meets the cutoff strands nothing worth a warning.
  const strandsEnergy =
    facts.stopReason !== 'amp-lockout' || facts.lowestSocPct >= STRANDED_SOC_MINIMUM_PCT
  if (facts.lockoutV !== null && facts.lockoutV > facts.cutoffSupplyV && strandsEnergy) {
    const left =
      facts.stopReason === 'amp-lockout'
        ? ` About ${Math.round(facts.lowestSocPct)} % of the pack is left when it mutes.`
        : ''
    add(
      'lockout-above-cutoff',
      `The amplifier mutes at ${fixed(facts.lockoutV)} V, above the ${fixed(facts.cutoffSupplyV)} V it would see at the pack's cutoff, so energy is stranded.${left} Use a pack with more cells in series, a thicker lead, or an amplifier with a lower lock-out.`,
    )
  }
  if (facts.maxDischargeA === null) {
    add(
      'pack-rating-unknown',
      "Enter the pack's maximum continuous discharge current so the draw can be checked against it.",
    )
  } else if (facts.maxAverageCurrentA > facts.maxDischargeA) {
    add(
      'current-over-rating',
      `The rig draws up to ${fixed(facts.maxAverageCurrentA)} A on average, above the pack's ${fixed(facts.maxDischargeA)} A rating: lower the level, or use a pack rated for more current (more cells in parallel). Overdriven packs can overheat.`,
    )
  } else if (facts.peakCurrentA > facts.maxDischargeA) {
    add(
      'peak-current-over-rating',
      `On sustained bass notes the rig draws up to ${fixed(facts.peakCurrentA)} A, above the pack's ${fixed(facts.maxDischargeA)} A rating: its protection may cut out on bass and the cells run hot. Lower the level or use a pack rated for more current (more cells in parallel).`,
    )
  }
  if (facts.leadAreaMm2 !== null) {
    const ratingA = leadCurrentRatingA(facts.leadAreaMm2)
    // Copper heats over minutes, so the current that counts is the highest average of a step,
    // not the peaks of a bass note.
    if (facts.maxAverageCurrentA > ratingA) {
      const neededMm2 = leadAreaForCurrentMm2(facts.maxAverageCurrentA)
      add(
        'lead-over-rating',
        `The lead carries up to ${fixed(facts.maxAverageCurrentA)} A, but a ${wireSize(facts.leadAreaMm2)} cord is rated for only about ${fixed(ratingA)} A, so it will run hot: fit leads of at least ${wireSize(neededMm2, true)}, with a fuse rated for the lead close to the pack.`,
      )
    }
    if (facts.leadDropPct.average > LEAD_DROP_LIMIT_PCT) {
      add(
        'lead-drop-high',
        `The lead loses ${fixed(facts.leadDropPct.average)} % of the pack voltage at the average draw (${fixed(facts.leadDropPct.peak)} % on peaks): use a thicker or shorter lead.`,
      )
    }
  }
  if (facts.dropoutRisk && facts.dropout) {
    add(
      ...dropoutWarning(facts.dropout, facts.minPeakSupplyV),
      facts.dropout.fromMinute ?? undefined,
    )
  }
  if (facts.clipsFromMinute !== null) {
    add(
      'peaks-clip',
      `The programme's peaks start to clip ${runMomentPhrase(facts.clipsFromMinute)}, as the pack sags: lower the level a little or swap packs earlier.`,
      facts.clipsFromMinute,
    )
  }
  for (const converter of facts.converters) {
    if (converter.linearHeatW > LINEAR_HEAT_LIMIT_W) {
      add(
        'linear-regulator-hot',
        `The linear regulator for "${converter.label}" sheds ${fixed(converter.linearHeatW)} W of heat at full charge: fit a heatsink, or use a step-down (buck) converter instead.`,
      )
    }
    if (
      converter.verdict === 'over-max' ||
      (converter.feed === 'direct' && converter.verdict === 'step-down')
    ) {
      add('accessory-over-max', `"${converter.label}": ${converter.advice}`)
    } else if (converter.feed === 'direct' && !converter.fits) {
      add('accessory-under-min', `"${converter.label}": ${converter.advice}`)
    } else if (converter.feed !== 'direct' && !converter.fits) {
      add(
        'converter-mismatch',
        `"${converter.label}": a ${converter.feed} converter does not suit a pack window of ${fixed(converter.windowMinV)}–${fixed(converter.windowMaxV)} V for a ${fixed(converter.suppliedV)} V output. ${converter.advice}`,
      )
    }
  }
  if (facts.averageSplDb !== null) {
    const permitted =
      facts.permittedMinutes === null
        ? ''
        : ` (NIOSH permits about ${Math.round(facts.permittedMinutes)} minutes a day)`
    if (facts.averageSplDb > WHO_VENUE_LAEQ_DB) {
      add(
        'hearing-over-venue-limit',
        `The estimated level at the listener is ${Math.round(facts.averageSplDb)} dB, above the WHO venue figure of 100 dB LAeq over 15 minutes${permitted}: lower the level or move the audience back. Follow local rules.`,
      )
    } else if (facts.averageSplDb > NIOSH_REL_DBA) {
      add(
        'hearing-caution',
        `The estimated level at the listener is ${Math.round(facts.averageSplDb)} dB, above 85 dBA${permitted}: lower the level, keep people back from the speakers, or offer hearing protection. Follow local rules.`,
      )
    }
    if (facts.childrenPresent && facts.averageSplDb > CHILDREN_CAUTION_DB) {
      add(
        'children-present',
        `Children are present: the estimated ${Math.round(facts.averageSplDb)} dB is above the stricter ${CHILDREN_CAUTION_DB} dB aimed at for them. Lower the level, keep children well back from the speakers, and follow local rules.`,
      )
    }
    add(
      'sound-level-estimate',
      'Sound levels are free-field estimates for a steady programme: measure with a sound level meter on the day.',
    )
  }
  if (facts.chemistry === 'lead-acid' && facts.lowestSocPct < LEAD_ACID_DEEP_DISCHARGE_SOC * 100) {
    add(
      'lead-acid-deep-discharge',
      `The lead-acid pack is drawn down to ${Math.round(facts.lowestSocPct)} %: bring another battery or a larger one to stay above 50 %, which keeps it healthy for longer.`,
    )
  }
  if (facts.temperatureC < COLD_PACK_C) {
    const charge = chemistry.isLithium ? ' Never charge lithium packs below 0 °C.' : ''
    add(
      'cold-pack',
      `At ${fixed(facts.temperatureC, 0)} °C the pack gives about ${Math.round(facts.capacityFactor * 100)} % of its capacity and sags more: keep packs warm until use, or bring more.${charge}`,
    )
  } else if (facts.temperatureC > HOT_PACK_C) {
    add(
      'hot-pack',
      `At ${fixed(facts.temperatureC, 0)} °C packs age fast and lithium packs get nearer their limits: keep them in the shade and out of closed cars.`,
    )
  }
  if (facts.stopReason === 'time-limit') {
    add(
      'runtime-limit',
      'The rig runs for more than 7 days on these packs; the run stops there. Add a schedule for a real plan.',
    )
  }
  if (facts.outputResistanceClamped) {
    add(
      'rated-power-above-ideal',
      "The amplifier's rated power is more than its rated supply can swing into the rated load: check the datasheet figures (it may be a 10 % THD rating; set ratedThdPct).",
    )
  }
  if (facts.abEfficiencyGiven) {
    add(
      'efficiency-not-used',
      'Class AB efficiency follows from the supply voltage and the output swing, so the efficiency entered is not used.',
    )
  }
  if (chemistry.isLithium) {
    add(
      'lithium-safety',
      "Lithium packs are a fire risk when crushed, shorted or charged in the cold: fuse the lead close to the pack, stay within its discharge rating, and follow the maker's and local rules.",
    )
    if (facts.airlineClass === '100-to-160wh') {
      add(
        'airline-approval-needed',
        `Each pack holds ${Math.round(facts.nominalWh)} Wh: ask the airline for approval before flying with it, and carry it in the cabin with its terminals covered (IATA: over 100 Wh, up to 160 Wh).`,
      )
    } else if (facts.airlineClass === 'over-160wh') {
      add(
        'airline-not-allowed',
        `Each pack holds ${Math.round(facts.nominalWh)} Wh, over 160 Wh: it may not travel in passenger baggage (IATA); ship it as cargo or use smaller packs.`,
      )
    }
  } else if (facts.chemistry === 'lead-acid') {
    add(
      'lead-acid-safety',
      'Lead-acid batteries vent gas when charged: charge them in a ventilated place, fuse the lead close to the battery, and follow local rules.',
    )
  }
  return warnings
}
