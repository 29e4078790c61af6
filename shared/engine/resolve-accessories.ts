// Each accessory with its converter's defaults: output voltage, efficiency, idle draw and the
// input range the pack's voltage reaches (docs/model.md §6).
import type { EstimateRequest } from '../schemas/estimate'
import type { AccessoryInputs } from './converters'
import { DEFAULT_CONVERTER_EFFICIENCY, DEFAULT_CONVERTER_IDLE_W } from './converters'
import type { DefaultPicker } from './resolve-assumed'

type AccessorySpec = NonNullable<EstimateRequest['accessories']>[number]

export function resolveAccessory(
  accessory: AccessorySpec,
  index: number,
  pick: DefaultPicker,
): AccessoryInputs {
  return {
    label: accessory.label,
    powerW: accessory.powerW,
    inputMinV: accessory.inputMinV,
    inputMaxV: accessory.inputMaxV,
    feed: accessory.feed,
    outputV:
      accessory.feed === 'direct'
        ? 0
        : pick(
            accessory.outputV,
            `accessories.${index}.outputV`,
            (accessory.inputMinV + accessory.inputMaxV) / 2,
            "our default: the middle of the accessory's input range",
          ),
    // Direct and linear feeds draw the accessory's own current from the pack (accessoryLoad in
    // converters.ts): no conversion efficiency and no idle draw of a module of their own.
    efficiency:
      accessory.feed === 'direct' || accessory.feed === 'linear'
        ? 1
        : pick(
            accessory.efficiency,
            `accessories.${index}.efficiency`,
            DEFAULT_CONVERTER_EFFICIENCY[accessory.feed],
            'from memory: typical small converter module',
          ),
    exposedInput: exposedInput(accessory, index, pick),
    idleW:
      accessory.feed === 'direct' || accessory.feed === 'linear'
        ? 0
        : pick(
            accessory.idleW,
            `accessories.${index}.idleW`,
            DEFAULT_CONVERTER_IDLE_W[accessory.feed],
            'from memory: no-load draw of a small converter module',
          ),
  }
}

/** The input range the pack's voltage reaches for this accessory (AccessoryInputs.exposedInput). */
function exposedInput(
  accessory: AccessorySpec,
  index: number,
  pick: DefaultPicker,
): AccessoryInputs['exposedInput'] {
  if (accessory.feed === 'direct') return { minV: accessory.inputMinV, maxV: accessory.inputMaxV }
  const { converterInputMinV, converterInputMaxV } = accessory
  if (converterInputMinV !== undefined || converterInputMaxV !== undefined) {
    return { minV: converterInputMinV ?? 0, maxV: converterInputMaxV ?? Number.MAX_VALUE }
  }
  if (accessory.feed !== 'isolated') return null
  // Safe side: small isolated modules are often unregulated, passing the pack's voltage through
  // in a fixed ratio, so without the module's own range the accessory's range is checked.
  return {
    minV: pick(
      undefined,
      `accessories.${index}.converterInputMinV`,
      accessory.inputMinV,
      "ours, safe side: an isolated module taken as unregulated, so the accessory's range applies",
    ),
    maxV: pick(
      undefined,
      `accessories.${index}.converterInputMaxV`,
      accessory.inputMaxV,
      "ours, safe side: an isolated module taken as unregulated, so the accessory's range applies",
    ),
  }
}
