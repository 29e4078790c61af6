import { describe, expect, it } from 'vitest'
import { seriousAxeViolations } from '../helpers/browser'
import { submitSignIn, useAppUnderTest } from '../helpers/e2e-app'

// Field-ready (design/product.md §8): a plan already open keeps working offline, its card too,
// and signing out leaves none of the account's answers in the browser.

const app = useAppUnderTest()

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
    expect(await page.evaluate(() => caches.has('loudhour-api'))).toBe(true)
    await page.getByRole('button', { name: 'Sam Creek (editor)' }).click()
    await page.getByText('Sign out').click()
    await page.waitForURL(`${app.server.url}/sign-in`)
    await expect
      .poll(() => page.evaluate(() => caches.has('loudhour-api')), { timeout: 5000 })
      .toBe(false)
    expect(app.browser.consoleErrors).toEqual([])
  })
})
