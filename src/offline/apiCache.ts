import { OFFLINE_API_CACHE, OFFLINE_PUBLIC_API_PREFIXES } from '@shared/offline'

/**
 * Forgets the API answers kept for offline use that belong to an account, so that nothing of it
 * stays in the browser once signed out (a shared or borrowed phone). The service worker does the
 * same by itself when an API answer is 401 (vite.config.ts). Never fails: without the
 * Cache API there is nothing to forget.
 */
export async function forgetOfflineAnswers(): Promise<void> {
  if (typeof caches === 'undefined') return
  try {
    const cache = await caches.open(OFFLINE_API_CACHE)
    for (const request of await cache.keys()) {
      const path = new URL(request.url).pathname
      if (!OFFLINE_PUBLIC_API_PREFIXES.some((prefix) => path.startsWith(prefix)))
        await cache.delete(request)
    }
  } catch {
    // A browser that refuses storage access holds no cache to empty.
  }
}
