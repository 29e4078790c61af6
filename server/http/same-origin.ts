import type { RequestHandler } from 'express'
import { ApiError } from './errors'

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS'])
// "none" is a navigation the user started themselves (typed address, bookmark).
const allowedFetchSites = new Set(['same-origin', 'none'])

/**
 * CSRF defence for cookie sessions: a state-changing request must come from our own pages.
 *
 * - `Sec-Fetch-Site`, when sent (every current browser, Fetch Metadata spec), must be
 *   same-origin or none.
 * - `Origin`, when sent, must equal PUBLIC_URL's origin. Browsers send it on every cross-origin
 *   POST, PUT, PATCH and DELETE (Fetch standard, "append a request Origin header").
 * - When both are absent the request did not come from a browser page (curl, scripts, supertest),
 *   so there is no victim's ambient cookie being abused; it goes through. SameSite=Lax on the
 *   session cookie is the second layer for very old browsers that send neither header.
 */
export function sameOrigin(publicUrl: string): RequestHandler {
  const expectedOrigin = new URL(publicUrl).origin
  return (req, _res, next) => {
    if (safeMethods.has(req.method)) return next()
    const fetchSite = req.get('sec-fetch-site')
    const origin = req.get('origin')
    const crossSite =
      (fetchSite !== undefined && !allowedFetchSites.has(fetchSite)) ||
      (origin !== undefined && origin !== expectedOrigin)
    if (crossSite) {
      throw new ApiError(
        403,
        'cross-site',
        'Requests that change data must come from Loudhour itself.',
      )
    }
    next()
  }
}
