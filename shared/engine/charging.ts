// Charging during the day: a pack on a charger at a break (a car socket, a solar panel, a
// venue's mains at lunch). The rig is silent; the pack gains charge up to full.

/**
 * Charge a pack takes in from `chargeW` (power into the pack, after the charger) over `minutes`,
 * converted at its open-circuit voltage: I = chargeW / OCV, Q = I·t, and never more than the
 * room left to full (`roomToFullAh` = capacity minus the charge in the pack now). Ah, ≥ 0.
 *
 * Q = P·t / V is the definition of electric charge and power (P = V·I). Taking the open-circuit
 * voltage (not the charger's terminal voltage, which is higher by I·R) counts the energy that
 * ends up stored; the I·R heat in the pack is the charger's loss, not stored charge.
 * Coulombic losses (under 1 % for lithium, several % for lead-acid near full: from memory) are
 * left to `chargeW`: enter what the pack takes, not what the charger is rated for.
 */
export function chargeAh(
  chargeW: number,
  packOpenCircuitV: number,
  minutes: number,
  roomToFullAh: number,
): number {
  if (chargeW <= 0 || minutes <= 0 || roomToFullAh <= 0 || packOpenCircuitV <= 0) return 0
  const ah = (chargeW / packOpenCircuitV) * (minutes / 60)
  return Math.min(ah, roomToFullAh)
}

/**
 * Power into the pack from a charger's input power and its efficiency (η = P_out / P_in, the
 * definition of efficiency): a 60 W car socket through an 85 % charger gives the pack 51 W.
 */
export function powerIntoPackW(chargerInputW: number, chargerEfficiency: number): number {
  return Math.max(0, chargerInputW) * Math.min(Math.max(chargerEfficiency, 0), 1)
}
