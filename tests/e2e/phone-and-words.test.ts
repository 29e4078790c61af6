import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { join } from 'node:path'
import { screenshotDir } from '../helpers/browser'
import { useAppUnderTest } from '../helpers/e2e-app'

// What a practitioner reads on a phone in the sun and at a desk: the answer first, a header that
// keeps out of the way, and fields that say what is wrong with what was typed.

const app = useAppUnderTest()

const phone = { width: 390, height: 844 } // a common phone screen in CSS pixels (from memory)
const desktop = { width: 1280, height: 800 }

async function openBench(page: Page, size: { width: number; height: number }): Promise<void> {
  await page.setViewportSize(size)
  await page.goto(`${app.server.url}/`)
  await page.getByTestId('runtime').waitFor()
}

/** What the screen shows without scrolling: the first view is the point on a phone. */
const firstView = (page: Page, name: string) =>
  page.screenshot({ path: join(screenshotDir, `${name}-first-view.png`) })

const top = async (page: Page, selector: string) =>
  (await page.locator(selector).first().boundingBox())?.y ?? Number.POSITIVE_INFINITY

describe('the bench on a phone and at a desk', () => {
  it('on a phone, keeps the header to one short line and puts the runtime above the fields', async () => {
    const { page } = app.browser
    await openBench(page, phone)
    const header = await page.locator('header.frame__header').boundingBox()
    // A 64 px bar is under 8 % of an 844 px screen (our own aim for the header).
    expect(header?.height).toBeLessThan(64)
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false)
    expect(await top(page, '[data-testid="runtime"]')).toBeLessThan(
      await top(page, 'form[aria-label="Rig"]'),
    )
    await firstView(page, 'phone-bench')
    // The menu holds the navigation, one tap away, and closes on the way to a page.
    await page.getByTestId('menu-button').click()
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Plans' })
      .waitFor()
    await firstView(page, 'phone-menu-open')
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Bench' })
      .click()
    await page.waitForFunction(
      () => !document.querySelector('nav[aria-label="Main"]')?.checkVisibility(),
    )
  })

  it('at a desk, shows the navigation in the header and the answer beside the fields', async () => {
    const { page } = app.browser
    await openBench(page, desktop)
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(true)
    expect(await page.getByTestId('menu-button').isVisible()).toBe(false)
    const runtime = await page.getByTestId('runtime').boundingBox()
    const fields = await page.locator('form[aria-label="Rig"]').boundingBox()
    expect(runtime!.x).toBeGreaterThan(fields!.x + fields!.width - 1)
    expect(runtime!.y).toBeLessThan(400)
  })

  for (const [name, size] of [
    ['phone', phone],
    ['desktop', desktop],
  ] as const) {
    it(`says at the field when typed text is not a number, and marks the results (${name})`, async () => {
      const { page } = app.browser
      await openBench(page, size)
      const capacity = page.getByLabel('Cell capacity (Ah)')
      const runtimeBefore = await page.getByTestId('runtime').innerText()
      await capacity.fill('abc')
      const message = page.getByTestId('message-pack.cellCapacityAh')
      await message.waitFor()
      expect(await message.innerText()).toBe(
        '“abc” is not a number: type digits, such as 12 or 4.5',
      )
      expect(await capacity.getAttribute('aria-invalid')).toBe('true')
      // The results stay those of the last valid rig, and say so.
      expect(await page.getByTestId('issue-summary').innerText()).toContain(
        'Showing the last complete rig',
      )
      expect(await page.getByTestId('runtime').innerText()).toBe(runtimeBefore)
      if (name === 'phone') {
        expect(await page.locator('.app-strip').innerText()).toContain('Last valid rig')
      }
      await capacity.scrollIntoViewIfNeeded()
      await firstView(page, `${name}-bench-field-not-a-number`)

      // Leaving the field with text that is not a number: it goes back and says so.
      await capacity.blur()
      await expect
        .poll(() => page.getByTestId('field-pack.cellCapacityAh').innerText())
        .toContain('“abc” was not a number, so the field went back to its last value.')
      expect(await page.getByTestId('issue-summary').count()).toBe(0)

      // A comma decimal: the point is asked for, with the value it would be.
      await capacity.fill('2,5')
      await expect.poll(() => message.innerText()).toBe('Use a point for decimals: 2.5')

      // A negative capacity reads as a number, and the shared schema names the allowed range.
      await capacity.fill('-6')
      await expect.poll(() => message.innerText()).toMatch(/^Cell capacity must be more than 0/)
      await capacity.fill('3')
      await capacity.blur()
      await expect.poll(() => page.getByTestId('issue-summary').count()).toBe(0)
    })
  }

  it('names what the estimate assumed in plain words with their sources', async () => {
    const { page } = app.browser
    await openBench(page, desktop)
    const table = page.getByTestId('assumed')
    await table.scrollIntoViewIfNeeded()
    await table.locator('tbody tr').first().waitFor()
    const text = await table.innerText()
    // No field paths (a dot between two words) and no document names.
    expect(text).not.toMatch(/\b[a-z]+[A-Z]?\w*\.\w+/)
    expect(text).not.toMatch(/\.md\b|§/)
    expect(text).toContain('Connector and fuse resistance')
    expect(text).toContain('our default')
    expect(await page.getByTestId('power-budget').innerText()).toContain('output power')
    expect(await page.locator('input[placeholder="Please Input"]').count()).toBe(0)
  })
})
