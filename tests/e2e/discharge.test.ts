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
    await acceptButton.click()
    await page.getByText(`Health: ${healthText}\u00a0%.`).waitFor()
    await app.browser.screenshot('discharge-accepted')
    expect(await seriousAxeViolations(page)).toEqual([])
    expect(app.browser.consoleErrors).toEqual([])
  })
})
