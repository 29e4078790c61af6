import express from 'express'
import request from 'supertest'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { ApiError, errorHandler } from '../../server/http/errors'
import { delayAfterFailures, minuteMs } from '../../server/http/throttle'

/*
 * The per-account part of sign-in throttling slows and never refuses (OWASP Authentication Cheat
 * Sheet, "Login Throttling": delays rather than lockouts, which an attacker could use to lock the
 * owner out). Timers are faked, so the test reads the delay itself rather than a clock.
 */

afterEach(() => {
  vi.useRealTimers()
})

/** A route that fails unless the body says `right`, behind the delay, keyed by `account`. */
let received = 0

function delayedApp() {
  const app = express()
  app.use(express.json())
  app.use((_req, _res, next) => {
    received += 1
    next()
  })
  app.post(
    '/',
    delayAfterFailures({
      name: 'test',
      windowMs: 15 * minuteMs,
      freeFailures: 2,
      stepMs: 500,
      maxDelayMs: 1000,
      key: (req) => (req.body as { account?: string }).account,
    }),
    (req, res) => {
      if ((req.body as { password?: string }).password !== 'right')
        throw new ApiError(401, 'wrong-credentials', 'No.')
      res.status(204).end()
    },
  )
  app.use(errorHandler({ exposeStack: false, log: () => {} }))
  return app
}

/** Lets real I/O run until `until()` holds or `ms` pass (fake time stands still meanwhile). */
async function pumpReal(ms: number, until: () => boolean = () => false): Promise<void> {
  const endMs = performance.now() + ms
  while (performance.now() < endMs && !until()) {
    await new Promise((resolve) => setImmediate(resolve))
  }
}

/** Sends a request and lets it reach the server: `answered()` says whether it has come back. */
async function send(app: express.Express, body: object) {
  let done = false
  const receivedBefore = received
  const status = request(app)
    .post('/')
    .send(body)
    .then((response) => {
      done = true
      return response.status
    })
  await pumpReal(10_000, () => received > receivedBefore)
  return { answered: () => done, status }
}

/** Expects the request to be held exactly `delayMs` of (fake) time, then answered. */
async function expectHeldFor(
  pending: Awaited<ReturnType<typeof send>>,
  delayMs: number,
): Promise<number> {
  if (delayMs > 0) {
    await pumpReal(300)
    expect(pending.answered()).toBe(false)
    await vi.advanceTimersByTimeAsync(delayMs - 1)
    await pumpReal(300)
    expect(pending.answered()).toBe(false)
    await vi.advanceTimersByTimeAsync(1)
  }
  // Answered without any more fake time passing.
  await pumpReal(10_000, pending.answered)
  expect(pending.answered()).toBe(true)
  return pending.status
}

describe('delayAfterFailures', () => {
  it('answers the free failures at once, then waits 0.5 s more per failure, at most 1 s', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'Date'] })
    const app = delayedApp()
    const wrong = { account: 'pat', password: 'wrong' }
    // Two free failures; the third waits 500 ms, the fourth 1000 ms, the fifth still 1000 ms.
    for (const delayMs of [0, 0, 500, 1000, 1000]) {
      expect(await expectHeldFor(await send(app, wrong), delayMs)).toBe(401)
    }
    // The owner's right password: slowed too, never refused.
    expect(await expectHeldFor(await send(app, { account: 'pat', password: 'right' }), 1000)).toBe(
      204,
    )
    // Another account is not slowed at all.
    expect(await expectHeldFor(await send(app, { account: 'sam', password: 'wrong' }), 0)).toBe(401)
  })
})
