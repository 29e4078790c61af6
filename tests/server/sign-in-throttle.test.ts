import request from 'supertest'
import { afterEach, describe, expect, it } from 'vitest'
import { createAccount } from '../../server/auth/accounts'
import { hashPassword } from '../../server/auth/passwords'
import { otherStrongPassword, signInCookie, strongPassword } from '../helpers/accounts'
import { createTestApp, type TestApp } from '../helpers/test-app'

/*
 * Sign-in throttling as the OWASP Authentication Cheat Sheet ("Login Throttling") asks: count
 * failures per source and per account, prefer delays to lockouts, and never let strangers'
 * wrong passwords lock the owner out. Addresses are set with X-Forwarded-For, which the app
 * believes only from the proxies TRUST_PROXY names (supertest connects from loopback).
 */

let testApp: TestApp | undefined
afterEach(async () => {
  await testApp?.close()
  testApp = undefined
})

function start(overrides: Record<string, string> = { TRUST_PROXY: 'loopback' }): TestApp {
  testApp = createTestApp(overrides)
  return testApp
}

/** Accounts written straight to the database, all with `strongPassword` (one hash for speed). */
async function addAccounts(app: TestApp, emails: string[]): Promise<void> {
  const passwordHash = await hashPassword(strongPassword)
  for (const email of emails) {
    createAccount(app.database.db, { email, name: email.split('@')[0]!, passwordHash }, Date.now())
  }
}

const signInFrom = (app: TestApp, address: string, email: string, password: string) =>
  request(app.app)
    .post('/api/v1/auth/sign-in')
    .set('X-Forwarded-For', address)
    .send({ email, password })

describe('sign-in throttling', { timeout: 60_000 }, () => {
  it("never lets wrong passwords from other addresses stop the owner's right one", async () => {
    const app = start()
    await addAccounts(app, ['owner@crew.example'])
    // One attacker's eleventh wrong password is refused, for that address only.
    for (let attempt = 0; attempt < 10; attempt += 1) {
      await signInFrom(app, '203.0.113.7', 'owner@crew.example', otherStrongPassword).expect(401)
    }
    const refused = await signInFrom(app, '203.0.113.7', 'owner@crew.example', strongPassword)
    expect(refused.status).toBe(429)
    expect(refused.body.error.code).toBe('throttled')
    const retryAfterS = Number(refused.headers['retry-after'])
    expect(retryAfterS).toBeGreaterThan(0)
    expect(retryAfterS).toBeLessThanOrEqual(15 * 60)
    // A second attacker takes the account past its ten free failures: from here on each
    // attempt on it is slowed (0.5 s a failure, at most 5 s), never refused.
    for (let attempt = 0; attempt < 3; attempt += 1) {
      await signInFrom(app, '198.51.100.9', 'owner@crew.example', otherStrongPassword).expect(401)
    }
    const owner = await signInFrom(app, '192.0.2.44', 'owner@crew.example', strongPassword)
    expect(owner.status).toBe(200)
    expect(owner.body.user.email).toBe('owner@crew.example')
  })

  // All 40 sign in inside one throttle window (a quarter hour, so also within any minute).
  it('signs in 40 staff behind one school address within a minute, typos included', async () => {
    const app = start()
    const staff = Array.from({ length: 40 }, (_, index) => `staff${index + 1}@school.example`)
    await addAccounts(app, staff)
    for (const [index, email] of staff.entries()) {
      // Every fourth person mistypes once first (ten failures from the address in all).
      if (index % 4 === 0)
        await signInFrom(app, '198.51.100.20', email, otherStrongPassword).expect(401)
      const answer = await signInFrom(app, '198.51.100.20', email, strongPassword)
      expect(answer.status).toBe(200)
    }
  })

  it('refuses one address after 30 failed sign-ins, whichever accounts it tries', async () => {
    const app = start()
    await addAccounts(app, ['pat@crew.example'])
    for (let attempt = 0; attempt < 30; attempt += 1) {
      await signInFrom(app, '203.0.113.50', `guess${attempt}@crew.example`, strongPassword).expect(
        401,
      )
    }
    await signInFrom(app, '203.0.113.50', 'pat@crew.example', strongPassword).expect(429)
    // The next address along is a different client.
    await signInFrom(app, '203.0.113.51', 'pat@crew.example', strongPassword).expect(200)
  })

  it('without TRUST_PROXY, a forged X-Forwarded-For does not buy new attempts', async () => {
    const app = start({})
    await addAccounts(app, ['pat@crew.example'])
    for (let attempt = 0; attempt < 10; attempt += 1) {
      await signInFrom(
        app,
        `203.0.113.${attempt + 1}`,
        'pat@crew.example',
        otherStrongPassword,
      ).expect(401)
    }
    // All ten came from the socket's address (loopback), whatever the header said.
    await signInFrom(app, '203.0.113.99', 'pat@crew.example', strongPassword).expect(429)
  })
})

describe('password change throttling', { timeout: 60_000 }, () => {
  it('refuses the sixth wrong current password in a quarter hour, for that account only', async () => {
    const app = start()
    await addAccounts(app, ['pat@crew.example', 'sam@crew.example'])
    const patCookie = await signInCookie(app.app, 'pat@crew.example')
    const change = (cookie: string, currentPassword: string) =>
      request(app.app)
        .post('/api/v1/auth/password')
        .set('Cookie', cookie)
        .send({ currentPassword, newPassword: 'violet harbour climbs early 58' })
    for (let attempt = 0; attempt < 5; attempt += 1) {
      const wrong = await change(patCookie, `not the password ${attempt}`)
      expect(wrong.status).toBe(400)
      expect(wrong.body.error.issues[0].path).toBe('currentPassword')
    }
    const refused = await change(patCookie, strongPassword)
    expect(refused.status).toBe(429)
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0)
    // Another account from the same address is not held up.
    const samCookie = await signInCookie(app.app, 'sam@crew.example')
    await change(samCookie, strongPassword).expect(200)
  })
})
