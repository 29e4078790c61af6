import type { RequestHandler } from 'express'
import { ApiError } from '../http/errors'
import { minuteMs, throttle } from '../http/throttle'

// What every anonymous card behind a link shares: the token's shape, the one answer for a dead
// link, and the limit on requests from one address.

/** Tokens are 32 random bytes in base64url (auth/link-tokens.ts): anything else names no link. */
export const SHARE_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/

export const notShared = () =>
  new ApiError(
    404,
    'not-found',
    'This card link does not work: it was revoked, has expired, or was never made. Ask the crew for a new one.',
  )

export function sharedCardThrottle(name: string): RequestHandler {
  return throttle({
    name,
    windowMs: minuteMs,
    // Ours: a volunteer reloading on a phone stays far below it; guessing tokens gets nowhere.
    limit: 60,
    key: 'address',
    message: 'Too many card requests from this address. Wait a minute and try again.',
  })
}
