// A catalogue field as a zod number: its bounds and one plain message naming it by its label.
import { z } from 'zod'
import { FIELDS, type FieldKey, type NumberFieldEntry } from '../fields'

/** What every failure of a field says: its label, the numbers allowed and their unit. */
export function boundsMessage(entry: NumberFieldEntry): string {
  const unit = entry.unit ? ` ${entry.unit}` : ''
  const note = entry.boundsNote ? ` (${entry.boundsNote})` : ''
  const range = entry.whole
    ? `a whole number from ${entry.min} to ${entry.max}`
    : entry.aboveMin
      ? `more than ${entry.min} and at most ${entry.max}`
      : `a number from ${entry.min} to ${entry.max}`
  return `${entry.label} must be ${range}${unit}${note}`
}

/** A field's label as a message begins with it: the catalogue's own. */
export function fieldLabel(key: FieldKey): string {
  return FIELDS[key].label
}

/** A field's label inside a sentence: lower case but for a leading abbreviation ("THD"). */
export function fieldLabelInSentence(key: FieldKey): string {
  const label = fieldLabel(key)
  return /^\p{Lu}\p{Lu}/u.test(label) ? label : label.charAt(0).toLowerCase() + label.slice(1)
}

/** A finite number within the field's bounds; zod 4 numbers already refuse NaN and ±Infinity. */
export function numberField(key: FieldKey) {
  const entry: NumberFieldEntry = FIELDS[key]
  const message = boundsMessage(entry)
  const number = z.number({ error: message })
  const whole = entry.whole ? number.int({ error: message }) : number
  const low = entry.aboveMin
    ? whole.gt(entry.min, { error: message })
    : whole.min(entry.min, { error: message })
  return low.max(entry.max, { error: message })
}
