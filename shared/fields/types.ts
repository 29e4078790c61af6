// What the catalogue says of one number field. The schema's bounds and messages, the label and
// unit beside the input and the help under it are all read from one such entry, so a form and the
// message about it never name a field two ways.

/**
 * How a field is shown when the screen's unit is not the engine's: milliohms and percent as
 * datasheets print them, and masses, lengths and temperatures in the header's unit system. The
 * client maps each to its conversion; the engine only ever sees its own unit.
 */
export type FieldDisplay = 'milliOhm' | 'percentOfOne' | 'mass' | 'length' | 'temperature'

export interface NumberFieldEntry {
  /** Named at the field and in every message about it: clear without the form around it. */
  label: string
  /** The engine's unit: the stored value, the bounds and the messages are in it. */
  unit?: string
  /** The lowest value allowed, in `unit`. */
  min: number
  /** The highest value allowed, in `unit`. */
  max: number
  /** The minimum itself is not allowed (a zero capacity, impedance or efficiency is not physical). */
  aboveMin?: boolean
  /** Whole numbers only (cells, drivers, channels): a numeric keypad on phones. */
  whole?: boolean
  /** What the arrow keys add, in the unit shown at the field; 1 when absent. */
  step?: number
  /** Shown and typed in another unit than the engine's. */
  display?: FieldDisplay
  /**
   * How many decimals the field's figures show where its value is worked out rather than typed
   * (a wire's AWG from its mm², and back; a default the estimate assumed); the display
   * quantity's own decimals where it has one, else none for a whole number and 2 for others.
   */
  decimals?: number
  /** Said under the field: where to find the value, or what it means. */
  help?: string
  /** Said after the bounds in a message, where the numbers alone would puzzle. */
  boundsNote?: string
}
