// The amplifier's number fields.
import { efficiencyField, voltageField } from './limits'
import type { NumberFieldEntry } from './types'

export const amplifierFields = {
  'amplifier.channels': { label: 'Amplifier channels', min: 1, max: 16, whole: true },
  'amplifier.ratedPowerW': {
    label: 'Rated power per channel',
    unit: 'W',
    min: 0,
    max: 20000,
    aboveMin: true,
    step: 5,
  },
  'amplifier.ratedLoadOhm': { label: 'Rated load', unit: 'Ω', min: 0, max: 100, aboveMin: true },
  'amplifier.ratedSupplyV': voltageField('Rated supply voltage'),
  'amplifier.ratedThdPct': {
    label: 'Distortion (THD) at the rated power',
    unit: '%',
    min: 0,
    max: 30,
    aboveMin: true,
    decimals: 1,
    help: 'Usually 1 % or 10 % THD.',
  },
  'amplifier.supplyMinV': voltageField('Minimum supply voltage'),
  'amplifier.supplyMaxV': voltageField('Maximum supply voltage'),
  'amplifier.lockoutV': { ...voltageField('Lock-out (undervoltage mute) voltage'), step: 0.5 },
  // Named with the amplifier: converters draw idle power too, and a message is read on its own.
  'amplifier.idleCurrentA': {
    label: 'Amplifier idle current',
    unit: 'A',
    min: 0,
    max: 50,
    step: 0.01,
  },
  'amplifier.efficiency': efficiencyField('Amplifier efficiency'),
  'amplifier.minLoadOhm': {
    label: 'Amplifier minimum load',
    unit: 'Ω',
    min: 0,
    max: 100,
    aboveMin: true,
    decimals: 1,
  },
  // Extension: the board's supply capacitors, which smooth a little of a bass note's ripple.
  'amplifier.bulkCapacitanceUF': {
    label: 'Bulk capacitance on the supply',
    unit: 'µF',
    min: 0,
    max: 1_000_000,
    step: 100,
  },
} as const satisfies Record<string, NumberFieldEntry>
