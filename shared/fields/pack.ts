// The pack's number fields.
import type { NumberFieldEntry } from './types'

export const packFields = {
  'pack.seriesCells': {
    label: 'Cells in series',
    min: 1,
    max: 100,
    whole: true,
    help: 'A "20 V max" tool pack has 5.',
  },
  'pack.parallelCells': { label: 'Cells in parallel', min: 1, max: 100, whole: true },
  'pack.cellCapacityAh': {
    label: 'Cell capacity',
    unit: 'Ah',
    min: 0,
    max: 1000,
    aboveMin: true,
    step: 0.5,
    help: 'Pack Ah ÷ cells in parallel.',
  },
  'pack.cellResistanceOhm': {
    label: 'Cell resistance',
    unit: 'Ω',
    min: 0,
    max: 10,
    aboveMin: true,
    // As datasheets give it.
    display: 'milliOhm',
    help: 'DC internal resistance of one cell.',
  },
  'pack.cutoffCellV': {
    label: 'Cutoff voltage per cell',
    unit: 'V',
    min: 0,
    max: 5,
    aboveMin: true,
    step: 0.05,
  },
  // A measured capacity can beat the label a little, hence above 100 %.
  'pack.healthPct': {
    label: 'Pack health',
    unit: '%',
    min: 0,
    max: 120,
    aboveMin: true,
    step: 5,
    decimals: 0,
  },
  'pack.maxDischargeA': {
    label: 'Maximum continuous discharge',
    unit: 'A',
    min: 0,
    max: 5000,
    aboveMin: true,
  },
  // 1 is an ideal cell (Peukert's law); the top of 1.6 is ours, above any cell we know of.
  'pack.peukertExponent': { label: 'Peukert exponent', min: 1, max: 1.6, step: 0.01 },
  'pack.count': { label: 'Charged packs on hand', min: 1, max: 50, whole: true },
  'pack.massKg': {
    label: 'Mass per pack',
    unit: 'kg',
    min: 0,
    max: 500,
    aboveMin: true,
    step: 0.1,
    display: 'mass',
  },
  'pack.price': { label: 'Price per pack', unit: 'USD', min: 0, max: 1_000_000, step: 10 },
} as const satisfies Record<string, NumberFieldEntry>
