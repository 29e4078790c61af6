// Wording of figures on the card. Fixed English (en-GB) so the server and the browser print the
// same strings whatever their locale.
import { celsiusToFahrenheit, metresToFeet } from '../units'

/** Whole minutes as "6 h 05 min", "45 min", "under 1 min". */
export function durationWords(minutes: number): string {
  const total = Math.round(minutes)
  if (total < 1) return 'under 1 min'
  const hours = Math.floor(total / 60)
  const rest = total % 60
  if (hours === 0) return `${rest} min`
  return `${hours} h ${String(rest).padStart(2, '0')} min`
}

/** A figure with at most `decimals` decimals, trailing zeros dropped: 5, 4.7, 2.67. */
export function figure(value: number, decimals = 1): string {
  const fixed = value.toFixed(decimals)
  const text = fixed.includes('.') ? fixed.replace(/\.?0+$/, '') : fixed
  return text === '-0' ? '0' : text
}

export function temperatureWords(temperatureC: number): string {
  return `${figure(temperatureC, 0)} °C (${figure(celsiusToFahrenheit(temperatureC), 0)} °F)`
}

export function distanceWords(distanceM: number): string {
  return `${figure(distanceM, 1)} m (${figure(metresToFeet(distanceM), 0)} ft)`
}

const dateFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'long',
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  timeZone: 'UTC',
})

/** "Saturday 13 June 2026" for a YYYY-MM-DD calendar date. */
export function dateWords(date: string): string {
  const [year = 1970, month = 1, day = 1] = date.split('-').map(Number)
  return dateFormat.format(new Date(Date.UTC(year, month - 1, day))).replace(',', '')
}

export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`
}
