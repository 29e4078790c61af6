import { createPinia, setActivePinia } from 'pinia'
import { nextTick } from 'vue'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { useLiveEstimate } from '@/composables/useEstimate'
import { useRigDraftStore } from '@/stores/rigDraft'
import { engineSpy } from './engine-spy'

// The estimate is computed state of the rig draft store: the engine runs once per change of the
// draft, and while the draft does not pass the schema the last valid rig's result stays, marked.

// The engine module, spied on: its runs counted, and made to fail on request.
vi.mock('../../shared/engine', async (original) =>
  (await import('./engine-spy')).spiedEngine(original),
)

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
  engineSpy.runs = 0
  engineSpy.fail = false
})

describe('the estimate of the rig draft store', () => {
  it('answers a valid draft, and a change brings a new answer', async () => {
    const store = useRigDraftStore()
    const before = store.result
    expect(before).not.toBeNull()
    expect(store.stale).toBe(false)
    expect(store.request).toEqual(store.validation.success ? store.validation.data : null)
    // Source: definition of the ampere-hour: cells in parallel add their capacity, so at the same
    // draw twice the strings of cells must run longer.
    store.draft.pack.parallelCells = store.draft.pack.parallelCells! * 2
    await nextTick()
    expect(store.stale).toBe(false)
    expect(store.result!.runtimeHours).toBeGreaterThan(before!.runtimeHours)
  })

  it('keeps the last valid rig’s result, marked, while the draft does not pass', async () => {
    const store = useRigDraftStore()
    const valid = store.result
    const validRequest = store.request
    store.draft.pack.parallelCells = 0
    await nextTick()
    expect(store.result).toBe(valid)
    expect(store.request).toBe(validRequest)
    expect(store.stale).toBe(true)
    expect(store.fieldIssues.get('pack.parallelCells')).toMatch(/^Cells in parallel/)
    expect(store.issueMessages).toEqual([...store.fieldIssues.values()])
    // Fixed: a new answer, no longer marked, and no messages (the same empty map each time).
    store.draft.pack.parallelCells = 1
    await nextTick()
    expect(store.stale).toBe(false)
    expect(store.fieldIssues.size).toBe(0)
    expect(store.fieldIssues).toBe(useRigDraftStore().fieldIssues)
  })

  it('marks the result while a field holds text that is not a number, first at that field', () => {
    // The draft keeps the field's last number; the typed text is said at the field, ahead of
    // any message of the schema for it.
    const store = useRigDraftStore()
    const valid = store.result
    store.markUnreadable('pack.parallelCells', '“two” is not a number')
    expect(store.stale).toBe(true)
    expect(store.result).toBe(valid)
    store.draft.pack.parallelCells = 0
    expect(store.fieldIssues.get('pack.parallelCells')).toBe('“two” is not a number')
    store.draft.pack.parallelCells = 2
    store.markUnreadable('pack.parallelCells', null)
    expect(store.stale).toBe(false)
    expect(store.result).not.toBe(valid)
  })

  it('runs the engine once per change of the draft, however many readers', async () => {
    const store = useRigDraftStore()
    const readers = [useLiveEstimate(), useLiveEstimate()]
    const readAll = () => [
      store.result,
      ...readers.map((reader) => [reader.result.value, reader.stale.value]),
    ]
    readAll()
    expect(engineSpy.runs).toBe(1)
    readAll()
    expect(engineSpy.runs).toBe(1)
    // Two fields changed before anyone reads: one run for the new draft.
    store.draft.pack.count = 3
    store.draft.programme.peakBelowClipDb = 6
    await nextTick()
    readAll()
    readAll()
    expect(engineSpy.runs).toBe(2)
    // A draft the schema refuses does not reach the engine.
    store.draft.pack.count = 0
    readAll()
    expect(engineSpy.runs).toBe(2)
    // Unreadable text typed and taken back without a change: the kept answer is the draft's.
    store.draft.pack.count = 3
    readAll()
    expect(engineSpy.runs).toBe(3)
    store.markUnreadable('pack.count', '“x” is not a number')
    readAll()
    store.markUnreadable('pack.count', null)
    readAll()
    expect(engineSpy.runs).toBe(3)
    expect(store.stale).toBe(false)
  })

  it('says when the engine fails on a valid draft, and keeps the last result marked', () => {
    const store = useRigDraftStore()
    const valid = store.result
    expect(store.engineError).toBeNull()
    engineSpy.fail = true
    store.draft.pack.count = 3
    expect(store.engineError).toBe('cutoff search did not converge')
    expect(store.result).toBe(valid)
    expect(store.stale).toBe(true)
    engineSpy.fail = false
    store.draft.pack.count = 4
    expect(store.engineError).toBeNull()
    expect(store.stale).toBe(false)
  })
})
