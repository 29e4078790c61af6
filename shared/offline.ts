/**
 * The service worker's cache of the API's answers (vite.config.ts, runtime caching): what an open
 * plan, its card and the bench show offline. The client empties it when a session ends.
 */
export const OFFLINE_API_CACHE = 'loudhour-api'
