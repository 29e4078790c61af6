import {
  BarElement,
  CategoryScale,
  Chart,
  Decimation,
  LinearScale,
  LineElement,
  PointElement,
  Tooltip,
  type ChartOptions,
} from 'chart.js'
import { computed, type ComputedRef } from 'vue'
import { formatElapsed } from '@/display/format'
import { usePreferencesStore } from '@/stores/preferences'
import { darkChartPalette, lightChartPalette, type ChartPalette } from '@/theme/themes'

// Only the parts the bench draws (vue-chartjs registers the line and bar controllers itself), so
// the rest of chart.js stays out of the bundle.
Chart.register(
  BarElement,
  CategoryScale,
  Decimation,
  LinearScale,
  LineElement,
  PointElement,
  Tooltip,
)

export function useChartPalette(): ComputedRef<ChartPalette> {
  const preferences = usePreferencesStore()
  return computed(() => (preferences.isDark ? darkChartPalette : lightChartPalette))
}

/**
 * Options every chart shares: no animation and pre-parsed points, because a bench redraw follows
 * every keystroke and should fit in one frame. `decimate` thins long series (measured logs of
 * thousands of rows); the engine's timelines hold at most 500 points, and thinning those costs
 * more time than it saves.
 */
export function baseOptions(
  palette: ChartPalette,
  { decimate = false }: { decimate?: boolean } = {},
): ChartOptions<'line'> & ChartOptions<'bar'> {
  return {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    normalized: true,
    interaction: { mode: 'index', intersect: false },
    plugins: {
      // A few hundred pixels wide: more points than that cannot be seen, only drawn.
      decimation: { enabled: decimate, algorithm: 'min-max' },
      // The key is page text beside the chart (BenchChartLegend).
      legend: { display: false },
      tooltip: { enabled: true },
    },
    color: palette.text,
  }
}

/** A level drawn across the whole run (cutoff, lock-out, clipping) as a two-point line. */
export function levelLine(
  timeline: readonly { minute: number }[],
  y: number,
): { x: number; y: number }[] {
  const first = timeline[0]?.minute ?? 0
  const last = timeline[timeline.length - 1]?.minute ?? 0
  return [
    { x: first, y },
    { x: last, y },
  ]
}

/** The elapsed-time axis under every timeline chart. */
export function elapsedTimeAxis(palette: ChartPalette) {
  return {
    type: 'linear' as const,
    grid: { color: palette.grid },
    title: { display: true, text: 'Elapsed time (h:mm)', color: palette.text },
    ticks: {
      ...tickOptions(palette),
      callback: (value: number | string) => formatElapsed(Number(value)),
    },
  }
}

/** Options of a chart over elapsed time, with the given value axes. */
export function timelineOptions(
  palette: ChartPalette,
  valueScales: NonNullable<ChartOptions<'line'>['scales']>,
): ChartOptions<'line'> {
  return {
    ...baseOptions(palette),
    parsing: false,
    spanGaps: true,
    elements: { point: { radius: 0 }, line: { borderWidth: 2 } },
    scales: { x: elapsedTimeAxis(palette), ...valueScales },
  }
}

/** The page-text key of a chart's datasets (BenchChartLegend). */
export function legendItems(
  datasets: readonly { label?: string; borderColor?: unknown; borderDash?: unknown }[],
) {
  return datasets.map((dataset) => ({
    label: dataset.label ?? '',
    colour: String(dataset.borderColor),
    dashed: Array.isArray(dataset.borderDash) && dataset.borderDash.length > 0,
  }))
}

/**
 * Tick settings that keep label measuring (the costliest part of a redraw) to a few labels: at
 * most seven ticks are made, so there is nothing for chart.js to skip and measure twice.
 */
export function tickOptions(palette: ChartPalette) {
  return { color: palette.text, maxTicksLimit: 7, maxRotation: 0, sampleSize: 4, autoSkip: false }
}
