import request from 'supertest'
import type { Express } from 'express'
import type { Response } from 'supertest'
import type { MeResponse } from '../../shared/schemas/account-responses'

// Passphrases zxcvbn scores 4 ("very unguessable"); tests that need a refused one say so.
export const strongPassword = 'amber kettle wanders north 41'
export const otherStrongPassword = 'copper lantern drifts slowly 73'

/** The `name=value` part of the session cookie the response set, for a `Cookie` header. */
export function sessionCookieOf(response: Response): string {
  const header = response.headers['set-cookie'] as unknown as string[] | undefined
  const session = header?.find((cookie) => /^(__Host-)?loudhour_session=[^;]+/.test(cookie))
  if (!session) throw new Error(`No session cookie set (status ${response.status})`)
  return session.split(';')[0] ?? ''
}

export interface SignedUp {
  cookie: string
  me: MeResponse
}

export async function signUp(app: Express, email: string, name = 'Test Person'): Promise<SignedUp> {
  const response = await request(app)
    .post('/api/v1/auth/sign-up')
    .send({ email, name, password: strongPassword })
    .expect(201)
  return { cookie: sessionCookieOf(response), me: response.body as MeResponse }
}

export async function signInCookie(
  app: Express,
  email: string,
  password = strongPassword,
): Promise<string> {
  const response = await request(app)
    .post('/api/v1/auth/sign-in')
    .send({ email, password })
    .expect(200)
  return sessionCookieOf(response)
}

/** A fake clock that tests move forward by hand. */
export function fakeClock(startIso = '2026-05-02T09:00:00Z') {
  let nowMs = Date.parse(startIso)
  return {
    clock: () => new Date(nowMs),
    advance(ms: number) {
      nowMs += ms
    },
  }
}

/** The link token in the newest outbox message to `to`. */
export function tokenInMail(text: string): string {
  const match = /[?&]token=([A-Za-z0-9_-]{43})/.exec(text)
  if (!match?.[1]) throw new Error(`No token link in:\n${text}`)
  return match[1]
}
