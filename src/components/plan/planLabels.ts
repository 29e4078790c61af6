// Plain words for a plan's states, and the colours that tell them apart (with a pattern too, so
// the day reads in black and white).
import type { SegmentState } from '@shared/schemas/estimate'

export const stateLabels: Record<SegmentState, string> = {
  on: 'Playing',
  idle: 'On, silent',
  off: 'Switched off',
  charging: 'Charging',
}
