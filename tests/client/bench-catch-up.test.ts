import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import BenchCatchUp from '@/components/bench/BenchCatchUp.vue'
import { useEstimate } from '@/composables/useEstimate'
import { useRigDraftStore } from '@/stores/rigDraft'

// A stand-in for the browser's IntersectionObserver and idle callbacks, driven by the test.
let reportVisibility: (visible: boolean) => void = () => {}
let idleCallbacks: (() => void)[] = []

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
  idleCallbacks = []
  vi.stubGlobal(
    'IntersectionObserver',
    class {
      constructor(callback: (entries: { isIntersecting: boolean }[]) => void) {
        reportVisibility = (visible) => callback([{ isIntersecting: visible }])
      }
      observe() {}
      disconnect() {}
    },
  )
  vi.stubGlobal('requestIdleCallback', (callback: () => void) => idleCallbacks.push(callback))
  vi.stubGlobal('cancelIdleCallback', () => {})
})
afterEach(() => vi.unstubAllGlobals())

const runIdleCallbacks = () => idleCallbacks.splice(0).forEach((callback) => callback())

// A panel that shows the average draw of the estimate it is given.
const DrawPanel = defineComponent({
  setup() {
    const { result } = useEstimate()
    return () => h('p', { 'data-testid': 'draw' }, String(result.value?.averageDrawW))
  },
})

function mountPanel() {
  return mount(BenchCatchUp, { slots: { default: () => h(DrawPanel) } })
}

async function changeLevel(levelDb: number): Promise<void> {
  useRigDraftStore().draft.programme.peakBelowClipDb = levelDb
  await flushPromises()
}

describe('a panel that catches up off screen', () => {
  it('follows every change while it is on screen', async () => {
    const wrapper = mountPanel()
    const before = wrapper.get('[data-testid="draw"]').text()
    await changeLevel(12)
    expect(wrapper.get('[data-testid="draw"]').text()).not.toBe(before)
    expect(idleCallbacks).toHaveLength(0)
  })

  it('keeps what it showed off screen and catches up once the browser is idle', async () => {
    const wrapper = mountPanel()
    reportVisibility(false)
    const before = wrapper.get('[data-testid="draw"]').text()
    await changeLevel(12)
    expect(wrapper.get('[data-testid="draw"]').text()).toBe(before)
    // Several changes before the browser is idle: one catch-up shows the latest.
    await changeLevel(15)
    expect(idleCallbacks).toHaveLength(1)
    runIdleCallbacks()
    await flushPromises()
    const caughtUp = wrapper.get('[data-testid="draw"]').text()
    expect(caughtUp).not.toBe(before)
    reportVisibility(true)
    await flushPromises()
    expect(wrapper.get('[data-testid="draw"]').text()).toBe(caughtUp)
  })

  it('shows the live estimate as soon as it comes back on screen', async () => {
    const wrapper = mountPanel()
    reportVisibility(false)
    const before = wrapper.get('[data-testid="draw"]').text()
    await changeLevel(12)
    reportVisibility(true)
    await flushPromises()
    expect(wrapper.get('[data-testid="draw"]').text()).not.toBe(before)
  })
})
