// The bench page in real Chromium: how long a field change takes until every chart has redrawn and
// the frame that shows it has rendered (the main thread's work for one change, without the wait
// for the screen's next refresh), and how much JavaScript (gzipped) the page loads. Figures are
// printed, never asserted.
// Needs the built client: `npx vite build && npm run bench`. LOUDHOUR_BENCH_URL may point at a
// server that is already running instead of starting one.
import { gzipSync } from 'node:zlib'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, bench, describe } from 'vitest'
import { openBrowser, type BrowserSession } from '../helpers/browser'
import { startServer, type RunningServer } from '../helpers/e2e-server'

const changes = 50
// The first changes run while Chromium is still compiling the page's code (they take about twice
// as long); a person typing makes dozens of changes, so the figure is taken after these.
const warmUpChanges = 10
const chartCount = 3

let server: RunningServer | undefined
let browser: BrowserSession
let baseUrl: string
interface ChangeTiming {
  /** Field change until the last chart has drawn: Vue, the engine and chart.js. */
  scriptMs: number
  /** The frame that shows the change: style, layout, paint and commit. */
  renderMs: number
}
const warmUpTimings: ChangeTiming[] = []
const timings: ChangeTiming[] = []
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
  if (timings.length > 0) {
    const totalsMs = timings.map((timing) => timing.scriptMs + timing.renderMs)
    const sorted = [...totalsMs].sort((a, b) => a - b)
    const ms = (value: number) => `${value.toFixed(1)} ms`
    console.log(
      `\nField change → ${chartCount} charts redrawn and the frame rendered, over ` +
        `${timings.length} changes after ${warmUpTimings.length} warm-up changes: median ` +
        `${ms(median(totalsMs))} (script ${ms(median(timings.map((t) => t.scriptMs)))}, ` +
        `rendering ${ms(median(timings.map((t) => t.renderMs)))}), fastest ${ms(sorted[0]!)}, ` +
        `75th percentile ${ms(sorted[Math.floor(sorted.length * 0.75)]!)}, slowest ` +
        `${ms(sorted[sorted.length - 1]!)} (target: one frame, 16 ms). The warm-up changes: ` +
        `median ${ms(median(warmUpTimings.map((t) => t.scriptMs + t.renderMs)))}.`,
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
      const timing = await browser.page.evaluate(
        async ({ levelDb, charts }) => {
          const input = document.querySelector<HTMLInputElement>(
            '[data-testid="field-programme.peakBelowClipDb"] input',
          )
          if (!input) throw new Error('level field not found')
          const counter = (window as unknown as { __chartDraws: { draws: number } }).__chartDraws
          const drawsBefore = counter.draws
          const chartsDrawn = () => counter.draws - drawsBefore >= charts
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
          // Vue and chart.js do their work in microtasks of this task: the script's part ends
          // when the last chart has drawn. Wait on through tasks, should a chart ever draw later.
          for (let tries = 0; tries < 100 && !chartsDrawn(); tries++) await Promise.resolve()
          for (let tries = 0; tries < 1000 && !chartsDrawn(); tries++) await macrotask()
          if (!chartsDrawn()) throw new Error('the charts did not redraw')
          const scriptMs = performance.now() - startedMs
          // The browser's part: the next frame styles, lays out, paints and commits the change;
          // the first task after its animation-frame callbacks runs once that is done. The wait
          // for the frame itself is left out: it depends only on where the screen's refresh was.
          await new Promise<void>((resolve) => requestAnimationFrame(() => resolve()))
          const frameStartedMs = performance.now()
          await macrotask()
          return { scriptMs, renderMs: performance.now() - frameStartedMs }
        },
        { levelDb: nextLevelDb, charts: chartCount },
      )
      ;(warmUpTimings.length < warmUpChanges ? warmUpTimings : timings).push(timing)
    },
    { iterations: warmUpChanges + changes, time: 0, warmupIterations: 0, warmupTime: 0 },
  )
})
