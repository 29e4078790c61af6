import { beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, seriousAxeViolations } from '../helpers/browser'
import { submitSignIn, useAppUnderTest } from '../helpers/e2e-app'

// States a crew can trust, signed in on the demo seed: a bench address that names its rig and
// leads to a day, a plan address that is not the team's, plurals, clock times, pounds, dark mode,
// and a card whose QR code stays the one chosen.

const app = useAppUnderTest()
const rigName = 'Market stage columns' // the demo plan's rig (see the seed)

beforeAll(async () => {
  const { page } = app.browser
  await page.goto(`${app.server.url}/sign-in`)
  await submitSignIn(page, 'editor@alder-creek.example')
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'))
})

async function openSaturdayMarket(): Promise<number> {
  const { page } = app.browser
  await page.goto(`${app.server.url}/plans`)
  await page.getByRole('link', { name: 'Saturday market' }).click()
  await page.waitForURL(/\/plans\/\d+$/)
  await page.getByTestId('plan-lasts').waitFor()
  return Number(new URL(page.url()).pathname.split('/').pop())
}

describe('states that are true', () => {
  // Three browsers in one test: it takes its time on a busy machine.
  it(
    'names the open rig in the bench address, and plans a day with it',
    { timeout: 150_000 },
    async () => {
      const { page } = app.browser
      await page.goto(`${app.server.url}/rigs`)
      await page.getByRole('button', { name: `Open in bench: ${rigName}` }).click()
      await page.waitForURL(/\/\?rig=\d+$/)
      const rigAddress = page.url()
      const rigId = new URL(rigAddress).searchParams.get('rig')
      await page.getByTestId('plan-with-rig').click()
      await page.waitForURL(new RegExp(`/plans/new\\?rig=${rigId}$`))
      await expect.poll(() => page.getByTestId('plan-rig').innerText()).toContain(rigName)
      await app.browser.screenshot('plan-new-from-bench')

      // A teammate on a phone opens the same address: the same saved rig is on the bench.
      const phone = await openBrowser({ viewport: { width: 390, height: 844 } })
      try {
        await phone.context.addCookies(await app.browser.context.cookies())
        await phone.page.goto(rigAddress)
        await expect
          .poll(() => phone.page.getByTestId('rig-save-status').innerText(), { timeout: 30_000 })
          .toContain(`Saved rig “${rigName}”`)
        await phone.screenshot('phone-bench-from-address')
      } finally {
        await phone.close()
      }

      // Signed out, the address says what it is and how to open it.
      const guest = await openBrowser()
      try {
        await guest.page.goto(rigAddress)
        await guest.page.getByTestId('rig-address-guest').waitFor()
      } finally {
        await guest.close()
      }
    },
  )

  it('answers a plan address that is not the team’s with “no such plan”, and no form', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/plans/999999`)
    await page.getByRole('heading', { name: 'No such plan' }).waitFor()
    expect(await page.getByText('New event plan').count()).toBe(0)
    expect(await page.getByTestId('plan-save').count()).toBe(0)
  })

  it('says a single pack is used up in the singular, and names times on the event clock', async () => {
    const { page } = app.browser
    await openSaturdayMarket()
    const packs = page.getByTestId('plan-pack-count').locator('input')
    await packs.fill('1')
    await packs.blur()
    const verdict = page.locator('[data-testid="plan-lasts"][data-lasts="no"]')
    await verdict.waitFor()
    const text = await page.getByTestId('plan-verdict').innerText()
    expect(text).toContain('The 1 pack on hand is used up.')
    expect(text).not.toMatch(/minute \d/)
    await app.browser.screenshot('plan-one-pack')
    // Typed text that is not a number: said at the field, the day marked as the last valid one.
    await packs.fill('two')
    await page.getByTestId('plan-stale').waitFor()
    expect(await page.getByTestId('plan-save').isDisabled()).toBe(true)
    await packs.fill('1')
    await page.getByTestId('plan-stale').waitFor({ state: 'detached' })
    // A plan the schema refuses (no start time): the last valid plan's day stays, marked.
    const start = page.locator('input[type="time"]')
    const startTime = await start.inputValue()
    await start.fill('')
    await page.getByTestId('plan-stale').waitFor()
    expect(await page.getByTestId('plan-stale').innerText()).toContain('fields marked in red')
    expect(await page.getByTestId('plan-verdict').innerText()).toContain('1 pack on hand is used')
    expect(await page.getByTestId('plan-save').isDisabled()).toBe(true)
    await app.browser.screenshot('plan-last-valid')
    await start.fill(startTime)
    await page.getByTestId('plan-stale').waitFor({ state: 'detached' })
  })

  it('shows masses in pounds once imperial is chosen', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/`)
    await page.getByTestId('runtime').waitFor()
    await page.getByRole('radio', { name: 'Imperial' }).check({ force: true })
    await page.getByLabel('Mass per pack (lb)').waitFor()
    const energy = page.getByTestId('pack-energy')
    await energy.scrollIntoViewIfNeeded()
    // Source: 1 lb = 0.45359237 kg exactly (international yard and pound agreement, 1959)
    await expect
      .poll(() => energy.innerText())
      .toMatch(/Mass per pack\s+[\d.]+\u00a0lb, \d+\u00a0Wh\/lb/)
    await page.getByRole('radio', { name: 'Metric' }).check({ force: true })
  })

  it('passes axe on the plan in dark mode, at a desk and on a phone', async () => {
    const { page } = app.browser
    await openSaturdayMarket()
    await page.getByTestId('plan-timeline').waitFor()
    await page.getByRole('button', { name: 'Dark mode' }).click()
    await page.getByRole('button', { name: 'Light mode' }).waitFor()
    expect(await seriousAxeViolations(page)).toEqual([])
    await app.browser.screenshot('plan-dark')
    await page.setViewportSize({ width: 390, height: 844 })
    expect(await seriousAxeViolations(page)).toEqual([])
    await app.browser.screenshot('plan-dark-phone')
    await page.getByTestId('menu-button').click()
    await page.getByRole('button', { name: 'Light mode' }).click()
    await page.setViewportSize({ width: 1280, height: 800 })
  })

  it('keeps the QR code chosen for the card when the card is e-mailed', async () => {
    const { page } = app.browser
    const planId = await openSaturdayMarket()
    await page.goto(`${app.server.url}/plans/${planId}/card`)
    const links = page.getByTestId('share-links')
    await page.getByLabel('Label (optional)').fill('Printed on the card')
    await page.getByRole('button', { name: 'Make a share link' }).click()
    const printed = links.getByRole('listitem').filter({ hasText: 'Printed on the card' })
    await printed.waitFor()
    expect(
      await printed.getByRole('button', { name: 'QR on card' }).getAttribute('aria-pressed'),
    ).toBe('true')
    // The link lasts until the day after the plan's date (or a week, once that is past: the
    // server tests pin both dates), not until revoked.
    expect(await printed.innerText()).toMatch(/works until \w/)
    expect(await printed.innerText()).not.toContain('works until revoked')

    await page.getByLabel('E-mail addresses').fill('gate@crew.example')
    await page.getByRole('button', { name: 'Send the card' }).click()
    const mailed = links.getByRole('listitem').filter({ hasText: 'E-mailed to gate@crew.example' })
    await mailed.waitFor()
    expect(
      await mailed.getByRole('button', { name: 'QR on card' }).getAttribute('aria-pressed'),
    ).toBe('false')
    expect(
      await printed.getByRole('button', { name: 'QR on card' }).getAttribute('aria-pressed'),
    ).toBe('true')
    await app.browser.screenshot('card-after-email')
    // The only errors: the 404 of the plan address that is not the team's, asked on purpose.
    expect(app.browser.consoleErrors.filter((error) => !/status of 404/.test(error))).toEqual([])
  })
})
