// Each accessory against the pack's window, as it is wired (docs/model.md §6).
import type { ConverterResult } from '../schemas/estimate'
import {
  accessoryLoad,
  converterAdvice,
  feedFits,
  linearRegulatorHeatW,
  wiredVerdict,
} from './converters'
import type { ResolvedRequest } from './resolve'

/** Each accessory against the pack's window over the whole discharge, as it is wired. */
export function converterResults(
  resolved: ResolvedRequest,
  windowMaxV: number,
  windowMinV: number,
): ConverterResult[] {
  return resolved.accessories.map((accessory) => {
    const verdict = wiredVerdict(accessory, windowMinV, windowMaxV)
    const load = accessoryLoad(accessory)
    const isLinear = accessory.feed === 'linear'
    const linearHeatW = isLinear
      ? linearRegulatorHeatW(windowMaxV, accessory.outputV, load.packCurrentA)
      : 0
    const packDrawW = isLinear ? windowMaxV * load.packCurrentA : load.packPowerW
    return {
      label: accessory.label,
      verdict,
      feed: accessory.feed,
      fits: feedFits(accessory, verdict, windowMinV, windowMaxV),
      advice: converterAdvice(accessory, verdict, windowMinV, windowMaxV),
      windowMinV,
      windowMaxV,
      suppliedV: accessory.feed === 'direct' ? windowMaxV : accessory.outputV,
      packDrawW,
      lossW: packDrawW - accessory.powerW,
      linearHeatW,
    }
  })
}
