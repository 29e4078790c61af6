import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import { NConfigProvider } from 'naive-ui'
import PartForm from '@/components/parts/PartForm.vue'
import { partKinds } from '@/components/parts/partKinds'
import { useRigDraftStore } from '@/stores/rigDraft'
import { useSavedRigStore } from '@/stores/savedRig'
import { exampleRigs } from '../../shared/library'
import type { RigItem } from '../../shared/schemas/resources'

// The bench's link to a saved rig (open, unsaved changes, save with its version) and the parts
// form's messages from the shared schema.

function savedRig(overrides: Partial<RigItem> = {}): RigItem {
  const example = exampleRigs[1]!
  return {
    id: 7,
    version: 3,
    name: 'Busker cart',
    notes: '',
    createdAt: '2026-05-02T09:00:00.000Z',
    updatedAt: '2026-05-02T09:00:00.000Z',
    createdBy: null,
    updatedBy: null,
    spec: structuredClone(example.rig),
    specSchemaVersion: 1,
    summary: null,
    packId: 4,
    amplifierId: null,
    speakersId: null,
    accessoryIds: [],
    ...overrides,
  }
}

function answer(status: number, body: unknown) {
  return Promise.resolve(
    new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } }),
  )
}

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
})
afterEach(() => vi.unstubAllGlobals())

describe('the saved rig on the bench', () => {
  it('opens with no unsaved changes, and notices an edit and a new name', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(() => answer(200, savedRig())),
    )
    const saved = useSavedRigStore()
    const bench = useRigDraftStore()
    await saved.open(1, 7)
    expect(saved.link).toMatchObject({ teamId: 1, rigId: 7, version: 3, name: 'Busker cart' })
    expect(saved.hasUnsavedChanges).toBe(false)

    bench.draft.pack.seriesCells = 12
    expect(saved.hasUnsavedChanges).toBe(true)
    bench.draft.pack.seriesCells = savedRig().spec.pack.seriesCells
    expect(saved.hasUnsavedChanges).toBe(false)
    bench.name = 'Cart, left side'
    expect(saved.hasUnsavedChanges).toBe(true)
  })

  it('sends the version it opened, and keeps the link as it was on a 409', async () => {
    const fetchMock = vi.fn(() => answer(200, savedRig()))
    vi.stubGlobal('fetch', fetchMock)
    const saved = useSavedRigStore()
    await saved.open(1, 7)
    useRigDraftStore().draft.pack.seriesCells = 12

    fetchMock.mockImplementationOnce(() =>
      answer(409, { error: { code: 'stale-version', message: 'Someone else saved this rig.' } }),
    )
    await expect(saved.save()).rejects.toMatchObject({ status: 409, code: 'stale-version' })
    const [url, init] = fetchMock.mock.calls.at(-1) as unknown as [URL, RequestInit]
    expect(String(url)).toContain('/api/v1/teams/1/rigs/7')
    expect(JSON.parse(String(init.body))).toMatchObject({
      version: 3,
      packId: 4,
      name: 'Busker cart',
    })
    expect(saved.link?.version).toBe(3)
    expect(saved.hasUnsavedChanges).toBe(true)
  })

  it('lets go of the saved rig when the bench loads an example instead', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(() => answer(200, savedRig())),
    )
    const saved = useSavedRigStore()
    await saved.open(1, 7)
    const example = exampleRigs[0]!
    useRigDraftStore().replace(example.rig, example.label)
    expect(saved.link).toBeNull()
    expect(saved.hasUnsavedChanges).toBe(false)
  })
})

describe('the part form', () => {
  it('shows the shared schema’s message beside the field and sends nothing', async () => {
    const save = vi.fn(() => Promise.resolve())
    const packs = partKinds.find((kind) => kind.id === 'packs')!
    const Host = defineComponent(
      () => () => h(NConfigProvider, null, () => h(PartForm, { kind: packs, save })),
    )
    const wrapper = mount(Host, { attachTo: document.body })
    await wrapper.find('#part-packs-name').setValue('Spare pack')
    await wrapper.find('#part-packs-seriesCells').setValue('0')
    await wrapper.find('form').trigger('submit')
    await flushPromises()
    expect(wrapper.text()).toContain('Cells in series must be a whole number from 1 to 100')
    expect(save).not.toHaveBeenCalled()
    wrapper.unmount()
  })
})
