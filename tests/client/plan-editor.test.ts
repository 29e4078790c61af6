import { createPinia, setActivePinia } from 'pinia'
import { flushPromises } from '@vue/test-utils'
import { computed, effectScope, ref } from 'vue'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { ApiRequestError } from '@/api/http'
import { plansApi } from '@/api/plans'
import { packsApi, rigsApi } from '@/api/resources'
import { usePlanEditor } from '@/composables/usePlanEditor'
import { usePlanResult } from '@/composables/usePlanResult'
import { exampleRigs } from '../../shared/library'
import type { RigItem } from '../../shared/schemas/resources'
import { engineSpy } from './engine-spy'

// The plan editor follows the bench's pattern: the day is computed state of the editor, worked
// out once per change, and while the plan does not pass, the last valid plan's day stays, marked.

vi.mock('../../shared/engine', async (original) =>
  (await import('./engine-spy')).spiedEngine(original),
)
vi.mock('@/api/resources', () => ({
  rigsApi: { list: vi.fn(), update: vi.fn() },
  packsApi: { list: vi.fn() },
}))
vi.mock('@/api/plans', () => ({ plansApi: { get: vi.fn(), create: vi.fn(), update: vi.fn() } }))
vi.mock('@/composables/useTeamAccess', async () => {
  const { computed } = await import('vue')
  return { useTeamAccess: () => ({ teamId: computed(() => 1), canEdit: computed(() => true) }) }
})

const rig: RigItem = {
  id: 5,
  version: 1,
  name: 'Square stage',
  notes: '',
  createdAt: '2026-05-02T09:00:00.000Z',
  updatedAt: '2026-05-02T09:00:00.000Z',
  createdBy: null,
  updatedBy: null,
  spec: structuredClone(exampleRigs[0]!.rig),
  specSchemaVersion: 1,
  summary: null,
  packId: null,
  amplifierId: null,
  speakersId: null,
  accessoryIds: [],
}

beforeEach(() => {
  setActivePinia(createPinia())
  engineSpy.runs = 0
  engineSpy.fail = false
  vi.mocked(rigsApi.list).mockResolvedValue({ items: [rig], total: 1 } as never)
  vi.mocked(packsApi.list).mockResolvedValue({ items: [], total: 0 } as never)
})

/** A new plan, loaded on the team's one rig, with the page's view of its day. */
async function newPlan() {
  const scope = effectScope()
  const parts = scope.run(() => {
    const editor = usePlanEditor(ref(null))
    const shown = usePlanResult(
      editor.result,
      editor.resultPlan,
      computed(() => []),
    )
    return { editor, shown }
  })!
  await flushPromises()
  return { ...parts, stop: () => scope.stop() }
}

describe('the plan editor’s day', () => {
  it('works the new plan’s day out on the chosen rig', async () => {
    const { editor, stop } = await newPlan()
    expect(editor.draft.rigId).toBe(rig.id)
    // Source: clock arithmetic: the new plan's 30 minutes of set-up and 60 of music are 90.
    expect(editor.result.value?.schedule?.totalMinutes).toBe(90)
    expect(editor.resultPlan.value?.body.startTime).toBe('08:00')
    expect(editor.stale.value).toBe(false)
    expect(editor.complete.value).toBe(true)
    stop()
  })

  it('keeps the last valid plan’s day, marked, with its own start on the clock', async () => {
    const { editor, shown, stop } = await newPlan()
    // A day long enough for one pack to run out: the engine plans swaps.
    editor.draft.packCount = 4
    editor.draft.schedule[1]!.minutes = 2000
    const valid = editor.result.value
    const swapTimes = shown.swaps.value.map((swap) => swap.atTime)
    expect(swapTimes.length).toBeGreaterThan(0)
    editor.draft.startTime = '25:00'
    expect(editor.stale.value).toBe(true)
    expect(editor.result.value).toBe(valid)
    expect(editor.complete.value).toBe(false)
    expect(editor.fieldIssues.value.get('startTime')).toBeTruthy()
    // The swaps keep the valid plan's 08:00 start, never a clock read from "25:00".
    expect(shown.swaps.value.map((swap) => swap.atTime)).toEqual(swapTimes)
    editor.draft.startTime = '09:00'
    expect(editor.stale.value).toBe(false)
    // Source: clock arithmetic: the same swaps an hour later on the clock.
    const hourLater = (time: string) => {
      const [hours, minutes] = time.split(':').map(Number)
      return `${String((hours! + 1) % 24).padStart(2, '0')}:${String(minutes).padStart(2, '0')}`
    }
    expect(shown.swaps.value.map((swap) => swap.atTime.slice(0, 5))).toEqual(
      swapTimes.map((time) => hourLater(time.slice(0, 5))),
    )
    stop()
  })

  it('marks the day while a number field holds text that is not a number, and waits to save', async () => {
    const { editor, stop } = await newPlan()
    const valid = editor.result.value
    const runs = engineSpy.runs
    editor.markUnreadable('segment-2-minutes', '“an hour” is not a number')
    expect(editor.stale.value).toBe(true)
    expect(editor.result.value).toBe(valid)
    expect(editor.complete.value).toBe(false)
    editor.markUnreadable('segment-2-minutes', null)
    expect(editor.stale.value).toBe(false)
    expect(editor.complete.value).toBe(true)
    // The draft did not change: the day is not worked out again.
    expect(engineSpy.runs).toBe(runs)
    stop()
  })

  it('runs the engine once per change of the plan', async () => {
    const { editor, shown, stop } = await newPlan()
    const read = () => [editor.result.value, editor.stale.value, shown.swaps.value]
    read()
    const runs = engineSpy.runs
    editor.draft.temperatureC = 5
    editor.draft.schedule[1]!.minutes = 90
    read()
    read()
    expect(engineSpy.runs).toBe(runs + 1)
    // A plan the schema refuses (a segment with no length) does not reach the engine.
    editor.draft.schedule[1]!.minutes = undefined
    read()
    expect(engineSpy.runs).toBe(runs + 1)
    expect(editor.fieldIssues.value.has('schedule.1.minutes')).toBe(true)
    stop()
  })

  it('shows what the server said of a field beside it, ahead of the schema', async () => {
    const { editor, stop } = await newPlan()
    vi.mocked(plansApi.create).mockRejectedValue(
      new ApiRequestError(400, 'invalid-input', 'The plan was not saved.', [
        { path: 'rigId', message: 'There is no such rig in this team.' },
      ]),
    )
    expect(await editor.save()).toBeNull()
    expect(editor.fieldIssues.value.get('rigId')).toBe('There is no such rig in this team.')
    expect(editor.saveError.value).toBe('The plan was not saved.')
    stop()
  })
})
