import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { estimate } from '@shared/engine'
import { FIELDS, type FieldKey } from '@shared/fields'
import { estimateRequestSchema, type AssumedValue } from '@shared/schemas/estimate'
import { assumedRow } from '@/components/bench/assumedLabels'
import { usePreferencesStore } from '@/stores/preferences'
import { columnRig } from '../shared/rig-fixtures'

// "What the estimate assumed" on the bench: every default the engine lists is named by its
// field's label in the catalogue (as its form and its messages name it) and shown in the unit
// its form shows.

/** The column rig with one accessory of every feed, so each converter default is taken. */
function rigWithEveryFeed() {
  const feeds = ['direct', 'buck', 'boost', 'buck-boost', 'isolated', 'linear'] as const
  return estimateRequestSchema.parse({
    ...columnRig(),
    accessories: feeds.map((feed) => ({
      label: `Light on ${feed}`,
      powerW: 3,
      inputMinV: 11,
      inputMaxV: 13,
      feed,
    })),
  })
}

function row(field: string, value: AssumedValue['value']) {
  return assumedRow({ field, value, source: 'common practice' }, rigWithEveryFeed())
}

describe('what the estimate assumed', () => {
  beforeEach(() => {
    localStorage.clear()
    setActivePinia(createPinia())
  })

  it('names every default the engine takes by its catalogue label, never by its path', () => {
    // A wiring check: the labels are the catalogue's own, read back.
    const request = rigWithEveryFeed()
    const assumed = estimate(request).assumed
    expect(assumed.length).toBeGreaterThan(10)
    for (const entry of assumed) {
      const { label } = assumedRow(entry, request)
      const key = entry.field.replace(/^accessories\.\d+\./, 'accessory.') as FieldKey
      expect(FIELDS[key], entry.field).toBeDefined()
      expect(label.endsWith(FIELDS[key].label), entry.field).toBe(true)
      expect(label).not.toMatch(/\b[a-z]+[A-Z]?\w*\.\w+/)
    }
  })

  it('names an accessory default by the accessory it belongs to', () => {
    expect(row('accessories.1.efficiency', 0.9).label).toBe('Light on buck: Converter efficiency')
    expect(row('accessories.4.converterInputMinV', 11).label).toBe(
      'Light on isolated: Converter minimum input voltage',
    )
  })

  it('shows each value in the unit its field shows', () => {
    // Source: SI prefixes: 1 Ω = 1000 mΩ.
    expect(row('pack.cellResistanceOhm', 0.02).value).toBe('20.0\u00a0mΩ')
    // Source: an efficiency of 0.9 is 90 % (a fraction times 100).
    expect(row('amplifier.efficiency', 0.9).value).toBe('90\u00a0%')
    expect(row('pack.cutoffCellV', 3).value).toBe('3.00\u00a0V')
    expect(row('pack.count', 1).value).toBe('1')
    expect(row('programme.playingPct', 100).value).toBe('100\u00a0%')
  })

  it('follows the header’s unit switch for temperatures and distances', () => {
    expect(row('temperatureC', 25).value).toBe('25\u00a0°C')
    usePreferencesStore().units = 'imperial'
    // Source: °F = °C × 9/5 + 32, so 25 °C is 77 °F.
    expect(row('temperatureC', 25).value).toBe('77\u00a0°F')
    // Source: 1 ft = 0.3048 m exactly (international yard and pound agreement, 1959): 3 m is 9.8 ft.
    expect(row('listenerDistanceM', 3).value).toBe('9.8\u00a0ft')
  })
})
