import { createHash, randomBytes } from 'node:crypto'
import { ApiError } from '../http/errors'

// 32 random bytes = 256 bits, above the 128 bits OWASP asks of reset and invitation tokens.
const tokenBytes = 32

export interface LinkToken {
  /** Goes into the e-mailed link only. */
  token: string
  /** Goes into the database only. */
  tokenHash: string
}

export function createLinkToken(): LinkToken {
  const token = randomBytes(tokenBytes).toString('base64url')
  return { token, tokenHash: hashLinkToken(token) }
}

// A fast hash is enough: the token has full entropy, so there is nothing to brute-force offline.
export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}

/** The one answer for a link token that is unknown, spent or expired (which one is not said). */
export function invalidLinkToken(what: 'reset' | 'invitation' | 'confirmation'): ApiError {
  const message = `This ${what} link is not valid, was used already or has expired; ask for a new one`
  return new ApiError(400, 'invalid-token', `token: ${message}`, [{ path: 'token', message }])
}
