import { OFFLINE_API_CACHE } from '../../shared/offline'

// Answers anyone may have without an account: a card shared by link (a volunteer's copy, kept
// for offline use) and the built-in library.
const publicPaths = ['/api/v1/shared/', '/api/v1/library/']

/**
 * Forgets the API answers kept for offline use that belong to an account, so that nothing of it
 * stays in the browser once signed out (a shared or borrowed phone). Never fails: without the
 * Cache API there is nothing to forget.
 */
export async function forgetOfflineAnswers(): Promise<void> {
  if (typeof caches === 'undefined') return
  try {
    const cache = await caches.open(OFFLINE_API_CACHE)
    for (const request of await cache.keys()) {
      const path = new URL(request.url).pathname
      if (!publicPaths.some((prefix) => path.startsWith(prefix))) await cache.delete(request)
    }
  } catch {
    // A browser that refuses storage access holds no cache to empty.
  }
}
