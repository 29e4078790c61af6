import { describe, expect, it } from 'vitest'
import { seriousAxeViolations } from '../helpers/browser'
import { useAppUnderTest } from '../helpers/e2e-app'

const app = useAppUnderTest()

describe('the app shell in Chromium', () => {
  it('reports migrations applied at /api/health', async () => {
    const response = await app.browser.page.request.get(`${app.server.url}/api/health`)
    const health = await response.json()
    expect(health.ok).toBe(true)
    expect(health.migrations.pending).toBe(0)
    expect(health.migrations.applied).toBeGreaterThanOrEqual(1)
  })

  it('loads the client from a deep link and navigates between areas', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/about`)
    await page.getByRole('heading', { name: 'Method and cautions' }).waitFor()
    await page.goto(`${app.server.url}/plans/123`)
    await page.getByRole('navigation', { name: 'Main' }).waitFor()
    await page.getByRole('link', { name: 'Parts' }).click()
    // The team's parts need a member: a guest is sent to sign-in and back.
    await page.waitForURL(/\/sign-in\?redirect=(%2F|\/)parts$/)
    expect(await page.title()).toContain('Loudhour')
  })

  it('uses the bundled IBM Plex Sans on the body', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/about`)
    await page.getByRole('heading', { name: 'Method and cautions' }).waitFor()
    const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily)
    expect(family).toContain('IBM Plex Sans')
    await page.evaluate(() => document.fonts.ready)
    const loaded = await page.evaluate(() => document.fonts.check('16px "IBM Plex Sans"'))
    expect(loaded).toBe(true)
  })

  it('has no console errors and no serious accessibility violations', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/about`)
    await page.getByRole('heading', { name: 'Method and cautions' }).waitFor()
    expect(await seriousAxeViolations(page)).toEqual([])
    await app.browser.screenshot('app-shell-about')
    expect(app.browser.consoleErrors).toEqual([])
  })
})
