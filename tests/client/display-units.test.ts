import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { energyPerMass, energyPerMassText, mass, showFigure } from '@/display/units'
import { usePreferencesStore } from '@/stores/preferences'

// Source: 1 lb = 0.45359237 kg exactly (international yard and pound agreement, 1959).

describe('masses and energy per mass in the chosen units', () => {
  beforeEach(() => {
    localStorage.clear()
    setActivePinia(createPinia())
  })

  it('shows kilograms and Wh/kg in metric', () => {
    expect(mass.unit).toBe('kg')
    expect(showFigure(10, mass)).toBe('10.00')
    expect(energyPerMassText(150)).toBe('150\u00a0Wh/kg')
  })

  it('shows pounds and Wh/lb in imperial', () => {
    usePreferencesStore().units = 'imperial'
    expect(mass.unit).toBe('lb')
    // 10 kg / 0.45359237 = 22.046 lb
    expect(showFigure(10, mass)).toBe('22.05')
    // 150 Wh/kg × 0.45359237 kg/lb = 68.04 Wh/lb
    expect(energyPerMass.unit).toBe('Wh/lb')
    expect(energyPerMassText(150)).toBe('68\u00a0Wh/lb')
    expect(energyPerMass.fromDisplay(68.0388555)).toBeCloseTo(150, 6)
  })
})
