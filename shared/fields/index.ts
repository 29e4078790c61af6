// The field catalogue: every number field of a rig, a plan and an event, once. The shared
// schemas take their bounds and messages from it and every form its label, unit, step and help,
// so the bench, the parts library and the plans name a field the same way as its message does.
import { accessoryFields } from './accessory'
import { amplifierFields } from './amplifier'
import { eventFields } from './event'
import { leadFields } from './leads'
import { packFields } from './pack'
import { placeFields } from './place'
import { programmeFields } from './programme'
import { speakerFields } from './speakers'
import type { NumberFieldEntry } from './types'

export type { FieldDisplay, NumberFieldEntry } from './types'
export {
  ACCESSORY_FEEDS,
  AMPLIFIER_CLASSES,
  CHOICES,
  choiceEntry,
  choiceOptions,
  choiceWords,
  FLAGS,
  flagEntry,
  type ChoiceFieldEntry,
  type ChoiceKey,
  type FlagFieldEntry,
  type FlagKey,
} from './choices'
export { MAX_SCHEDULE_MINUTES, MAX_SUPPLY_V } from './limits'

export const FIELDS = {
  ...packFields,
  ...leadFields,
  ...amplifierFields,
  ...speakerFields,
  ...accessoryFields,
  ...programmeFields,
  ...placeFields,
  ...eventFields,
} as const satisfies Record<string, NumberFieldEntry>

/** A field's key in the catalogue: `pack.cellCapacityAh`, `temperatureC`. */
export type FieldKey = keyof typeof FIELDS

/** The first part of a dotted key: `pack`, `amplifier`, `segment`. */
export type FieldGroup = FieldKey extends infer Key
  ? Key extends `${infer Group}.${string}`
    ? Group
    : never
  : never

/** The fields of one group by their property names: `FieldProperty<'pack'>` holds `seriesCells`. */
export type FieldProperty<Group extends FieldGroup> = FieldKey extends infer Key
  ? Key extends `${Group}.${infer Property}`
    ? Property
    : never
  : never

/** The catalogue key of one group's property. */
export function groupFieldKey<Group extends FieldGroup>(
  group: Group,
  property: FieldProperty<Group>,
): FieldKey {
  return `${group}.${property}` as FieldKey
}

export function fieldEntry(key: FieldKey): NumberFieldEntry {
  return FIELDS[key]
}
