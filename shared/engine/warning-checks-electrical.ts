// The warnings about the rig's electrics: what the pack can deliver, the load, the supply range,
// the currents, the lead, dropouts and clipping on peaks, and each accessory's feed. Each check
// reads the facts and gives its warnings, in the order a reader should meet them.
import type { EstimateWarning } from '../schemas/estimate'
import { LINEAR_HEAT_LIMIT_W } from './converters'
import { leadAreaForCurrentMm2, leadCurrentRatingA } from './leads'
import { runMomentPhrase } from './moment'
import { IMPEDANCE_DIP_FACTOR } from './speakers'
import { warning } from './warning-catalogue'
import { dropoutWarning, fixed, wireSize } from './warning-words'
import type { WarningFacts } from './warnings'

export const LEAD_DROP_LIMIT_PCT = 3 // common practice: keep DC supply leads under 3 % drop
// ours: a lock-out that leaves under 2 % of the pack unused is within the tables' own error
export const STRANDED_SOC_MINIMUM_PCT = 2

export function cannotDeliverWarnings(facts: WarningFacts): EstimateWarning[] {
  if (!facts.anyPackCannotDeliver && facts.stopReason !== 'cannot-deliver') return []
  return [
    warning(
      'cannot-deliver',
      'The pack cannot deliver the power asked of it through its own resistance and the lead: lower the level, use a pack with more cells in parallel or a higher voltage, or a thicker, shorter lead.',
    ),
  ]
}

/** Below the amplifier's minimum load, or close enough that real impedance dips reach it. */
export function loadWarnings(facts: WarningFacts): EstimateWarning[] {
  const loadOhm = fixed(facts.loadOhm, 2)
  const minLoadOhm = fixed(facts.minLoadOhm, 2)
  if (facts.loadOhm < facts.minLoadOhm) {
    return [
      warning(
        'load-below-minimum',
        `The load is ${loadOhm} ohm per channel, below the amplifier's minimum of ${minLoadOhm} ohm: wire fewer drivers in parallel or more banks in series.`,
      ),
    ]
  }
  if (facts.loadOhm * IMPEDANCE_DIP_FACTOR < facts.minLoadOhm) {
    return [
      warning(
        'impedance-dips',
        `The load is ${loadOhm} ohm per channel, close to the amplifier's minimum of ${minLoadOhm} ohm; real impedance dips below nominal, so watch the amplifier's temperature or raise the load.`,
      ),
    ]
  }
  return []
}

/** The pack's voltage against the amplifier's supply range: too high, unknown, or muting early. */
export function supplyRangeWarnings(facts: WarningFacts): EstimateWarning[] {
  const found: EstimateWarning[] = []
  if (facts.supplyMaxV !== null && facts.chargedPackV > facts.supplyMaxV) {
    found.push(
      warning(
        'supply-over-max',
        `A pack straight off the charger gives ${fixed(facts.chargedPackV)} V, above the amplifier's maximum supply of ${fixed(facts.supplyMaxV)} V, which can destroy it: use a pack with fewer cells in series or an amplifier rated for it.`,
      ),
    )
  }
  if (facts.supplyMaxV === null || facts.lockoutV === null) {
    found.push(
      warning(
        'supply-range-unknown',
        "Enter the amplifier's supply range and lock-out voltage from its datasheet so the pack voltage can be checked against them.",
      ),
    )
  }
  return [...found, ...lockoutWarnings(facts)]
}

/** A lock-out above the supply at the pack's cutoff strands the energy below it. */
function lockoutWarnings(facts: WarningFacts): EstimateWarning[] {
  const mutedByLockout = facts.stopReason === 'amp-lockout'
  // A lock-out that only just meets the cutoff strands nothing worth a warning.
  const strandsEnergy = !mutedByLockout || facts.lowestSocPct >= STRANDED_SOC_MINIMUM_PCT
  const lockoutV = facts.lockoutV
  if (lockoutV === null || !(lockoutV > facts.cutoffSupplyV && strandsEnergy)) return []
  const left = mutedByLockout
    ? ` About ${Math.round(facts.lowestSocPct)} % of the pack is left when it mutes.`
    : ''
  return [
    warning(
      'lockout-above-cutoff',
      `The amplifier mutes at ${fixed(lockoutV)} V, above the ${fixed(facts.cutoffSupplyV)} V it would see at the pack's cutoff, so energy is stranded.${left} Use a pack with more cells in series, a thicker lead, or an amplifier with a lower lock-out.`,
    ),
  ]
}

/** The draw against the pack's rated discharge: on average first, then on bass peaks. */
export function packCurrentWarnings(facts: WarningFacts): EstimateWarning[] {
  const ratingA = facts.maxDischargeA
  if (ratingA === null) {
    return [
      warning(
        'pack-rating-unknown',
        "Enter the pack's maximum continuous discharge current so the draw can be checked against it.",
      ),
    ]
  }
  if (facts.maxAverageCurrentA > ratingA) {
    return [
      warning(
        'current-over-rating',
        `The rig draws up to ${fixed(facts.maxAverageCurrentA)} A on average, above the pack's ${fixed(ratingA)} A rating: lower the level, or use a pack rated for more current (more cells in parallel). Overdriven packs can overheat.`,
      ),
    ]
  }
  // docs/model.md §10: a peak current above the pack's rated discharge is a danger.
  if (facts.peakCurrentA > ratingA) {
    return [
      warning(
        'peak-current-over-rating',
        `On sustained bass notes the rig draws up to ${fixed(facts.peakCurrentA)} A, above the pack's ${fixed(ratingA)} A rating: its protection may cut out on bass and the cells run hot. Lower the level or use a pack rated for more current (more cells in parallel).`,
      ),
    ]
  }
  return []
}

/** The DC lead: its current rating and its voltage drop (none without leads). */
export function leadWarnings(facts: WarningFacts): EstimateWarning[] {
  const areaMm2 = facts.leadAreaMm2
  if (areaMm2 === null) return []
  const found: EstimateWarning[] = []
  const ratingA = leadCurrentRatingA(areaMm2)
  // Copper heats over minutes, so the current that counts is the highest average of a step,
  // not the peaks of a bass note.
  if (facts.maxAverageCurrentA > ratingA) {
    const neededMm2 = leadAreaForCurrentMm2(facts.maxAverageCurrentA)
    found.push(
      warning(
        'lead-over-rating',
        `The lead carries up to ${fixed(facts.maxAverageCurrentA)} A, but a ${wireSize(areaMm2)} cord is rated for only about ${fixed(ratingA)} A, so it will run hot: fit leads of at least ${wireSize(neededMm2, true)}, with a fuse rated for the lead close to the pack.`,
      ),
    )
  }
  if (facts.leadDropPct.average > LEAD_DROP_LIMIT_PCT) {
    found.push(
      warning(
        'lead-drop-high',
        `The lead loses ${fixed(facts.leadDropPct.average)} % of the pack voltage at the average draw (${fixed(facts.leadDropPct.peak)} % on peaks): use a thicker or shorter lead.`,
      ),
    )
  }
  return found
}

/** Music cutting out on bass peaks (docs/model.md §10, Dropout). */
export function dropoutWarnings(facts: WarningFacts): EstimateWarning[] {
  if (!facts.dropoutRisk || !facts.dropout) return []
  const [code, message] = dropoutWarning(facts.dropout, facts.minPeakSupplyV)
  return [warning(code, message, facts.dropout.fromMinute ?? undefined)]
}

export function peaksClipWarnings(facts: WarningFacts): EstimateWarning[] {
  if (facts.clipsFromMinute === null) return []
  return [
    warning(
      'peaks-clip',
      `The programme's peaks start to clip ${runMomentPhrase(facts.clipsFromMinute)}, as the pack sags: lower the level a little or swap packs earlier.`,
      facts.clipsFromMinute,
    ),
  ]
}

/** Each accessory in turn: a hot linear regulator, then how its feed suits the pack's window. */
export function converterWarnings(facts: WarningFacts): EstimateWarning[] {
  return facts.converters.flatMap((converter) => [
    ...linearHeatWarnings(converter),
    ...feedWarnings(converter),
  ])
}

type Converter = WarningFacts['converters'][number]

function linearHeatWarnings(converter: Converter): EstimateWarning[] {
  if (converter.linearHeatW <= LINEAR_HEAT_LIMIT_W) return []
  return [
    warning(
      'linear-regulator-hot',
      `The linear regulator for "${converter.label}" sheds ${fixed(converter.linearHeatW)} W of heat at full charge: fit a heatsink, or use a step-down (buck) converter instead.`,
    ),
  ]
}

/** Over the part's maximum comes first (docs/model.md §10, Over-voltage), then too low, then a
 *  converter that does not suit the window. */
function feedWarnings(converter: Converter): EstimateWarning[] {
  const direct = converter.feed === 'direct'
  const named = `"${converter.label}"`
  if (converter.verdict === 'over-max' || (direct && converter.verdict === 'step-down')) {
    return [warning('accessory-over-max', `${named}: ${converter.advice}`)]
  }
  if (converter.fits) return []
  if (direct) return [warning('accessory-under-min', `${named}: ${converter.advice}`)]
  return [
    warning(
      'converter-mismatch',
      `${named}: a ${converter.feed} converter does not suit a pack window of ${fixed(converter.windowMinV)}–${fixed(converter.windowMaxV)} V for a ${fixed(converter.suppliedV)} V output. ${converter.advice}`,
    ),
  ]
}
