import { describe, expect, it } from 'vitest'
import { openBrowser, seriousAxeViolations } from '../helpers/browser'
import { signInBeforeAll, useAppUnderTest } from '../helpers/e2e-app'

// Event plans in Chromium, on the demo seed (design/api.md, "Demo data"; issue 7).

const app = useAppUnderTest()
signInBeforeAll(app, 'editor@alder-creek.example')

const verdict = () => app.browser.page.getByTestId('plan-lasts')

async function openSaturdayMarket(): Promise<void> {
  const { page } = app.browser
  await page.goto(`${app.server.url}/plans`)
  await page.getByRole('link', { name: 'Saturday market' }).click()
  await page.waitForURL(/\/plans\/\d+$/)
  await verdict().waitFor()
}

async function setPacksOnHand(count: number): Promise<void> {
  const field = app.browser.page.getByTestId('plan-pack-count').locator('input')
  await field.fill(String(count))
  await field.blur()
}

describe('event plans', () => {
  it('lists the demo plan with its swap on the event clock', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/plans`)
    const row = page.getByRole('row', { name: /Saturday market/ })
    await row.waitFor()
    // The demo day runs 08:00–14:00 (see the seed).
    expect(await row.textContent()).toContain('2026-06-13 from 08:00')
    expect(await row.textContent()).toContain('lasts')
    // Swap at the first break below 30 %: on a segment boundary of the day, as the server stored it.
    const me = await (await page.request.get(`${app.server.url}/api/v1/auth/me`)).json()
    const list = await (
      await page.request.get(`${app.server.url}/api/v1/teams/${me.teams[0].id}/plans?q=Saturday`)
    ).json()
    const swapTimes: string[] = list.items[0].summary.swaps.map(
      (swap: { atTime: string }) => swap.atTime,
    )
    expect(swapTimes).toHaveLength(1)
    expect(['08:30', '11:00', '11:30', '12:00', '13:30']).toContain(swapTimes[0])
    expect(await row.textContent()).toContain(swapTimes[0])
  })

  it('shows a day that does not last, applies a suggestion, and then it lasts', async () => {
    const { page } = app.browser
    await openSaturdayMarket()
    expect(await verdict().getAttribute('data-lasts')).toBe('yes')
    await setPacksOnHand(1)
    await page.locator('[data-testid="plan-lasts"][data-lasts="no"]').waitFor()
    expect(await verdict().textContent()).toMatch(/the sound stops at \d\d:\d\d/)
    await app.browser.screenshot('plan-does-not-last')

    const morePacks = page.getByTestId('fix-packs')
    await morePacks.waitFor()
    await morePacks.getByRole('button').click()
    await page.locator('[data-testid="plan-lasts"][data-lasts="yes"]').waitFor()
    expect(await page.getByTestId('plan-swaps').textContent()).toMatch(/\d\d:\d\d to pack 2/)

    await page.getByTestId('plan-save').click()
    await page.getByText('Saved “Saturday market” for the team.').waitFor()
    // The server computed the same answer at save.
    const planId = new URL(page.url()).pathname.split('/').pop()
    const me = await (await page.request.get(`${app.server.url}/api/v1/auth/me`)).json()
    const teamId = me.teams[0].id
    const saved = await (
      await page.request.get(`${app.server.url}/api/v1/teams/${teamId}/plans/${planId}`)
    ).json()
    expect(saved.packCount).toBe(2)
    expect(saved.summary.lasts).toBe(true)
    expect(saved.summary.swaps[0].atTime).toMatch(/^\d\d:\d\d$/)
  })

  it('lowers the levels when that is the fix chosen', async () => {
    const { page } = app.browser
    await openSaturdayMarket()
    await setPacksOnHand(1)
    const quieter = page.getByTestId('fix-level')
    await quieter.waitFor()
    await quieter.getByRole('button').click()
    await page.locator('[data-testid="plan-lasts"][data-lasts="yes"]').waitFor()
  })

  it('compares packs side by side and puts one into the rig', async () => {
    const { page } = app.browser
    await openSaturdayMarket()
    const table = page.getByTestId('table-compare')
    await table.scrollIntoViewIfNeeded()
    await table.getByRole('row').nth(2).waitFor()
    const headers = await table.locator('th').allTextContents()
    for (const heading of ['Pack', 'Lasts', 'Packs needed', 'Wh per kg', 'Air travel']) {
      expect(headers.join('|')).toContain(heading)
    }
    await app.browser.screenshot('plan-compare')
    const pick = table.getByRole('button', { name: /^Put .* in the rig$/ }).first()
    const label = (await pick.getAttribute('aria-label'))!.replace(/^Put (.*) in the rig$/, '$1')
    await pick.click()
    await page.getByRole('button', { name: 'Put it in the rig' }).click()
    await page.getByText(`now runs on ${label}.`).waitFor()

    const me = await (await page.request.get(`${app.server.url}/api/v1/auth/me`)).json()
    const rigs = await (
      await page.request.get(`${app.server.url}/api/v1/teams/${me.teams[0].id}/rigs?q=Market`)
    ).json()
    expect(rigs.items[0].spec.pack.label).toBe(label)
  })

  it('reads on a phone, with no serious accessibility violations', async () => {
    const phone = await openBrowser({ viewport: { width: 390, height: 844 } })
    try {
      await phone.context.addCookies(await app.browser.context.cookies())
      await phone.page.goto(`${app.server.url}/plans`)
      await phone.page.getByRole('link', { name: 'Saturday market' }).click()
      await phone.page.getByTestId('plan-timeline').waitFor()
      await phone.page.getByTestId('plan-lasts').waitFor()
      const overflow = await phone.page.evaluate(
        () => document.documentElement.scrollWidth - window.innerWidth,
      )
      expect(overflow).toBeLessThanOrEqual(1)
      await phone.screenshot('plan-phone')
      expect(await seriousAxeViolations(phone.page)).toEqual([])
    } finally {
      await phone.close()
    }
    expect(app.browser.consoleErrors).toEqual([])
  })
})
