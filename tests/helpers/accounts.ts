import request from 'supertest'
import type { Express } from 'express'
import type { Response } from 'supertest'
import type { MeResponse, OutboxMessageView } from '../../shared/schemas/account-responses'
import { findUserByEmail } from '../../server/auth/accounts'
import { markEmailVerified } from '../../server/auth/email-verifications'
import type { TestApp } from './test-app'

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

/**
 * An account made the way a person makes one: sign-up (202, the account is made after the
 * answer), the confirmation link from the mail, then sign-in. `confirmed: false` stops before
 * the link. With a real SMTP_URL there is no catcher to read the link from, so the address is
 * marked confirmed in the database instead.
 */
export async function signUp(
  testApp: TestApp,
  email: string,
  name = 'Test Person',
  { confirmed = true }: { confirmed?: boolean } = {},
): Promise<SignedUp> {
  await request(testApp.app)
    .post('/api/v1/auth/sign-up')
    .send({ email, name, password: strongPassword })
    .expect(202)
  await testApp.mail.settled()
  if (confirmed) {
    if (testApp.mail.outbox) {
      const [mail] = mailsTo(testApp, email)
      if (!mail) throw new Error(`No confirmation mail to ${email}`)
      await request(testApp.app)
        .post('/api/v1/auth/email-verification/confirm')
        .send({ token: tokenInMail(mail.text) })
        .expect(204)
    } else {
      const user = findUserByEmail(testApp.database.db, email)
      if (!user) throw new Error(`No account for ${email}`)
      markEmailVerified(testApp.database.db, user.id, Date.now())
    }
  }
  const response = await request(testApp.app)
    .post('/api/v1/auth/sign-in')
    .send({ email, password: strongPassword })
    .expect(200)
  return { cookie: sessionCookieOf(response), me: response.body as MeResponse }
}

/** Every message the catcher holds for `email`, newest first (the addressee's own view). */
export function mailsTo(testApp: TestApp, email: string): OutboxMessageView[] {
  return testApp.mail.outbox?.listFor({ adminTeamIds: [], verifiedEmail: email }) ?? []
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
