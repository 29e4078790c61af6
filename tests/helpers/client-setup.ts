import { vi } from 'vitest'

// jsdom lacks these browser APIs that naive-ui and the preferences store touch.
if (!window.matchMedia) {
  window.matchMedia = (query: string) =>
    ({
      matches: false,
      media: query,
      onchange: null,
      addEventListener: () => {},
      removeEventListener: () => {},
      addListener: () => {},
      removeListener: () => {},
      dispatchEvent: () => false,
    }) as MediaQueryList
}
if (!('ResizeObserver' in window)) {
  ;(window as unknown as { ResizeObserver: unknown }).ResizeObserver = class {
    observe() {}
    unobserve() {}
    disconnect() {}
  }
}

window.scrollTo = () => {}

// jsdom has no canvas: charts render as a stub element that keeps the data it was given.
vi.mock('vue-chartjs', async () => {
  const { defineComponent, h } = await import('vue')
  const stub = (kind: string) =>
    defineComponent({
      name: `Stub${kind}Chart`,
      props: {
        data: { type: Object, required: true },
        options: { type: Object, default: () => ({}) },
      },
      setup:
        (props, { attrs }) =>
        () =>
          h('canvas', { ...attrs, 'data-chart': kind, 'data-points': JSON.stringify(props.data) }),
    })
  return {
    Line: stub('Line'),
    Bar: stub('Bar'),
    Doughnut: stub('Doughnut'),
    Scatter: stub('Scatter'),
  }
})
