// The plan as its form holds it, and the list operations on its segments. A draft becomes a plan
// body once the shared schema passes; until then the schema's messages say what is missing.
import { PROGRAMME_PRESETS } from '@shared/engine'
import type { ScheduleSegment, SegmentState, SwapPolicy } from '@shared/schemas/estimate'
import type { PlanItem } from '@shared/schemas/plans'
import { DEFAULT_SWAP_BELOW_SOC_PCT } from '@shared/engine/resolve'

type Editable<T> = { [K in keyof T]?: T[K] | undefined }

/** A segment being edited; `key` only keeps list rows apart while they move. */
export type SegmentDraft = Editable<ScheduleSegment> & { key: number; state: SegmentState }

export interface PlanDraft {
  name: string
  notes: string
  rigId: number | undefined
  date: string
  startTime: string
  temperatureC: number | null
  packCount: number | null
  swapPolicy: { mode: SwapPolicy['mode']; belowSocPct: number }
  schedule: SegmentDraft[]
}

let nextKey = 1
const keyed = (segment: Editable<ScheduleSegment>): SegmentDraft => ({
  ...segment,
  state: segment.state ?? 'on',
  key: nextKey++,
})

const DENSE_MUSIC_DB = PROGRAMME_PRESETS.find(
  (preset) => preset.id === 'dense-dance',
)!.crestFactorDb

/** A new segment: music at 3 dB below clipping (ours: a lively but clean start). */
export function newSegment(): SegmentDraft {
  return keyed({
    label: 'Music',
    minutes: 60,
    state: 'on',
    peakBelowClipDb: 3,
    crestFactorDb: DENSE_MUSIC_DB,
    playingPct: 90,
  })
}

/** Today's date in the browser's time zone, YYYY-MM-DD. */
function localToday(now = new Date()): string {
  const pad = (value: number) => String(value).padStart(2, '0')
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`
}

export function emptyDraft(rigId?: number): PlanDraft {
  return {
    name: 'New event plan',
    notes: '',
    rigId,
    date: localToday(),
    startTime: '08:00',
    temperatureC: null,
    packCount: null,
    swapPolicy: { mode: 'when-empty', belowSocPct: DEFAULT_SWAP_BELOW_SOC_PCT },
    schedule: [
      keyed({ label: 'Set-up and sound check', minutes: 30, state: 'idle' }),
      newSegment(),
    ],
  }
}

export function draftFromPlan(plan: PlanItem): PlanDraft {
  return {
    name: plan.name,
    notes: plan.notes,
    rigId: plan.rigId,
    date: plan.date,
    startTime: plan.startTime,
    temperatureC: plan.temperatureC,
    packCount: plan.packCount,
    swapPolicy: {
      mode: plan.swapPolicy?.mode ?? 'when-empty',
      belowSocPct: plan.swapPolicy?.belowSocPct ?? DEFAULT_SWAP_BELOW_SOC_PCT,
    },
    schedule: structuredClone(plan.schedule).map(keyed),
  }
}

/** What goes to the schema and the server: the draft without list keys or unused fields. */
export function bodyOfDraft(draft: PlanDraft): unknown {
  return {
    name: draft.name,
    notes: draft.notes,
    rigId: draft.rigId,
    date: draft.date,
    startTime: draft.startTime,
    temperatureC: draft.temperatureC,
    packCount: draft.packCount,
    swapPolicy:
      draft.swapPolicy.mode === 'when-empty'
        ? { mode: 'when-empty' }
        : { mode: 'at-break-below', belowSocPct: draft.swapPolicy.belowSocPct },
    schedule: draft.schedule.map(({ key: _key, ...segment }) =>
      Object.fromEntries(Object.entries(segment).filter(([, value]) => value !== undefined)),
    ),
  }
}

export function moveSegment(schedule: SegmentDraft[], index: number, by: -1 | 1): void {
  const target = index + by
  if (target < 0 || target >= schedule.length) return
  const [moved] = schedule.splice(index, 1)
  if (moved) schedule.splice(target, 0, moved)
}

export function duplicateSegment(schedule: SegmentDraft[], index: number): void {
  const original = schedule[index]
  if (!original) return
  const { key: _key, ...copy } = original
  schedule.splice(index + 1, 0, keyed(structuredClone(copy)))
}

export function removeSegment(schedule: SegmentDraft[], index: number): void {
  schedule.splice(index, 1)
}

/** The preset whose crest factor this is, if any (to show its name in the picker). */
export function presetIdFor(crestFactorDb: number | undefined): string | null {
  if (crestFactorDb === undefined) return null
  return (
    PROGRAMME_PRESETS.find((preset) => Math.abs(preset.crestFactorDb - crestFactorDb) < 0.005)
      ?.id ?? null
  )
}
