import { jwtVerify, SignJWT } from 'jose'
import { minimumSecretBytes } from '../secret'

// The session cookie's content: a signed pointer to a row in `sessions`. The row decides whether
// the session is still alive; the signature only proves the server issued the pointer.
const issuer = 'loudhour'
const audience = 'loudhour-web'
const algorithm = 'HS256'

export interface SessionClaims {
  userId: number
  sessionId: string
}

export function sessionKey(secret: string): Uint8Array {
  const key = new TextEncoder().encode(secret)
  if (key.byteLength < minimumSecretBytes) {
    throw new Error(`The session secret must be at least ${minimumSecretBytes} bytes long`)
  }
  return key
}

export function signSessionToken(
  key: Uint8Array,
  claims: SessionClaims,
  issuedAt: Date,
  expiresAt: Date,
): Promise<string> {
  return new SignJWT({ sid: claims.sessionId })
    .setProtectedHeader({ alg: algorithm, typ: 'JWT' })
    .setSubject(String(claims.userId))
    .setIssuer(issuer)
    .setAudience(audience)
    .setIssuedAt(Math.floor(issuedAt.getTime() / 1000))
    .setExpirationTime(Math.floor(expiresAt.getTime() / 1000))
    .sign(key)
}

/** The claims of a valid token, or undefined for a forged, foreign, altered or expired one. */
export async function verifySessionToken(
  key: Uint8Array,
  token: string,
  now: Date,
): Promise<SessionClaims | undefined> {
  try {
    // The allow-list refuses "none" and asymmetric algorithms (RFC 8725 §3.1).
    const { payload } = await jwtVerify(token, key, {
      algorithms: [algorithm],
      issuer,
      audience,
      currentDate: now,
      requiredClaims: ['sub', 'exp', 'iat'],
    })
    const userId = Number(payload.sub)
    if (!Number.isSafeInteger(userId) || typeof payload.sid !== 'string') return undefined
    return { userId, sessionId: payload.sid }
  } catch {
    return undefined
  }
}
