import { describe, expect, it } from 'vitest'
import { chartLabels, packFigures, shortName } from '@/components/plan/compareLabels'
import { libraryPacks } from '../../shared/library'

// Labels of the pack comparison chart: told apart, and short enough for a 390 px phone.

const nbsp = '\u00a0'

describe('pack labels in the comparison chart', () => {
  it('says what a pack is in figures', () => {
    // Common practice: a "20 V max" tool pack is 5 li-ion cells of 3.6 V nominal (18 V); two
    // 2.5 Ah cells in parallel hold 5 Ah. A 12.8 V LiFePO4 battery is 4 cells of 3.2 V.
    const spec = { chemistry: 'li-ion', seriesCells: 5, parallelCells: 2, cellCapacityAh: 2.5 }
    expect(packFigures(spec as never)).toBe(`18${nbsp}V · 5.0${nbsp}Ah · 5S2P`)
    const lfp = { chemistry: 'lifepo4', seriesCells: 4, parallelCells: 1, cellCapacityAh: 6 }
    expect(packFigures(lfp as never)).toBe(`12.8${nbsp}V · 6.0${nbsp}Ah · 4S1P`)
  })

  it('keeps both ends of a long name', () => {
    expect(shortName('Tool pack 18 V ("20 V max"), 5.0 Ah (5S2P)', 22)).toBe('Tool pack 18…(5S2P)')
    expect(shortName('Blue crate', 22)).toBe('Blue crate')
  })

  it('tells every built-in 18 V pack apart, within 22 characters a line of name', () => {
    const packs = libraryPacks
      .filter((pack) => pack.part.chemistry === 'li-ion' && pack.part.seriesCells === 5)
      .map((pack) => ({ name: pack.label, spec: pack.part }))
    expect(packs.length).toBeGreaterThanOrEqual(4)
    const labels = chartLabels(packs, 22)
    expect(new Set(labels.map((lines) => lines.join('\n'))).size).toBe(packs.length)
    for (const lines of labels) expect(lines[0]!.length).toBeLessThanOrEqual(22)
  })

  it('numbers two packs that would still read the same, and adds a note as its own line', () => {
    const spec = libraryPacks[0]!.part
    const labels = chartLabels(
      [
        { name: 'Crate pack', spec },
        { name: 'Crate pack', spec, note: 'does not fit' },
      ],
      22,
    )
    expect(labels[0]![0]).toBe('Crate pack')
    expect(labels[1]![0]).toBe('Crate pack (2)')
    expect(labels[1]![2]).toBe('does not fit')
  })
})
