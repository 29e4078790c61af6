// Accessories and how they are fed (docs/model.md §6). Accessories are wired at the amplifier end of
// the lead, so they see the same supply as the amplifier.
import type { ConverterVerdict } from '../schemas/estimate'

export type AccessoryFeed = 'direct' | 'buck' | 'boost' | 'buck-boost' | 'isolated' | 'linear'

// from memory: typical efficiencies of small converter modules at a few watts
export const DEFAULT_CONVERTER_EFFICIENCY: Record<AccessoryFeed, number> = {
  direct: 1,
  buck: 0.9,
  boost: 0.88,
  'buck-boost': 0.85,
  isolated: 0.8,
  linear: 1, // not used: a linear regulator's efficiency is V_out/V_in
}
// from memory: no-load input power of small converter modules
export const DEFAULT_CONVERTER_IDLE_W: Record<AccessoryFeed, number> = {
  direct: 0,
  buck: 0.05,
  boost: 0.05,
  'buck-boost': 0.1,
  isolated: 0.2,
  linear: 0,
}
// from memory: a buck module needs about 1 V above its output; linear regulators need 0.2 V
// (low-dropout) to 2 V (78xx), 1 V taken here
export const BUCK_HEADROOM_V = 1
export const LINEAR_DROPOUT_V = 1
// from memory: about what a TO-220 regulator sheds in free air without a heatsink
export const LINEAR_HEAT_LIMIT_W = 1

export interface AccessoryInputs {
  label: string
  powerW: number
  inputMinV: number
  inputMaxV: number
  feed: AccessoryFeed
  /** Voltage the converter gives the accessory (unused for direct). */
  outputV: number
  efficiency: number
  idleW: number
  /**
   * The input range of the part the pack's voltage reaches: the accessory itself when fed direct,
   * the converter module's own range when given, else null (a regulated module taken to accept
   * the window). An isolated feed without its module's range takes the accessory's (resolve-accessories.ts).
   */
  exposedInput: { minV: number; maxV: number } | null
}

/** The pack's window over the whole discharge against the accessory's input range. */
export function converterVerdict(
  windowMinV: number,
  windowMaxV: number,
  inputMinV: number,
  inputMaxV: number,
): ConverterVerdict {
  const above = windowMaxV > inputMaxV
  const below = windowMinV < inputMinV
  if (above && below) return 'buck-boost'
  if (above) return windowMinV > inputMaxV ? 'step-down' : 'over-max'
  if (below) return 'step-up'
  return 'direct-ok'
}

/**
 * The verdict for the rig as wired: what the accessory needs from the pack's window, except that a
 * part the pack reaches (a direct accessory, or a converter module with a known input range) with
 * its maximum below the pack straight off the charger is `over-max`, whatever else is wrong.
 */
export function wiredVerdict(
  accessory: AccessoryInputs,
  windowMinV: number,
  windowMaxV: number,
): ConverterVerdict {
  const exposed = accessory.exposedInput
  if (exposed && windowMaxV > exposed.maxV) return 'over-max'
  const needs = converterVerdict(windowMinV, windowMaxV, accessory.inputMinV, accessory.inputMaxV)
  // A converter of unknown range between them keeps the device off the pack's voltage: what the
  // device needs is a step-down, and no part is over its maximum.
  if (!exposed && needs === 'over-max') return 'step-down'
  return needs
}

/** Whether the chosen feed works over the whole window. */
export function feedFits(
  accessory: AccessoryInputs,
  verdict: ConverterVerdict,
  windowMinV: number,
  windowMaxV: number,
): boolean {
  const exposed = accessory.exposedInput
  if (exposed && (windowMaxV > exposed.maxV || windowMinV < exposed.minV)) return false
  switch (accessory.feed) {
    case 'direct':
      return verdict === 'direct-ok'
    case 'buck':
      return windowMinV >= accessory.outputV + BUCK_HEADROOM_V
    case 'linear':
      return windowMinV >= accessory.outputV + LINEAR_DROPOUT_V
    case 'boost':
      return windowMaxV <= accessory.outputV
    case 'buck-boost':
    case 'isolated':
      return true
  }
}

function volts(value: number): string {
  return `${value.toFixed(1)} V`
}

/** What to fit, in plain words. */
export function converterAdvice(
  accessory: AccessoryInputs,
  verdict: ConverterVerdict,
  windowMinV: number,
  windowMaxV: number,
): string {
  const window = `${volts(windowMinV)}–${volts(windowMaxV)}`
  const range = `${volts(accessory.inputMinV)}–${volts(accessory.inputMaxV)}`
  const isolation =
    accessory.feed === 'isolated'
      ? ' The isolated converter also breaks the ground shared with the amplifier, a common cure for hum and whine.'
      : ''
  switch (verdict) {
    case 'direct-ok':
      return `Connect directly: the pack stays within ${window}, inside the accessory's ${range}.${isolation}`
    case 'over-max':
      if (accessory.feed !== 'direct') {
        const maxV = accessory.exposedInput ? accessory.exposedInput.maxV : accessory.inputMaxV
        return `Use a converter rated for more input: a pack straight off the charger gives ${volts(windowMaxV)}, above the ${accessory.feed} converter's maximum input of ${volts(maxV)}.${isolation}`
      }
      return `Fit a step-down (buck) converter: a pack straight off the charger gives ${volts(windowMaxV)}, above the accessory's maximum of ${volts(accessory.inputMaxV)}.${isolation}`
    case 'step-down':
      return `Fit a step-down (buck) converter: the pack (${window}) goes above the accessory's ${range}.${isolation}`
    case 'step-up':
      return `Fit a step-up (boost) converter: the pack falls to ${volts(windowMinV)}, below the accessory's minimum of ${volts(accessory.inputMinV)}.${isolation}`
    case 'buck-boost':
      return `Fit a buck-boost converter: the pack (${window}) goes both above and below the accessory's ${range}.${isolation}`
  }
}

export interface AccessoryLoad {
  /** Constant power taken from the supply (direct and switching feeds). */
  packPowerW: number
  /** Constant current taken from the supply (linear regulators). */
  packCurrentA: number
  /** Power the accessory itself uses. */
  devicePowerW: number
}

/**
 * Pack draw of an accessory. A converter's quoted efficiency already counts its own losses at that
 * load, idle losses included, so the idle draw is their floor, not an addition (which counted it
 * twice): loss = max(P·(1/η − 1), idle). A linear regulator passes the device current.
 */
export function accessoryLoad(accessory: AccessoryInputs): AccessoryLoad {
  if (accessory.feed === 'linear') {
    return {
      packPowerW: 0,
      packCurrentA: accessory.powerW / accessory.outputV,
      devicePowerW: accessory.powerW,
    }
  }
  return {
    packPowerW:
      accessory.powerW +
      Math.max(accessory.powerW / accessory.efficiency - accessory.powerW, accessory.idleW),
    packCurrentA: 0,
    devicePowerW: accessory.powerW,
  }
}

/** Linear regulator efficiency V_out/V_in (docs/model.md §6). */
export function linearRegulatorEfficiency(inputV: number, outputV: number): number {
  return Math.min(outputV / inputV, 1)
}

/** Heat in a linear regulator: (V_in − V_out)·I (docs/model.md §6). */
export function linearRegulatorHeatW(inputV: number, outputV: number, currentA: number): number {
  return Math.max(inputV - outputV, 0) * currentA
}
