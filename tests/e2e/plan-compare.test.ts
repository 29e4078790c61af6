import type { Page } from 'playwright-core'
import { beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, seriousAxeViolations } from '../helpers/browser'
import { submitSignIn, useAppUnderTest } from '../helpers/e2e-app'

// The plan's pack comparison in Chromium, on the demo seed: the crew's market rig runs on 36 V
// packs through a board rated 18–50 V. A "60 V max" pack is 15 li-ion cells, 63 V off the
// charger (common practice: 4.20 V per cell), so it must not be offered for that board.

const app = useAppUnderTest()
beforeAll(async () => {
  const { page } = app.browser
  await page.goto(`${app.server.url}/sign-in`)
  await submitSignIn(page, 'editor@alder-creek.example')
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'))
})

const overVoltagePack = 'Tool pack 54 V ("60 V max"), 6.0 Ah (15S2P)'

async function openComparison(page: Page): Promise<void> {
  await page.goto(`${app.server.url}/plans`)
  await page.getByRole('link', { name: 'Saturday market' }).click()
  await page.waitForURL(/\/plans\/\d+$/)
  await page.getByTestId('plan-lasts').waitFor()
  const table = page.getByTestId('table-compare')
  await table.scrollIntoViewIfNeeded()
  await table.getByRole('row').nth(1).waitFor()
}

async function addPack(page: Page, label: string): Promise<void> {
  const select = page.getByTestId('compare-select')
  await select.click()
  await page.keyboard.type('60 V max')
  // naive-ui's options are plain elements, without an option role.
  await page.locator('.n-base-select-option', { hasText: label }).click()
  await page.keyboard.press('Escape')
  await page
    .getByTestId('table-compare')
    .getByRole('row', { name: new RegExp('15S2P') })
    .waitFor()
}

/** Words of the table's header cells that are split across two lines. */
function brokenHeaderWords(page: Page): Promise<string[]> {
  return page.getByTestId('table-compare').evaluate((table) => {
    const broken: string[] = []
    for (const cell of table.querySelectorAll('th')) {
      const walker = document.createTreeWalker(cell, NodeFilter.SHOW_TEXT)
      for (let node = walker.nextNode(); node; node = walker.nextNode()) {
        const text = node.textContent ?? ''
        for (const match of text.matchAll(/\S+/g)) {
          const range = document.createRange()
          range.setStart(node, match.index)
          range.setEnd(node, match.index + match[0].length)
          // A word on one line is one box; a word broken mid-way is two.
          const lines = new Set([...range.getClientRects()].map((rect) => Math.round(rect.top)))
          if (lines.size > 1) broken.push(match[0])
        }
      }
    }
    return broken
  })
}

describe('comparing packs on a plan', () => {
  it('says why a pack does not fit and never offers it for the rig', async () => {
    const { page } = app.browser
    await openComparison(page)
    const table = page.getByTestId('table-compare')
    const headers = (await table.locator('th').allTextContents()).join('|')
    expect(headers).toContain('Fits the rig')
    expect(headers).toContain('Chemistry')

    // The default candidates all suit the 18–50 V board: every one fits.
    const defaults = await table.getByRole('row').count()
    expect(defaults).toBeGreaterThan(2)
    expect(await table.getByText('does not fit').count()).toBe(0)

    await addPack(page, overVoltagePack)
    const row = table.getByRole('row', { name: /15S2P/ })
    const text = (await row.textContent()) ?? ''
    expect(text).toContain('no: ')
    expect(text).toContain('does not fit')
    expect(text).toMatch(/63(\.0)?\s?V/)
    expect(await row.getByRole('button', { name: /^Put .* in the rig$/ }).count()).toBe(0)
    // Packs that fit keep their button.
    expect(
      await table.getByRole('button', { name: /^Put .* in the rig$/ }).count(),
    ).toBeGreaterThan(0)

    // Chemistry in words, never the codes.
    const chemistries = await table.locator('td[data-col-key="chemistry"]').allTextContents()
    expect(chemistries.length).toBeGreaterThan(0)
    for (const name of chemistries) {
      expect(['Li-ion (NMC/NCA)', 'LiFePO4', 'Lead-acid (AGM/gel)', 'NiMH']).toContain(name)
    }
    expect(await brokenHeaderWords(page)).toEqual([])
    await page.getByTestId('plan-compare').screenshot({
      path: await app.browser.screenshot('plan-compare-fits'),
    })
    expect(await seriousAxeViolations(page)).toEqual([])
    expect(app.browser.consoleErrors).toEqual([])
  }, 120_000)

  it('reads on a phone: chart inside the screen, headers whole', async () => {
    const phone = await openBrowser({ viewport: { width: 390, height: 844 } })
    try {
      await phone.context.addCookies(await app.browser.context.cookies())
      await openComparison(phone.page)
      await addPack(phone.page, overVoltagePack)
      const chart = phone.page.getByTestId('chart-compare')
      await chart.scrollIntoViewIfNeeded()
      const box = (await chart.boundingBox())!
      expect(box.x).toBeGreaterThanOrEqual(0)
      expect(box.x + box.width).toBeLessThanOrEqual(390)
      const overflow = await phone.page.evaluate(
        () => document.documentElement.scrollWidth - window.innerWidth,
      )
      expect(overflow).toBeLessThanOrEqual(1)
      expect(await brokenHeaderWords(phone.page)).toEqual([])
      await phone.page.getByTestId('plan-compare').screenshot({
        path: await phone.screenshot('plan-compare-phone'),
      })
      expect(phone.consoleErrors).toEqual([])
    } finally {
      await phone.close()
    }
  }, 120_000)
})
