import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'

export type ColourMode = 'light' | 'dark' | 'system'
export type UnitSystem = 'metric' | 'imperial'

const storageKey = 'loudhour.preferences.v1'

interface StoredPreferences {
  colourMode: ColourMode
  units: UnitSystem
}

function load(): StoredPreferences {
  const fallback: StoredPreferences = { colourMode: 'system', units: 'metric' }
  try {
    const raw = localStorage.getItem(storageKey)
    if (!raw) return fallback
    const parsed = JSON.parse(raw) as Partial<StoredPreferences>
    return {
      colourMode: ['light', 'dark', 'system'].includes(parsed.colourMode ?? '')
        ? (parsed.colourMode as ColourMode)
        : fallback.colourMode,
      units: parsed.units === 'imperial' ? 'imperial' : 'metric',
    }
  } catch {
    return fallback
  }
}

function systemPrefersDark(): boolean {
  return (
    typeof window !== 'undefined' && !!window.matchMedia?.('(prefers-color-scheme: dark)').matches
  )
}

/** Display choices that belong to this browser, not to an account: colour mode and units. */
export const usePreferencesStore = defineStore('preferences', () => {
  const initial = load()
  const colourMode = ref<ColourMode>(initial.colourMode)
  const units = ref<UnitSystem>(initial.units)
  const systemDark = ref(systemPrefersDark())

  if (typeof window !== 'undefined' && window.matchMedia) {
    window
      .matchMedia('(prefers-color-scheme: dark)')
      .addEventListener?.('change', (event) => (systemDark.value = event.matches))
  }

  const isDark = computed(() =>
    colourMode.value === 'system' ? systemDark.value : colourMode.value === 'dark',
  )

  watch([colourMode, units], () => {
    try {
      localStorage.setItem(
        storageKey,
        JSON.stringify({ colourMode: colourMode.value, units: units.value }),
      )
    } catch {
      // Private browsing may refuse storage; the choice still holds for this visit.
    }
  })

  function toggleDark(): void {
    colourMode.value = isDark.value ? 'light' : 'dark'
  }

  return { colourMode, units, isDark, toggleDark }
})
