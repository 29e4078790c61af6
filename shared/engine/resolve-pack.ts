// The pack with its defaults: health, the cell resistance a worn cell has, the cutoff, the rate
// effect and how many packs are on hand (docs/model.md §1).
import type { EstimateRequest } from '../schemas/estimate'
import type { ChemistryData } from './chemistry'
import { CHEMISTRY_DATA, defaultCellResistanceOhm } from './chemistry'
import type { PackInputs } from './pack'
import { ageingResistanceFactor } from './pack'
import type { DefaultPicker } from './resolve-assumed'
import type { ResolvedRequest } from './resolve'

export const DEFAULT_HEALTH_PCT = 100 // ours: a pack as labelled until a discharge log says otherwise
export const DEFAULT_PACK_COUNT = 1

type PackSpec = EstimateRequest['pack']

export function resolvePack(pack: PackSpec, pick: DefaultPicker): ResolvedRequest['pack'] {
  return {
    ...packInputs(pack, pick),
    count: pick(pack.count, 'pack.count', DEFAULT_PACK_COUNT, 'our default: one pack'),
    maxDischargeA: pack.maxDischargeA ?? null,
    label: pack.label,
    massKg: pack.massKg,
    price: pack.price,
  }
}

/** The fields the pack model takes (pack.ts), every default applied: a rig's pack and a saved
 *  pack read against its discharge log (discharge-model.ts) take the same ones. */
export function packInputs(pack: PackSpec, pick: DefaultPicker): PackInputs {
  const chemistry = CHEMISTRY_DATA[pack.chemistry]
  const healthPct = pick(
    pack.healthPct,
    'pack.healthPct',
    DEFAULT_HEALTH_PCT,
    'our default: as labelled',
  )
  return {
    chemistry: pack.chemistry,
    seriesCells: pack.seriesCells,
    parallelCells: pack.parallelCells,
    cellCapacityAh: pack.cellCapacityAh,
    cellResistanceOhm: pack.cellResistanceOhm ?? typicalCellResistanceOhm(pack, healthPct, pick),
    cutoffCellV: pick(
      pack.cutoffCellV,
      'pack.cutoffCellV',
      chemistry.cutoffCellV,
      `common practice for ${chemistry.label}`,
    ),
    healthPct,
    peukertExponent: pick(
      pack.peukertExponent,
      'pack.peukertExponent',
      chemistry.peukertExponent,
      peukertSource(pack.chemistry, chemistry),
    ),
    // A Peukert exponent given by the user carries the whole rate effect.
    rateLossPerC: pack.peukertExponent === undefined ? chemistry.rateLossPerC : 0,
  }
}

/** A typical cell of the chemistry at this capacity, its resistance raised for a worn pack. */
function typicalCellResistanceOhm(pack: PackSpec, healthPct: number, pick: DefaultPicker): number {
  const chemistry = CHEMISTRY_DATA[pack.chemistry]
  const worn =
    healthPct < 100 ? `, raised for ${healthPct} % health (doubles at 80 %, common practice)` : ''
  return pick(
    undefined,
    'pack.cellResistanceOhm',
    defaultCellResistanceOhm(pack.chemistry, pack.cellCapacityAh) *
      ageingResistanceFactor(healthPct),
    `from memory: typical ${chemistry.label} cell, ${chemistry.resistanceOhmAh} ohm·Ah over the cell capacity${worn}`,
  )
}

function peukertSource(chemistryName: PackSpec['chemistry'], chemistry: ChemistryData): string {
  if (chemistryName === 'lead-acid') return 'common practice: lead-acid k ≈ 1.1–1.3'
  if (chemistry.isLithium) {
    return 'no Peukert for lithium: the I·R sag and a small rate loss from makers’ curves'
  }
  return 'from memory'
}
