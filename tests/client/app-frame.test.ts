import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { createMemoryHistory } from 'vue-router'
import App from '@/App.vue'
import { createAppRouter } from '@/router'
import { usePreferencesStore } from '@/stores/preferences'

async function mountApp(path = '/about') {
  const pinia = createPinia()
  setActivePinia(pinia)
  const router = createAppRouter(createMemoryHistory())
  router.push(path)
  await router.isReady()
  const wrapper = mount(App, { global: { plugins: [pinia, router] }, attachTo: document.body })
  await flushPromises()
  return { wrapper, router }
}

describe('the app frame', () => {
  beforeEach(() => localStorage.clear())

  it('links every area of the product from the main navigation', async () => {
    const { wrapper } = await mountApp()
    const labels = wrapper.findAll('nav[aria-label="Main"] a').map((link) => link.text())
    expect(labels).toEqual(['Bench', 'Rigs', 'Plans', 'Events', 'Parts', 'Team'])
    wrapper.unmount()
  })

  it('remembers the unit system across visits', async () => {
    const { wrapper } = await mountApp()
    const imperial = wrapper
      .findAll('input[type="radio"]')
      .find((input) => input.element.getAttribute('value') === 'imperial')
    expect(imperial).toBeDefined()
    await imperial!.setValue(true)
    await flushPromises()
    expect(usePreferencesStore().units).toBe('imperial')
    expect(JSON.parse(localStorage.getItem('loudhour.preferences.v1')!).units).toBe('imperial')
    wrapper.unmount()
  })

  it('switches between light and dark and keeps the choice', async () => {
    const { wrapper } = await mountApp()
    const toggle = wrapper.findAll('button').find((button) => button.text() === 'Dark mode')
    expect(toggle).toBeDefined()
    await toggle!.trigger('click')
    await flushPromises()
    expect(usePreferencesStore().isDark).toBe(true)
    expect(wrapper.findAll('button').some((button) => button.text() === 'Light mode')).toBe(true)
    expect(JSON.parse(localStorage.getItem('loudhour.preferences.v1')!).colourMode).toBe('dark')
    wrapper.unmount()
  })

  it('shows the not-found page for an unknown address', async () => {
    const { wrapper } = await mountApp('/no/such/page')
    expect(wrapper.text()).toContain('No page here')
    wrapper.unmount()
  })
})
