// Every default the engine takes is listed in the result's assumed[] with its source, so a screen
// can say what it took for granted (docs/model.md §9).
import type { AssumedValue } from '../schemas/estimate'

/** The value given, or the fallback, recorded in assumed[] with its field and source. */
export type DefaultPicker = <T extends number | string | boolean>(
  given: T | undefined,
  field: string,
  fallback: T,
  source: string,
) => T

/** A picker and the list it records into, in the order the defaults are taken. */
export function assumptionRecorder(): { assumed: AssumedValue[]; pick: DefaultPicker } {
  const assumed: AssumedValue[] = []
  const pick: DefaultPicker = function pick<T extends number | string | boolean>(
    given: T | undefined,
    field: string,
    fallback: T,
    source: string,
  ): T {
    if (given !== undefined) return given
    assumed.push({ field, value: fallback, source })
    return fallback
  }
  return { assumed, pick }
}
