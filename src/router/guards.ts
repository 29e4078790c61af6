import type { RouteLocationRaw, Router } from 'vue-router'
import { onUnauthorized } from '@/api/http'
import { useSessionStore } from '@/stores/session'

/** Where to go after signing in: only paths inside this app, never another site (open redirect). */
export function redirectTarget(raw: unknown): string {
  const path = Array.isArray(raw) ? raw[0] : raw
  return typeof path === 'string' &&
    path.startsWith('/') &&
    !path.startsWith('//') &&
    !path.includes('\\')
    ? path
    : '/'
}

function toSignIn(returnPath: string): RouteLocationRaw {
  return { name: 'sign-in', query: returnPath === '/' ? {} : { redirect: returnPath } }
}

/**
 * `meta.access`: 'member' pages send guests to sign-in and back after; 'guest' pages (sign-in,
 * sign-up) send signed-in users on. A 401 from any request ends the session in the client and
 * goes to sign-in, to return to the same page once signed in again.
 */
export function installSessionGuards(router: Router): void {
  router.beforeEach(async (to) => {
    const session = useSessionStore()
    await session.ensureLoaded()
    const access = to.meta.access ?? 'anyone'
    if (access === 'member' && session.status !== 'signed-in') return toSignIn(to.fullPath)
    if (access === 'guest' && session.status === 'signed-in')
      return redirectTarget(to.query.redirect)
    return true
  })

  onUnauthorized(() => {
    useSessionStore().clear()
    const current = router.currentRoute.value
    if (current.meta.access !== 'guest') void router.push(toSignIn(current.fullPath))
  })
}
