import { OFFLINE_API_CACHE } from '../../shared/offline'

/**
 * Forgets the API answers kept for offline use, so that nothing of a signed-out account stays in
 * the browser (a shared or borrowed phone). Never fails: without the Cache API there is nothing.
 */
export async function forgetOfflineAnswers(): Promise<void> {
  if (typeof caches === 'undefined') return
  try {
    await caches.delete(OFFLINE_API_CACHE)
  } catch {
    // A browser that refuses storage access holds no cache to empty.
  }
}
