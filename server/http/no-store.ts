import type { RequestHandler } from 'express'

/**
 * API answers hold an account's data: no browser or proxy cache may keep them (RFC 9111 §5.2.2.5,
 * `no-store`). A route whose answer anyone may have (the built-in library) sets its own header.
 * The service worker keeps answers for offline use in its own cache, which ignores this header.
 */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store')
  next()
}
