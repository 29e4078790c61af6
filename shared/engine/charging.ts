// Charging a pack from a charger's power (docs/model.md §12, docs/events.md "Charging"): a pack
// in the rig at a charging break in the run (run-segments.ts, chargeThrough) and a pack on an
// event's charger (shared/events: how long to full, and the charge on the way). One conversion,
// I = P / OCV, one open-circuit curve (pack.ts) and one charge temperature range serve both.
import { CHEMISTRY_DATA, type Chemistry } from './chemistry'
import { packOpenCircuitVAt } from './pack'

/**
 * Whether a pack of `chemistry` at `temperatureC` may be charged: inside its maker's charge
 * range, both ends allowed (chemistry.ts, chargeTemperatureC). Outside it a charger must give the
 * pack nothing: lithium charged below 0 °C plates lithium on the anode, a fire risk later.
 */
export function chargingPermitted(chemistry: Chemistry, temperatureC: number): boolean {
  const range = CHEMISTRY_DATA[chemistry].chargeTemperatureC
  return range === null || (temperatureC >= range.minC && temperatureC <= range.maxC)
}

/**
 * Current that `chargeW` (power into the pack, after the charger) gives a pack resting at
 * `openCircuitV`: I = P / V, the definition of electric power (P = V·I). Taking the open-circuit
 * voltage (not the charger's terminal voltage, which is higher by I·R) counts the energy that
 * ends up stored; the I·R heat in the pack is the charger's loss, not stored charge.
 * Coulombic losses (under 1 % for lithium, several % for lead-acid near full: from memory) are
 * left to `chargeW`: enter what the pack takes, not what the charger is rated for.
 */
export function chargingCurrentA(chargeW: number, openCircuitV: number): number {
  return chargeW / openCircuitV
}

/**
 * Charge a pack takes in from `chargeW` over `minutes` at open-circuit `packOpenCircuitV`:
 * Q = I·t, and never more than the room left to full (`roomToFullAh` = capacity minus the charge
 * in the pack now). Ah, ≥ 0. The run's charging step.
 */
export function chargeAh(
  chargeW: number,
  packOpenCircuitV: number,
  minutes: number,
  roomToFullAh: number,
): number {
  if (chargeW <= 0 || minutes <= 0 || roomToFullAh <= 0 || packOpenCircuitV <= 0) return 0
  const ah = chargingCurrentA(chargeW, packOpenCircuitV) * (minutes / 60)
  return Math.min(ah, roomToFullAh)
}

/**
 * Power into the pack from a charger's input power and its efficiency (η = P_out / P_in, the
 * definition of efficiency): a 60 W car socket through an 85 % charger gives the pack 51 W.
 */
export function powerIntoPackW(chargerInputW: number, chargerEfficiency: number): number {
  return Math.max(0, chargerInputW) * Math.min(Math.max(chargerEfficiency, 0), 1)
}

/** A pack on a charger, as an event knows it. */
export interface ChargeablePack {
  chemistry: Chemistry
  seriesCells: number
  /** The charge the pack holds when full (rated capacity × health). */
  capacityAh: number
}

// Steps of 1 % of state of charge: the open-circuit rows sit on whole percents, so a finer step
// changes nothing but the cost.
const STEP_PCT = 1

/**
 * Walks a charge from `fromSocPct` up to full in steps of STEP_PCT: each step's charge over the
 * current `chargeW` gives at the open-circuit voltage in the step's middle (chargingCurrentA).
 * `visit` gets each step's start, size and hours, and returns false to stop the walk.
 * Returns where the walk stopped.
 */
function walkToFull(
  pack: ChargeablePack,
  fromSocPct: number,
  chargeW: number,
  visit: (socPct: number, stepPct: number, stepH: number) => boolean,
): number {
  let socPct = Math.min(Math.max(fromSocPct, 0), 100)
  while (socPct < 100) {
    const stepPct = Math.min(STEP_PCT - (socPct % STEP_PCT) || STEP_PCT, 100 - socPct)
    const middleV = packOpenCircuitVAt(pack, socPct + stepPct / 2)
    const stepH = ((stepPct / 100) * pack.capacityAh) / chargingCurrentA(chargeW, middleV)
    if (!visit(socPct, stepPct, stepH)) return socPct
    socPct += stepPct
  }
  return socPct
}

/**
 * Hours to bring a pack from `fromSocPct` to full with `chargeW` going into it, the way a
 * constant-power source fills a battery. Assumed: the power holds up to full. Real chargers slow
 * down near full (the constant-voltage stage), so a real pack can take longer than this: the
 * event's answer says so beside every charge.
 */
export function chargeHoursToFull(
  pack: ChargeablePack,
  fromSocPct: number,
  chargeW: number,
): number {
  if (!(chargeW > 0) || !(pack.capacityAh > 0)) return Number.POSITIVE_INFINITY
  let hours = 0
  walkToFull(pack, fromSocPct, chargeW, (_socPct, _stepPct, stepH) => {
    hours += stepH
    return true
  })
  return hours
}

/** State of charge reached after `hours` on a charger from `fromSocPct` (the same walk). */
export function socAfterChargingPct(
  pack: ChargeablePack,
  fromSocPct: number,
  chargeW: number,
  hours: number,
): number {
  if (!(chargeW > 0) || !(pack.capacityAh > 0)) return fromSocPct
  let remainingH = Math.max(hours, 0)
  let withinStepPct = 0
  const stoppedPct = walkToFull(pack, fromSocPct, chargeW, (_socPct, stepPct, stepH) => {
    if (!(remainingH > 0)) return false
    // Partway through a step: the share of the step's time that is left.
    if (stepH > remainingH) {
      withinStepPct = (stepPct * remainingH) / stepH
      return false
    }
    remainingH -= stepH
    return true
  })
  return stoppedPct + withinStepPct
}
