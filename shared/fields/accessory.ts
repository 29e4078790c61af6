// One accessory's number fields (a mixer, a receiver, a light) and its converter's.
import { efficiencyField, voltageField } from './limits'
import type { NumberFieldEntry } from './types'

export const accessoryFields = {
  'accessory.powerW': {
    label: 'Accessory power',
    unit: 'W',
    min: 0,
    max: 5000,
    aboveMin: true,
    step: 0.5,
  },
  'accessory.inputMinV': voltageField('Accessory minimum input voltage'),
  'accessory.inputMaxV': voltageField('Accessory maximum input voltage'),
  'accessory.outputV': voltageField('Converter output voltage'),
  'accessory.efficiency': efficiencyField('Converter efficiency'),
  'accessory.idleW': { label: 'Converter idle draw', unit: 'W', min: 0, max: 50, step: 0.05 },
  // Extension: the converter module's own input range, checked against the pack's window.
  'accessory.converterInputMinV': voltageField('Converter minimum input voltage'),
  'accessory.converterInputMaxV': voltageField('Converter maximum input voltage'),
} as const satisfies Record<string, NumberFieldEntry>
