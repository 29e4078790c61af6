// Packs of one build are interchangeable on the day: a rig takes any charged pack of its kind.
// A kind is the electrical build (chemistry, cells in series and parallel, cell capacity); the
// pack's name is only its label.
import { CHEMISTRY_DATA } from '../engine/chemistry'
import type { PackSpec } from '../schemas/estimate'

export interface PackKind {
  /** Stable key, e.g. "li-ion/5s1p/5ah": what the event's pool and chargers refer to. */
  key: string
  /** For people: the pack's own name, else its build ("Li-ion (NMC/NCA) 5S1P 5 Ah"). */
  label: string
  chemistry: PackSpec['chemistry']
  seriesCells: number
  nominalV: number
  isLithium: boolean
}

export function packKindKey(pack: PackSpec): string {
  return `${pack.chemistry}/${pack.seriesCells}s${pack.parallelCells}p/${pack.cellCapacityAh}ah`
}

export function packKindOf(pack: PackSpec): PackKind {
  const data = CHEMISTRY_DATA[pack.chemistry]
  const build = `${data.label} ${pack.seriesCells}S${pack.parallelCells}P ${pack.cellCapacityAh * pack.parallelCells} Ah`
  return {
    key: packKindKey(pack),
    label: pack.label ?? build,
    chemistry: pack.chemistry,
    seriesCells: pack.seriesCells,
    nominalV: pack.seriesCells * data.nominalCellV,
    isLithium: data.isLithium,
  }
}
