// The bench page in real Chromium: how long a field change takes until every chart has redrawn,
// and how much JavaScript (gzipped) the page loads. Figures are printed, never asserted.
// Needs the built client: `npx vite build && npm run bench`. LOUDHOUR_BENCH_URL may point at a
// server that is already running instead of starting one.
import { gzipSync } from 'node:zlib'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, bench, describe } from 'vitest'
import { openBrowser, type BrowserSession } from '../helpers/browser'
import { startServer, type RunningServer } from '../helpers/e2e-server'

const changes = 50
const chartCount = 3

let server: RunningServer | undefined
let browser: BrowserSession
let baseUrl: string
const timingsMs: number[] = []
let nextLevelDb = 3

/** Gzipped bytes of every script the page loads while `action` runs. */
async function scriptBytes(page: Page, action: () => Promise<void>): Promise<number> {
  const bodies: Promise<Buffer>[] = []
  const seen = new Set<string>()
  const listener = (response: import('playwright-core').Response) => {
    if (response.request().resourceType() !== 'script' || seen.has(response.url())) return
    seen.add(response.url())
    bodies.push(response.body())
  }
  page.on('response', listener)
  await action()
  page.off('response', listener)
  const all = await Promise.all(bodies)
  return all.reduce((sum, body) => sum + gzipSync(body, { level: 9 }).length, 0)
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  const middle = Math.floor(sorted.length / 2)
  return sorted.length % 2 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2
}

/** Scrolls each chart's panel into view (charts load near the screen) and waits for its canvas. */
async function showCharts(page: Page): Promise<void> {
  const panels = {
    'power-budget': 'chart-breakdown',
    discharge: 'chart-discharge',
    headroom: 'chart-headroom',
  }
  for (const [panel, chart] of Object.entries(panels)) {
    await page.getByTestId(panel).scrollIntoViewIfNeeded()
    await page.getByTestId(chart).waitFor()
  }
}

const kilobytes = (bytes: number) => `${(bytes / 1024).toFixed(1)} KB`

beforeAll(async () => {
  if (process.env.LOUDHOUR_BENCH_URL) baseUrl = process.env.LOUDHOUR_BENCH_URL
  else {
    server = await startServer()
    baseUrl = server.url
  }
  browser = await openBrowser()
  const { page } = browser
  // Counts canvas clears: chart.js clears its canvas at the start of every draw.
  await page.addInitScript(() => {
    const counts = { draws: 0 }
    ;(window as unknown as { __chartDraws: typeof counts }).__chartDraws = counts
    const clear = CanvasRenderingContext2D.prototype.clearRect
    CanvasRenderingContext2D.prototype.clearRect = function (...args) {
      counts.draws++
      return clear.apply(this, args)
    }
  })

  const shellBytes = await scriptBytes(page, async () => {
    await page.goto(`${baseUrl}/about`, { waitUntil: 'networkidle' })
  })
  const fresh = await browser.context.newPage()
  await fresh.addInitScript(() => localStorage.clear())
  const firstScreenBytes = await scriptBytes(fresh, async () => {
    await fresh.goto(`${baseUrl}/`, { waitUntil: 'networkidle' })
    await fresh.getByTestId('runtime').waitFor()
  })
  const chartBytes = await scriptBytes(fresh, async () => {
    await showCharts(fresh)
    await fresh.waitForLoadState('networkidle')
  })
  await fresh.close()
  console.log(
    `\nGzipped JS for "/": ${kilobytes(firstScreenBytes)} on the first screen, ` +
      `${kilobytes(firstScreenBytes + chartBytes)} once the charts have loaded ` +
      `(the app shell alone, on /about: ${kilobytes(shellBytes)}).`,
  )

  await page.goto(`${baseUrl}/`)
  await showCharts(page)
  await page.waitForLoadState('networkidle')
}, 120_000)

afterAll(async () => {
  if (timingsMs.length > 0) {
    const sorted = [...timingsMs].sort((a, b) => a - b)
    console.log(
      `\nField change → ${chartCount} charts redrawn, over ${timingsMs.length} changes: ` +
        `median ${median(timingsMs).toFixed(1)} ms, fastest ${sorted[0]!.toFixed(1)} ms, ` +
        `slowest ${sorted[sorted.length - 1]!.toFixed(1)} ms (target: one frame, 16 ms).`,
    )
  }
  await browser?.close()
  await server?.stop()
})

describe('the rig bench', () => {
  bench(
    'level field change until every chart has redrawn',
    async () => {
      // Alternate the level so that every change moves every curve.
      nextLevelDb = nextLevelDb === 3 ? 4 : 3
      const elapsedMs = await browser.page.evaluate(
        async ({ levelDb, charts }) => {
          const input = document.querySelector<HTMLInputElement>(
            '[data-testid="field-programme.peakBelowClipDb"] input',
          )
          if (!input) throw new Error('level field not found')
          const counter = (window as unknown as { __chartDraws: { draws: number } }).__chartDraws
          const drawsBefore = counter.draws
          const macrotask = () =>
            new Promise<void>((resolve) => {
              const channel = new MessageChannel()
              channel.port1.onmessage = () => resolve()
              channel.port2.postMessage(null)
            })
          const setValue = Object.getOwnPropertyDescriptor(
            HTMLInputElement.prototype,
            'value',
          )!.set!
          // Each change starts from a settled page, as a keystroke does: people type a few
          // keystrokes a second, and the page finishes its idle-time work in between.
          await new Promise<void>((resolve) =>
            requestIdleCallback(() => resolve(), { timeout: 1000 }),
          )
          const startedMs = performance.now()
          setValue.call(input, String(levelDb))
          input.dispatchEvent(new Event('input', { bubbles: true }))
          // Vue and chart.js finish their work in microtasks; the first macrotask after the last
          // chart's draw marks the end. Wait on, should a chart ever draw later than that.
          for (let tries = 0; tries < 1000 && counter.draws - drawsBefore < charts; tries++) {
            await macrotask()
          }
          await macrotask()
          if (counter.draws - drawsBefore < charts) throw new Error('the charts did not redraw')
          return performance.now() - startedMs
        },
        { levelDb: nextLevelDb, charts: chartCount },
      )
      timingsMs.push(elapsedMs)
    },
    { iterations: changes, time: 0, warmupIterations: 0, warmupTime: 0 },
  )
})
