// How long a pack takes to fill on a charger. Written apart from the engine's discharge run on
// purpose: the engine may later gain its own charging segment, and both can then share one
// function (docs/events.md, "Later: one charging function").
import { CHEMISTRY_DATA, type Chemistry } from '../engine/chemistry'
import { interpolate } from '../engine/table'

export interface ChargeablePack {
  chemistry: Chemistry
  seriesCells: number
  /** The charge the pack holds when full (rated capacity × health). */
  capacityAh: number
}

// Steps of 1 % of state of charge: the open-circuit rows sit on whole percents, so a finer step
// changes nothing but the cost.
const STEP_PCT = 1

/** Pack open-circuit voltage at a state of charge in percent, from the chemistry's rows. */
export function packOpenCircuitVAt(
  pack: Pick<ChargeablePack, 'chemistry' | 'seriesCells'>,
  socPct: number,
): number {
  return pack.seriesCells * interpolate(CHEMISTRY_DATA[pack.chemistry].ocvRows, socPct)
}

/**
 * Hours to bring a pack from `fromSocPct` to full with `chargeW` going into it. The charger's
 * power is converted to current at the pack's open-circuit voltage (I = P / OCV), the way a
 * constant-power source fills a battery; charge accepted is counted in ampere-hours.
 *
 * Assumed: the power holds up to full. Real chargers slow down near full (the constant-voltage
 * stage), so a real pack can take longer than this: the answer says so beside every charge.
 */
export function chargeHoursToFull(
  pack: ChargeablePack,
  fromSocPct: number,
  chargeW: number,
): number {
  if (!(chargeW > 0) || !(pack.capacityAh > 0)) return Number.POSITIVE_INFINITY
  let hours = 0
  let socPct = Math.min(Math.max(fromSocPct, 0), 100)
  while (socPct < 100) {
    const stepPct = Math.min(STEP_PCT - (socPct % STEP_PCT) || STEP_PCT, 100 - socPct)
    const middleV = packOpenCircuitVAt(pack, socPct + stepPct / 2)
    // Charge needed for the step over the current the power gives at that voltage.
    hours += ((stepPct / 100) * pack.capacityAh) / (chargeW / middleV)
    socPct += stepPct
  }
  return hours
}

/** State of charge reached after `hours` on a charger from `fromSocPct` (the inverse walk). */
export function socAfterChargingPct(
  pack: ChargeablePack,
  fromSocPct: number,
  chargeW: number,
  hours: number,
): number {
  if (!(chargeW > 0) || !(pack.capacityAh > 0)) return fromSocPct
  let remainingH = Math.max(hours, 0)
  let socPct = Math.min(Math.max(fromSocPct, 0), 100)
  while (socPct < 100 && remainingH > 0) {
    const stepPct = Math.min(STEP_PCT - (socPct % STEP_PCT) || STEP_PCT, 100 - socPct)
    const middleV = packOpenCircuitVAt(pack, socPct + stepPct / 2)
    const stepH = ((stepPct / 100) * pack.capacityAh) / (chargeW / middleV)
    if (stepH > remainingH) return socPct + (stepPct * remainingH) / stepH
    remainingH -= stepH
    socPct += stepPct
  }
  return socPct
}
