// The warning codes: stable kebab-case (screens and saved plans key on them, docs/model.md §9),
// each with its severity and what it means.
import type { EstimateWarning, Severity } from '../schemas/estimate'

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
  'charge-temperature-out-of-range': {
    severity: 'danger',
    meaning:
      "A charging break falls outside the pack's charge temperature range: the pack takes no charge there.",
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
