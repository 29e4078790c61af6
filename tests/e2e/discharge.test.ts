import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { seriousAxeViolations } from '../helpers/browser'
import { submitSignIn, useAppUnderTest } from '../helpers/e2e-app'

const app = useAppUnderTest()

// 2.000 A for 2 h while the voltage falls evenly from 41 V to 30 V, sampled every minute.
const logFile = fileURLToPath(new URL('../fixtures/discharge-log-10s-2a.csv', import.meta.url))

describe('a discharge log on the pack page, in Chromium', () => {
  it('an editor uploads a log, sees what the pack holds, and makes it the pack health', async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/sign-in`)
    await submitSignIn(page, 'editor@alder-creek.example')
    await page.waitForURL(`${app.server.url}/`)

    // A "40 V max" tool pack, 10 Li-ion cells in series (common practice), 2 × 2.5 Ah in parallel.
    const me = await (await page.request.get(`${app.server.url}/api/v1/auth/me`)).json()
    const teamId = me.teams[0].id as number
    const created = await page.request.post(`${app.server.url}/api/v1/teams/${teamId}/packs`, {
      data: {
        name: 'Bench test pack',
        chemistry: 'li-ion',
        seriesCells: 10,
        parallelCells: 2,
        cellCapacityAh: 2.5,
        cellResistanceOhm: 0.022,
      },
    })
    expect(created.status()).toBe(201)
    const pack = await created.json()

    await page.goto(`${app.server.url}/parts/packs/${pack.id}`)
    await page.getByRole('heading', { name: 'Bench test pack' }).waitFor()
    await page.getByText('No logs for this pack yet.').waitFor()
    await page.getByTestId('discharge-caution').waitFor()

    await page.getByLabel('Discharge log (CSV, up to 5 MB)').setInputFiles(logFile)
    await page.getByRole('button', { name: 'Upload and read' }).click()
    const figures = page.getByTestId('discharge-figures')
    await figures.waitFor()
    const text = (await figures.textContent()) ?? ''
    // Source: definition of the ampere-hour: 2 A × 2 h = 4 Ah, of 5 Ah rated = 80 %; energy by
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
    await app.browser.screenshot('discharge-pack-page')

    await page.getByRole('button', { name: "Use 80.0\u00a0% as the pack's health" }).click()
    await page.getByText('Health: 80.0\u00a0%.').waitFor()
    await app.browser.screenshot('discharge-accepted')
    expect(await seriousAxeViolations(page)).toEqual([])
    expect(app.browser.consoleErrors).toEqual([])
  })
})
