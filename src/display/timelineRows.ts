import type { TimelinePoint } from '@shared/schemas/estimate'

/** About `count` points spread evenly over the run (first and last included), for the tables. */
export function sampleTimeline(timeline: readonly TimelinePoint[], count: number): TimelinePoint[] {
  if (timeline.length <= count) return [...timeline]
  const rows: TimelinePoint[] = []
  const last = timeline.length - 1
  for (let index = 0; index < count; index++) {
    const point = timeline[Math.round((index * last) / (count - 1))]
    if (point && point !== rows[rows.length - 1]) rows.push(point)
  }
  return rows
}
