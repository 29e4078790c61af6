import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import AppUnverifiedNotice from '@/components/AppUnverifiedNotice.vue'
import { useSessionStore } from '@/stores/session'
import type { MeResponse } from '../../shared/schemas/account-responses'

const me = (emailVerified: boolean): MeResponse => ({
  user: { id: 1, email: 'pat@crew.example', name: 'Pat' },
  teams: [{ id: 7, name: 'Crew', role: 'admin' }],
  devOutbox: true,
  emailVerified,
})

function answer(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  })
}

// The behaviour README.md describes under "Accounts and mail": no sending until the address is
// confirmed, a way to have the link again, and a sign-up that signs nobody in.
describe('an account whose address is not confirmed', { timeout: 30_000 }, () => {
  beforeEach(() => setActivePinia(createPinia()))
  afterEach(() => vi.unstubAllGlobals())

  it('is told why nothing is sent, and can have the link sent again', async () => {
    const fetchMock = vi.fn(async () =>
      answer(202, { message: 'A new link is on its way to pat@crew.example.' }),
    )
    vi.stubGlobal('fetch', fetchMock)
    useSessionStore().apply(me(false))
    const notice = mount(AppUnverifiedNotice)
    expect(notice.text()).toContain('Confirm your address to send mail')
    expect(notice.text()).toContain('pat@crew.example')
    await notice.get('button').trigger('click')
    await flushPromises()
    expect(fetchMock).toHaveBeenCalledTimes(1)
    const [url, init] = fetchMock.mock.calls[0] as unknown as [URL, RequestInit]
    expect(String(url)).toMatch(/^http:\/\/[^/]+\/api\/v1\/auth\/email-verification$/)
    expect(init.method).toBe('POST')
    expect(notice.get('[role="status"]').text()).toBe(
      'A new link is on its way to pat@crew.example.',
    )
  })

  it('shows nothing once the address is confirmed', () => {
    useSessionStore().apply(me(true))
    expect(mount(AppUnverifiedNotice).text()).toBe('')
  })

  it('a sign-up signs nobody in: the session stays signed out and the answer is passed on', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => answer(202, { message: 'Check your mail at pat@crew.example.' })),
    )
    const session = useSessionStore()
    const message = await session.signUp({
      email: 'pat@crew.example',
      name: 'Pat',
      password: 'amber kettle wanders north 41',
    })
    expect(message).toBe('Check your mail at pat@crew.example.')
    expect(session.status).toBe('unknown')
    expect(session.me).toBeUndefined()
  })
})
