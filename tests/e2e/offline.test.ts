import { request } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { seriousAxeViolations } from '../helpers/browser'
import { demoPassword, submitSignIn, useAppUnderTest } from '../helpers/e2e-app'

// Field-ready (README, offline): a plan already open keeps working offline, its card too,
// and signing out leaves none of the account's answers in the browser.

const app = useAppUnderTest()

/** Signs in through the API as the demo admin and ends every session of the account. */
async function signOutEverywhereElsewhere(): Promise<void> {
  const api = await request.newContext({ baseURL: app.server.url })
  const headers = { Origin: app.server.url }
  await api.post('/api/v1/auth/sign-in', {
    data: { email: 'admin@alder-creek.example', password: demoPassword },
    headers,
  })
  const ended = await api.post('/api/v1/auth/sign-out-everywhere', { headers })
  expect(ended.status()).toBe(204)
  await api.dispose()
}

/** A share link for the demo plan, made through the API as its editor. */
async function makeShareLink(): Promise<string> {
  const api = await request.newContext({ baseURL: app.server.url })
  await api.post('/api/v1/auth/sign-in', {
    data: { email: 'editor@alder-creek.example', password: demoPassword },
    headers: { Origin: app.server.url },
  })
  const me = await (await api.get('/api/v1/auth/me')).json()
  const teamId = me.teams[0].id as number
  const plans = await (await api.get(`/api/v1/teams/${teamId}/plans`)).json()
  const plan = plans.items.find((item: { name: string }) => item.name === 'Saturday market')
  const link = await api.post(`/api/v1/teams/${teamId}/plans/${plan.id}/share-links`, {
    data: { label: 'Gate volunteers' },
    headers: { Origin: app.server.url },
  })
  const body = await link.json()
  await api.dispose()
  return body.url as string
}

describe('offline, in Chromium', () => {
  it('reloads an open plan and its card without a network, and forgets them at sign-out', async () => {
    const { page, context } = app.browser
    await page.goto(`${app.server.url}/sign-in?redirect=%2Fplans`)
    await submitSignIn(page, 'editor@alder-creek.example')
    await page.waitForURL(`${app.server.url}/plans`)
    await page.getByText('Saturday market').first().click()
    await page.waitForURL(/\/plans\/\d+$/)
    const planUrl = page.url()
    // The service worker takes over the page once installed; from then on it keeps what loads.
    await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, undefined, {
      timeout: 30_000,
    })
    await page.reload()
    await page.getByRole('heading', { name: 'Saturday market' }).waitFor()
    await page.getByTestId('plan-card-link').click()
    await page.getByTestId('runtime-card').waitFor()
    const cardText = await page.getByTestId('runtime-card').textContent()

    await context.setOffline(true)
    try {
      await page.goto(planUrl)
      await page.getByRole('heading', { name: 'Saturday market' }).waitFor()
      await page.getByTestId('offline-note').waitFor()
      expect(await seriousAxeViolations(page)).toEqual([])
      await page.getByTestId('plan-card-link').click()
      await page.getByTestId('runtime-card').waitFor()
      expect(await page.getByTestId('runtime-card').textContent()).toBe(cardText)
      await app.browser.screenshot('offline-card')
    } finally {
      await context.setOffline(false)
    }

    await page.goto(planUrl)
    await page.getByRole('heading', { name: 'Saturday market' }).waitFor()
    const keptPaths = () =>
      page.evaluate(async () => {
        const cache = await caches.open('loudhour-api')
        return (await cache.keys()).map((request) => new URL(request.url).pathname)
      })
    expect((await keptPaths()).some((path) => /\/plans\/\d+$/.test(path))).toBe(true)
    await page.getByRole('button', { name: 'Sam Creek (editor)' }).click()
    await page.getByText('Sign out').click()
    await page.waitForURL(`${app.server.url}/sign-in`)
    // Only answers anyone may have (shared cards, the built-in library) may stay.
    await expect
      .poll(
        async () =>
          (await keptPaths()).filter(
            (path) => !path.startsWith('/api/v1/shared/') && !path.startsWith('/api/v1/library/'),
          ),
        { timeout: 5000 },
      )
      .toEqual([])
    expect(app.browser.consoleErrors).toEqual([])
  })

  it('keeps a card shared by link for a volunteer without an account, offline too', async () => {
    const { page, context } = app.browser
    await context.clearCookies()
    const sharedUrl = await makeShareLink()
    await page.goto(sharedUrl)
    const card = page.getByTestId('runtime-card')
    await card.waitFor()
    await page.waitForFunction(() => navigator.serviceWorker?.controller !== null)
    await page.reload()
    await card.waitFor()
    const cardText = await card.textContent()
    // Signed-out pages forget any account's answers; the shared card is no account's.
    await page.goto(`${app.server.url}/plans`, { waitUntil: 'networkidle' })
    await context.setOffline(true)
    try {
      await page.goto(sharedUrl)
      await card.waitFor()
      expect(await card.textContent()).toBe(cardText)
    } finally {
      await context.setOffline(false)
    }
  })

  it('forgets account answers after a 401 from a session ended elsewhere, and never keeps the mail catcher', async () => {
    const { page, context } = app.browser
    await context.clearCookies()
    await page.goto(`${app.server.url}/sign-in?redirect=%2Fplans`)
    await submitSignIn(page, 'admin@alder-creek.example')
    await page.waitForURL(`${app.server.url}/plans`)
    await page.waitForFunction(() => navigator.serviceWorker?.controller !== null)
    await page.reload()
    await page.getByText('Saturday market').first().waitFor()
    const keptPaths = () =>
      page.evaluate(async () => {
        const cache = await caches.open('loudhour-api')
        return (await cache.keys()).map((kept) => new URL(kept.url).pathname)
      })
    await expect
      .poll(async () => (await keptPaths()).some((path) => path.endsWith('/plans')))
      .toBe(true)

    // The catcher holds reset links: read through the service worker, it is still not kept.
    const outboxStatus = await page.evaluate(async () => (await fetch('/api/v1/dev/outbox')).status)
    expect(outboxStatus).toBe(200)
    expect((await keptPaths()).filter((path) => path.startsWith('/api/v1/dev/'))).toEqual([])

    // "Sign out everywhere" from another device; this page's next request answers 401. The
    // request goes round the app's own 401 handling, so only the service worker can forget.
    await signOutEverywhereElsewhere()
    const teamsStatus = await page.evaluate(async () => (await fetch('/api/v1/teams')).status)
    expect(teamsStatus).toBe(401)
    await expect
      .poll(
        async () =>
          (await keptPaths()).filter(
            (path) => !path.startsWith('/api/v1/shared/') && !path.startsWith('/api/v1/library/'),
          ),
        { timeout: 5000 },
      )
      .toEqual([])
  })
})
