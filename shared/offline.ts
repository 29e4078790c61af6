/**
 * The service worker's cache of the API's answers (vite.config.ts, runtime caching): what an open
 * plan, its card and the bench show offline. The client empties it when a session ends.
 */
export const OFFLINE_API_CACHE = 'loudhour-api'

/** Answers anyone may have without an account (a card shared by link, the built-in library):
 * the only ones kept once a session ends. */
export const OFFLINE_PUBLIC_API_PREFIXES = ['/api/v1/shared/', '/api/v1/library/'] as const

/** Never kept at all: the mail catcher holds links that grant access to accounts. */
export const OFFLINE_NEVER_KEPT_API_PREFIXES = ['/api/v1/dev/'] as const
