import { flushPromises } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { createMemoryHistory } from 'vue-router'
import { apiRequest } from '@/api/http'
import { createAppRouter } from '@/router'
import { redirectTarget } from '@/router/guards'
import { useSessionStore } from '@/stores/session'

const me = {
  user: { id: 1, email: 'pat@crew.example', name: 'Pat' },
  teams: [{ id: 7, name: 'Crew', role: 'admin' }],
  devOutbox: true,
  emailVerified: true,
}

function answer(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  })
}

async function routerWith(session: unknown, path: string) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => answer(200, { session })),
  )
  setActivePinia(createPinia())
  const router = createAppRouter(createMemoryHistory())
  await router.push(path)
  return router
}

// The first navigation compiles the lazy views, which is slow on a busy two-core machine.
describe('route guards and the session', { timeout: 30_000 }, () => {
  beforeEach(() => localStorage.clear())
  afterEach(() => vi.unstubAllGlobals())

  it('sends a guest from a member page to sign-in, remembering the way back', async () => {
    const router = await routerWith(null, '/team')
    expect(router.currentRoute.value.name).toBe('sign-in')
    expect(router.currentRoute.value.query.redirect).toBe('/team')
  })

  it('sends a guest from every team page to sign-in alike', async () => {
    // The team's pages (its plans, events, rigs, parts, packs, cards and members) hold nothing
    // for a guest; each behaves as the others do. The bench and the shared cards stay open.
    const teamPages = [
      '/plans',
      '/plans/new',
      '/plans/3',
      '/plans/3/card',
      '/events',
      '/events/new',
      '/events/4',
      '/events/4/card',
      '/rigs',
      '/rigs/5/card',
      '/parts',
      '/parts/packs/6',
      '/team',
      '/account',
    ]
    for (const path of teamPages) {
      const router = await routerWith(null, path)
      expect(router.currentRoute.value.name, path).toBe('sign-in')
      expect(router.currentRoute.value.query.redirect, path).toBe(path)
    }
    for (const path of ['/', '/about', '/shared/abc', '/shared/events/abc']) {
      const router = await routerWith(null, path)
      expect(router.currentRoute.value.path, path).toBe(path)
    }
  })

  it('lets a signed-in user in, and sends them on from sign-in', async () => {
    const router = await routerWith(me, '/team')
    expect(router.currentRoute.value.name).toBe('team')
    await router.push('/sign-in?redirect=/account')
    expect(router.currentRoute.value.name).toBe('account')
    expect(useSessionStore().outboxAvailable).toBe(true)
  })

  it('returns to sign-in, and back after, when any request answers 401', async () => {
    const router = await routerWith(me, '/account')
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => answer(401, { error: { code: 'signed-out', message: 'Sign in' } })),
    )
    await expect(apiRequest('/v1/teams/7/members')).rejects.toMatchObject({ status: 401 })
    await flushPromises()
    expect(router.currentRoute.value.name).toBe('sign-in')
    expect(router.currentRoute.value.query.redirect).toBe('/account')
    expect(useSessionStore().status).toBe('signed-out')
  })

  it('only redirects within the app after sign-in', () => {
    // Source: OWASP Unvalidated Redirects and Forwards Cheat Sheet (no open redirects).
    expect(redirectTarget('/plans?day=2')).toBe('/plans?day=2')
    expect(redirectTarget('//evil.example/phish')).toBe('/')
    expect(redirectTarget('https://evil.example')).toBe('/')
    expect(redirectTarget('/\\evil.example')).toBe('/')
    expect(redirectTarget(undefined)).toBe('/')
  })
})
