import { awgToAreaMm2 } from '../units'

export const COPPER_RESISTIVITY_OHM_M = 1.7241e-8 // IEC 60028: annealed copper at 20 °C
export const COPPER_TEMPERATURE_COEFFICIENT_PER_K = 0.00393 // IEC 60028: α at 20 °C
// from memory: a pair of good connectors (about 0.5 mΩ each) plus a blade fuse and holder (a few mΩ)
export const DEFAULT_CONNECTOR_OHM = 0.005

/**
 * Flexible cord sizes and the largest rated current each carries: IEC 60335-1 Table 11, minimum
 * cross-sections of supply cords (from memory). A cautious basis for battery leads, which are
 * flexible, bundled in pairs and often run inside a cabinet.
 */
export const CORD_RATINGS: readonly { areaMm2: number; currentA: number }[] = [
  { areaMm2: 0.5, currentA: 3 },
  { areaMm2: 0.75, currentA: 6 },
  { areaMm2: 1, currentA: 10 },
  { areaMm2: 1.5, currentA: 16 },
  { areaMm2: 2.5, currentA: 25 },
  { areaMm2: 4, currentA: 32 },
  { areaMm2: 6, currentA: 40 },
  { areaMm2: 10, currentA: 63 },
]
// ours: outside the table, the current density at its ends (3 A in 0.5 mm², 63 A in 10 mm²)
const THIN_CORD_A_PER_MM2 = 6
const THICK_CORD_A_PER_MM2 = 6.3
// ours: AWG areas miss the metric sizes by a few per cent (18 AWG is 0.82 mm²), so a lead within
// 3 % of a table size counts as that size.
const SIZE_TOLERANCE = 0.97

/** The continuous current a copper lead of this cross-section is rated for (CORD_RATINGS). */
export function leadCurrentRatingA(areaMm2: number): number {
  const first = CORD_RATINGS[0]!
  const last = CORD_RATINGS[CORD_RATINGS.length - 1]!
  if (areaMm2 < first.areaMm2 * SIZE_TOLERANCE) return areaMm2 * THIN_CORD_A_PER_MM2
  if (areaMm2 > last.areaMm2) return areaMm2 * THICK_CORD_A_PER_MM2
  // Between two sizes a lead is rated as the thinner one.
  let ratingA = first.currentA
  for (const size of CORD_RATINGS)
    if (areaMm2 >= size.areaMm2 * SIZE_TOLERANCE) ratingA = size.currentA
  return ratingA
}

/** The thinnest lead (cross-section in mm²) rated for this continuous current. */
export function leadAreaForCurrentMm2(currentA: number): number {
  const size = CORD_RATINGS.find((candidate) => candidate.currentA >= currentA)
  return size ? size.areaMm2 : currentA / THICK_CORD_A_PER_MM2
}

export interface LeadInputs {
  areaMm2: number
  /** One-way length of the two-conductor lead. */
  lengthM: number
  connectorOhm: number
}

export function leadAreaMm2(leads: { awg?: number | undefined; areaMm2?: number | undefined }) {
  return leads.areaMm2 ?? awgToAreaMm2(leads.awg ?? 0)
}

export function copperResistivityOhmM(temperatureC: number): number {
  return COPPER_RESISTIVITY_OHM_M * (1 + COPPER_TEMPERATURE_COEFFICIENT_PER_K * (temperatureC - 20))
}

export function conductorResistanceOhmPerKm(areaMm2: number, temperatureC: number): number {
  return (copperResistivityOhmM(temperatureC) / (areaMm2 * 1e-6)) * 1000
}

/** Round-trip resistance: out and back (2L) plus the connector and fuse allowance (docs/model.md §2). */
export function leadResistanceOhm(leads: LeadInputs, temperatureC: number): number {
  const conductorOhm =
    (conductorResistanceOhmPerKm(leads.areaMm2, temperatureC) / 1000) * 2 * leads.lengthM
  return conductorOhm + leads.connectorOhm
}
