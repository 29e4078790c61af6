import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { packsApi } from '@/api/resources'
import BenchPackForm from '@/components/bench/BenchPackForm.vue'
import { useRigDraftStore } from '@/stores/rigDraft'
import { useSessionStore } from '@/stores/session'
import type { PackItem } from '../../shared/schemas/resources'

// The bench's pack picker offers the signed-in team's own packs beside the built-in library.

vi.mock('@/api/resources', () => ({
  packsApi: { list: vi.fn() },
}))
const list = vi.mocked(packsApi.list)

const teamPack: PackItem = {
  id: 12,
  version: 2,
  name: 'Crew LiFePO4 block',
  notes: '',
  createdAt: '2026-04-01T10:00:00.000Z',
  updatedAt: '2026-04-01T10:00:00.000Z',
  createdBy: null,
  updatedBy: null,
  label: 'Crew LiFePO4 block',
  chemistry: 'lifepo4',
  seriesCells: 4,
  parallelCells: 1,
  cellCapacityAh: 50,
  count: 1,
}

function signIn(): void {
  useSessionStore().apply({
    user: { id: 1, email: 'sam@example.test', name: 'Sam' },
    teams: [{ id: 3, name: 'Night crew', role: 'viewer' }],
    devOutbox: false,
    emailVerified: true,
  })
}

async function mountPackForm() {
  const wrapper = mount(BenchPackForm, { attachTo: document.body })
  await flushPromises()
  return wrapper
}

function picker(wrapper: Awaited<ReturnType<typeof mountPackForm>>) {
  return wrapper.get('[data-testid="field-pack.library"] select')
}

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
  list.mockReset()
})
afterEach(() => vi.restoreAllMocks())

describe('team parts on the bench', () => {
  it('lists the team’s pack in its own first group and fills the form from it', async () => {
    list.mockResolvedValue({ items: [teamPack], total: 1 })
    signIn()
    const store = useRigDraftStore()
    store.draft.pack.count = 3
    const wrapper = await mountPackForm()

    expect(list).toHaveBeenCalledWith(3, expect.objectContaining({ sort: 'name' }))
    const groups = picker(wrapper).findAll('optgroup')
    expect(groups[0]!.attributes('label')).toBe("Your team's packs")
    expect(groups[0]!.findAll('option').map((option) => option.text())).toEqual([
      'Crew LiFePO4 block',
    ])
    // The built-in library is still there after it.
    expect(groups.length).toBeGreaterThan(1)

    await picker(wrapper).setValue('team-12')
    await flushPromises()
    // As a library pick: the part's fields, with the number on hand kept from the rig.
    expect(store.draft.pack).toEqual({
      label: 'Crew LiFePO4 block',
      chemistry: 'lifepo4',
      seriesCells: 4,
      parallelCells: 1,
      cellCapacityAh: 50,
      count: 3,
    })
    expect((picker(wrapper).element as HTMLSelectElement).value).toBe('team-12')
    // Source: common practice, a LiFePO4 cell is 3.2 V nominal, so 4 in series make 12.8 V.
    expect(wrapper.get('[data-testid="pack-summary"]').text()).toMatch(/^12\.8\sV nominal/)
    wrapper.unmount()
  })

  it('asks nothing and shows only the built-in library when signed out', async () => {
    useSessionStore().clear()
    const wrapper = await mountPackForm()
    expect(list).not.toHaveBeenCalled()
    const labels = picker(wrapper)
      .findAll('optgroup')
      .map((group) => group.attributes('label'))
    expect(labels).not.toContain("Your team's packs")
    expect(labels.length).toBeGreaterThan(0)
    wrapper.unmount()
  })

  it('falls back to the built-in library with a note, without a console error', async () => {
    const consoleError = vi.spyOn(console, 'error')
    list.mockRejectedValue(new Error('The server answered 500.'))
    signIn()
    const wrapper = await mountPackForm()
    expect(list).toHaveBeenCalledOnce()
    const labels = picker(wrapper)
      .findAll('optgroup')
      .map((group) => group.attributes('label'))
    expect(labels).not.toContain("Your team's packs")
    expect(labels.length).toBeGreaterThan(0)
    expect(wrapper.get('[data-testid="field-pack.library"]').text()).toContain(
      "Your team's parts could not be loaded",
    )
    expect(consoleError).not.toHaveBeenCalled()
    wrapper.unmount()
  })
})
