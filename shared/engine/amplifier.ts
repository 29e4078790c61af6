// Amplifier model (docs/model.md §4), per channel unless a name says otherwise.

export type AmplifierClass = 'd' | 'ab' | 'a'

export const DEFAULT_CLASS_D_EFFICIENCY = 0.88 // docs/model.md §4 default
// Boylestad & Nashelsky, Electronic Devices and Circuit Theory, ch. 12: series-fed class A
// reaches at most 25 % at full output (50 % transformer- or push-pull-fed: set it if so)
export const DEFAULT_CLASS_A_EFFICIENCY = 0.25
export const DEFAULT_IDLE_CURRENT_A = 0.05 // from memory: small class D boards idle at 20–80 mA
// from memory: class AB power chips (bridged pairs of the common 20–50 W parts) quiesce at
// 0.1–0.25 A; the middle of that range
export const DEFAULT_CLASS_AB_IDLE_CURRENT_A = 0.15
// common practice: a board's headline power is usually its 10 % THD figure (clipping hard)
export const DEFAULT_RATED_THD_PCT = 10
// from memory: a 10 % THD rating is roughly 1 dB above the clean 1 % figure (docs/model.md §4)
const THD_10_PCT_EXCESS_DB = 1

/** dB by which a rating at this THD exceeds the clean figure: 0 at 1 %, 1 dB at 10 % and above,
 *  log-linear between. */
export function ratingExcessDb(ratedThdPct: number): number {
  return Math.min(Math.max(Math.log10(ratedThdPct), 0), 1) * THD_10_PCT_EXCESS_DB
}

/** Peak swing available at the load per volt of supply, before R_out: bridged V_s, else V_s/2. */
function swingPerSupplyV(bridged: boolean): number {
  return bridged ? 1 : 0.5
}

/**
 * Output resistance from a datasheet point (docs/model.md §4): V_pk,r = √(2·P_r·R_r),
 * R_out = R_r·(swing/V_pk,r − 1) where swing is V_r bridged or V_r/2 single-ended.
 * A rating above the ideal swing gives a negative value, clamped to 0 (reported as a warning).
 */
export function outputResistanceOhm(
  cleanRatedPowerW: number,
  ratedLoadOhm: number,
  ratedSupplyV: number,
  bridged: boolean,
): { outputResistanceOhm: number; clamped: boolean } {
  const ratedPeakV = Math.sqrt(2 * cleanRatedPowerW * ratedLoadOhm)
  const value = ratedLoadOhm * ((swingPerSupplyV(bridged) * ratedSupplyV) / ratedPeakV - 1)
  return { outputResistanceOhm: Math.max(value, 0), clamped: value < 0 }
}

/** Clip power as a multiple of V_s²: P_clip = (swing·V_s·Z/(Z + R_out))² / (2Z). */
export function clipPowerPerSupplyV2(
  loadOhm: number,
  outputResistanceOhm: number,
  bridged: boolean,
): number {
  const divider = (swingPerSupplyV(bridged) * loadOhm) / (loadOhm + outputResistanceOhm)
  return (divider * divider) / (2 * loadOhm)
}

export function clipPowerW(
  supplyV: number,
  loadOhm: number,
  outputResistanceOhm: number,
  bridged: boolean,
): number {
  return clipPowerPerSupplyV2(loadOhm, outputResistanceOhm, bridged) * supplyV * supplyV
}

/**
 * Class AB/B supply current of one channel: mean|i| = k·V_rms/Z (docs/model.md §4), drawn from the
 * full supply when bridged and, single-ended on one supply, only on the half-cycles that source
 * current through the output capacitor (half of it: V_s/2 in place of V_s in P_in = V_s·mean|i|).
 */
export function classAbSupplyCurrentA(
  outputW: number,
  loadOhm: number,
  meanToRms: number,
  bridged: boolean,
): number {
  const meanLoadCurrentA = (meanToRms * Math.sqrt(outputW * loadOhm)) / loadOhm
  return bridged ? meanLoadCurrentA : meanLoadCurrentA / 2
}

/** Class A bias current of one channel from its rating: P_in = V_r·I_bias = P_r/η_max. */
export function classABiasCurrentA(
  ratedPowerW: number,
  ratedSupplyV: number,
  efficiencyAtRated: number,
): number {
  return ratedPowerW / (efficiencyAtRated * ratedSupplyV)
}

export interface AmplifierModel {
  ampClass: AmplifierClass
  channels: number
  bridged: boolean
  loadOhm: number
  outputResistanceOhm: number
  /** P_clip per channel = this × V_s². */
  clipPowerPerV2: number
  /** Class D conversion efficiency (class A: its efficiency at rated output). */
  efficiency: number
  /** Whole amplifier, classes D and AB. */
  idleCurrentA: number
  /** Whole amplifier, class A only (it draws this whatever it plays). */
  biasCurrentA: number
  lockoutV: number | null
  /** Bulk supply capacitance on the board (0: none taken). */
  bulkCapacitanceF: number
}

/** Supply current that does not depend on the supply voltage (constant-current part). */
export function amplifierConstantCurrentA(
  amplifier: AmplifierModel,
  outputPerChannelW: number,
  playingShare: number,
  meanToRms: number,
): number {
  switch (amplifier.ampClass) {
    case 'd':
      return amplifier.idleCurrentA
    case 'ab':
      return (
        amplifier.idleCurrentA +
        amplifier.channels *
          playingShare *
          classAbSupplyCurrentA(outputPerChannelW, amplifier.loadOhm, meanToRms, amplifier.bridged)
      )
    case 'a':
      return amplifier.biasCurrentA
  }
}

/** Supply power that does not depend on the supply voltage (class D: P_out/η). */
export function amplifierConstantPowerW(amplifier: AmplifierModel, averageOutputW: number) {
  return amplifier.ampClass === 'd' ? averageOutputW / amplifier.efficiency : 0
}

/** Power the amplifier takes from its supply at voltage V. */
export function amplifierInputW(
  amplifier: AmplifierModel,
  supplyV: number,
  outputPerChannelW: number,
  playingShare: number,
  meanToRms: number,
): number {
  const averageOutputW = amplifier.channels * outputPerChannelW * playingShare
  return (
    supplyV * amplifierConstantCurrentA(amplifier, outputPerChannelW, playingShare, meanToRms) +
    amplifierConstantPowerW(amplifier, averageOutputW)
  )
}
