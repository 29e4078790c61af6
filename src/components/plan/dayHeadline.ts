import { formatHours } from '@/display/format'
import { clockLabel } from '@shared/plans/clock'
import type { EstimateResult } from '@shared/schemas/estimate'

/** Whether the day lasts, in one sentence on the event clock ("Lasts the day, to 14:00."). */
export function dayHeadline(schedule: EstimateResult['schedule'], startTime: string): string {
  if (!schedule) return ''
  const end = clockLabel(startTime, schedule.totalMinutes)
  if (schedule.lasts) return `Lasts the day, to ${end}.`
  const stopped = schedule.stoppedAtMinute ?? 0
  return `Does not last: the sound stops at ${clockLabel(startTime, stopped)}, ${formatHours((schedule.totalMinutes - stopped) / 60)} before ${end}.`
}
