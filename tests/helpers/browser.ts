import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { createRequire } from 'node:module'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium, type BrowserContext, type Page } from 'playwright-core'

// Debian's Chromium; a browser download is impossible here (and never wanted).
const chromiumPath = process.env.LOUDHOUR_CHROMIUM ?? '/usr/bin/chromium'
const chromiumArgs = [
  '--headless=new',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-dev-shm-usage',
]

/** Screenshots go outside the tree, so nothing generated is ever committed. */
export const screenshotDir = join(tmpdir(), 'loudhour-screenshots')

export interface BrowserSession {
  context: BrowserContext
  page: Page
  /** Console errors and uncaught exceptions seen so far, across every page of the context. */
  consoleErrors: string[]
  screenshot: (name: string) => Promise<string>
  close: () => Promise<void>
}

export async function openBrowser(
  options: { viewport?: { width: number; height: number } } = {},
): Promise<BrowserSession> {
  const profileDir = mkdtempSync(join(tmpdir(), 'loudhour-chromium-'))
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: chromiumPath,
    args: chromiumArgs,
    headless: true,
    viewport: options.viewport ?? { width: 1280, height: 900 },
    acceptDownloads: true,
  })
  const consoleErrors: string[] = []
  const watch = (page: Page) => {
    page.on('console', (message) => {
      if (message.type() === 'error') consoleErrors.push(message.text())
    })
    page.on('pageerror', (error) => consoleErrors.push(error.message))
  }
  context.pages().forEach(watch)
  context.on('page', watch)
  const page = context.pages()[0] ?? (await context.newPage())
  mkdirSync(screenshotDir, { recursive: true })
  return {
    context,
    page,
    consoleErrors,
    screenshot: async (name) => {
      const file = join(screenshotDir, `${name}.png`)
      await page.screenshot({ path: file, fullPage: true })
      return file
    },
    close: async () => {
      await context.close()
      rmSync(profileDir, { recursive: true, force: true })
    },
  }
}

export interface AxeViolation {
  id: string
  impact: string | null
  help: string
  nodes: number
  /** Where: the CSS selectors of the first few elements found, to name the culprit in a failure. */
  targets: string[]
}

const axeSource = readFileSync(
  createRequire(import.meta.url).resolve('axe-core/axe.min.js'),
  'utf8',
)

/**
 * Runs axe-core in the page and returns the serious and critical violations. The script is
 * evaluated rather than injected as a <script> tag, which the app's CSP rightly refuses.
 */
export async function seriousAxeViolations(page: Page): Promise<AxeViolation[]> {
  // Axe judges colours as they are drawn: let entrance transitions (a toast fading in, a dialog)
  // finish first, or it measures a half-faded text. Endless ones (spinners) are not waited for.
  await page.waitForFunction(() =>
    document
      .getAnimations()
      .every(
        (animation) =>
          animation.playState !== 'running' ||
          animation.effect?.getComputedTiming().endTime === Infinity,
      ),
  )
  await page.evaluate(axeSource)
  const violations = await page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: {
          run: (context: Document) => Promise<{
            violations: {
              id: string
              impact: string | null
              help: string
              nodes: { target: unknown[] }[]
            }[]
          }>
        }
      }
    ).axe
    const result = await axe.run(document)
    return result.violations.map((violation) => ({
      id: violation.id,
      impact: violation.impact,
      help: violation.help,
      nodes: violation.nodes.length,
      targets: violation.nodes.slice(0, 3).map((node) => node.target.map(String).join(' ')),
    }))
  })
  return violations.filter(
    (violation) => violation.impact === 'serious' || violation.impact === 'critical',
  )
}

/** The two screens every page is checked on: a desk and a phone. */
export const desktopViewport = { width: 1280, height: 800 }
export const phoneViewport = { width: 390, height: 844 }

/**
 * The app's colour mode for every page loaded from now on, as the header's switch stores it in
 * the browser (stores/preferences.ts); the page must be on the app's origin.
 */
export async function chooseColourMode(page: Page, mode: 'light' | 'dark'): Promise<void> {
  await page.evaluate((colourMode) => {
    const key = 'loudhour.preferences.v1'
    const stored = JSON.parse(localStorage.getItem(key) ?? '{}') as Record<string, unknown>
    localStorage.setItem(key, JSON.stringify({ units: 'metric', ...stored, colourMode }))
  }, mode)
}

/**
 * Axe's serious and critical violations on the page as it is, at a desk and then on a phone
 * (the same load, resized), with a screenshot of each (`<name>-desktop`, `<name>-phone`). The
 * page is left at desk size. One load per page keeps a run over every page short.
 */
export async function axeAtDeskAndPhone(
  session: BrowserSession,
  name: string,
  /** More checks of the page at desk and at phone size, on the same load. */
  { onDesk, onPhone }: { onDesk?: () => Promise<void>; onPhone?: () => Promise<void> } = {},
): Promise<{ desktop: AxeViolation[]; phone: AxeViolation[] }> {
  const { page } = session
  await page.setViewportSize(desktopViewport)
  const desktop = await seriousAxeViolations(page)
  await onDesk?.()
  await session.screenshot(`${name}-desktop`)
  await page.setViewportSize(phoneViewport)
  await page.evaluate(() => window.scrollTo(0, 0))
  const phone = await seriousAxeViolations(page)
  await onPhone?.()
  await session.screenshot(`${name}-phone`)
  await page.setViewportSize(desktopViewport)
  return { desktop, phone }
}

/**
 * Words in the page's tables that the layout splits across two lines ("Rig" / "s", "2026-" /
 * "06-13"). A break after a hyphen or a slash between words ("Li-" / "ion") counts as a line
 * break between pieces, not a broken word; a break inside a piece is what the check refuses.
 */
export async function wordsBrokenInTables(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const broken: string[] = []
    for (const table of document.querySelectorAll('table')) {
      const walker = document.createTreeWalker(table, NodeFilter.SHOW_TEXT)
      for (let node = walker.nextNode(); node; node = walker.nextNode()) {
        for (const piece of (node.textContent ?? '').matchAll(/[^\s/-]+[/-]?/g)) {
          const range = document.createRange()
          range.setStart(node, piece.index)
          range.setEnd(node, piece.index + piece[0].length)
          const lineTops = new Set(
            [...range.getClientRects()]
              .filter((rect) => rect.width > 0)
              .map((rect) => Math.round(rect.top)),
          )
          if (lineTops.size > 1) broken.push(piece[0])
        }
      }
    }
    return broken
  })
}
