// Where the rig plays: the air around it and the listener.
import type { NumberFieldEntry } from './types'

export const placeFields = {
  temperatureC: {
    label: 'Temperature',
    unit: '°C',
    min: -40,
    max: 70,
    display: 'temperature',
  },
  listenerDistanceM: {
    label: 'Listener distance',
    unit: 'm',
    min: 0.5,
    max: 1000,
    display: 'length',
  },
  boundaryGainDb: {
    label: 'Placement (boundary gain)',
    unit: 'dB',
    min: 0,
    max: 12,
    decimals: 0,
  },
} as const satisfies Record<string, NumberFieldEntry>
