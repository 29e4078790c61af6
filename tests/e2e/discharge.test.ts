import { fileURLToPath } from 'node:url'
import { join } from 'node:path'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { screenshotDir, seriousAxeViolations } from '../helpers/browser'
import { submitSignIn, useAppUnderTest } from '../helpers/e2e-app'

const app = useAppUnderTest()

const phone = { width: 390, height: 844 } // a common phone screen in CSS pixels (from memory)

// A "40 V max" tool pack, 10 Li-ion cells in series (common practice), 2 × 2.5 Ah in parallel.
const benchPack = {
  chemistry: 'li-ion',
  seriesCells: 10,
  parallelCells: 2,
  cellCapacityAh: 2.5,
  cellResistanceOhm: 0.022,
}

/**
 * Through the API as the signed-in editor: the pack, a rig saved with it (a copy of its values),
 * a rig saved with it whose copy has other cells, and a plan on the first rig. The rigs borrow
 * the rest of their spec from a demo rig.
 */
async function packWithRigs(page: Page, name: string) {
  const url = app.server.url
  const me = await (await page.request.get(`${url}/api/v1/auth/me`)).json()
  const teamId = me.teams[0].id as number
  const api = `${url}/api/v1/teams/${teamId}`
  const created = await page.request.post(`${api}/packs`, { data: { name, ...benchPack } })
  expect(created.status()).toBe(201)
  const pack = await created.json()
  const demoRigs = await (await page.request.get(`${api}/rigs`)).json()
  const base = demoRigs.items[0].spec
  const saveRig = async (rigName: string, packValues: object) => {
    const rig = await page.request.post(`${api}/rigs`, {
      data: {
        name: rigName,
        spec: { ...base, pack: { ...benchPack, label: name, ...packValues } },
        packId: pack.id,
      },
    })
    expect(rig.status(), await rig.text()).toBe(201)
    return rig.json()
  }
  const rig = await saveRig(`${name} column`, {})
  // 3 Ah cells: another pack, whatever the rig says it was saved with (common practice).
  await saveRig(`${name} column, 3 Ah cells`, { cellCapacityAh: 3 })
  const plan = await page.request.post(`${api}/plans`, {
    data: {
      name: `${name} market day`,
      rigId: rig.id,
      date: '2026-06-13',
      startTime: '09:00',
      schedule: [{ label: 'Market', minutes: 240, state: 'on', peakBelowClipDb: 6 }],
    },
  })
  expect(plan.status(), await plan.text()).toBe(201)
  return pack as { id: number }
}

/** The effect panel's lists as plain lines. */
async function effectLines(page: Page, testid: string): Promise<string[]> {
  return (await page.getByTestId(testid).locator('li').allInnerTexts()).map((line) =>
    line.replace(/\s+/g, ' ').trim(),
  )
}

// 2.000 A for 2 h while the voltage falls evenly from 41 V to 30 V, sampled every minute.
const logFile = fileURLToPath(new URL('../fixtures/discharge-log-10s-2a.csv', import.meta.url))

describe('a discharge log on the pack page, in Chromium', () => {
  it('an editor uploads a log, sees what the pack holds, and makes it the pack health', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/sign-in`)
    await submitSignIn(page, 'editor@alder-creek.example')
    await page.waitForURL(`${app.server.url}/`)

    const pack = await packWithRigs(page, 'Bench test pack')

    await page.goto(`${app.server.url}/parts/packs/${pack.id}`)
    await page.getByRole('heading', { name: 'Bench test pack' }).waitFor()
    await page.getByText('No logs for this pack yet.').waitFor()
    await page.getByTestId('discharge-caution').waitFor()

    await page.getByLabel('Discharge log (CSV, up to 5 MB)').setInputFiles(logFile)
    await page.getByRole('button', { name: 'Upload and read' }).click()
    const figures = page.getByTestId('discharge-figures')
    await figures.waitFor()
    const text = (await figures.textContent()) ?? ''
    // Source: definition of the ampere-hour: 2 A × 2 h = 4 Ah, of 5 Ah rated = 80 % (the label
    // ratio); energy by
    // the trapezoid rule, 2 A × 35.5 V mean × 2 h = 142 Wh; the cutoff is 10 × 3.0 V = 30 V.
    expect(text).toContain('4.00\u00a0Ah')
    expect(text).toContain('142\u00a0Wh')
    expect(text).toContain('80.0\u00a0% of 5.00\u00a0Ah rated')
    expect(text).toContain('2\u00a0h 00\u00a0min')
    expect(text).toContain('yes, at 30.00\u00a0V')
    await page.getByTestId('chart-discharge-log').waitFor()
    await page
      .getByTestId('discharge-log-list')
      .getByRole('rowheader', { name: 'discharge-log-10s-2a.csv' })
      .waitFor()
    // The model drawn is the calibrated one: with the log's health it reaches the same 30 V
    // cutoff at the same 2 h (it delivers the log's 4 Ah), and starts at 10 × 4.2 V less
    // 2 A × 0.11 Ω = 41.78 V (Ohm's law; pack resistance 10 × 0.022 / 2).
    const table = page.getByTestId('discharge-model-table')
    const lastRow = table.getByRole('row').last()
    expect(await lastRow.textContent()).toContain('2:00')
    expect((await lastRow.textContent())?.match(/30\.00\u00a0V/g)).toHaveLength(2)
    expect(await table.getByRole('row').nth(1).textContent()).toContain('41.78\u00a0V')
    await app.browser.screenshot('discharge-pack-page')

    // Against a new pack at 2 A (which itself stops short of 5 Ah), the health is above 80 %.
    const acceptButton = page.getByRole('button', {
      name: /^Use [\d.]+\s% as the pack's health$/,
    })
    const healthText = /Use ([\d.]+)\s%/.exec((await acceptButton.textContent()) ?? '')?.[1]
    expect(Number(healthText)).toBeGreaterThan(80)

    // Before applying it: which rigs and plans take the figure, which not and why.
    const effect = page.getByTestId('health-effect')
    await effect.getByText('These rigs will use the measured health:').waitFor()
    expect(await effectLines(page, 'health-effect-taking')).toEqual([
      'Bench test pack column (now as labelled)',
    ])
    const keeping = await effectLines(page, 'health-effect-keeping')
    expect(keeping[0]).toBe(
      'Bench test pack column, 3 Ah cells, because it has its own copy of the pack, which differs in cell capacity: the log was read against the pack as saved.',
    )
    // The demo rigs use the demo packs.
    expect(keeping[1]).toMatch(/, because they use other packs\.$/)
    expect(await effectLines(page, 'health-effect-plans')).toEqual([
      'Bench test pack market day (rig Bench test pack column)',
    ])
    await effect.scrollIntoViewIfNeeded()
    await app.browser.screenshot('discharge-effect-preview')

    await acceptButton.click()
    await page.getByText(`Health: ${healthText}\u00a0%.`).waitFor()
    await effect.getByText('These rigs now use the measured health:').waitFor()
    expect(await effectLines(page, 'health-effect-taking')).toEqual([
      'Bench test pack column (was as labelled)',
    ])
    expect(await effect.innerText()).toContain('These did not:')
    await app.browser.screenshot('discharge-accepted')
    expect(await seriousAxeViolations(page)).toEqual([])
    expect(app.browser.consoleErrors).toEqual([])
  })

  it('on a phone, shows what applying the figure changes within the screen width', async () => {
    const { page } = app.browser
    await page.setViewportSize(phone)
    const pack = await packWithRigs(page, 'Phone test pack')
    await page.goto(`${app.server.url}/parts/packs/${pack.id}`)
    await page.getByRole('heading', { name: 'Phone test pack' }).waitFor()
    await page.getByLabel('Discharge log (CSV, up to 5 MB)').setInputFiles(logFile)
    await page.getByRole('button', { name: 'Upload and read' }).click()
    const effect = page.getByTestId('health-effect')
    await effect.getByText('These rigs will use the measured health:').waitFor()
    expect(await effectLines(page, 'health-effect-taking')).toEqual([
      'Phone test pack column (now as labelled)',
    ])
    // Nothing wider than the phone: the lists wrap.
    expect(
      await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth),
    ).toBeLessThanOrEqual(0)
    await effect.scrollIntoViewIfNeeded()
    await page.screenshot({
      path: join(screenshotDir, 'phone-discharge-effect-preview.png'),
    })
    await page.getByRole('button', { name: /^Use [\d.]+\s% as the pack's health$/ }).click()
    await effect.getByText('These rigs now use the measured health:').waitFor()
    await effect.scrollIntoViewIfNeeded()
    await page.screenshot({ path: join(screenshotDir, 'phone-discharge-effect-applied.png') })
    expect(await seriousAxeViolations(page)).toEqual([])
    expect(app.browser.consoleErrors).toEqual([])
  })
})
