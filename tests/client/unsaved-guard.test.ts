import { flushPromises, mount } from '@vue/test-utils'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h, ref } from 'vue'
import { createMemoryHistory, createRouter, RouterView } from 'vue-router'
import AppDialogHost from '@/components/AppDialogHost.vue'
import { useUnsavedChangesGuard } from '@/composables/useUnsavedChangesGuard'

const unsaved = ref(false)

const EditorPage = defineComponent({
  setup() {
    useUnsavedChangesGuard(
      () => unsaved.value,
      () => '“Stage left” has changes that are not saved.',
    )
    return () => h('p', 'editing')
  },
})

async function mountEditor() {
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/edit/:id', component: EditorPage },
      { path: '/elsewhere', component: { render: () => h('p', 'elsewhere') } },
    ],
  })
  await router.push('/edit/1')
  const wrapper = mount(AppDialogHost, {
    slots: { default: () => h(RouterView) },
    global: { plugins: [router] },
    attachTo: document.body,
  })
  await flushPromises()
  return { wrapper, router }
}

const dialogButton = (label: string) =>
  vi.waitFor(() => {
    const button = [...document.querySelectorAll('button')].find(
      (candidate) => candidate.textContent?.trim() === label,
    )
    if (!button) throw new Error(`no “${label}” button yet`)
    return button
  })

afterEach(() => {
  unsaved.value = false
  document.body.innerHTML = ''
})

describe('the unsaved-changes guard', () => {
  it('lets the user leave at once when nothing is unsaved', async () => {
    const { wrapper, router } = await mountEditor()
    await router.push('/elsewhere')
    expect(router.currentRoute.value.path).toBe('/elsewhere')
    wrapper.unmount()
  })

  it('asks first, and stays when the user says so', async () => {
    const { wrapper, router } = await mountEditor()
    unsaved.value = true
    const leaving = router.push('/elsewhere')
    ;(await dialogButton('Stay')).click()
    await leaving
    expect(router.currentRoute.value.path).toBe('/edit/1')
    expect(document.body.textContent).toContain('“Stage left” has changes that are not saved.')
    wrapper.unmount()
  })

  it('leaves when the user confirms, also for the same page with another item', async () => {
    const { wrapper, router } = await mountEditor()
    unsaved.value = true
    const leaving = router.push('/edit/2')
    ;(await dialogButton('Leave')).click()
    await leaving
    expect(router.currentRoute.value.path).toBe('/edit/2')
    wrapper.unmount()
  })

  it('asks the browser to confirm closing the tab only while something is unsaved', async () => {
    const { wrapper } = await mountEditor()
    const closing = () => {
      const event = new Event('beforeunload', { cancelable: true })
      window.dispatchEvent(event)
      return event.defaultPrevented
    }
    expect(closing()).toBe(false)
    unsaved.value = true
    expect(closing()).toBe(true)
    wrapper.unmount()
  })
})
