import { createPinia, setActivePinia } from 'pinia'
import { nextTick } from 'vue'
import { beforeEach, describe, expect, it } from 'vitest'
import { exampleRigs } from '../../shared/library'
import { rigDraftStorageKey, startingRig, useRigDraftStore } from '@/stores/rigDraft'

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
})

const busker = exampleRigs.find((rig) => rig.id === 'rig-busker-cart')!

describe('the rig draft store', () => {
  it('starts from the first example rig', () => {
    const store = useRigDraftStore()
    expect(store.name).toBe(startingRig.label)
    expect(store.validation.success).toBe(true)
    expect(store.notice).toBeNull()
  })

  it('restores the last complete rig from this browser', () => {
    localStorage.setItem(rigDraftStorageKey, JSON.stringify({ name: 'Cart', rig: busker.rig }))
    const store = useRigDraftStore()
    expect(store.name).toBe('Cart')
    expect(store.draft.pack.chemistry).toBe('lead-acid')
  })

  it.each([
    ['unreadable JSON', '{"name": "Cart", ', /not readable JSON/],
    ['a rig the schema refuses', JSON.stringify({ name: 'Cart', rig: { pack: 'big' } }), /Pack/],
    ['no rig at all', JSON.stringify(['Cart']), /holds no rig/],
  ])('drops %s with a message and never crashes', (_what, stored, message) => {
    localStorage.setItem(rigDraftStorageKey, stored)
    const store = useRigDraftStore()
    expect(store.notice).toMatch(message)
    expect(store.name).toBe(startingRig.label)
    expect(store.validation.success).toBe(true)
  })

  it('writes only rigs that pass the schema', async () => {
    const store = useRigDraftStore()
    store.draft.pack.cellCapacityAh = 5
    await nextTick()
    expect(JSON.parse(localStorage.getItem(rigDraftStorageKey)!).rig.pack.cellCapacityAh).toBe(5)
    store.draft.pack.cellCapacityAh = -1
    await nextTick()
    expect(JSON.parse(localStorage.getItem(rigDraftStorageKey)!).rig.pack.cellCapacityAh).toBe(5)
  })

  it('replaces the whole rig, dropping fields the new rig does not have', () => {
    const store = useRigDraftStore()
    expect(store.draft.childrenPresent).toBe(true)
    store.replace(busker.rig, busker.label)
    expect(store.draft.childrenPresent).toBeUndefined()
    expect(JSON.stringify(store.draft)).toBe(JSON.stringify({ ...busker.rig }))
  })
})
