import { describe, expect, it } from 'vitest'
import { signInBeforeAll, useAppUnderTest } from '../helpers/e2e-app'

// The whole day in Chromium, on the demo seed: a charging break in the plan editor, each
// segment's level in its table, and the meter readings on the runtime card.

const app = useAppUnderTest()
signInBeforeAll(app, 'editor@alder-creek.example')

async function openSaturdayMarket(): Promise<void> {
  const { page } = app.browser
  await page.goto(`${app.server.url}/plans`)
  await page.getByRole('link', { name: 'Saturday market' }).click()
  await page.waitForURL(/\/plans\/\d+$/)
  await page.getByTestId('plan-lasts').waitFor()
}

/** The lunch segment (the fourth) becomes a charging break on a 40 W car charger. */
async function chargeAtLunch(): Promise<void> {
  const { page } = app.browser
  const lunch = page.getByTestId('segment-3')
  // A switched-off segment has one picker: what the rig does.
  await lunch.locator('.n-select').click()
  await page.locator('.n-base-select-option', { hasText: /^Charging$/ }).click()
  const power = page.getByTestId('segment-3-charge').locator('input')
  await power.fill('40')
  await power.blur()
  await lunch.getByText('the pack in it charges up to full').waitFor()
}

describe('the whole day', () => {
  it('adds a charging break to a plan and shows each segment’s level', async () => {
    const { page } = app.browser
    await openSaturdayMarket()
    await chargeAtLunch()
    await page.getByTestId('plan-timeline').getByText('Charging 40 W').first().waitFor()

    const table = page.getByTestId('table-plan-energy')
    await table.getByText('into the pack').waitFor()
    const header = await table.locator('thead').textContent()
    expect(header).toContain('Level at')
    expect(header).toContain('Permitted a day (NIOSH)')
    // Every music segment gets a level in dBA; the demo's rig gives its speakers' sensitivity.
    const morning = table.getByRole('row', { name: /Morning music/ })
    expect(await morning.textContent()).toMatch(/\d+\sdBA/)
    await app.browser.screenshot('plan-charging-break')
  })

  it('gives the pack no charge at a break below 0 °C and says what to do instead', async () => {
    // Source: common practice (lithium cell makers' datasheets): never charge below 0 °C.
    const { page } = app.browser
    await openSaturdayMarket()
    await chargeAtLunch()
    const temperature = page.getByLabel('Temperature')
    await temperature.fill('-5')
    await temperature.blur()
    const refused = page.getByTestId('plan-warning-charge-temperature-out-of-range')
    await refused.waitFor()
    const words = await refused.textContent()
    expect(words).toMatch(/The charging break at about \d\d:\d\d gives it no charge/)
    expect(words).toMatch(/warm it to above 0 °C/)
    // Nothing goes into the pack at the break.
    const lunchRow = page.getByTestId('table-plan-energy').getByRole('row', { name: /Charging/ })
    expect(await lunchRow.first().textContent()).toMatch(/(^|[^\d.])0\.0\sWh into the pack/)
    await refused.scrollIntoViewIfNeeded()
    await app.browser.screenshot('plan-cold-charging-break')
  })

  it('puts the meter reading of each music segment on the runtime card', async () => {
    const { page } = app.browser
    await openSaturdayMarket()
    await page.getByTestId('plan-card-link').click()
    const card = page.getByTestId('runtime-card')
    await card.waitFor()
    const morning = card.getByRole('row', { name: /Morning music/ })
    expect(await morning.textContent()).toMatch(/Meter about \d+ dBA/)
    const note = await page.getByTestId('card-meter-note').textContent()
    expect(note).toMatch(/A-weighted, slow/)
    expect(note).toMatch(/free-field estimates/)
    await app.browser.screenshot('card-meter-readings')
  })
})
