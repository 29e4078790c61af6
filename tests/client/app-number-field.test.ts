import { flushPromises, mount } from '@vue/test-utils'
import { NConfigProvider } from 'naive-ui'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h, ref } from 'vue'
import type { FieldKey } from '@shared/fields'
import { numberField } from '@shared/schemas/number-field'
import AppNumberField from '@/components/AppNumberField.vue'
import { provideNumberFieldContext } from '@/composables/useNumberFieldContext'
import { roundForField } from '@/display/fieldNumber'
import { usePreferencesStore } from '@/stores/preferences'

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
})

/**
 * One number field on a page of its own that does what the bench and the plans do: it keeps the
 * value, checks it with the shared schema and gives that message back to the field by its path.
 */
function mountField(field: FieldKey, start: number | undefined) {
  const path = 'the.field'
  const report = vi.fn<(fieldId: string, message: string | null) => void>()
  const value = ref(start)
  const Page = defineComponent({
    setup() {
      provideNumberFieldContext(() => ({
        messageAt: (at) => {
          if (at !== path || value.value === undefined) return undefined
          const parsed = numberField(field).safeParse(value.value)
          return parsed.success ? undefined : parsed.error.issues[0]?.message
        },
        report,
      }))
      return () =>
        h(AppNumberField, {
          field,
          path,
          value: value.value,
          'onUpdate:value': (next: number | undefined) => (value.value = next),
        })
    },
  })
  const wrapper = mount(
    defineComponent(() => () => h(NConfigProvider, null, () => h(Page))),
    {
      attachTo: document.body,
    },
  )
  const input = () => wrapper.get(`[data-testid="field-${path}"] input`)
  const message = () => wrapper.find(`[data-testid="message-${path}"]`)
  return { wrapper, value, report, input, message, path }
}

describe('the number field', () => {
  it('shows the catalogue’s label, unit and help, and a datasheet’s mΩ as the engine’s Ω', () => {
    const { wrapper, input } = mountField('pack.cellResistanceOhm', 0.022)
    expect(wrapper.get('label').text()).toBe('Cell resistance')
    // Source: SI prefixes (BIPM): 1 mΩ = 0.001 Ω, so 0.022 Ω is 22 mΩ.
    expect((input().element as HTMLInputElement).value).toBe('22')
    expect(wrapper.get('.app-number__unit').text()).toBe('mΩ')
    expect(input().attributes('aria-label')).toBe('Cell resistance (mΩ)')
    expect(wrapper.text()).toContain('DC internal resistance of one cell.')
    wrapper.unmount()
  })

  it('rounds a converted value to one decimal more than its figures, and stores what is typed', async () => {
    usePreferencesStore().units = 'imperial'
    const { wrapper, input, value } = mountField('listenerDistanceM', 6)
    // Source: 1 ft = 0.3048 m exactly (1959 agreement): 6 m is 19.685 ft, shown to 0.01 ft.
    expect((input().element as HTMLInputElement).value).toBe('19.69')
    expect(wrapper.get('.app-number__unit').text()).toBe('ft')
    await input().setValue('10')
    await flushPromises()
    expect(value.value).toBeCloseTo(3.048, 9)
    wrapper.unmount()
  })

  it('shows a value in the engine’s own unit exactly as typed', async () => {
    const { wrapper, input, value } = mountField('pack.cutoffCellV', 2.875)
    expect((input().element as HTMLInputElement).value).toBe('2.875')
    await input().setValue('3.0125')
    await flushPromises()
    expect(value.value).toBe(3.0125)
    wrapper.unmount()
  })

  it('says at the field that "abc" is not a number, and what was dropped on leaving it', async () => {
    const { wrapper, input, message, report, value, path } = mountField('pack.seriesCells', 5)
    await input().setValue('abc')
    await flushPromises()
    expect(message().text()).toBe('“abc” is not a number: type digits, such as 12 or 4.5')
    expect(input().attributes('aria-invalid')).toBe('true')
    // The page hears it (to mark its results as the last valid rig's) and keeps the last number.
    expect(report).toHaveBeenLastCalledWith(path, message().text())
    expect(value.value).toBe(5)

    await input().trigger('blur')
    await flushPromises()
    expect(message().exists()).toBe(false)
    expect(report).toHaveBeenLastCalledWith(path, null)
    expect(wrapper.text()).toContain(
      '“abc” was not a number, so the field went back to its last value.',
    )
    wrapper.unmount()
  })

  it('says the schema’s message at the field for a number out of bounds', async () => {
    const { wrapper, input, message } = mountField('pack.seriesCells', 5)
    // Source: a pack has at least one cell in series; there are no negative cells.
    await input().setValue('-6')
    await flushPromises()
    expect(message().text()).toBe('Cells in series must be a whole number from 1 to 100')
    expect(input().attributes('aria-invalid')).toBe('true')
    await input().setValue('6')
    await flushPromises()
    expect(message().exists()).toBe(false)
    wrapper.unmount()
  })

  it('refuses an efficiency above 100 %, in the % it was typed in', async () => {
    const { wrapper, input, message, value } = mountField('amplifier.efficiency', 0.9)
    expect((input().element as HTMLInputElement).value).toBe('90')
    // Source: conservation of energy: an amplifier cannot give out more power than it draws.
    await input().setValue('120')
    await flushPromises()
    expect(value.value).toBeCloseTo(1.2, 9)
    expect(message().text()).toBe(
      'Amplifier efficiency must be more than 0 and at most 1 (1 is 100 %)',
    )
    wrapper.unmount()
  })
})

describe('the one rounding rule', () => {
  it('keeps one decimal more than the figures show', () => {
    // Source: ASTM B258: 14 AWG is 2.081 mm²; shown as 2.1 mm² elsewhere, so 2.08 in a field.
    expect(roundForField(2.0816, 1)).toBe(2.08)
    expect(roundForField(53.6, 0)).toBe(53.6)
  })
})
