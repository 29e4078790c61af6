import { CHEMISTRY_DATA, capacityTemperatureFactor, resistanceTemperatureFactor } from './chemistry'
import type { Chemistry } from './chemistry'
import { interpolate } from './table'

/** Pack inputs with every default already applied (see resolve-pack.ts). */
export interface PackInputs {
  chemistry: Chemistry
  seriesCells: number
  parallelCells: number
  cellCapacityAh: number
  cellResistanceOhm: number
  cutoffCellV: number
  healthPct: number
  peukertExponent: number
  /** Lithium rate loss beyond I·R per C (chemistry.ts); 0 or absent: none. */
  rateLossPerC?: number
}

export interface PackModel {
  chemistry: Chemistry
  nominalV: number
  fullV: number
  /** Straight off the charger (chargedCellV per cell): what every maximum-voltage check uses. */
  chargedV: number
  cutoffV: number
  /** Label capacity: parallel cells × cell capacity. */
  ratedCapacityAh: number
  /** What this pack can give today: rated × health × temperature factor. */
  capacityAh: number
  resistanceOhm: number
  peukertExponent: number
  /** Peukert reference current: rated capacity over its rated hours. */
  ratedCurrentA: number
  /** Lithium: fraction of charge lost beyond I·R per ampere above ratedCurrentA (0: none). */
  rateLossPerA: number
  /** Pack open-circuit voltage sampled every 1 % of state of charge, for a fast lookup. */
  openCircuitTableV: Float64Array
}

// Every OCV row sits on a whole percent, so sampling at 1 % loses nothing between rows.
const OCV_SAMPLES_PER_UNIT = 100

export function buildPack(inputs: PackInputs, temperatureC: number): PackModel {
  const data = CHEMISTRY_DATA[inputs.chemistry]
  const ratedCapacityAh = inputs.parallelCells * inputs.cellCapacityAh
  const table = new Float64Array(OCV_SAMPLES_PER_UNIT + 1)
  for (let i = 0; i <= OCV_SAMPLES_PER_UNIT; i++) {
    table[i] = packOpenCircuitVAt(inputs, (100 * i) / OCV_SAMPLES_PER_UNIT)
  }
  return {
    chemistry: inputs.chemistry,
    nominalV: inputs.seriesCells * data.nominalCellV, // docs/model.md §1
    fullV: inputs.seriesCells * data.fullCellV,
    chargedV: inputs.seriesCells * data.chargedCellV,
    cutoffV: inputs.seriesCells * inputs.cutoffCellV,
    ratedCapacityAh,
    // docs/model.md §1: capacity = p × cell Ah × health × temperature factor
    capacityAh:
      ratedCapacityAh *
      (inputs.healthPct / 100) *
      capacityTemperatureFactor(inputs.chemistry, temperatureC),
    // docs/model.md §1: resistance = s × cell resistance / p, times a cold-temperature factor
    resistanceOhm:
      ((inputs.seriesCells * inputs.cellResistanceOhm) / inputs.parallelCells) *
      resistanceTemperatureFactor(inputs.chemistry, temperatureC),
    peukertExponent: inputs.peukertExponent,
    ratedCurrentA: ratedCapacityAh / data.ratedHours,
    // per C → per ampere of this pack
    rateLossPerA: (inputs.rateLossPerC ?? 0) / ratedCapacityAh,
    openCircuitTableV: table,
  }
}

// common practice: cell makers' cycle-life tests and battery standards call a cell worn out at
// 80 % of its capacity or at twice its new resistance, whichever comes first (e.g. the end-of-life
// criteria of IEC 62660-1 cycle tests and of IEEE 1188 for stationary lead-acid); linking the two,
// resistance rises in a straight line as health falls and doubles at 80 % health
const HEALTH_AT_DOUBLED_RESISTANCE_PCT = 80

/** How much a cell's resistance has grown at this health (1 when new or better than labelled). */
export function ageingResistanceFactor(healthPct: number): number {
  const lostPct = Math.max(100 - healthPct, 0)
  return 1 + lostPct / (100 - HEALTH_AT_DOUBLED_RESISTANCE_PCT)
}

/**
 * Pack open-circuit voltage at a state of charge in percent, from the chemistry's rows
 * (docs/model.md §1, "Open-circuit voltage"): cells in series times the resting cell voltage.
 */
export function packOpenCircuitVAt(
  pack: { chemistry: Chemistry; seriesCells: number },
  socPct: number,
): number {
  return pack.seriesCells * interpolate(CHEMISTRY_DATA[pack.chemistry].ocvRows, socPct)
}

/** Pack open-circuit voltage at a state of charge given as a fraction 0..1 (from the table). */
export function packOpenCircuitV(pack: PackModel, socFraction: number): number {
  const position = Math.min(Math.max(socFraction, 0), 1) * OCV_SAMPLES_PER_UNIT
  const index = Math.min(Math.floor(position), OCV_SAMPLES_PER_UNIT - 1)
  const lower = pack.openCircuitTableV[index]!
  const upper = pack.openCircuitTableV[index + 1]!
  return lower + (position - index) * (upper - lower)
}

/** The state of charge (fraction) at which the pack at rest reads `openCircuitV`: 0 if it reads
 *  more even when empty, 1 if it reads less even when full (the OCV rises with charge). */
export function socAtOpenCircuitV(pack: PackModel, openCircuitV: number): number {
  const table = pack.openCircuitTableV
  if (openCircuitV <= table[0]!) return 0
  if (openCircuitV >= table[OCV_SAMPLES_PER_UNIT]!) return 1
  let index = 0
  while (table[index + 1]! < openCircuitV) index++
  const lower = table[index]!
  const upper = table[index + 1]!
  const within = upper > lower ? (openCircuitV - lower) / (upper - lower) : 0
  return (index + within) / OCV_SAMPLES_PER_UNIT
}

/** Returned by the current solves when the source cannot deliver the power at all. A number,
 *  not null, so the step loop's hot functions stay monomorphic. */
export const CANNOT_DELIVER = -1

/**
 * Current drawn by a constant power P from a source of open-circuit voltage E through R: the
 * smaller root of R·I² − E·I + P = 0 (docs/model.md §1), written as 2P / (E + √(E² − 4RP)) so it
 * stays exact as R → 0. Returns CANNOT_DELIVER when E² < 4RP.
 */
export function constantPowerCurrentA(
  openCircuitV: number,
  resistanceOhm: number,
  powerW: number,
): number {
  if (powerW <= 0) return 0
  if (openCircuitV <= 0) return CANNOT_DELIVER
  const discriminant = openCircuitV * openCircuitV - 4 * resistanceOhm * powerW
  if (discriminant < 0) return CANNOT_DELIVER
  return (2 * powerW) / (openCircuitV + Math.sqrt(discriminant))
}

/**
 * Current for a load that is part constant current (idle, class AB/A supply current, linear
 * regulators) and part constant power (class D output, switching converters): the constant
 * current lowers the voltage the constant-power part sees to E − Ic·R, then the same root.
 */
export function mixedLoadCurrentA(
  openCircuitV: number,
  resistanceOhm: number,
  constantCurrentA: number,
  constantPowerW: number,
): number {
  const effectiveV = openCircuitV - constantCurrentA * resistanceOhm
  if (effectiveV <= 0) return CANNOT_DELIVER
  const powerCurrentA = constantPowerCurrentA(effectiveV, resistanceOhm, constantPowerW)
  return powerCurrentA === CANNOT_DELIVER ? CANNOT_DELIVER : constantCurrentA + powerCurrentA
}

/**
 * Rate at which charge leaves the pack under Peukert's law (docs/model.md §1):
 * dQ/dt = I·(I/I_rated)^(k−1) above the rated current, I below it.
 */
export function peukertChargeRateA(
  currentA: number,
  ratedCurrentA: number,
  peukertExponent: number,
): number {
  // Common practice: the law is fitted from the rated current upwards; below it a pack gives its
  // rated capacity, not more (more would exceed the energy its own OCV table holds).
  if (currentA <= ratedCurrentA || peukertExponent === 1) return currentA
  // exp(a·ln x) is x^a, about twice as fast as Math.pow in V8, and this runs every step.
  return currentA * Math.exp((peukertExponent - 1) * Math.log(currentA / ratedCurrentA))
}

// from memory: makers' curves flatten out: the loss beyond I·R stays within about 5 % even at
// the highest rates a power cell is rated for (chemistry.ts names the datasheets)
export const LITHIUM_RATE_LOSS_MAX = 0.05

/**
 * Rate at which charge leaves the pack: Peukert's law where the chemistry (or the user) gives an
 * exponent, times the lithium rate loss beyond I·R (rateLossPerA above the rated current, capped).
 */
export function chargeRateA(pack: PackModel, currentA: number): number {
  const rateA = peukertChargeRateA(currentA, pack.ratedCurrentA, pack.peukertExponent)
  if (pack.rateLossPerA === 0 || currentA <= pack.ratedCurrentA) return rateA
  const loss = (currentA - pack.ratedCurrentA) * pack.rateLossPerA
  return rateA * (1 + (loss < LITHIUM_RATE_LOSS_MAX ? loss : LITHIUM_RATE_LOSS_MAX))
}

/** Peukert's law in closed form, t = H·(C/(I·H))^k (docs/model.md §1). */
export function peukertRuntimeHours(
  capacityAh: number,
  ratedHours: number,
  currentA: number,
  peukertExponent: number,
): number {
  return ratedHours * (capacityAh / (currentA * ratedHours)) ** peukertExponent
}
