// Plain words for the engine's codes, in the bench's own voice.
import type { Chemistry } from '@shared/engine'
import type {
  AirlineClass,
  AmplifierSpec,
  ConverterVerdict,
  AccessorySpec,
  StopReason,
} from '@shared/schemas/estimate'

export const amplifierClassLabels: Record<AmplifierSpec['class'], string> = {
  d: 'D (switching)',
  ab: 'AB (linear)',
  a: 'A',
}

export const feedLabels: Record<AccessorySpec['feed'], string> = {
  direct: 'Straight from the pack',
  buck: 'Step-down (buck) converter',
  boost: 'Step-up (boost) converter',
  'buck-boost': 'Buck-boost converter',
  isolated: 'Isolated converter',
  linear: 'Linear regulator',
}

export const stopReasonText: Record<StopReason, string> = {
  'pack-cutoff': 'The last pack reaches its cutoff voltage under load.',
  'cannot-deliver':
    'The pack can no longer deliver the power asked of it: its voltage would collapse.',
  'amp-lockout': 'The amplifier mutes: its supply falls below the lock-out voltage.',
  'pack-empty': 'The packs are empty.',
  'schedule-end': 'The schedule ends with charge to spare.',
  'time-limit': 'It would run for more than 7 days; the estimate stops there.',
}

export const verdictText: Record<ConverterVerdict, string> = {
  'direct-ok': 'Suits the pack directly',
  'step-down': 'Needs a step-down converter',
  'step-up': 'Needs a step-up converter',
  'buck-boost': 'Needs a buck-boost converter',
  'over-max': 'A full pack is over its maximum',
}

export const airlineClassText: Record<AirlineClass, string> = {
  'up-to-100wh': 'Up to 100 Wh: allowed in carry-on baggage',
  '100-to-160wh': '100 to 160 Wh: only with the airline’s approval',
  'over-160wh': 'Over 160 Wh: not allowed in passenger baggage',
  'not-lithium': 'Not lithium: the Wh limits for lithium do not apply; ask the airline',
}

/** Chemistries in words, as the trade says them (never the codes). */
export const chemistryNames: Record<Chemistry, string> = {
  'li-ion': 'Lithium-ion',
  lifepo4: 'LiFePO4',
  'lead-acid': 'Lead-acid (AGM/gel)',
  nimh: 'NiMH',
}
