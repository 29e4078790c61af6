import { describe, expect, it } from 'vitest'
import { openBrowser, seriousAxeViolations } from '../helpers/browser'
import { signInBeforeAll, useAppUnderTest } from '../helpers/e2e-app'

// Event plans in Chromium, on the demo seed (docs/api.md, "Demo sign-ins").

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
    // The list shows the swap the server stored, on the event clock.
    const me = await (await page.request.get(`${app.server.url}/api/v1/auth/me`)).json()
    const list = await (
      await page.request.get(
        `${app.server.url}/api/v1/teams/${me.teams[0].id}/plans?q=Saturday%20market`,
      )
    ).json()
    const swapTimes: string[] = list.items[0].summary.swaps.map(
      (swap: { atTime: string }) => swap.atTime,
    )
    expect(swapTimes).toHaveLength(1)
    expect(await row.textContent()).toContain(swapTimes[0])
  })

  it('swaps at the first break below the threshold, at the time the energy budget gives', async () => {
    const { page } = app.browser
    const me = await (await page.request.get(`${app.server.url}/api/v1/auth/me`)).json()
    const teamId = me.teams[0].id as number
    const plansUrl = `${app.server.url}/api/v1/teams/${teamId}/plans`
    const demo = (await (await page.request.get(`${plansUrl}?q=Saturday%20market`)).json()).items[0]
    // The demo day on the demo rig, swapping at the first break with the pack below half.
    const created = await page.request.post(plansUrl, {
      data: {
        name: 'Half-charge swap check',
        rigId: demo.rigId,
        date: demo.date,
        startTime: demo.startTime,
        temperatureC: demo.temperatureC,
        packCount: 2,
        swapPolicy: { mode: 'at-break-below', belowSocPct: 50 },
        schedule: demo.schedule,
      },
    })
    expect(created.status()).toBe(201)
    // By hand, from the demo rig's parts (seed) and the pack model of docs/model.md §1–§6:
    // - Pack 10S2P of 2.5 Ah li-ion at 12 °C: 5 Ah × 0.94 (capacity at 12 °C, makers' curves,
    //   from memory) = 4.70 Ah; about 41.6 V full under load, 36 V near a third of its charge.
    // - Setup, 30 min idle: amplifier idle 0.08 A × 41.7 V = 3.3 W, accessories
    //   (0.6 + 3) W / 0.9 + 2 × 0.05 W = 4.1 W; 7.4 W / 41.7 V = 0.18 A × 0.5 h = 0.09 Ah, 2 %:
    //   98 % at 08:30, above 50 %, no swap.
    // - Morning music, 150 min: clean rating 150 W × 10^(−1/10) = 119 W; V_pk = √(2·119·4) = 30.9 V;
    //   R_out = 4 × (36/30.9 − 1) = 0.66 Ω; into 5.33 Ω, P_clip = (41.6 × 5.33/5.99)² / (2 × 5.33)
    //   = 129 W; P_avg = 2 × 129 W × 10^(−(2 + 9)/10) = 20.4 W per channel; × 2 channels × 90 %
    //   playing / η 0.9 = 40.9 W, + idle 3.1 W + accessories 4.1 W = 48 W. At a mean 39 V that is
    //   1.23 A, × (1.23/1.0)^0.05 (Peukert, rated 1 A) = 1.25 A × 2.5 h = 3.1 Ah = 66 % of 4.70 Ah.
    //   32 % is left at 11:00: the first break below 50 % (an error of a third in the draw would
    //   still leave it below), so the swap is at 11:00, minute 180.
    expect((await created.json()).summary.swaps).toEqual([{ atMinute: 180, atTime: '11:00' }])
    await page.goto(`${app.server.url}/plans`)
    const row = page.getByRole('row', { name: /Half-charge swap check/ })
    await row.waitFor()
    expect(await row.textContent()).toContain('11:00')
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
    for (const heading of [
      'Pack',
      'Lasts',
      'Packs needed',
      'Energy per mass (Wh/kg)',
      'Air travel',
    ]) {
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
