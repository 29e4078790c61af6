import { join } from 'node:path'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import {
  desktopViewport,
  openBrowser,
  phoneViewport,
  screenshotDir,
  type BrowserSession,
} from '../helpers/browser'
import { signInBeforeAll, submitSignIn, useAppUnderTest } from '../helpers/e2e-app'

// States that say what is true, on the demo seed (docs/api.md, "Demo sign-ins"): a viewer's
// fields are read-only, a guest meets sign-in on every team page, a save that never reached the
// server says nothing was saved, masses follow the imperial switch, and the event page keeps
// unsaved work from being dropped by a stray click.

const app = useAppUnderTest()
signInBeforeAll(app, 'editor@alder-creek.example')
const rigName = 'Market stage columns' // the demo plan's rig (see the seed)

async function openSaturdayMarket(page: Page): Promise<void> {
  await page.goto(`${app.server.url}/plans`)
  await page.getByRole('link', { name: 'Saturday market' }).click()
  await page.waitForURL(/\/plans\/\d+$/)
  await page.getByTestId('plan-lasts').waitFor()
}

/** The whole page at a desk, and a phone's first view of it; left at desk size. */
async function shootBoth(session: BrowserSession, name: string): Promise<void> {
  await session.screenshot(`${name}-desktop`)
  await session.page.setViewportSize(phoneViewport)
  await session.page.screenshot({ path: join(screenshotDir, `${name}-phone.png`) })
  await session.page.setViewportSize(desktopViewport)
}

/** Form controls in the element that a person could still change. */
const enabledControls = (page: Page, selector: string) =>
  page.locator(`${selector} :is(input, select, textarea, button):not(:disabled)`).count()

describe('states that are true', () => {
  it('shows a viewer read-only plans, events and saved rigs', { timeout: 180_000 }, async () => {
    const viewer = await openBrowser({ viewport: desktopViewport })
    const { page } = viewer
    try {
      await page.goto(`${app.server.url}/sign-in?redirect=%2Fplans`)
      await submitSignIn(page, 'viewer@alder-creek.example')
      await page.waitForURL(`${app.server.url}/plans`)

      await openSaturdayMarket(page)
      expect(await page.getByTestId('plan-save').count()).toBe(0)
      expect(await page.getByTestId('add-segment').count()).toBe(0)
      expect(await enabledControls(page, 'form[aria-label="Plan"]')).toBe(0)
      await shootBoth(viewer, 'viewer-plan')

      await page.goto(`${app.server.url}/events`)
      await page.getByTestId('team-events').getByRole('link').first().click()
      await page.getByTestId('event-verdict').waitFor()
      await page.getByTestId('read-only-note').waitFor()
      expect(await page.getByTestId('event-save').count()).toBe(0)
      expect(await page.getByRole('button', { name: /charger/i }).count()).toBe(0)
      expect(await enabledControls(page, '.event-page__form')).toBe(0)
      await shootBoth(viewer, 'viewer-event')

      // The bench: a saved rig opens read-only, and one button opens it to try changes.
      await page.goto(`${app.server.url}/rigs`)
      await page.getByRole('button', { name: `Open in bench: ${rigName}` }).click()
      const note = page.getByTestId('rig-read-only')
      await note.waitFor({ timeout: 60_000 })
      const fields = page.getByTestId('bench-fields')
      expect(await fields.evaluate((set) => (set as HTMLFieldSetElement).disabled)).toBe(true)
      expect(await page.getByLabel('Cells in series').isDisabled()).toBe(true)
      expect(await page.getByLabel('Rig name').isDisabled()).toBe(true)
      // naive-ui's switches are no form controls: they say so by their class alone.
      expect(await page.locator('[data-testid="bench-fields"] .n-switch').count()).toBe(
        await page.locator('[data-testid="bench-fields"] .n-switch--disabled').count(),
      )
      expect(await page.getByRole('button', { name: /^Save/ }).count()).toBe(0)
      await shootBoth(viewer, 'viewer-bench-locked')

      await page.getByRole('button', { name: 'Try changes without saving' }).click()
      expect(await note.innerText()).toContain('a viewer cannot save')
      expect(await fields.evaluate((set) => (set as HTMLFieldSetElement).disabled)).toBe(false)
      const cells = page.getByLabel('Cells in series')
      await cells.fill('5')
      await cells.press('Tab')
      await page.getByTestId('rig-save-status').getByText('unsaved changes').waitFor()
      expect(await page.getByRole('button', { name: /^Save/ }).count()).toBe(0)
      await shootBoth(viewer, 'viewer-bench-trying')
      expect(viewer.consoleErrors).toEqual([])
    } finally {
      await viewer.close()
    }
  })

  it('sends a guest from every team page to sign-in and back', async () => {
    const guest = await openBrowser({ viewport: phoneViewport })
    try {
      for (const path of ['/plans', '/events', '/rigs', '/parts', '/team']) {
        await guest.page.goto(`${app.server.url}${path}`)
        await guest.page.waitForURL(
          (url) => url.pathname === '/sign-in' && url.searchParams.get('redirect') === path,
        )
        await guest.page.getByLabel('E-mail').waitFor()
      }
      await guest.screenshot('guest-events-to-sign-in-phone')
    } finally {
      await guest.close()
    }
  })

  it('says nothing was saved when a plan is saved offline', async () => {
    const { page, context } = app.browser
    await openSaturdayMarket(page)
    const packs = page.getByTestId('plan-pack-count').locator('input')
    await packs.fill('3')
    await packs.blur()
    await context.setOffline(true)
    try {
      await page.getByTestId('plan-save').click()
      await expect
        .poll(() => page.getByRole('alert').allInnerTexts())
        .toContainEqual(expect.stringContaining('could not be reached, so nothing was saved'))
      await shootBoth(app.browser, 'plan-saved-offline')
    } finally {
      await context.setOffline(false)
    }
    await page.getByTestId('plan-save').click()
    await page.getByText('Saved “Saturday market” for the team.').waitFor()
  })

  it('shows masses in pounds and energy per mass in Wh/lb once imperial is chosen', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/parts`)
    const teamPacks = page.getByTestId('team-packs')
    const massCell = teamPacks
      .getByRole('row', { name: /Announcer battery/ })
      .locator('td[data-col-key="massKg"]')
    const kg = Number(await massCell.innerText())
    await page.getByRole('radio', { name: 'Imperial' }).check({ force: true })
    try {
      await teamPacks.getByRole('columnheader', { name: 'Mass per pack (lb)' }).waitFor()
      // Source: 1 lb = 0.45359237 kg exactly (international yard and pound agreement, 1959).
      expect(Number(await massCell.innerText())).toBeCloseTo(kg / 0.45359237, 2)

      await openSaturdayMarket(page)
      const table = page.getByTestId('table-compare')
      await table.scrollIntoViewIfNeeded()
      await table.getByRole('row').nth(1).waitFor()
      const headers = await table.getByRole('columnheader').allInnerTexts()
      expect(headers.join(' | ')).toContain('Mass (lb)')
      expect(headers.join(' | ')).toContain('Energy per mass (Wh/lb)')
      expect(headers.join(' | ')).not.toMatch(/\bkg\b/)
      await page.getByTestId('plan-compare').screenshot({
        path: await app.browser.screenshot('plan-compare-imperial'),
      })
    } finally {
      await page.getByRole('radio', { name: 'Metric' }).check({ force: true })
    }
  })

  it('asks before leaving an event with unsaved changes', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/events`)
    await page.getByTestId('team-events').getByRole('link').first().click()
    await page.getByTestId('event-verdict').waitFor()
    const name = page.getByLabel('Name', { exact: true })
    const saved = await name.inputValue()
    await name.fill(`${saved} (moved)`)
    await page.getByText('Not saved yet').waitFor()
    const eventUrl = page.url()
    await page.getByRole('link', { name: 'All events' }).click()
    const dialog = page.getByRole('dialog').filter({ hasText: 'Leave without saving?' })
    await dialog.waitFor()
    await shootBoth(app.browser, 'event-leave-unsaved')
    await dialog.getByRole('button', { name: 'Stay' }).click()
    expect(page.url()).toBe(eventUrl)
    // Undone by hand, nothing is unsaved: leaving asks nothing.
    await name.fill(saved)
    await page.getByText('Not saved yet').waitFor({ state: 'detached' })
    await page.getByRole('link', { name: 'All events' }).click()
    await page.waitForURL(`${app.server.url}/events`)
    // The only errors: the requests refused while offline, on purpose.
    expect(
      app.browser.consoleErrors.filter((error) => !/ERR_INTERNET_DISCONNECTED/.test(error)),
    ).toEqual([])
  })
})
