import type { AccessorySpec } from '../schemas/estimate'
import type { LibraryConverter } from './types'

function converter(id: string, label: string, part: LibraryConverter['part']): LibraryConverter {
  return { id, label, part }
}

/**
 * Generic converter modules to put between the pack and an accessory: the accessory's converter
 * settings, filled in one pick (datasheet class of the common small modules, from memory where
 * marked). A linear regulator's efficiency is V_out/V_in, so it has none here.
 */
export const libraryConverters: readonly LibraryConverter[] = [
  converter('conv-buck-5v', 'Step-down module, 5 V (USB) out', {
    feed: 'buck',
    outputV: 5,
    efficiency: 0.88, // datasheet class: synchronous buck modules, 85–92 % at 1–10 W
    idleW: 0.05, // datasheet class: a few mA quiescent at 12–20 V
  }),
  converter('conv-buck-12v', 'Step-down module, 12 V out', {
    feed: 'buck',
    outputV: 12,
    efficiency: 0.92, // datasheet class: higher output voltage, higher efficiency
    idleW: 0.05,
  }),
  converter('conv-isolated-12v', 'Isolated DC-DC module, 12 V out', {
    feed: 'isolated',
    outputV: 12,
    efficiency: 0.82, // datasheet class: 3–10 W isolated modules, 78–86 %
    idleW: 0.3, // from memory: no-load input of 20–40 mA at 12 V
    // datasheet class: regulated isolated modules with a 4:1 wide input, 9–36 V
    converterInputMinV: 9,
    converterInputMaxV: 36,
  }),
  converter('conv-boost-12v', 'Step-up module, 12 V out', {
    feed: 'boost',
    outputV: 12,
    efficiency: 0.9, // datasheet class: small boost modules, 88–93 %
    idleW: 0.1,
  }),
  converter('conv-buck-boost-12v', 'Buck-boost module, 12 V out', {
    feed: 'buck-boost',
    outputV: 12,
    efficiency: 0.86, // datasheet class: four-switch buck-boost modules, 85–90 %
    idleW: 0.1,
  }),
  converter('conv-linear-5v', 'Linear regulator, 5 V out', {
    feed: 'linear',
    outputV: 5,
    idleW: 0.05, // from memory: about 5 mA quiescent for the classic three-pin parts
  }),
]

/** The accessory (complete, or a draft being typed) with a library converter's settings. */
export function withConverter<Accessory extends Partial<AccessorySpec>>(
  accessory: Accessory,
  item: LibraryConverter,
): Omit<
  Accessory,
  'outputV' | 'efficiency' | 'idleW' | 'converterInputMinV' | 'converterInputMaxV'
> &
  LibraryConverter['part'] {
  const {
    outputV: _outputV,
    efficiency: _efficiency,
    idleW: _idleW,
    converterInputMinV: _converterInputMinV,
    converterInputMaxV: _converterInputMaxV,
    ...rest
  } = accessory
  return { ...rest, ...item.part }
}
