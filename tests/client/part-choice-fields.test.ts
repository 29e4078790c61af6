import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { fieldOf, labelOf, partKinds, shownValue } from '@/components/parts/partKinds'

// The parts library names a choice field and its value as the bench does: the catalogue's label
// and words, never the request's code.

function kind(id: (typeof partKinds)[number]['id']) {
  return partKinds.find((candidate) => candidate.id === id)!
}

describe('choice fields of the parts library', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it('labels each choice field as the catalogue does', () => {
    expect(labelOf(fieldOf(kind('packs'), 'chemistry')!)).toBe('Chemistry')
    expect(labelOf(fieldOf(kind('amplifiers'), 'class')!)).toBe('Amplifier class')
    expect(labelOf(fieldOf(kind('accessories'), 'feed')!)).toBe('Accessory feed')
    expect(labelOf(fieldOf(kind('amplifiers'), 'bridged')!)).toBe('Bridged (BTL) output')
  })

  it('shows a chosen code in words in the tables', () => {
    // Source: trade usage: LiFePO4 is lithium iron phosphate; a buck converter steps down.
    expect(shownValue(fieldOf(kind('packs'), 'chemistry'), 'lifepo4')).toBe('LiFePO4')
    expect(shownValue(fieldOf(kind('accessories'), 'feed'), 'buck')).toBe(
      'Step-down (buck) converter',
    )
    expect(shownValue(fieldOf(kind('amplifiers'), 'class'), 'd')).toBe('D (switching)')
  })
})
