// An event's shared pool of packs and the venue's chargers.
import type { NumberFieldEntry } from './types'

export const eventFields = {
  'pool.count': { label: 'Packs on hand', unit: 'packs', min: 0, max: 50, whole: true },
  // Ours: 2 kW per pack is above any portable-pack charger; a typo of an extra zero is caught.
  'charger.powerW': {
    label: 'Charger power into each pack',
    unit: 'W',
    min: 0,
    max: 2000,
    aboveMin: true,
  },
  'charger.slots': { label: 'Charger slots', min: 1, max: 20, whole: true },
} as const satisfies Record<string, NumberFieldEntry>
