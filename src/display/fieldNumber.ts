// How a number field shows the value it holds: the one rounding rule of every number field.
import { formatNumber } from './format'
import type { DisplayQuantity } from './units'

/**
 * A worked-out value (converted to the unit shown, or one wire size from the other) rounded for a
 * field: one decimal more than its figures show elsewhere, so typing the shown value back changes
 * nothing a figure shows.
 */
export function roundForField(shown: number, figureDecimals: number): number {
  const factor = 10 ** (figureDecimals + 1)
  return Math.round(shown * factor) / factor
}

/**
 * A stored value (in the engine's unit) as its field shows it: converted and rounded by that rule
 * in a display quantity (feet, °F, mΩ, %); in the engine's own unit exactly as typed.
 */
export function fieldNumber(stored: number, quantity: DisplayQuantity | undefined): number {
  return quantity ? roundForField(quantity.toDisplay(stored), quantity.decimals) : stored
}

/** A number typed in a field back in the engine's unit. */
export function storedNumber(shown: number, quantity: DisplayQuantity | undefined): number {
  return quantity ? quantity.fromDisplay(shown) : shown
}

/** What an empty field says when the engine assumed a value for it; its unit is beside it. */
export function assumedText(stored: number, quantity: DisplayQuantity | undefined): string {
  const shown = quantity ? quantity.toDisplay(stored) : stored
  return `assumed ${formatNumber(shown, quantity ? quantity.decimals + 1 : 2)}`
}
