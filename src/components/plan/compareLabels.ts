// Names for the packs of a comparison that can be told apart in a narrow chart: the pack's own
// name (shortened in the middle, where tool-pack names repeat themselves least), and beneath it
// what the pack is in figures, which differs between packs even when names are alike.
import { CHEMISTRY_DATA } from '@shared/engine'
import type { PackSpec } from '@shared/schemas/estimate'
import { formatNumber, withUnit } from '@/display/format'

/** "18 V · 5.0 Ah · 5S2P": nominal voltage, rated charge and cells, short enough for a phone. */
export function packFigures(spec: PackSpec): string {
  const nominalV = spec.seriesCells * CHEMISTRY_DATA[spec.chemistry].nominalCellV
  const tenthsV = Math.round(nominalV * 10) / 10
  return [
    withUnit(formatNumber(tenthsV, Number.isInteger(tenthsV) ? 0 : 1), 'V'),
    withUnit(formatNumber(spec.parallelCells * spec.cellCapacityAh, 1), 'Ah'),
    `${spec.seriesCells}S${spec.parallelCells}P`,
  ].join(' · ')
}

/** Keeps the start and the end of a long name, in whole words: `Tool pack 18…(5S2P)`. */
export function shortName(name: string, maxChars: number): string {
  if (name.length <= maxChars) return name
  const headChars = Math.ceil((maxChars - 1) * 0.6)
  const tailChars = maxChars - 1 - headChars
  let head = name.slice(0, headChars)
  if (/\S/.test(name[headChars] ?? ' ') && head.includes(' '))
    head = head.slice(0, head.lastIndexOf(' '))
  let tail = name.slice(name.length - tailChars)
  if (/\S/.test(name[name.length - tailChars - 1] ?? ' ') && tail.includes(' '))
    tail = tail.slice(tail.indexOf(' ') + 1)
  return `${head.trimEnd()}…${tail.trimStart()}`
}

/**
 * One chart label per pack, as lines (chart.js draws an array as lines): the short name, the
 * figures, and a note if any; a number is added where two packs would still read the same.
 */
export function chartLabels(
  packs: readonly { name: string; spec: PackSpec; note?: string }[],
  maxChars: number,
): string[][] {
  const seen = new Map<string, number>()
  return packs.map((pack) => {
    const name = shortName(pack.name, maxChars)
    const figures = packFigures(pack.spec)
    const key = `${name}\n${figures}`
    const count = (seen.get(key) ?? 0) + 1
    seen.set(key, count)
    return [count === 1 ? name : `${name} (${count})`, figures, ...(pack.note ? [pack.note] : [])]
  })
}
