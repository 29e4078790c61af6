import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { seriousAxeViolations } from '../helpers/browser'
import { useAppUnderTest } from '../helpers/e2e-app'
import { minutesOfRuntimeText } from '../helpers/runtime-text'

const app = useAppUnderTest()

const runtime = (page: Page) => page.getByTestId('runtime').innerText()
const dischargeChart = (page: Page) => page.getByTestId('chart-discharge')

/** The chart's text alternative and its pixels: both must change when the curve does. */
async function chartState(page: Page): Promise<{ label: string; pixels: string }> {
  // Charts load as their panel nears the screen.
  await page.getByTestId('discharge').scrollIntoViewIfNeeded()
  const chart = dischargeChart(page)
  await chart.waitFor()
  return {
    label: (await chart.getAttribute('aria-label')) ?? '',
    pixels: await chart.evaluate((canvas: HTMLCanvasElement) => canvas.toDataURL()),
  }
}

/** Each test opens the bench itself, so none depends on the page a test before it left. */
async function openBench(page: Page): Promise<void> {
  await page.goto(`${app.server.url}/`)
  await page.getByTestId('runtime').waitFor()
}

async function waitForChange(read: () => Promise<string>, before: string): Promise<string> {
  for (let attempt = 0; attempt < 50; attempt++) {
    const now = await read()
    if (now !== before) return now
    await new Promise((resolve) => setTimeout(resolve, 100))
  }
  return read()
}

describe('the rig bench in Chromium', () => {
  it('composes a rig from the library and follows a level change in the runtime and chart', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/`)
    await page.getByRole('heading', { name: 'Rig bench' }).waitFor()
    await page.getByTestId('runtime').waitFor()

    // Parts from the library. Definition of the ampere-hour: a pack of less charge runs the
    // same rig for less time.
    const startRuntime = await runtime(page)
    await page.getByLabel('Pack from the library').selectOption('li-ion-5s-4ah')
    const smallPackRuntime = await waitForChange(() => runtime(page), startRuntime)
    expect(minutesOfRuntimeText(smallPackRuntime)).toBeLessThan(minutesOfRuntimeText(startRuntime))
    expect(await page.getByLabel('Cells in series').inputValue()).toBe('5')
    await page.getByLabel('Amplifier from the library').selectOption('amp-d-mono-100w')
    await page.getByLabel('Arrangement from the library').selectOption('spk-2x-8ohm-parallel')
    await expect.poll(() => page.getByLabel('Amplifier channels').inputValue()).toBe('1')

    // Definition of the decibel: 6 dB further below clipping is a quarter of the average output
    // power, so the same charge lasts longer.
    const chartBefore = await chartState(page)
    const runtimeBefore = await runtime(page)
    const level = page.getByLabel('Level (peaks below clipping)')
    await level.fill('8')
    await level.press('Tab')
    const runtimeAfter = await waitForChange(() => runtime(page), runtimeBefore)
    expect(minutesOfRuntimeText(runtimeAfter)).toBeGreaterThan(minutesOfRuntimeText(runtimeBefore))
    const labelAfter = await waitForChange(
      async () => (await chartState(page)).label,
      chartBefore.label,
    )
    expect(labelAfter).not.toBe(chartBefore.label)
    expect((await chartState(page)).pixels).not.toBe(chartBefore.pixels)
    // The same numbers sit in a table beside the chart.
    expect(await page.getByTestId('table-discharge').locator('tbody tr').count()).toBeGreaterThan(3)
    await app.browser.screenshot('bench-after-level-change')
  })

  it('refuses a bad rig file with a message and keeps the rig', async () => {
    const { page } = app.browser
    await openBench(page)
    const before = await runtime(page)
    const levelBefore = await page.getByLabel('Level (peaks below clipping)').inputValue()
    await page.getByTestId('import-input').setInputFiles({
      name: 'shopping-list.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify({ items: ['bread', 'milk'] })),
    })
    const message = page.getByTestId('file-message')
    await message.waitFor()
    expect(await message.innerText()).toContain('not a Loudhour rig file')
    expect(await message.getAttribute('role')).toBe('alert')
    expect(await runtime(page)).toBe(before)
    expect(await page.getByLabel('Level (peaks below clipping)').inputValue()).toBe(levelBefore)
  })

  it('keeps the rig across a reload', async () => {
    const { page } = app.browser
    await openBench(page)
    // A level no library rig uses, so only the stored draft can bring it back.
    const level = page.getByLabel('Level (peaks below clipping)')
    const runtimeBefore = await runtime(page)
    await level.fill('11')
    await level.press('Tab')
    await waitForChange(() => runtime(page), runtimeBefore)
    await page.reload()
    await page.getByTestId('runtime').waitFor()
    expect(await page.getByLabel('Level (peaks below clipping)').inputValue()).toBe('11')
  })

  it('has no console errors and no serious accessibility violations, light and dark', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/`)
    await page.getByTestId('runtime').waitFor()
    for (const panel of ['power-budget', 'discharge', 'headroom']) {
      await page.getByTestId(panel).scrollIntoViewIfNeeded()
    }
    await page.getByTestId('chart-headroom').waitFor()
    expect(await seriousAxeViolations(page)).toEqual([])
    await app.browser.screenshot('bench-light')
    await page.getByRole('button', { name: 'Dark mode' }).click()
    await page.getByRole('button', { name: 'Light mode' }).waitFor()
    expect(await seriousAxeViolations(page)).toEqual([])
    await app.browser.screenshot('bench-dark')
    await page.setViewportSize({ width: 390, height: 844 })
    await page.evaluate(() => window.scrollTo(0, 0))
    expect(await seriousAxeViolations(page)).toEqual([])
    await app.browser.screenshot('bench-phone')
    // On a phone the switches sit in the header's menu.
    await page.getByTestId('menu-button').click()
    await page.getByRole('button', { name: 'Light mode' }).click()
    expect(app.browser.consoleErrors).toEqual([])
  })

  it('says what must change before the runtime when a pack is over the board maximum', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/`)
    await page.getByTestId('runtime').waitFor()
    expect(await page.getByTestId('must-change').count()).toBe(0)
    // Source: common practice: 7 li-ion cells straight off the charger are 7 × 4.20 = 29.4 V,
    // over the starting board's 26 V maximum supply.
    const cells = page.getByLabel('Cells in series')
    await cells.fill('7')
    await cells.press('Tab')
    await page.getByTestId('must-change').waitFor()
    expect(await page.getByTestId('must-change').innerText()).toContain('29.4 V')
    expect(await page.getByTestId('runtime-not-valid').innerText()).toContain('Not valid')
    await app.browser.screenshot('bench-must-change')
    await page.setViewportSize({ width: 390, height: 844 })
    await page.getByTestId('strip-must-change').waitFor()
    await app.browser.screenshot('bench-must-change-phone')
  })
})
