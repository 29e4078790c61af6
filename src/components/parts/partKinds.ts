import type { z } from 'zod'
import {
  mass,
  milliOhm,
  percentOfOne,
  quantityNumber,
  showQuantity,
  type DisplayQuantity,
} from '@/display/units'
import {
  accessoriesApi,
  amplifiersApi,
  packsApi,
  speakersApi,
  type ResourceApi,
} from '@/api/resources'
import {
  libraryAccessories,
  libraryAmplifiers,
  libraryPacks,
  librarySpeakers,
} from '@shared/library'
import { ACCESSORY_FEEDS, AMPLIFIER_CLASSES, CHEMISTRY_VALUES } from '@shared/schemas/estimate'
import {
  accessoryBodySchema,
  amplifierBodySchema,
  packBodySchema,
  speakersBodySchema,
  type SavedItemMeta,
} from '@shared/schemas/resources'

// The four kinds of part as data: the form fields (datasheet values, with their units), the
// columns of the tables, the shared schema that checks a form, and the built-in library beside.

export interface PartField {
  key: string
  label: string
  type: 'number' | 'whole' | 'choice' | 'flag'
  unit?: string
  /** Shown and typed in this quantity (mΩ, %), stored in the engine's unit; replaces `unit`. */
  quantity?: DisplayQuantity
  options?: readonly string[]
  /** Shown under the field: where to find the value on a datasheet. */
  hint?: string
  required?: boolean
}

export type PartRecord = SavedItemMeta & Record<string, unknown>

export interface PartKind {
  id: 'packs' | 'amplifiers' | 'speakers' | 'accessories'
  title: string
  /** "pack", "speaker set", for buttons and messages. */
  singular: string
  api: ResourceApi<PartRecord, Record<string, unknown>>
  schema: z.ZodType
  fields: PartField[]
  /** Keys shown as table columns beside the name. */
  columns: string[]
  library: readonly { id: string; label: string; part: object }[]
  /** What a new form starts with (choices need a value; numbers start empty). */
  defaults: Record<string, unknown>
}

const chemistryHint = 'Li-ion covers NMC and NCA tool packs; lead-acid covers AGM and gel.'

export const partKinds: PartKind[] = [
  {
    id: 'packs',
    title: 'Packs',
    singular: 'pack',
    api: packsApi as unknown as PartKind['api'],
    schema: packBodySchema,
    fields: [
      {
        key: 'chemistry',
        label: 'Chemistry',
        type: 'choice',
        options: CHEMISTRY_VALUES,
        hint: chemistryHint,
        required: true,
      },
      {
        key: 'seriesCells',
        label: 'Cells in series',
        type: 'whole',
        required: true,
        hint: 'A "20 V max" tool pack has 5.',
      },
      { key: 'parallelCells', label: 'Cells in parallel', type: 'whole', required: true },
      {
        key: 'cellCapacityAh',
        label: 'Cell capacity',
        type: 'number',
        unit: 'Ah',
        required: true,
        hint: 'Pack Ah ÷ cells in parallel.',
      },
      {
        key: 'cellResistanceOhm',
        label: 'Cell resistance',
        type: 'number',
        // As the bench and datasheets give it.
        quantity: milliOhm,
        hint: 'DC internal resistance of one cell.',
      },
      { key: 'cutoffCellV', label: 'Cutoff per cell', type: 'number', unit: 'V' },
      { key: 'healthPct', label: 'Health', type: 'number', unit: '%' },
      { key: 'maxDischargeA', label: 'Max continuous discharge', type: 'number', unit: 'A' },
      { key: 'peukertExponent', label: 'Peukert exponent', type: 'number' },
      { key: 'count', label: 'Packs on hand', type: 'whole' },
      { key: 'massKg', label: 'Mass', type: 'number', quantity: mass },
      { key: 'price', label: 'Price', type: 'number' },
    ],
    columns: ['chemistry', 'seriesCells', 'parallelCells', 'cellCapacityAh', 'massKg'],
    library: libraryPacks,
    defaults: { chemistry: 'li-ion' },
  },
  {
    id: 'amplifiers',
    title: 'Amplifiers',
    singular: 'amplifier',
    api: amplifiersApi as unknown as PartKind['api'],
    schema: amplifierBodySchema,
    fields: [
      { key: 'class', label: 'Class', type: 'choice', options: AMPLIFIER_CLASSES, required: true },
      { key: 'bridged', label: 'Bridged (BTL) output', type: 'flag', required: true },
      { key: 'channels', label: 'Channels', type: 'whole', required: true },
      {
        key: 'ratedPowerW',
        label: 'Rated power per channel',
        type: 'number',
        unit: 'W',
        required: true,
      },
      { key: 'ratedLoadOhm', label: 'Rated into', type: 'number', unit: 'ohm', required: true },
      { key: 'ratedSupplyV', label: 'Rated at supply', type: 'number', unit: 'V', required: true },
      {
        key: 'ratedThdPct',
        label: 'Rated at distortion',
        type: 'number',
        unit: '%',
        hint: 'Usually 1 % or 10 % THD.',
      },
      { key: 'supplyMinV', label: 'Minimum supply', type: 'number', unit: 'V' },
      { key: 'supplyMaxV', label: 'Maximum supply', type: 'number', unit: 'V' },
      { key: 'lockoutV', label: 'Lock-out (undervoltage mute)', type: 'number', unit: 'V' },
      { key: 'idleCurrentA', label: 'Idle current', type: 'number', unit: 'A' },
      { key: 'efficiency', label: 'Efficiency', type: 'number', quantity: percentOfOne },
      { key: 'minLoadOhm', label: 'Minimum load', type: 'number', unit: 'ohm' },
      { key: 'bulkCapacitanceUF', label: 'Bulk capacitance', type: 'number', unit: 'µF' },
    ],
    columns: ['class', 'channels', 'ratedPowerW', 'ratedLoadOhm', 'ratedSupplyV'],
    library: libraryAmplifiers,
    defaults: { class: 'd', bridged: true },
  },
  {
    id: 'speakers',
    title: 'Speaker sets',
    singular: 'speaker set',
    api: speakersApi as unknown as PartKind['api'],
    schema: speakersBodySchema,
    fields: [
      { key: 'driverOhm', label: 'Driver impedance', type: 'number', unit: 'ohm', required: true },
      { key: 'parallel', label: 'Drivers in parallel per bank', type: 'whole', required: true },
      {
        key: 'banks',
        label: 'Banks in series',
        type: 'whole',
        required: true,
        hint: 'Per amplifier channel.',
      },
      { key: 'sensitivityDb', label: 'Sensitivity (1 W, 1 m)', type: 'number', unit: 'dB' },
      { key: 'facingListener', label: 'Drivers facing the listener', type: 'whole' },
    ],
    columns: ['driverOhm', 'parallel', 'banks', 'sensitivityDb'],
    library: librarySpeakers,
    defaults: {},
  },
  {
    id: 'accessories',
    title: 'Accessories',
    singular: 'accessory',
    api: accessoriesApi as unknown as PartKind['api'],
    schema: accessoryBodySchema,
    fields: [
      { key: 'powerW', label: 'Power', type: 'number', unit: 'W', required: true },
      { key: 'inputMinV', label: 'Minimum input', type: 'number', unit: 'V', required: true },
      { key: 'inputMaxV', label: 'Maximum input', type: 'number', unit: 'V', required: true },
      {
        key: 'feed',
        label: 'Fed through',
        type: 'choice',
        options: ACCESSORY_FEEDS,
        required: true,
      },
      { key: 'outputV', label: 'Converter output', type: 'number', unit: 'V' },
      {
        key: 'efficiency',
        label: 'Converter efficiency',
        type: 'number',
        quantity: percentOfOne,
      },
      { key: 'idleW', label: 'Converter idle draw', type: 'number', unit: 'W' },
      { key: 'converterInputMinV', label: 'Converter input minimum', type: 'number', unit: 'V' },
      { key: 'converterInputMaxV', label: 'Converter input maximum', type: 'number', unit: 'V' },
    ],
    columns: ['powerW', 'inputMinV', 'inputMaxV', 'feed'],
    library: libraryAccessories,
    defaults: { feed: 'direct' },
  },
]

export function fieldOf(kind: PartKind, key: string): PartField | undefined {
  return kind.fields.find((field) => field.key === key)
}

/**
 * A part's value as a table shows it: the figure in the unit the switch asks for, and the unit
 * unless the column's title carries it (`unitInTitle`).
 */
export function shownValue(
  field: PartField | undefined,
  value: unknown,
  { unitInTitle = false } = {},
): string {
  if (value === undefined || value === null) return '—'
  if (typeof value === 'boolean') return value ? 'yes' : 'no'
  if (typeof value === 'number' && field?.quantity)
    return unitInTitle ? quantityNumber(value, field.quantity) : showQuantity(value, field.quantity)
  if (typeof value === 'number' && field?.unit && !unitInTitle) return `${value}\u00a0${field.unit}`
  return String(value)
}

/** The unit a field is shown and typed in. */
export const unitOf = (field: PartField | undefined): string | undefined =>
  field?.quantity?.unit ?? field?.unit
