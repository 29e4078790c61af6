import { interpolate } from './table'

export const CHEMISTRIES = ['li-ion', 'lifepo4', 'lead-acid', 'nimh'] as const
export type Chemistry = (typeof CHEMISTRIES)[number]

export interface ChemistryData {
  label: string
  nominalCellV: number
  /** Open-circuit voltage of a cell at 100 % state of charge (the top OCV row). */
  fullCellV: number
  /**
   * A cell straight off the charger, before it rests: the highest voltage any part of the rig can
   * see, so every maximum-voltage check uses it.
   */
  chargedCellV: number
  /** Default cutoff per cell under load. */
  cutoffCellV: number
  /** [state of charge %, open-circuit cell voltage V], resting cell. */
  ocvRows: readonly (readonly [number, number])[]
  /**
   * Cell resistance × cell capacity (ohm·Ah): a bigger cell of the same build has proportionally
   * lower resistance, so the default resistance of a cell is this over its capacity.
   */
  resistanceOhmAh: number
  /** Peukert exponent by default (1: none; lithium uses rateLossPerC instead). */
  peukertExponent: number
  /**
   * Lithium: charge lost beyond I·R per C of discharge rate above the rated (0.2 C) current, as a
   * fraction; 0 where Peukert's law carries the rate effect.
   */
  rateLossPerC: number
  /** Discharge time at which the capacity is rated (the Peukert reference current is C / H). */
  ratedHours: number
  /** [°C, capacity factor], [°C, resistance factor], both 1 at 25 °C. */
  capacityFactorRows: readonly (readonly [number, number])[]
  resistanceFactorRows: readonly (readonly [number, number])[]
  /**
   * The pack's temperature (°C) in which it may be charged, both ends allowed; null where the
   * chemistry charges across the engine's whole temperature range. Narrower than the discharge
   * range: charging is refused outside it (charging.ts, chargingPermitted).
   */
  chargeTemperatureC: { minC: number; maxC: number } | null
  isLithium: boolean
}

export const CHEMISTRY_DATA: Record<Chemistry, ChemistryData> = {
  'li-ion': {
    label: 'Li-ion (NMC/NCA)',
    nominalCellV: 3.6, // common practice: "18 V" tool packs are 5 × 3.6 V
    fullCellV: 4.2, // common practice: NMC/NCA charge end voltage
    chargedCellV: 4.2, // common practice: NMC/NCA chargers stop at 4.20 V per cell
    cutoffCellV: 3.0, // common practice: tool packs and BMS boards cut at 2.8–3.0 V per cell
    // from memory: resting OCV of NMC cells at 25 °C; makers' curves differ by a few tens of mV
    ocvRows: [
      [0, 3.0],
      [5, 3.3],
      [10, 3.45],
      [20, 3.56],
      [30, 3.63],
      [40, 3.69],
      [50, 3.75],
      [60, 3.82],
      [70, 3.91],
      [80, 3.99],
      [90, 4.08],
      [100, 4.2],
    ],
    resistanceOhmAh: 0.075, // from memory: a 2.5 Ah 18650 power cell measures about 30 mΩ DC
    // No Peukert on top of I·R for lithium: the I·R sag is modelled, and beyond it makers' curves
    // lose little (rateLossPerC below).
    peukertExponent: 1,
    // from memory: makers' discharge curves of power 18650 cells (Samsung SDI INR18650-25R,
    // Sony/Murata US18650VTC5 datasheets) give within a few % of the 0.2 C capacity at 1–8 C;
    // beyond the I·R sag the model already holds, about 1–3 % at 1 C, hence 2 % per C, capped
    rateLossPerC: 0.02,
    ratedHours: 5, // IEC 61960: capacity rated at 0.2 C
    // from memory: makers' curves for NMC cells, about 85 % at 0 °C and 60 % at −20 °C
    capacityFactorRows: [
      [-20, 0.6],
      [-10, 0.75],
      [0, 0.85],
      [10, 0.93],
      [25, 1],
      [45, 1],
      [60, 0.97],
    ],
    // from memory: DC resistance roughly doubles near 0 °C and quadruples at −20 °C
    resistanceFactorRows: [
      [-20, 4],
      [-10, 2.5],
      [0, 1.8],
      [10, 1.3],
      [25, 1],
      [45, 0.85],
      [60, 0.8],
    ],
    // Makers' datasheets: Samsung SDI ICR18650-26C specification, charge 0 to 45 °C (discharge
    // −10 to 60 °C); Panasonic NCR18650B charge 0 to +45 °C, discharge −20 to +60 °C (from
    // memory); Samsung SDI INR18650-25R charge 0 to 50 °C (from memory). Common practice: never
    // charge lithium below 0 °C (lithium plates on the anode). The lower top, 45 °C, errs safe.
    chargeTemperatureC: { minC: 0, maxC: 45 },
    isLithium: true,
  },
  lifepo4: {
    label: 'LiFePO4',
    nominalCellV: 3.2, // common practice: "12.8 V" LiFePO4 packs are 4 × 3.2 V
    fullCellV: 3.6, // from memory: just off the charger (3.65 V charge end); it rests near 3.4 V
    chargedCellV: 3.65, // common practice: LiFePO4 chargers stop at 3.65 V per cell
    cutoffCellV: 2.5, // common practice: LiFePO4 BMS undervoltage cut at 2.5 V per cell
    // from memory: the flat LiFePO4 plateau at 3.25–3.35 V, steep at both ends
    ocvRows: [
      [0, 2.5],
      [5, 3.0],
      [10, 3.15],
      [20, 3.22],
      [30, 3.26],
      [40, 3.28],
      [50, 3.3],
      [60, 3.31],
      [70, 3.32],
      [80, 3.33],
      [90, 3.35],
      [95, 3.4],
      [100, 3.6],
    ],
    resistanceOhmAh: 0.05, // from memory: a 3.3 Ah 26650 cell about 15 mΩ, a 100 Ah prismatic 0.5 mΩ
    peukertExponent: 1,
    // from memory: LiFePO4 makers' curves (A123 ANR26650M1 datasheet) nearly overlap from 1 C to
    // 10 C once the I·R sag is taken out: 1 % per C, capped
    rateLossPerC: 0.01,
    ratedHours: 5, // IEC 61960: capacity rated at 0.2 C
    // from memory: makers' curves, LiFePO4 loses more than NMC in the cold
    capacityFactorRows: [
      [-20, 0.55],
      [-10, 0.7],
      [0, 0.85],
      [10, 0.93],
      [25, 1],
      [45, 1],
      [60, 0.97],
    ],
    resistanceFactorRows: [
      [-20, 5],
      [-10, 3],
      [0, 1.9],
      [10, 1.35],
      [25, 1],
      [45, 0.85],
      [60, 0.8],
    ],
    // Makers' datasheets (from memory): A123 ANR26650M1-B and other LiFePO4 26650 cells charge
    // 0 to 55 °C; packs' BMS boards commonly stop charging at 45 °C (common practice), and a pack
    // warms as it charges, so 45 °C errs to the safe side. Below 0 °C: never (common practice).
    chargeTemperatureC: { minC: 0, maxC: 45 },
    isLithium: true,
  },
  'lead-acid': {
    label: 'Lead-acid (AGM/gel)',
    nominalCellV: 2.0, // common practice: a "12 V" battery is 6 × 2 V cells
    fullCellV: 12.7 / 6, // from memory: 12.7 V resting for a full 12 V AGM battery
    chargedCellV: 2.45, // common practice: AGM absorption charge at 2.45 V per cell (14.7 V)
    cutoffCellV: 1.75, // common practice: 10.5 V under load for a 12 V battery
    // from memory: the common resting-voltage chart for 12 V AGM, 12.7 / 12.4 / 12.2 / 12.0 / 11.8 V
    // at 100 / 75 / 50 / 25 / 0 %, here per cell
    ocvRows: [
      [0, 11.8 / 6],
      [25, 12.0 / 6],
      [50, 12.2 / 6],
      [75, 12.4 / 6],
      [100, 12.7 / 6],
    ],
    resistanceOhmAh: 0.04, // from memory: a 12 V 7 Ah AGM measures about 25–35 mΩ
    peukertExponent: 1.2, // docs/model.md §1: lead-acid k ≈ 1.1–1.3
    rateLossPerC: 0, // Peukert's law carries lead-acid's rate effect
    ratedHours: 20, // common practice: the 20-hour rate (C20) on lead-acid labels
    // from memory: lead-acid gives about 80 % at 0 °C and 55 % at −20 °C
    capacityFactorRows: [
      [-20, 0.55],
      [-10, 0.68],
      [0, 0.8],
      [10, 0.9],
      [25, 1],
      [40, 1.05],
      [60, 1.08],
    ],
    resistanceFactorRows: [
      [-20, 2.5],
      [-10, 1.9],
      [0, 1.5],
      [10, 1.2],
      [25, 1],
      [40, 0.9],
      [60, 0.85],
    ],
    // Common practice: lead-acid may be charged below 0 °C with a temperature-compensated charge
    // voltage (a good charger does this), so no range is applied here.
    chargeTemperatureC: null,
    isLithium: false,
  },
  nimh: {
    label: 'NiMH',
    nominalCellV: 1.2, // common practice
    fullCellV: 1.4, // from memory: rested just after a full charge
    chargedCellV: 1.45, // common practice: NiMH at the end of a charge, about 1.45 V per cell
    cutoffCellV: 1.0, // common practice: 1.0 V per cell end of discharge
    // from memory: NiMH plateau near 1.2–1.3 V
    ocvRows: [
      [0, 1.0],
      [5, 1.15],
      [10, 1.2],
      [20, 1.23],
      [40, 1.25],
      [60, 1.27],
      [80, 1.3],
      [90, 1.33],
      [100, 1.4],
    ],
    resistanceOhmAh: 0.06, // from memory: a 2 Ah AA cell measures about 30 mΩ
    peukertExponent: 1.1, // from memory
    rateLossPerC: 0, // Peukert's law carries NiMH's rate effect
    ratedHours: 5, // IEC 61951-2: capacity rated at 0.2 It
    // from memory
    capacityFactorRows: [
      [-20, 0.5],
      [-10, 0.7],
      [0, 0.85],
      [10, 0.95],
      [25, 1],
      [45, 0.95],
      [60, 0.85],
    ],
    resistanceFactorRows: [
      [-20, 3],
      [-10, 2],
      [0, 1.5],
      [10, 1.2],
      [25, 1],
      [45, 0.9],
      [60, 0.9],
    ],
    // from memory: NiMH makers give about 0 to 45 °C for a standard charge (fast charge 10 to
    // 45 °C); outside it the cell takes charge poorly and heats.
    chargeTemperatureC: { minC: 0, maxC: 45 },
    isLithium: false,
  },
}

export function cellOpenCircuitV(chemistry: Chemistry, socPct: number): number {
  return interpolate(CHEMISTRY_DATA[chemistry].ocvRows, socPct)
}

export function capacityTemperatureFactor(chemistry: Chemistry, temperatureC: number): number {
  return interpolate(CHEMISTRY_DATA[chemistry].capacityFactorRows, temperatureC)
}

export function resistanceTemperatureFactor(chemistry: Chemistry, temperatureC: number): number {
  return interpolate(CHEMISTRY_DATA[chemistry].resistanceFactorRows, temperatureC)
}

export function defaultCellResistanceOhm(chemistry: Chemistry, cellCapacityAh: number): number {
  return CHEMISTRY_DATA[chemistry].resistanceOhmAh / cellCapacityAh
}
