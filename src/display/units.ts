import { computed, type ComputedRef } from 'vue'
import {
  areaMm2ToAwg,
  awgToAreaMm2,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  feetToMetres,
  kilogramsToPounds,
  metresToFeet,
  poundsToKilograms,
} from '@shared/units'
import type { FieldDisplay } from '@shared/fields'
import { usePreferencesStore } from '@/stores/preferences'
import { formatNumber, withUnit } from './format'

/** How one kind of quantity is shown: its unit, conversions from and to SI, and its rounding. */
export interface DisplayQuantity {
  unit: string
  toDisplay: (si: number) => number
  fromDisplay: (shown: number) => number
  decimals: number
}

const identity = (value: number) => value

const metres: DisplayQuantity = {
  unit: 'm',
  toDisplay: identity,
  fromDisplay: identity,
  decimals: 2,
}
const feet: DisplayQuantity = {
  unit: 'ft',
  toDisplay: metresToFeet,
  fromDisplay: feetToMetres,
  decimals: 1,
}
const celsius: DisplayQuantity = {
  unit: '°C',
  toDisplay: identity,
  fromDisplay: identity,
  decimals: 0,
}
const fahrenheit: DisplayQuantity = {
  unit: '°F',
  toDisplay: celsiusToFahrenheit,
  fromDisplay: fahrenheitToCelsius,
  decimals: 0,
}

/** SI prefixes for small quantities that datasheets print in milli-units. */
export const milliOhm: DisplayQuantity = {
  unit: 'mΩ',
  toDisplay: (ohm) => ohm * 1000,
  fromDisplay: (milli) => milli / 1000,
  decimals: 1,
}
/** Efficiencies are fractions in the engine and percentages on screen. */
export const percentOfOne: DisplayQuantity = {
  unit: '%',
  toDisplay: (fraction) => fraction * 100,
  fromDisplay: (percent) => percent / 100,
  decimals: 0,
}

const imperialNow = () => usePreferencesStore().units === 'imperial'

/**
 * Masses in the units of the header's switch, wherever they are shown or typed: pounds in
 * imperial, kilograms in metric. Read at use, so a static table of fields (the parts forms)
 * follows the switch too.
 */
export const mass: DisplayQuantity = {
  get unit() {
    return imperialNow() ? 'lb' : 'kg'
  },
  toDisplay: (massKg) => (imperialNow() ? kilogramsToPounds(massKg) : massKg),
  fromDisplay: (shown) => (imperialNow() ? poundsToKilograms(shown) : shown),
  decimals: 2,
}

/** Energy per mass in the same units: Wh/lb in imperial, Wh/kg in metric. */
export const energyPerMass: DisplayQuantity = {
  get unit() {
    return imperialNow() ? 'Wh/lb' : 'Wh/kg'
  },
  // Wh per lb = Wh per kg × the kilograms in one pound.
  toDisplay: (whPerKg) => (imperialNow() ? whPerKg * poundsToKilograms(1) : whPerKg),
  fromDisplay: (shown) => (imperialNow() ? shown / poundsToKilograms(1) : shown),
  decimals: 0,
}

/** Energy per mass with its unit, as the switch asks. */
export function energyPerMassText(whPerKg: number): string {
  return showQuantity(whPerKg, energyPerMass)
}

/** The AWG name of a gauge: 0 is "1/0", −1 is "2/0" (ASTM B258 numbering). */
export function awgName(awg: number): string {
  const whole = Math.round(awg)
  if (Math.abs(awg - whole) > 0.05) return `${formatNumber(awg, 1)} AWG`
  return whole <= 0 ? `${1 - whole}/0 AWG` : `${whole} AWG`
}

/** Both names of a lead's wire size, the unit system's own first. */
export function wireSizeText(
  size: { awg?: number | undefined; areaMm2?: number | undefined },
  imperial: boolean,
): string {
  const areaMm2 = size.areaMm2 ?? (size.awg !== undefined ? awgToAreaMm2(size.awg) : undefined)
  const awg = size.awg ?? (size.areaMm2 !== undefined ? areaMm2ToAwg(size.areaMm2) : undefined)
  if (areaMm2 === undefined || awg === undefined) return ''
  const mm2 = withUnit(formatNumber(areaMm2, areaMm2 < 1 ? 2 : 1), 'mm²')
  return imperial ? `${awgName(awg)} (${mm2})` : `${mm2} (${awgName(awg)})`
}

const lengthIn = (imperial: boolean) => (imperial ? feet : metres)
const temperatureIn = (imperial: boolean) => (imperial ? fahrenheit : celsius)

/** How a catalogue field is shown (its `display`), in the header's units where there is a choice. */
export function displayQuantity(display: FieldDisplay | undefined): DisplayQuantity | undefined {
  switch (display) {
    case 'milliOhm':
      return milliOhm
    case 'percentOfOne':
      return percentOfOne
    case 'mass':
      return mass
    case 'length':
      return lengthIn(imperialNow())
    case 'temperature':
      return temperatureIn(imperialNow())
    default:
      return undefined
  }
}

export interface DisplayUnits {
  imperial: ComputedRef<boolean>
  length: ComputedRef<DisplayQuantity>
  temperature: ComputedRef<DisplayQuantity>
}

/** The display units chosen in the header's metric/imperial switch. */
export function useDisplayUnits(): DisplayUnits {
  const preferences = usePreferencesStore()
  const imperial = computed(() => preferences.units === 'imperial')
  return {
    imperial,
    length: computed(() => lengthIn(imperial.value)),
    temperature: computed(() => temperatureIn(imperial.value)),
  }
}

/** An SI value shown in a display quantity, rounded, without its unit (a column names it). */
export function showFigure(si: number, quantity: DisplayQuantity): string {
  return formatNumber(quantity.toDisplay(si), quantity.decimals)
}

/** An SI value shown in a display quantity, rounded, with its unit. */
export function showQuantity(si: number, quantity: DisplayQuantity): string {
  return withUnit(showFigure(si, quantity), quantity.unit)
}
