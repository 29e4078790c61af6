import { flushPromises } from '@vue/test-utils'
import { beforeEach, describe, expect, it } from 'vitest'
import { PROGRAMME_PRESETS } from '../../shared/engine'
import { estimateRequestSchema } from '../../shared/schemas/estimate'
import { usePreferencesStore } from '@/stores/preferences'
import { rigDraftStorageKey, startingRig, useRigDraftStore } from '@/stores/rigDraft'
import {
  benchTestTimeoutMs,
  plainText,
  fieldInput,
  fieldValue,
  mountBench,
  typeInto,
} from './bench-helpers'

beforeEach(() => localStorage.clear())

describe('the bench forms', { timeout: benchTestTimeoutMs }, () => {
  it('shows the shared schema’s message at the field and keeps the last complete rig', async () => {
    const wrapper = await mountBench()
    await typeInto(wrapper, 'pack.count', '3')
    const runtimeBefore = wrapper.get('[data-testid="runtime"]').text()
    // A pack needs at least one cell in series.
    await typeInto(wrapper, 'pack.seriesCells', '0')

    const expected = estimateRequestSchema.safeParse({
      ...startingRig.rig,
      pack: { ...startingRig.rig.pack, seriesCells: 0 },
    })
    expect(expected.success).toBe(false)
    const schemaMessage = expected.error!.issues.find(
      (issue) => issue.path.join('.') === 'pack.seriesCells',
    )!.message
    expect(wrapper.get('[data-testid="message-pack.seriesCells"]').text()).toBe(schemaMessage)
    expect(fieldInput(wrapper, 'pack.seriesCells').attributes('aria-invalid')).toBe('true')
    expect(wrapper.get('[data-testid="issue-summary"]').text()).toContain(schemaMessage)
    // The result stays on the last valid rig, and storage keeps that rig, not the broken one.
    expect(wrapper.get('[data-testid="runtime"]').text()).toBe(runtimeBefore)
    const stored = JSON.parse(localStorage.getItem(rigDraftStorageKey)!).rig
    expect(stored.pack).toMatchObject({ seriesCells: 5, count: 3 })

    await typeInto(wrapper, 'pack.seriesCells', '5')
    expect(wrapper.find('[data-testid="message-pack.seriesCells"]').exists()).toBe(false)
    expect(wrapper.find('[data-testid="issue-summary"]').exists()).toBe(false)
    wrapper.unmount()
  })

  it('names the field of a message from a cross-field rule (lock-out above the rating)', async () => {
    const wrapper = await mountBench()
    await typeInto(wrapper, 'amplifier.lockoutV', '30')
    expect(wrapper.get('[data-testid="message-amplifier.lockoutV"]').text()).toMatch(/Lock-out/)
    wrapper.unmount()
  })

  it('converts the displayed lengths, temperature and wire size with the unit switch', async () => {
    const wrapper = await mountBench()
    // The starting rig: a 0.5 m lead of 14 AWG, 6 m to the listener, 12 °C.
    expect(fieldValue(wrapper, 'leads.lengthM')).toBe('0.5')
    expect(fieldValue(wrapper, 'temperatureC')).toBe('12')
    // Source: ASTM B258: 14 AWG is 1.628 mm across, 2.08 mm².
    expect(fieldValue(wrapper, 'leads.areaMm2')).toBe('2.08')

    // What the header's switch sets (its own test covers the switch itself).
    usePreferencesStore().units = 'imperial'
    await flushPromises()
    // Source: 1 ft = 0.3048 m exactly (1959 agreement); °F = °C × 9/5 + 32.
    expect(fieldValue(wrapper, 'leads.lengthM')).toBe('1.64')
    expect(fieldValue(wrapper, 'listenerDistanceM')).toBe('19.69')
    expect(fieldValue(wrapper, 'temperatureC')).toBe('53.6')
    expect(fieldValue(wrapper, 'leads.awg')).toBe('14')
    expect(plainText(wrapper, '[data-testid="field-leads.awg"]')).toContain('14 AWG (2.1 mm²)')
    expect(wrapper.get('[data-testid="field-leads.lengthM"]').text()).toContain('ft')

    // Typing in feet stores metres; switching units alone never changed the rig.
    const store = useRigDraftStore()
    expect(store.draft.leads?.lengthM).toBe(0.5)
    await typeInto(wrapper, 'leads.lengthM', '10')
    expect(store.draft.leads?.lengthM).toBeCloseTo(3.048, 9)
    await typeInto(wrapper, 'temperatureC', '32')
    expect(store.draft.temperatureC).toBeCloseTo(0, 9)
    wrapper.unmount()
  })

  it('counts speaker leads: their resistance and the share of power they heat', async () => {
    const wrapper = await mountBench()
    const store = useRigDraftStore()
    store.draft.speakerLeads = { areaMm2: 1.5, lengthM: 5 }
    store.draft.temperatureC = 20
    await flushPromises()
    await typeInto(wrapper, 'speakerLeads.lengthM', '10')
    expect(store.draft.speakerLeads?.lengthM).toBe(10)
    // Source: IEC 60028: 1.5 mm² copper is 11.49 ohm/km at 20 °C, so 2 × 10 m is 0.230 ohm.
    const summary = plainText(wrapper, '[data-testid="speaker-leads-summary"]')
    expect(summary).toContain('0.230 Ω out and back per channel')
    expect(summary).toMatch(/the cable takes \d+(\.\d)? % of the output/)
    // Two sizes at once is refused at the field, as for the DC lead.
    await typeInto(wrapper, 'speakerLeads.areaMm2', '0')
    expect(wrapper.get('[data-testid="message-speakerLeads.areaMm2"]').text()).toMatch(
      /^Speaker lead wire area must be/,
    )
    wrapper.unmount()
  })

  it('fills the pack form from a library pick and keeps the packs on hand', async () => {
    const wrapper = await mountBench()
    const store = useRigDraftStore()
    const countBefore = store.draft.pack.count
    await fieldInput(wrapper, 'pack.library').setValue('lead-acid-12v-18ah')
    await flushPromises()
    // Source: common practice: a 12 V lead-acid battery is 6 cells of 2 V.
    expect(fieldValue(wrapper, 'pack.chemistry')).toBe('lead-acid')
    expect(fieldValue(wrapper, 'pack.seriesCells')).toBe('6')
    expect(fieldValue(wrapper, 'pack.cellCapacityAh')).toBe('18')
    expect(store.draft.pack.count).toBe(countBefore)
    expect(plainText(wrapper, '[data-testid="pack-summary"]')).toContain('12.0 V nominal')
    // Editing a field turns the pick into the user's own values.
    await typeInto(wrapper, 'pack.cellCapacityAh', '20')
    expect(fieldValue(wrapper, 'pack.library')).toBe('')
    wrapper.unmount()
  })

  it('fills the crest factor from a programme preset', async () => {
    const wrapper = await mountBench()
    const speech = PROGRAMME_PRESETS.find((preset) => preset.id === 'speech')!
    await fieldInput(wrapper, 'programme.preset').setValue('speech')
    await flushPromises()
    // Source: docs/model.md §5 (common practice): speech has a crest factor of about 12–15 dB.
    const shown = Number(fieldValue(wrapper, 'programme.crestFactorDb'))
    expect(shown).toBe(speech.crestFactorDb)
    expect(shown).toBeGreaterThanOrEqual(12)
    expect(shown).toBeLessThanOrEqual(15)
    wrapper.unmount()
  })

  it('adds an accessory from the library and removes it again', async () => {
    const wrapper = await mountBench()
    const store = useRigDraftStore()
    const before = store.draft.accessories.length
    await fieldInput(wrapper, 'accessories.add').setValue('acc-led-strip-12v')
    await flushPromises()
    expect(store.draft.accessories.length).toBe(before + 1)
    // Source: common practice: 60 LEDs per metre of 3528 strip draw 4.8 W per metre.
    expect(fieldValue(wrapper, `accessories.${before}.powerW`)).toBe('4.8')
    expect(wrapper.get(`[data-testid="converter-${before}"]`).text()).toContain('LED strip')
    await wrapper.get(`[data-testid="accessory-${before}"] button`).trigger('click')
    await flushPromises()
    expect(store.draft.accessories.length).toBe(before)
    wrapper.unmount()
  })

  it("fills an accessory's converter settings from a generic module", async () => {
    const wrapper = await mountBench()
    const store = useRigDraftStore()
    const index = store.draft.accessories.length
    await fieldInput(wrapper, 'accessories.add').setValue('acc-wireless-mic-receiver')
    await flushPromises()
    expect(fieldValue(wrapper, `accessories.${index}.feed`)).toBe('direct')
    await fieldInput(wrapper, `accessories.${index}.converter`).setValue('conv-isolated-12v')
    await flushPromises()
    // Source: ours (shared/library/converters.ts, datasheet class of isolated modules).
    expect(fieldValue(wrapper, `accessories.${index}.feed`)).toBe('isolated')
    expect(fieldValue(wrapper, `accessories.${index}.outputV`)).toBe('12')
    expect(fieldValue(wrapper, `accessories.${index}.efficiency`)).toBe('82')
    expect(fieldValue(wrapper, `accessories.${index}.idleW`)).toBe('0.3')
    // The accessory itself is untouched, and the picker shows its prompt again.
    expect(store.draft.accessories[index]).toMatchObject({ powerW: 3, inputMinV: 11 })
    expect(fieldValue(wrapper, `accessories.${index}.converter`)).toBe('')
    // A linear regulator has no efficiency of its own (V_out/V_in, docs/model.md §6).
    await fieldInput(wrapper, `accessories.${index}.converter`).setValue('conv-linear-5v')
    await flushPromises()
    expect(store.draft.accessories[index]!.efficiency).toBeUndefined()
    expect(fieldValue(wrapper, `accessories.${index}.feed`)).toBe('linear')
    wrapper.unmount()
  })
})
