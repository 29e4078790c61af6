import { flushPromises, mount, type VueWrapper } from '@vue/test-utils'
import { NMessageProvider } from 'naive-ui'
import { createPinia, setActivePinia } from 'pinia'
import { defineComponent, h } from 'vue'
import { createMemoryHistory, createRouter, RouterView } from 'vue-router'
import AppDialogHost from '@/components/AppDialogHost.vue'
import BenchView from '@/views/BenchView.vue'

// The bench inside the providers App.vue gives it, on a router holding only the bench, so these
// tests do not depend on the rest of the app.
const Harness = defineComponent({
  setup: () => () => h(NMessageProvider, () => h(AppDialogHost, () => h(BenchView))),
})

/** Mounting the whole bench in jsdom takes a few seconds on a busy machine. */
export const benchTestTimeoutMs = 60_000

/** The bench on a fresh testing Pinia and a memory router. */
export async function mountBench(): Promise<VueWrapper> {
  const pinia = createPinia()
  setActivePinia(pinia)
  const router = createRouter({
    history: createMemoryHistory(),
    // The save bar links to sign-in; an empty page stands in for it.
    routes: [
      { path: '/', name: 'bench', component: Harness },
      { path: '/sign-in', name: 'sign-in', component: { render: () => null } },
    ],
  })
  router.push('/')
  await router.isReady()
  const wrapper = mount(RouterView, {
    global: { plugins: [pinia, router] },
    attachTo: document.body,
  })
  await flushPromises()
  return wrapper
}

/** The input inside the field for this request path (`pack.seriesCells`). */
export function fieldInput(wrapper: VueWrapper, path: string) {
  return wrapper.get(`[data-testid="field-${path}"] input, [data-testid="field-${path}"] select`)
}

export async function typeInto(wrapper: VueWrapper, path: string, text: string): Promise<void> {
  await fieldInput(wrapper, path).setValue(text)
  await flushPromises()
}

export function fieldValue(wrapper: VueWrapper, path: string): string {
  return (fieldInput(wrapper, path).element as HTMLInputElement).value
}

/** Visible text with no-break spaces (between figures and units) read as plain spaces. */
export function plainText(wrapper: VueWrapper, selector: string): string {
  return wrapper
    .get(selector)
    .text()
    .replace(/\u00a0/g, ' ')
}
