// Display formatting for the bench: tabular figures, sensible rounding, a unit on every figure.

const formatters = new Map<number, Intl.NumberFormat>()

function formatter(decimals: number): Intl.NumberFormat {
  let found = formatters.get(decimals)
  if (!found) {
    found = new Intl.NumberFormat('en-GB', {
      minimumFractionDigits: decimals,
      maximumFractionDigits: decimals,
    })
    formatters.set(decimals, found)
  }
  return found
}

/** Fixed decimals with digit grouping; −0 shows as 0. */
export function formatNumber(value: number, decimals = 0): string {
  const text = formatter(decimals).format(value)
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text
}

/** Three significant figures at most, never more than `maxDecimals` decimals: 0.123, 12.3, 1,234. */
export function formatSignificant(value: number, maxDecimals = 2): string {
  const magnitude = Math.abs(value)
  const decimals = magnitude >= 100 ? 0 : magnitude >= 10 ? 1 : 2
  return formatNumber(value, Math.min(decimals, maxDecimals))
}

/** A figure and its unit, joined by a no-break space so they never part at a line end. */
export function withUnit(figure: string, unit: string): string {
  return unit === '%' ? `${figure}\u00a0%` : `${figure}\u00a0${unit}`
}

/** A duration in hours as "3 h 05 min", "45 min" or "under 1 min". */
export function formatHours(hours: number): string {
  const totalMinutes = Math.round(hours * 60)
  if (totalMinutes < 1) return 'under 1\u00a0min'
  const wholeHours = Math.floor(totalMinutes / 60)
  const minutes = totalMinutes % 60
  if (wholeHours === 0) return `${minutes}\u00a0min`
  return `${formatNumber(wholeHours)}\u00a0h ${String(minutes).padStart(2, '0')}\u00a0min`
}

/** Elapsed time as h:mm, for chart axes and tables. */
export function formatElapsed(minute: number): string {
  const rounded = Math.round(minute)
  const hours = Math.floor(rounded / 60)
  return `${hours}:${String(rounded % 60).padStart(2, '0')}`
}
