import type { ChartPalette } from '@/theme/themes'
import { tickOptions } from '@/components/bench/charts/register'
import { eventClock } from '@shared/events/words'

// Ticks on whole half-hours or hours (08:00, 09:00 …), at most seven, so a crew reads the axis
// as a clock rather than at odd minutes.
const STEPS_MINUTES = [30, 60, 120, 180, 240, 360, 720, 1440]

/** The time-of-day axis under an event's charts, from its first to its last minute. */
export function clockAxis(palette: ChartPalette, startMinute: number, endMinute: number) {
  const span = Math.max(endMinute - startMinute, 1)
  const stepSize = STEPS_MINUTES.find((step) => span / step <= 6) ?? 1440
  return {
    type: 'linear' as const,
    min: startMinute,
    max: endMinute,
    grid: { color: palette.grid },
    ticks: {
      ...tickOptions(palette),
      stepSize,
      callback: (value: number | string) => eventClock(Number(value)),
    },
    title: { display: true, text: 'Time of day', color: palette.text },
  }
}
