import { flushPromises, mount } from '@vue/test-utils'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import AppDialogHost from '@/components/AppDialogHost.vue'
import { useAppDialog } from '@/composables/useAppDialog'

afterEach(() => {
  document.body.innerHTML = ''
})

describe('the app dialogs', () => {
  it('load on the first request and open every dialog asked for meanwhile', async () => {
    const confirmed = vi.fn()
    const Asker = defineComponent({
      setup() {
        const dialog = useAppDialog()
        return () =>
          h(
            'button',
            {
              onClick: () => {
                dialog.warning({ title: 'First?', positiveText: 'Yes', negativeText: 'No' })
                dialog.warning({
                  title: 'Delete “Stage left”?',
                  positiveText: 'Delete',
                  negativeText: 'Keep it',
                  onPositiveClick: confirmed,
                })
              },
            },
            'Ask',
          )
      },
    })
    const wrapper = mount(AppDialogHost, {
      slots: { default: () => h(Asker) },
      attachTo: document.body,
    })
    // Nothing of the dialog layer before the first request.
    expect(document.body.textContent).not.toContain('First?')
    await wrapper.get('button').trigger('click')
    await vi.waitFor(() => expect(document.body.textContent).toContain('Delete “Stage left”?'))
    expect(document.body.textContent).toContain('First?')
    const deleteButton = [...document.querySelectorAll('button')].find(
      (button) => button.textContent?.trim() === 'Delete',
    )
    deleteButton!.click()
    await flushPromises()
    expect(confirmed).toHaveBeenCalledOnce()
    wrapper.unmount()
  })

  it('says what is missing when a component asks without a host', () => {
    const Lonely = defineComponent({
      setup() {
        useAppDialog()
        return () => null
      },
    })
    expect(() => mount(Lonely)).toThrow(/AppDialogHost/)
  })
})
