import type { z } from 'zod'
import {
  choiceEntry,
  choiceWords,
  fieldEntry,
  flagEntry,
  type ChoiceKey,
  type FieldKey,
  type FlagKey,
} from '@shared/fields'
import { displayQuantity, showFigure, showQuantity } from '@/display/units'
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
import {
  accessoryBodySchema,
  amplifierBodySchema,
  packBodySchema,
  speakersBodySchema,
  type SavedItemMeta,
} from '@shared/schemas/resources'

// The four kinds of part as data: the form fields (datasheet values; a number field's label, unit
// and help are the field catalogue's), the columns of the tables, the shared schema that checks a
// form, and the built-in library beside.

interface PartFieldBase {
  /** The property of the part. */
  key: string
  required?: boolean
}
/** A number: its entry in the field catalogue. */
export interface PartNumberField extends PartFieldBase {
  type: 'number'
  field: FieldKey
}
/** One of a list of codes (chemistry, class, feed): its label, help and words in the catalogue. */
export interface PartChoiceField extends PartFieldBase {
  type: 'choice'
  choice: ChoiceKey
}
/** Yes or no: its label in the catalogue. */
export interface PartFlagField extends PartFieldBase {
  type: 'flag'
  flag: FlagKey
}
export type PartField = PartNumberField | PartChoiceField | PartFlagField

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

/** A number field of a part: its property is the catalogue key's last part. */
function number(field: FieldKey, required = false): PartNumberField {
  return { key: field.slice(field.indexOf('.') + 1), type: 'number', field, required }
}

/** A choice field of a part, always required: the property is the catalogue key's last part. */
function choice(field: ChoiceKey): PartChoiceField {
  return { key: field.slice(field.indexOf('.') + 1), type: 'choice', choice: field, required: true }
}

export const partKinds: PartKind[] = [
  {
    id: 'packs',
    title: 'Packs',
    singular: 'pack',
    api: packsApi as unknown as PartKind['api'],
    schema: packBodySchema,
    fields: [
      choice('pack.chemistry'),
      number('pack.seriesCells', true),
      number('pack.parallelCells', true),
      number('pack.cellCapacityAh', true),
      number('pack.cellResistanceOhm'),
      number('pack.cutoffCellV'),
      number('pack.healthPct'),
      number('pack.maxDischargeA'),
      number('pack.peukertExponent'),
      number('pack.count'),
      number('pack.massKg'),
      number('pack.price'),
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
      choice('amplifier.class'),
      { key: 'bridged', type: 'flag', flag: 'amplifier.bridged', required: true },
      number('amplifier.channels', true),
      number('amplifier.ratedPowerW', true),
      number('amplifier.ratedLoadOhm', true),
      number('amplifier.ratedSupplyV', true),
      number('amplifier.ratedThdPct'),
      number('amplifier.supplyMinV'),
      number('amplifier.supplyMaxV'),
      number('amplifier.lockoutV'),
      number('amplifier.idleCurrentA'),
      number('amplifier.efficiency'),
      number('amplifier.minLoadOhm'),
      number('amplifier.bulkCapacitanceUF'),
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
      number('speakers.driverOhm', true),
      number('speakers.parallel', true),
      number('speakers.banks', true),
      number('speakers.sensitivityDb'),
      number('speakers.facingListener'),
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
      number('accessory.powerW', true),
      number('accessory.inputMinV', true),
      number('accessory.inputMaxV', true),
      choice('accessory.feed'),
      number('accessory.outputV'),
      number('accessory.efficiency'),
      number('accessory.idleW'),
      number('accessory.converterInputMinV'),
      number('accessory.converterInputMaxV'),
    ],
    columns: ['powerW', 'inputMinV', 'inputMaxV', 'feed'],
    library: libraryAccessories,
    defaults: { feed: 'direct' },
  },
]

export function fieldOf(kind: PartKind, key: string): PartField | undefined {
  return kind.fields.find((field) => field.key === key)
}

/** A field's label: the catalogue's for a number and a choice. */
export function labelOf(field: PartField): string {
  if (field.type === 'number') return fieldEntry(field.field).label
  return field.type === 'choice' ? choiceEntry(field.choice).label : flagEntry(field.flag).label
}

/** The unit a field is shown and typed in. */
export function unitOf(field: PartField | undefined): string | undefined {
  if (field?.type !== 'number') return undefined
  const entry = fieldEntry(field.field)
  return displayQuantity(entry.display)?.unit ?? entry.unit
}

/** A part's value as a table shows it: the figure, and its unit unless the column names it. */
export function shownValue(field: PartField | undefined, value: unknown, withUnit = true): string {
  if (value === undefined || value === null) return '—'
  if (typeof value === 'boolean') return value ? 'yes' : 'no'
  if (field?.type === 'choice') return choiceWords(field.choice, String(value))
  if (typeof value !== 'number' || field?.type !== 'number') return String(value)
  const entry = fieldEntry(field.field)
  const quantity = displayQuantity(entry.display)
  if (quantity) return withUnit ? showQuantity(value, quantity) : showFigure(value, quantity)
  return withUnit && entry.unit ? `${value}\u00a0${entry.unit}` : String(value)
}
