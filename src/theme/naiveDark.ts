import { shallowRef } from 'vue'
import type { GlobalTheme } from 'naive-ui'

/**
 * naive-ui's dark theme, loaded when dark mode is first wanted: it restyles every component the
 * library has, and most visits are in light mode.
 */
export const naiveDarkTheme = shallowRef<GlobalTheme | null>(null)

export async function loadNaiveDarkTheme(): Promise<void> {
  if (naiveDarkTheme.value) return
  const { darkTheme } = await import('naive-ui/es/themes/dark')
  naiveDarkTheme.value = darkTheme
}
