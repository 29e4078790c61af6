// Plain words for the engine's codes, in the bench's own voice.
import type { AirlineClass, ConverterVerdict, StopReason } from '@shared/schemas/estimate'

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
