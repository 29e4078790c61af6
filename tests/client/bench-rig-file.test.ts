import { flushPromises, type VueWrapper } from '@vue/test-utils'
import { beforeEach, describe, expect, it } from 'vitest'
import { exampleRigs } from '../../shared/library'
import { rigDraftStorageKey, useRigDraftStore } from '@/stores/rigDraft'
import { readRigFile, rigFileName, rigFileText } from '@/utils/rigFile'
import { benchTestTimeoutMs, mountBench } from './bench-helpers'

beforeEach(() => localStorage.clear())

async function importText(wrapper: VueWrapper, text: string, name = 'rig.json'): Promise<void> {
  const input = wrapper.get('[data-testid="import-input"]').element as HTMLInputElement
  const file = new File([text], name, { type: 'application/json' })
  Object.defineProperty(input, 'files', { value: [file], configurable: true })
  input.dispatchEvent(new Event('change'))
  // Reading the file is asynchronous; let it finish.
  await new Promise((resolve) => setTimeout(resolve, 0))
  await flushPromises()
}

const busker = exampleRigs.find((rig) => rig.id === 'rig-busker-cart')!

describe('rig files', { timeout: benchTestTimeoutMs }, () => {
  it('round-trips a rig through our own versioned format', () => {
    const text = rigFileText(busker.rig, busker.label, new Date('2026-05-01T08:00:00Z'))
    const file = JSON.parse(text)
    expect(file.format).toBe('loudhour-rig')
    expect(file.version).toBe(1)
    const reading = readRigFile(text)
    expect(reading).toEqual({ ok: true, rig: busker.rig, name: busker.label })
    expect(rigFileName('Busker cart on a 12 V lead-acid battery')).toBe(
      'busker-cart-on-a-12-v-lead-acid-battery.loudhour-rig.json',
    )
  })

  it.each([
    ['broken JSON', '{"format": "loudhour-rig", ', /not readable JSON/],
    [
      'a foreign JSON file',
      JSON.stringify({ name: 'package', version: '1.0.0' }),
      /not a Loudhour rig file/,
    ],
    ['a list', '[1, 2, 3]', /holds no rig/],
    [
      'a newer version',
      JSON.stringify({ format: 'loudhour-rig', version: 2, rig: {} }),
      /version 2/,
    ],
    [
      'an invalid rig',
      rigFileText({ ...busker.rig, pack: { ...busker.rig.pack, seriesCells: 0 } }, 'x'),
      /at pack\.seriesCells.*Cells in series/,
    ],
  ])('refuses %s with a clear message', (_what, text, message) => {
    const reading = readRigFile(text)
    expect(reading.ok).toBe(false)
    if (!reading.ok) expect(reading.message).toMatch(message)
  })

  it('imports a bad file with a message and leaves the draft and storage unchanged', async () => {
    const wrapper = await mountBench()
    const store = useRigDraftStore()
    const draftBefore = JSON.stringify(store.draft)
    const storedBefore = localStorage.getItem(rigDraftStorageKey)
    const runtimeBefore = wrapper.get('[data-testid="runtime"]').text()

    await importText(wrapper, JSON.stringify({ hello: 'world' }), 'notes.json')
    const message = wrapper.get('[data-testid="file-message"]')
    expect(message.text()).toContain('notes.json')
    expect(message.text()).toContain('not a Loudhour rig file')
    expect(message.attributes('role')).toBe('alert')
    expect(JSON.stringify(store.draft)).toBe(draftBefore)
    expect(localStorage.getItem(rigDraftStorageKey)).toBe(storedBefore)
    expect(wrapper.get('[data-testid="runtime"]').text()).toBe(runtimeBefore)
    wrapper.unmount()
  })

  it('imports a good file and replaces the rig on the bench', async () => {
    const wrapper = await mountBench()
    const store = useRigDraftStore()
    await importText(wrapper, rigFileText(busker.rig, 'Cart, Saturday'), 'cart.loudhour-rig.json')
    expect(wrapper.get('[data-testid="file-message"]').text()).toContain(
      'Imported “Cart, Saturday”',
    )
    expect(store.name).toBe('Cart, Saturday')
    expect(store.draft.pack.chemistry).toBe('lead-acid')
    expect(JSON.parse(localStorage.getItem(rigDraftStorageKey)!).name).toBe('Cart, Saturday')
    wrapper.unmount()
  })
})
