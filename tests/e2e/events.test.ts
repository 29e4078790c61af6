import { execFileSync } from 'node:child_process'
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, screenshotDir, type BrowserSession } from '../helpers/browser'
import { startServer, type RunningServer } from '../helpers/e2e-server'
import { submitSignIn } from '../helpers/e2e-app'

// The event page and its card in Chromium, on the demo crew's Saturday: the answer first, a
// timeline per rig and the pool's charge with their tables, a change to the pool that makes a
// rig run short, and the crew lead's card on one page with a share link that opens signed out.

let server: RunningServer
let editor: BrowserSession
let phone: BrowserSession | undefined

beforeAll(async () => {
  server = await startServer()
  editor = await openBrowser()
})
afterAll(async () => {
  await phone?.close()
  await editor?.close()
  await server?.stop()
})

const eventName = 'Alder Creek Farmers’ Market, Saturday'

describe('the event page, in Chromium', () => {
  it('answers first, draws each rig and the pool with tables, and follows a change to the pool', async () => {
    const { page } = editor
    await page.goto(`${server.url}/sign-in?redirect=%2Fevents`)
    await submitSignIn(page, 'editor@alder-creek.example')
    await page.waitForURL(`${server.url}/events`)
    await page.getByText(eventName).first().click()
    await page.waitForURL(/\/events\/\d+$/)

    const verdict = page.getByTestId('event-verdict')
    await verdict.getByText('All 3 rigs last the whole day.').waitFor()
    await page
      .getByTestId('event-packs-to-bring')
      .getByText(/Crew tool pack 36 V, 5 Ah/)
      .waitFor()
    await page.getByTestId('chart-event-timeline').waitFor()
    await page.getByTestId('chart-event-pool').waitFor()

    // The market plan swaps at its break: the stored plan and the event name the same time.
    const me = await (await page.request.get(`${server.url}/api/v1/auth/me`)).json()
    const teamId = me.teams[0].id as number
    const plans = await (
      await page.request.get(`${server.url}/api/v1/teams/${teamId}/plans?q=Saturday%20market`)
    ).json()
    const swapTime = plans.items[0].summary.swaps[0].atTime as string
    const turns = page.getByTestId('event-turns')
    await turns.getByText(swapTime, { exact: true }).first().waitFor()
    // Each rig in the turns table; the pool table starts at the first rig's 08:00 start.
    for (const rig of ['Saturday market', 'Saturday busker cart', 'Saturday announcer box']) {
      await turns.getByText(rig).first().waitFor()
    }
    await page.getByTestId('event-pool').getByText('08:00', { exact: true }).waitFor()
    await page
      .getByTestId('event-sessions')
      .getByText('Tool-pack charger, office socket, slot 1')
      .waitFor()
    await editor.screenshot('event-desktop')

    // One tool pack instead of two: the market rig finds no charged pack at its swap.
    const toolPacks = page.getByLabel('Crew tool pack 36 V, 5 Ah')
    await toolPacks.fill('1')
    await toolPacks.blur()
    await verdict.getByText(/Not every rig lasts: Saturday market stops at/).waitFor()
    await page
      .getByTestId('event-verdict')
      .getByText(/only 1 on hand: 1 short/)
      .waitFor()
    await editor.screenshot('event-desktop-short')
    expect(editor.consoleErrors).toEqual([])
  }, 120_000)

  it('puts the answer above the form on a phone', async () => {
    phone = await openBrowser({ viewport: { width: 390, height: 844 } })
    const { page } = phone
    await page.goto(`${server.url}/sign-in?redirect=%2Fevents`)
    await submitSignIn(page, 'viewer@alder-creek.example')
    await page.waitForURL(`${server.url}/events`)
    await page.getByText(eventName).first().click()
    await page.waitForURL(/\/events\/\d+$/)
    const verdict = page.getByTestId('event-verdict')
    await verdict.waitFor()
    const verdictBox = await verdict.boundingBox()
    const formBox = await page.getByText('The day', { exact: true }).boundingBox()
    expect(verdictBox!.y).toBeLessThan(formBox!.y)
    // On screen at once, without scrolling.
    expect(verdictBox!.y).toBeLessThan(844)
    // A viewer reads and previews but has no save button.
    expect(await page.getByTestId('event-save').count()).toBe(0)
    await phone.screenshot('event-phone')
  }, 120_000)

  it('prints the crew lead’s card on one page', async () => {
    const { page } = editor
    await page.reload()
    await page.getByTestId('event-card-link').click()
    await page.waitForURL(/\/events\/\d+\/card$/)
    const card = page.getByTestId('event-card')
    await card.waitFor()
    await card.getByText('The day, in time order').waitFor()

    mkdirSync(screenshotDir, { recursive: true })
    const file = join(screenshotDir, 'event-card-a4.pdf')
    await page.getByRole('radio', { name: 'A4', exact: true }).check({ force: true })
    await page.pdf({ path: file, preferCSSPageSize: true, printBackground: true })
    // Read back with poppler's pdfinfo and pdftotext, as the plan card's test does.
    const pages = Number(
      /^Pages:\s+(\d+)/m.exec(execFileSync('pdfinfo', [file], { encoding: 'utf8' }))?.[1],
    )
    expect(pages).toBe(1)
    const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
    expect(text).toContain(eventName)
    expect(text).toContain('Swap in Crew tool pack 36 V, 5 Ah #2')
    expect(text).not.toContain('Back to the event')
    await editor.screenshot('event-card-desktop')
  }, 120_000)

  it('makes a share link whose card opens signed out on a phone', async () => {
    const { page } = editor

    await page.getByLabel('Label (optional)').fill('Stall holders')
    await page.getByRole('button', { name: 'Make a share link' }).click()
    const row = page
      .getByTestId('share-links')
      .getByRole('listitem')
      .filter({ hasText: 'Stall holders' })
    await row.waitFor()
    const shareUrl = await row.getByRole('link', { name: 'Open' }).getAttribute('href')
    expect(shareUrl).toMatch(new RegExp(`^${server.url}/shared/events/[A-Za-z0-9_-]{43}$`))

    const stranger = await openBrowser({ viewport: { width: 390, height: 844 } })
    try {
      await stranger.page.goto(shareUrl ?? '')
      const shared = stranger.page.getByTestId('event-card')
      await shared.getByText('The day, in time order').waitFor()
      expect(await stranger.page.locator('.frame__header').count()).toBe(0)
      await stranger.screenshot('event-card-shared-phone')
    } finally {
      await stranger.close()
    }
  }, 120_000)
})
