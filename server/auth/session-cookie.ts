import type { CookieOptions, Response } from 'express'

export interface SessionCookie {
  name: string
  set(res: Response, token: string, expiresAt: Date): void
  clear(res: Response): void
}

/**
 * HttpOnly keeps scripts from reading the token; SameSite=Lax keeps it off cross-site POSTs; over
 * https the `__Host-` prefix makes the browser refuse a copy set by another host or path (RFC 6265bis §4.1.3.2).
 */
export function sessionCookie(publicUrl: string): SessionCookie {
  const secure = publicUrl.startsWith('https:')
  const name = secure ? '__Host-loudhour_session' : 'loudhour_session'
  const base: CookieOptions = { httpOnly: true, sameSite: 'lax', path: '/', secure }
  return {
    name,
    set(res, token, expiresAt) {
      res.cookie(name, token, { ...base, expires: expiresAt })
    },
    clear(res) {
      res.clearCookie(name, base)
    },
  }
}
