import { awgToAreaMm2 } from '../units'

export const COPPER_RESISTIVITY_OHM_M = 1.7241e-8 // IEC 60028: annealed copper at 20 °C
export const COPPER_TEMPERATURE_COEFFICIENT_PER_K = 0.00393 // IEC 60028: α at 20 °C
// from memory: a pair of good connectors (about 0.5 mΩ each) plus a blade fuse and holder (a few mΩ)
export const DEFAULT_CONNECTOR_OHM = 0.005

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

/** Round-trip resistance: out and back (2L) plus the connector and fuse allowance (engine.md §2). */
export function leadResistanceOhm(leads: LeadInputs, temperatureC: number): number {
  const conductorOhm =
    (conductorResistanceOhmPerKm(leads.areaMm2, temperatureC) / 1000) * 2 * leads.lengthM
  return conductorOhm + leads.connectorOhm
}
