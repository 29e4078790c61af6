import request from 'supertest'
import { SignJWT, UnsecuredJWT } from 'jose'
import { afterEach, describe, expect, it } from 'vitest'
import { users } from '../../server/db/schema'
import { sessionAbsoluteMs, sessionIdleMs } from '../../server/auth/session-policy'
import {
  fakeClock,
  otherStrongPassword,
  sessionCookieOf,
  signInCookie,
  mailsTo,
  signUp,
  strongPassword,
  tokenInMail,
} from '../helpers/accounts'
import { createTestApp, testSessionSecret, type TestApp } from '../helpers/test-app'

let testApp: TestApp | undefined
afterEach(async () => {
  await testApp?.close()
  testApp = undefined
})

function start(overrides: Record<string, string> = {}, clock?: () => Date): TestApp {
  testApp = createTestApp(overrides, { clock })
  return testApp
}

const me = (app: TestApp, cookie: string) =>
  request(app.app).get('/api/v1/auth/me').set('Cookie', cookie)

/** Sign-up answers before making the account; this waits for that work, then signs in. */
async function signUpAndSignIn(app: TestApp, email: string) {
  const answer = await request(app.app)
    .post('/api/v1/auth/sign-up')
    .send({ email, name: 'Pat', password: strongPassword })
    .expect(202)
  await app.mail.settled()
  const signedIn = await request(app.app)
    .post('/api/v1/auth/sign-in')
    .send({ email: email.trim().toLowerCase(), password: strongPassword })
    .expect(200)
  return { answer, signedIn }
}

describe('sign-up and the session cookie', () => {
  it('makes the account with a personal team, signs nobody in, and the cookie comes at sign-in', async () => {
    const testApp = start()
    const { answer, signedIn } = await signUpAndSignIn(testApp, '  Pat@Crew.Example ')
    // The answer must not tell whether an account was made, so it cannot carry a session.
    expect(answer.headers['set-cookie']).toBeUndefined()
    expect(signedIn.body.user).toMatchObject({ email: 'pat@crew.example', name: 'Pat' })
    expect(signedIn.body.emailVerified).toBe(false)
    // Source: our account rules ("a personal team for each new user").
    expect(signedIn.body.teams).toEqual([expect.objectContaining({ role: 'admin' })])
    const cookie = (signedIn.headers['set-cookie'] as unknown as string[])[0] ?? ''
    // Source: RFC 6265 §5.2.5–5.2.6 (HttpOnly, Secure), RFC 6265bis §5.4.7 (SameSite).
    expect(cookie).toMatch(/^loudhour_session=/)
    expect(cookie).toMatch(/; HttpOnly/i)
    expect(cookie).toMatch(/; SameSite=Lax/i)
    expect(cookie).toMatch(/; Path=\//)
    expect(cookie).not.toMatch(/; Secure/i)
  })

  it('marks the cookie Secure, with the __Host- prefix, when PUBLIC_URL is https', async () => {
    const testApp = start({ PUBLIC_URL: 'https://loudhour.example' })
    const { signedIn } = await signUpAndSignIn(testApp, 'pat@crew.example')
    const cookie = (signedIn.headers['set-cookie'] as unknown as string[])[0] ?? ''
    // Source: RFC 6265bis §4.1.3.2 (__Host- needs Secure, Path=/ and no Domain).
    expect(cookie).toMatch(/^__Host-loudhour_session=/)
    expect(cookie).toMatch(/; Secure/i)
    expect(cookie).not.toMatch(/; Domain=/i)
  })

  it('stores argon2id at m = 19 MiB, t = 2, p = 1', async () => {
    const testApp = start()
    await signUp(testApp, 'pat@crew.example')
    const row = testApp.database.db.select().from(users).get()
    // Source: OWASP Password Storage Cheat Sheet, argon2id minimum; PHC string order m, p, t.
    expect(row?.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,p=1,t=2\$/)
  })

  it('refuses short, overlong and common passwords, naming the field', async () => {
    const { app } = start()
    const attempt = (password: string) =>
      request(app)
        .post('/api/v1/auth/sign-up')
        .send({ email: 'pat@crew.example', name: 'Pat', password })
    // Source: NIST SP 800-63B §3.1.1.2 (at least 12 here; refuse common passwords).
    const short = await attempt('short-pass1').expect(400)
    expect(short.body.error.issues).toEqual([
      { path: 'password', message: 'Use at least 12 characters' },
    ])
    const long = await attempt('x'.repeat(129)).expect(400)
    expect(long.body.error.issues[0].path).toBe('password')
    // "password" and "qwerty" head every published leaked-password list (zxcvbn's included).
    const common = await attempt('password1234').expect(400)
    expect(common.body.error.code).toBe('weak-password')
    expect(common.body.error.issues[0].path).toBe('password')
    const guessable = await attempt('qwertyuiop123').expect(400)
    expect(guessable.body.error.code).toBe('weak-password')
  })

  it('answers a second sign-up for an address as it answers a new one, and mails the owner', async () => {
    const testApp = start()
    const { app } = testApp
    await signUp(testApp, 'pat@crew.example')
    const body = (email: string) => ({ email, name: 'Other', password: otherStrongPassword })
    const again = await request(app).post('/api/v1/auth/sign-up').send(body('PAT@crew.example'))
    const fresh = await request(app).post('/api/v1/auth/sign-up').send(body('new@crew.example'))
    await testApp.mail.settled()
    // Source: OWASP Authentication Cheat Sheet, "Authentication and error messages" (account
    // creation must not reveal that an account exists). Same status, same body but the address.
    expect(again.status).toBe(202)
    expect(fresh.status).toBe(202)
    expect(again.body).toEqual({
      message: 'Check your mail at pat@crew.example: the message there says how to go on.',
    })
    expect(fresh.body.message).toBe(again.body.message.replace('pat@', 'new@'))
    expect(again.headers['set-cookie']).toBeUndefined()
    const [reminder] = mailsTo(testApp, 'pat@crew.example')
    expect(reminder?.subject).toBe('You already have a Loudhour account')
    expect(reminder?.text).toContain('Reset the password: http://localhost:3999/forgot-password')
    // Nothing changed: the old password still signs in, the one in the second sign-up does not.
    await signInCookie(app, 'pat@crew.example')
    await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'pat@crew.example', password: otherStrongPassword })
      .expect(401)
    expect(testApp.database.db.select().from(users).all()).toHaveLength(2)
    expect(mailsTo(testApp, 'new@crew.example')[0]?.subject).toBe(
      'Confirm your address for Loudhour',
    )
  })
})

describe('sign-in', () => {
  it('answers an unknown address and a wrong password alike', async () => {
    const testApp = start()
    const { app } = testApp
    await signUp(testApp, 'pat@crew.example')
    const wrong = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'pat@crew.example', password: otherStrongPassword })
    const unknown = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'nobody@crew.example', password: otherStrongPassword })
    // Source: OWASP Authentication Cheat Sheet, "Authentication and error messages".
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(unknown.body).toEqual(wrong.body)
    expect(await signInCookie(app, 'pat@crew.example')).toMatch(/^loudhour_session=/)
  })

  it('throttles failed sign-ins per account and address with 429 and Retry-After', async () => {
    const testApp = start()
    const { app } = testApp
    await signUp(testApp, 'pat@crew.example')
    const failed = () =>
      request(app)
        .post('/api/v1/auth/sign-in')
        .send({ email: 'pat@crew.example', password: otherStrongPassword })
    // Ten failures per quarter hour per account and address (OWASP Authentication Cheat Sheet,
    // "Login Throttling"); from other addresses see sign-in-throttle.test.ts.
    for (let attempt = 0; attempt < 10; attempt += 1) await failed().expect(401)
    const blocked = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'pat@crew.example', password: strongPassword })
      .expect(429)
    const retryAfterS = Number(blocked.headers['retry-after'])
    expect(retryAfterS).toBeGreaterThan(0)
    expect(retryAfterS).toBeLessThanOrEqual(15 * 60)
    expect(blocked.body.error.code).toBe('throttled')
    // Another account from the same address is not locked with it.
    await signUp(testApp, 'sam@crew.example')
    await signInCookie(app, 'sam@crew.example')
  })
})

describe('ending sessions', () => {
  it('sign-out ends the session on the server: the old cookie gets 401', async () => {
    const testApp = start()
    const { cookie } = await signUp(testApp, 'pat@crew.example')
    await me(testApp, cookie).expect(200)
    await request(testApp.app).post('/api/v1/auth/sign-out').set('Cookie', cookie).expect(204)
    await me(testApp, cookie).expect(401)
  })

  it('sign-out everywhere ends every session of the account', async () => {
    const testApp = start()
    const { cookie: first } = await signUp(testApp, 'pat@crew.example')
    const second = await signInCookie(testApp.app, 'pat@crew.example')
    await request(testApp.app)
      .post('/api/v1/auth/sign-out-everywhere')
      .set('Cookie', second)
      .expect(204)
    await me(testApp, first).expect(401)
    await me(testApp, second).expect(401)
  })

  it('a password change ends other sessions and keeps this browser signed in', async () => {
    const testApp = start()
    const { cookie: other } = await signUp(testApp, 'pat@crew.example')
    const here = await signInCookie(testApp.app, 'pat@crew.example')
    const wrongCurrent = await request(testApp.app)
      .post('/api/v1/auth/password')
      .set('Cookie', here)
      .send({ currentPassword: otherStrongPassword, newPassword: otherStrongPassword })
      .expect(400)
    expect(wrongCurrent.body.error.issues[0].path).toBe('currentPassword')
    const changed = await request(testApp.app)
      .post('/api/v1/auth/password')
      .set('Cookie', here)
      .send({ currentPassword: strongPassword, newPassword: otherStrongPassword })
      .expect(200)
    await me(testApp, other).expect(401)
    await me(testApp, here).expect(401)
    await me(testApp, sessionCookieOf(changed)).expect(200)
    await signInCookie(testApp.app, 'pat@crew.example', otherStrongPassword)
  })

  it('refuses tokens that were forged, unsigned or meant for another audience', async () => {
    const testApp = start()
    const { me: account } = await signUp(testApp, 'pat@crew.example')
    const claims = { sid: 'made-up', sub: String(account.user.id) }
    const withKey = (secret: string, audience: string) =>
      new SignJWT(claims)
        .setProtectedHeader({ alg: 'HS256' })
        .setIssuer('loudhour')
        .setAudience(audience)
        .setIssuedAt()
        .setExpirationTime('1h')
        .sign(new TextEncoder().encode(secret))
    // Source: RFC 8725 §3.1 (refuse "none"), §3.9 (validate audience).
    const unsigned = new UnsecuredJWT(claims)
      .setIssuer('loudhour')
      .setAudience('loudhour-web')
      .encode()
    for (const token of [
      unsigned,
      await withKey('another-secret-that-is-also-32-bytes-long', 'loudhour-web'),
      await withKey(testSessionSecret, 'some-other-app'),
      await withKey(testSessionSecret, 'loudhour-web'), // right signature, but no such session row
    ]) {
      await me(testApp, `loudhour_session=${token}`).expect(401)
    }
  })

  it('expires after a week idle, and after thirty days however busy', async () => {
    const time = fakeClock()
    const testApp = start({}, time.clock)
    const { cookie } = await signUp(testApp, 'pat@crew.example')
    time.advance(sessionIdleMs - 60_000)
    await me(testApp, cookie).expect(200)
    time.advance(sessionIdleMs - 60_000)
    await me(testApp, cookie).expect(200)
    time.advance(sessionIdleMs)
    await me(testApp, cookie).expect(401)

    const busy = await signInCookie(testApp.app, 'pat@crew.example')
    const dayMs = 24 * 60 * 60 * 1000
    for (let elapsedMs = dayMs; elapsedMs < sessionAbsoluteMs; elapsedMs += dayMs) {
      time.advance(dayMs)
      await me(testApp, busy).expect(200)
    }
    time.advance(dayMs)
    await me(testApp, busy).expect(401)
  })
})

describe('same-origin protection', () => {
  it('refuses a cross-site POST that carries a valid session cookie', async () => {
    const testApp = start()
    const { cookie } = await signUp(testApp, 'pat@crew.example')
    const createTeam = () =>
      request(testApp.app).post('/api/v1/teams').set('Cookie', cookie).send({ name: 'Crew' })
    // Source: OWASP CSRF Prevention Cheat Sheet (verify Origin; Fetch Metadata Sec-Fetch-Site).
    const byOrigin = await createTeam().set('Origin', 'https://evil.example').expect(403)
    expect(byOrigin.body.error.code).toBe('cross-site')
    await createTeam().set('Sec-Fetch-Site', 'cross-site').expect(403)
    await createTeam().set('Sec-Fetch-Site', 'same-site').expect(403)
    await createTeam().set('Origin', 'null').expect(403)
    await createTeam()
      .set('Origin', 'http://localhost:3999')
      .set('Sec-Fetch-Site', 'same-origin')
      .expect(201)
    // Reading is not a state change: a cross-site GET is answered (the cookie rules decide the rest).
    await request(testApp.app)
      .get('/api/v1/auth/me')
      .set('Cookie', cookie)
      .set('Sec-Fetch-Site', 'cross-site')
      .expect(200)
  })
})

describe('password reset', () => {
  it('answers 202 for any address and mails a single-use link to real accounts only', async () => {
    const testApp = start()
    const { cookie } = await signUp(testApp, 'pat@crew.example')
    const ask = (email: string) =>
      request(testApp.app).post('/api/v1/auth/password-reset').send({ email })
    const unknown = await ask('nobody@crew.example').expect(202)
    const known = await ask('pat@crew.example').expect(202)
    expect(known.body).toEqual(unknown.body)
    await testApp.mail.settled()
    const messages = await request(testApp.app)
      .get('/api/v1/dev/outbox')
      .set('Cookie', cookie)
      .expect(200)
    // The owner reads their own mail, newest first: the reset, then the sign-up's confirmation.
    expect(messages.body.messages.map((mail: { subject: string }) => mail.subject)).toEqual([
      'Reset your Loudhour password',
      'Confirm your address for Loudhour',
    ])
    const [message] = messages.body.messages
    expect(message.to).toBe('pat@crew.example')
    expect(message.text).toContain('http://localhost:3999/reset-password?token=')
    const token = tokenInMail(message.text)

    const confirm = (password: string) =>
      request(testApp.app).post('/api/v1/auth/password-reset/confirm').send({ token, password })
    const weak = await confirm('password1234').expect(400)
    expect(weak.body.error.issues[0].path).toBe('password')
    await confirm(otherStrongPassword).expect(204)
    // Source: OWASP Forgot Password Cheat Sheet: a reset ends all sessions, token single use.
    await me(testApp, cookie).expect(401)
    const reused = await confirm(strongPassword).expect(400)
    expect(reused.body.error.issues[0].path).toBe('token')
    await request(testApp.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'pat@crew.example', password: strongPassword })
      .expect(401)
    await signInCookie(testApp.app, 'pat@crew.example', otherStrongPassword)
  })

  it('refuses a reset link older than 30 minutes', async () => {
    const time = fakeClock()
    const testApp = start({}, time.clock)
    const { cookie } = await signUp(testApp, 'pat@crew.example')
    await request(testApp.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: 'pat@crew.example' })
      .expect(202)
    await testApp.mail.settled()
    const outbox = await request(testApp.app).get('/api/v1/dev/outbox').set('Cookie', cookie)
    const token = tokenInMail(outbox.body.messages[0].text)
    time.advance(30 * 60 * 1000)
    await request(testApp.app)
      .post('/api/v1/auth/password-reset/confirm')
      .send({ token, password: otherStrongPassword })
      .expect(400)
    await me(testApp, cookie).expect(200)
  })
})
