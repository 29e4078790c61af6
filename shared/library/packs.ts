import type { PackSpec } from '../schemas/estimate'
import type { LibraryPack } from './types'

// Generic packs by voltage class. Tool packs are named by their class ("20 V max" is the
// marketing name of the 5-cell, 18 V nominal class: common practice). Prices are rounded typical
// street prices in US dollars, from memory, only so that packs can be compared per hour of music.

/** Li-ion cell classes inside tool packs (from memory: makers' datasheets of power cells). */
const cells = {
  // 18650 power cell, 2.0 Ah: about 25 mΩ DC, about 46 g
  '18650 2.0 Ah': { cellCapacityAh: 2.0, cellResistanceOhm: 0.025, continuousA: 15, massKg: 0.046 },
  // 18650 power cell, 2.5 Ah: about 22 mΩ DC
  '18650 2.5 Ah': { cellCapacityAh: 2.5, cellResistanceOhm: 0.022, continuousA: 15, massKg: 0.047 },
  // 18650 cell, 3.0 Ah: about 25 mΩ DC
  '18650 3.0 Ah': { cellCapacityAh: 3.0, cellResistanceOhm: 0.025, continuousA: 12, massKg: 0.048 },
  // 21700 power cell, 4.0 Ah: about 16 mΩ DC, about 70 g
  '21700 4.0 Ah': { cellCapacityAh: 4.0, cellResistanceOhm: 0.016, continuousA: 25, massKg: 0.07 },
  // 21700 cell, 5.0 Ah: about 20 mΩ DC
  '21700 5.0 Ah': { cellCapacityAh: 5.0, cellResistanceOhm: 0.02, continuousA: 15, massKg: 0.07 },
} as const

type CellClass = keyof typeof cells

// The continuous figure per parallel string is what a closed tool pack sustains without tripping
// its thermal limit, well below the cell's own rating (common practice: tool packs are made for
// bursts). Housing, strips and electronics add about 35 % to the mass of the cells (from memory:
// weighing opened packs).
const HOUSING_MASS_FACTOR = 1.35

function toolPack(
  id: string,
  voltageClass: string,
  seriesCells: number,
  parallelCells: number,
  cell: CellClass,
  price: number,
): LibraryPack {
  const { cellCapacityAh, cellResistanceOhm, continuousA, massKg } = cells[cell]
  const capacityAh = cellCapacityAh * parallelCells
  const label = `Tool pack ${voltageClass}, ${capacityAh.toFixed(1)} Ah (${seriesCells}S${parallelCells}P)`
  const part: PackSpec = {
    chemistry: 'li-ion',
    seriesCells,
    parallelCells,
    cellCapacityAh,
    cellResistanceOhm,
    cutoffCellV: 3.0, // common practice: tool-pack electronics cut at 2.8–3.0 V per cell
    healthPct: 100,
    maxDischargeA: continuousA * parallelCells,
    label,
    massKg: Math.round(massKg * seriesCells * parallelCells * HOUSING_MASS_FACTOR * 100) / 100,
    price,
  }
  return { id, label, part }
}

// Voltage classes (common practice): "12 V max" = 3 cells in series (10.8 V nominal, 12.6 V full),
// "20 V max" = 5 cells (18 V nominal, 21 V full), "40 V max" = 10 cells (36 V, 42 V),
// "60 V max" = 15 cells (54 V, 63 V).
const V12 = '12 V ("12 V max")'
const V18 = '18 V ("20 V max")'
const V36 = '36 V ("40 V max")'
const V54 = '54 V ("60 V max")'

const toolPacks: LibraryPack[] = [
  toolPack('li-ion-3s-2ah', V12, 3, 1, '18650 2.0 Ah', 40),
  toolPack('li-ion-3s-4ah', V12, 3, 2, '18650 2.0 Ah', 60),
  toolPack('li-ion-3s-6ah', V12, 3, 2, '18650 3.0 Ah', 90),
  toolPack('li-ion-5s-2ah', V18, 5, 1, '18650 2.0 Ah', 60),
  toolPack('li-ion-5s-4ah', V18, 5, 1, '21700 4.0 Ah', 90),
  toolPack('li-ion-5s-5ah', V18, 5, 2, '18650 2.5 Ah', 110),
  toolPack('li-ion-5s-6ah', V18, 5, 2, '18650 3.0 Ah', 130),
  toolPack('li-ion-5s-8ah', V18, 5, 2, '21700 4.0 Ah', 170),
  toolPack('li-ion-5s-12ah', V18, 5, 3, '21700 4.0 Ah', 250),
  toolPack('li-ion-10s-2-5ah', V36, 10, 1, '18650 2.5 Ah', 120),
  toolPack('li-ion-10s-5ah', V36, 10, 2, '18650 2.5 Ah', 200),
  toolPack('li-ion-10s-10ah', V36, 10, 2, '21700 5.0 Ah', 350),
  toolPack('li-ion-15s-3ah', V54, 15, 1, '18650 3.0 Ah', 180),
  toolPack('li-ion-15s-6ah', V54, 15, 2, '18650 3.0 Ah', 280),
  toolPack('li-ion-15s-9ah', V54, 15, 3, '18650 3.0 Ah', 380),
  toolPack('li-ion-15s-12ah', V54, 15, 3, '21700 4.0 Ah', 480),
]

function battery(id: string, label: string, part: Omit<PackSpec, 'label'>): LibraryPack {
  return { id, label, part: { ...part, label } }
}

// 12 V LiFePO4 boxes: 4 cells in series, 12.8 V nominal (common practice). Continuous current is
// the built-in BMS rating, usually 1 C on these boxes (common practice); resistance per cell from
// memory of prismatic and 32700 cells; masses from memory of makers' listings.
const lifepo4Batteries: LibraryPack[] = [
  battery('lifepo4-4s-6ah', 'LiFePO4 battery 12.8 V, 6 Ah', {
    chemistry: 'lifepo4',
    seriesCells: 4,
    parallelCells: 1,
    cellCapacityAh: 6, // one 32700 cell per series step
    cellResistanceOhm: 0.008, // from memory: 32700 6 Ah cell, about 8 mΩ
    cutoffCellV: 2.5, // common practice: LiFePO4 BMS undervoltage cut
    maxDischargeA: 10, // datasheet class: small boxes list 6–10 A continuous
    healthPct: 100,
    massKg: 0.9,
    price: 45,
  }),
  battery('lifepo4-4s-20ah', 'LiFePO4 battery 12.8 V, 20 Ah', {
    chemistry: 'lifepo4',
    seriesCells: 4,
    parallelCells: 1,
    cellCapacityAh: 20,
    cellResistanceOhm: 0.003, // from memory: 20 Ah prismatic cell, about 3 mΩ
    cutoffCellV: 2.5,
    maxDischargeA: 20, // common practice: 1 C BMS
    healthPct: 100,
    massKg: 2.6,
    price: 90,
  }),
  battery('lifepo4-4s-50ah', 'LiFePO4 battery 12.8 V, 50 Ah', {
    chemistry: 'lifepo4',
    seriesCells: 4,
    parallelCells: 1,
    cellCapacityAh: 50,
    cellResistanceOhm: 0.0012, // from memory: 50 Ah prismatic cell, about 1.2 mΩ
    cutoffCellV: 2.5,
    maxDischargeA: 50,
    healthPct: 100,
    massKg: 6,
    price: 180,
  }),
  battery('lifepo4-4s-100ah', 'LiFePO4 battery 12.8 V, 100 Ah', {
    chemistry: 'lifepo4',
    seriesCells: 4,
    parallelCells: 1,
    cellCapacityAh: 100,
    cellResistanceOhm: 0.0006, // from memory: 100 Ah prismatic cell, about 0.5–0.7 mΩ
    cutoffCellV: 2.5,
    maxDischargeA: 100,
    healthPct: 100,
    massKg: 11,
    price: 300,
  }),
]

// 12 V sealed lead-acid (AGM): 6 cells of 2 V (common practice), capacity at the 20-hour rate.
// Resistance per cell is the battery's datasheet internal resistance over 6 (datasheet class of
// small VRLA batteries); continuous current about 3 C for the small sizes (datasheet class).
const leadAcidBatteries: LibraryPack[] = [
  battery('lead-acid-12v-7ah', 'Lead-acid AGM 12 V, 7 Ah', {
    chemistry: 'lead-acid',
    seriesCells: 6,
    parallelCells: 1,
    cellCapacityAh: 7,
    cellResistanceOhm: 0.005, // datasheet class: about 30 mΩ for the battery
    cutoffCellV: 1.75, // common practice: 10.5 V under load
    peukertExponent: 1.2, // common practice: AGM 1.1–1.3
    maxDischargeA: 21,
    healthPct: 100,
    massKg: 2.2,
    price: 25,
  }),
  battery('lead-acid-12v-12ah', 'Lead-acid AGM 12 V, 12 Ah', {
    chemistry: 'lead-acid',
    seriesCells: 6,
    parallelCells: 1,
    cellCapacityAh: 12,
    cellResistanceOhm: 0.003, // datasheet class: about 18 mΩ for the battery
    cutoffCellV: 1.75,
    peukertExponent: 1.2,
    maxDischargeA: 36,
    healthPct: 100,
    massKg: 3.7,
    price: 40,
  }),
  battery('lead-acid-12v-18ah', 'Lead-acid AGM 12 V, 18 Ah', {
    chemistry: 'lead-acid',
    seriesCells: 6,
    parallelCells: 1,
    cellCapacityAh: 18,
    cellResistanceOhm: 0.0025, // datasheet class: about 15 mΩ for the battery
    cutoffCellV: 1.75,
    peukertExponent: 1.2,
    maxDischargeA: 54,
    healthPct: 100,
    massKg: 5.5,
    price: 55,
  }),
  battery('lead-acid-12v-35ah', 'Lead-acid AGM 12 V, 35 Ah', {
    chemistry: 'lead-acid',
    seriesCells: 6,
    parallelCells: 1,
    cellCapacityAh: 35,
    cellResistanceOhm: 0.0017, // datasheet class: about 10 mΩ for the battery
    cutoffCellV: 1.75,
    peukertExponent: 1.2,
    maxDischargeA: 100,
    healthPct: 100,
    massKg: 10.5,
    price: 95,
  }),
  battery('lead-acid-12v-100ah', 'Lead-acid AGM deep-cycle 12 V, 100 Ah', {
    chemistry: 'lead-acid',
    seriesCells: 6,
    parallelCells: 1,
    cellCapacityAh: 100,
    cellResistanceOhm: 0.0008, // datasheet class: about 5 mΩ for the battery
    cutoffCellV: 1.75,
    peukertExponent: 1.15, // datasheet class: deep-cycle plates lose a little less at high rates
    maxDischargeA: 200,
    healthPct: 100,
    massKg: 29,
    price: 220,
  }),
]

// NiMH hobby and radio packs of 1.2 V cells (common practice).
const nimhPacks: LibraryPack[] = [
  battery('nimh-6s-3ah', 'NiMH pack 7.2 V, 3 Ah (6 sub-C cells)', {
    chemistry: 'nimh',
    seriesCells: 6,
    parallelCells: 1,
    cellCapacityAh: 3,
    cellResistanceOhm: 0.006, // from memory: sub-C power cells, about 5–8 mΩ
    cutoffCellV: 1.0, // common practice
    maxDischargeA: 30, // datasheet class: sub-C power cells 10 C
    healthPct: 100,
    massKg: 0.36,
    price: 35,
  }),
  battery('nimh-10s-2ah', 'NiMH pack 12 V, 2 Ah (10 AA cells)', {
    chemistry: 'nimh',
    seriesCells: 10,
    parallelCells: 1,
    cellCapacityAh: 2,
    cellResistanceOhm: 0.03, // from memory: AA cell, about 30 mΩ
    cutoffCellV: 1.0,
    maxDischargeA: 6, // datasheet class: AA cells, about 3 C continuous
    healthPct: 100,
    massKg: 0.3,
    price: 30,
  }),
  battery('nimh-10s-4-5ah', 'NiMH pack 12 V, 4.5 Ah (10 sub-C cells)', {
    chemistry: 'nimh',
    seriesCells: 10,
    parallelCells: 1,
    cellCapacityAh: 4.5,
    cellResistanceOhm: 0.007, // from memory: 4.5 Ah sub-C cell
    cutoffCellV: 1.0,
    maxDischargeA: 30,
    healthPct: 100,
    massKg: 0.85,
    price: 60,
  }),
]

export const libraryPacks: readonly LibraryPack[] = [
  ...toolPacks,
  ...lifepo4Batteries,
  ...leadAcidBatteries,
  ...nimhPacks,
]
