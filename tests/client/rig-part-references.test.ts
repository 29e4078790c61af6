import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import { accessoriesApi, amplifiersApi, packsApi, speakersApi } from '@/api/resources'
import { useRigPartReferences } from '@/composables/useRigPartReferences'
import { useRigDraftStore } from '@/stores/rigDraft'
import { useSessionStore } from '@/stores/session'
import type { PackItem } from '../../shared/schemas/resources'

// A saved rig refers to the team parts it uses unchanged, so those parts cannot vanish silently
// (a part in use by a rig is protected from deletion).

vi.mock('@/api/resources', () => ({
  packsApi: { list: vi.fn() },
  amplifiersApi: { list: vi.fn() },
  speakersApi: { list: vi.fn() },
  accessoriesApi: { list: vi.fn() },
}))

const meta = {
  version: 1,
  notes: '',
  createdAt: '2026-04-01T10:00:00.000Z',
  updatedAt: '2026-04-01T10:00:00.000Z',
  createdBy: null,
  updatedBy: null,
}

function mountReferences() {
  let references!: ReturnType<typeof useRigPartReferences>
  mount(
    defineComponent({
      setup() {
        references = useRigPartReferences()
        return () => h('div')
      },
    }),
  )
  return () => references.value
}

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
  useSessionStore().apply({
    user: { id: 1, email: 'sam@example.test', name: 'Sam' },
    teams: [{ id: 3, name: 'Night crew', role: 'editor' }],
    devOutbox: false,
    emailVerified: true,
  })
  for (const api of [amplifiersApi, speakersApi, accessoriesApi]) {
    vi.mocked(api.list).mockResolvedValue({ items: [], total: 0 } as never)
  }
})

describe('the part references a saved rig carries', () => {
  it('names the team pack the bench uses unchanged, and drops it once a value is edited', async () => {
    const bench = useRigDraftStore()
    const benchPack = bench.draft.pack
    const teamPack = { ...meta, id: 12, name: 'Crew pack', ...benchPack, count: 1 } as PackItem
    vi.mocked(packsApi.list).mockResolvedValue({ items: [teamPack], total: 1 } as never)
    const references = mountReferences()
    await flushPromises()
    // The packs on hand belong to the rig, so a different count still uses the same saved pack.
    expect(references()?.packId).toBe(12)
    expect(references()?.accessoryIds).toEqual([])

    bench.draft.pack = {
      ...bench.draft.pack,
      cellCapacityAh: (bench.draft.pack.cellCapacityAh ?? 2) + 1,
    }
    await flushPromises()
    expect(references()?.packId).toBeNull()
  })

  it('gives no references until the team lists have loaded, so a save keeps the old ones', async () => {
    vi.mocked(packsApi.list).mockRejectedValue(new Error('offline'))
    const references = mountReferences()
    await flushPromises()
    expect(references()).toBeUndefined()
  })
})
