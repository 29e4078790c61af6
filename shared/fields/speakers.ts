// The speakers' number fields, per amplifier channel.
import type { NumberFieldEntry } from './types'

export const speakerFields = {
  'speakers.driverOhm': { label: 'Driver impedance', unit: 'Ω', min: 0, max: 100, aboveMin: true },
  'speakers.parallel': { label: 'Drivers in parallel per bank', min: 1, max: 64, whole: true },
  'speakers.banks': {
    label: 'Banks in series',
    min: 1,
    max: 64,
    whole: true,
    help: 'Per amplifier channel.',
  },
  'speakers.sensitivityDb': {
    label: 'Driver sensitivity (1 W, 1 m)',
    unit: 'dB',
    min: 50,
    max: 130,
  },
  'speakers.facingListener': {
    label: 'Drivers facing the listener',
    min: 1,
    max: 4096,
    whole: true,
  },
} as const satisfies Record<string, NumberFieldEntry>
