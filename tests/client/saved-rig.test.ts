import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import { NConfigProvider } from 'naive-ui'
import PartForm from '@/components/parts/PartForm.vue'
import { partKinds, type PartRecord } from '@/components/parts/partKinds'
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

/** The parts form for one kind of part, inside the theme provider the app gives it. */
function mountPartForm(kindId: string, save: () => Promise<void>, part?: PartRecord) {
  const kind = partKinds.find((candidate) => candidate.id === kindId)!
  const Host = defineComponent(
    () => () => h(NConfigProvider, null, () => h(PartForm, { kind, save, part })),
  )
  return mount(Host, { attachTo: document.body })
}

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
    const wrapper = mountPartForm('packs', save)
    await wrapper.find('#part-packs-name').setValue('Spare pack')
    await wrapper.find('[data-testid="field-seriesCells"] input').setValue('0')
    await wrapper.find('form').trigger('submit')
    await flushPromises()
    expect(wrapper.text()).toContain('Cells in series must be a whole number from 1 to 100')
    expect(save).not.toHaveBeenCalled()
    wrapper.unmount()
  })

  it('takes cell resistance in mΩ and efficiency in %, as the bench does, and stores SI', async () => {
    const save = vi.fn(() => Promise.resolve())
    const wrapper = mountPartForm('packs', save)
    await wrapper.find('#part-packs-name').setValue('Spare pack')
    await wrapper.find('[data-testid="field-seriesCells"] input').setValue('5')
    await wrapper.find('[data-testid="field-parallelCells"] input').setValue('2')
    await wrapper.find('[data-testid="field-cellCapacityAh"] input').setValue('4')
    // 22 mΩ, a typical 18650 power cell's DC resistance (from memory), is 0.022 Ω.
    await wrapper.find('[data-testid="field-cellResistanceOhm"] input').setValue('22')
    expect(wrapper.find('[data-testid="field-cellResistanceOhm"] label').text()).toBe(
      'Cell resistance (optional)',
    )
    expect(wrapper.text()).toContain('mΩ')
    await wrapper.find('form').trigger('submit')
    await flushPromises()
    expect(save).toHaveBeenCalledOnce()
    const body = (save.mock.calls[0] as unknown as [Record<string, unknown>])[0]
    expect(body.cellResistanceOhm).toBeCloseTo(0.022, 9)
    wrapper.unmount()

    // An accessory saved with a 0.88 converter efficiency shows 88 %.
    const part = {
      id: 3,
      version: 1,
      name: 'Mixer',
      notes: '',
      createdAt: '2026-05-02T09:00:00.000Z',
      updatedAt: '2026-05-02T09:00:00.000Z',
      createdBy: null,
      updatedBy: null,
      powerW: 2,
      inputMinV: 9,
      inputMaxV: 15,
      feed: 'converter',
      efficiency: 0.88,
    }
    const editing = mountPartForm('accessories', save, part)
    const efficiency = editing.find('[data-testid="field-efficiency"] input')
      .element as HTMLInputElement
    expect(efficiency.value).toBe('88')
    editing.unmount()
  })
})
