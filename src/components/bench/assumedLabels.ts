// The rows of "What the estimate assumed": each default the engine lists in `result.assumed`
// named by its field's label in the catalogue and shown in its unit, so the table never shows a
// field path or a bare fraction, and names a field as its form and its messages do. The engine
// writes each default's basis (a published source, common practice, from memory or ours).
import { FIELDS, fieldEntry, type FieldKey, type NumberFieldEntry } from '@shared/fields'
import type { AssumedValue, EstimateRequest } from '@shared/schemas/estimate'
import { formatNumber, withUnit } from '@/display/format'
import { displayQuantity, showQuantity } from '@/display/units'

/** An accessory's default is listed by its place in the request: `accessories.2.idleW`. */
const accessoryPath = /^accessories\.(\d+)\.(\w+)$/

function isFieldKey(key: string): key is FieldKey {
  return Object.hasOwn(FIELDS, key)
}

/** The catalogue entry of an assumed value's field, and the index of its accessory if any. */
function catalogueEntry(field: string): {
  entry: NumberFieldEntry | undefined
  accessoryIndex: number | undefined
} {
  const accessory = accessoryPath.exec(field)
  const key = accessory ? `accessory.${accessory[2] ?? ''}` : field
  return {
    entry: isFieldKey(key) ? fieldEntry(key) : undefined,
    accessoryIndex: accessory ? Number(accessory[1]) : undefined,
  }
}

/**
 * A worked-out value of a field in the unit its form shows (mΩ, %, °F, ft as the header's switch
 * says), to the catalogue's decimals; whole numbers without any.
 */
function shownNumber(value: number, entry: NumberFieldEntry | undefined): string {
  const quantity = displayQuantity(entry?.display)
  if (quantity) return showQuantity(value, quantity)
  const figure = formatNumber(value, entry?.decimals ?? (entry?.whole ? 0 : 2))
  return entry?.unit ? withUnit(figure, entry.unit) : figure
}

/** The plain label and shown value of one assumed default. */
export function assumedRow(
  assumed: AssumedValue,
  request: EstimateRequest | null,
): { label: string; value: string } {
  const { entry, accessoryIndex } = catalogueEntry(assumed.field)
  let label = entry?.label ?? 'Other setting'
  if (accessoryIndex !== undefined) {
    const name = request?.accessories?.[accessoryIndex]?.label ?? 'Accessory'
    label = `${name}: ${label}`
  }
  const value =
    typeof assumed.value === 'number'
      ? shownNumber(assumed.value, entry)
      : typeof assumed.value === 'boolean'
        ? assumed.value
          ? 'yes'
          : 'no'
        : assumed.value
  return { label, value }
}
