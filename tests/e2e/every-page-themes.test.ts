import type { Locator, Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import {
  axeAtDeskAndPhone,
  chooseColourMode,
  phoneViewport,
  wordsBrokenInTables,
} from '../helpers/browser'
import { signInBeforeAll, useAppUnderTest } from '../helpers/e2e-app'

// Every main page of a team, light and dark, at a desk and on a phone, with axe-core's serious
// and critical findings (WCAG 2.1 AA: contrast, names, roles). The bench and a plan have theirs
// in bench.test.ts and team-states.test.ts. One load per page per mode keeps the run short.
// Signed in as the demo admin (docs/api.md, "Demo sign-ins"), who sees every control.

const app = useAppUnderTest()
signInBeforeAll(app, 'admin@alder-creek.example')

interface MainPage {
  name: string
  path: string
  /** What shows once the page has loaded its data. */
  ready: (page: Page) => Locator
}

async function apiGet<T>(path: string): Promise<T> {
  const answer = await app.browser.page.request.get(`${app.server.url}/api/v1${path}`)
  expect(answer.ok(), path).toBe(true)
  return (await answer.json()) as T
}

type Items = { items: { id: number; name: string }[] }

/** The team's pages, with the demo seed's plan, event, rig and pack. */
async function mainPages(): Promise<MainPage[]> {
  const me = await apiGet<{ teams: { id: number }[] }>('/auth/me')
  const team = `/teams/${me.teams[0]!.id}`
  const plan = (await apiGet<Items>(`${team}/plans`)).items.find(
    (item) => item.name === 'Saturday market',
  )!
  const event = (await apiGet<Items>(`${team}/events`)).items[0]!
  const rig = (await apiGet<Items>(`${team}/rigs`)).items[0]!
  const pack = (await apiGet<Items>(`${team}/packs`)).items[0]!
  const row = (testid: string, text: string) => (page: Page) =>
    page
      .getByTestId(testid)
      .getByRole('row', { name: new RegExp(text) })
      .first()
  return [
    { name: 'plans', path: '/plans', ready: row('team-plans', plan.name) },
    {
      name: 'plan-card',
      path: `/plans/${plan.id}/card`,
      ready: (page) => page.getByTestId('runtime-card'),
    },
    { name: 'events', path: '/events', ready: row('team-events', event.name) },
    {
      name: 'event',
      path: `/events/${event.id}`,
      ready: (page) => page.getByTestId('event-verdict'),
    },
    {
      name: 'event-card',
      path: `/events/${event.id}/card`,
      ready: (page) => page.getByTestId('event-card-steps'),
    },
    { name: 'rigs', path: '/rigs', ready: row('team-rigs', rig.name) },
    {
      name: 'rig-card',
      path: `/rigs/${rig.id}/card`,
      ready: (page) => page.getByTestId('runtime-card'),
    },
    { name: 'parts', path: '/parts', ready: row('team-packs', pack.name) },
    {
      name: 'pack',
      path: `/parts/packs/${pack.id}`,
      ready: (page) => page.getByTestId('pack-health'),
    },
    {
      name: 'team',
      path: '/team',
      ready: (page) => page.getByRole('cell', { name: 'admin@alder-creek.example' }),
    },
  ]
}

describe('every main page passes axe, light and dark, at a desk and on a phone', () => {
  for (const mode of ['light', 'dark'] as const) {
    it(`in ${mode} mode`, { timeout: 240_000 }, async () => {
      const { page } = app.browser
      await chooseColourMode(page, mode)
      const found: Record<string, unknown> = {}
      for (const main of await mainPages()) {
        await page.goto(`${app.server.url}${main.path}`)
        await main.ready(page).waitFor()
        // A table's words and dates stay whole (common practice in typesetting: a word is broken
        // only at a hyphen); a column too narrow for them widens, and the table scrolls.
        const noBrokenWords = async (size: string) => {
          const broken = await wordsBrokenInTables(page)
          if (broken.length > 0) found[`${main.name} words broken ${size}`] = broken
        }
        const violations = await axeAtDeskAndPhone(app.browser, `${main.name}-${mode}`, {
          onDesk: () => noBrokenWords('at a desk'),
          onPhone: async () => {
            await noBrokenWords('on a phone')
            // Nothing wider than the phone: a wide table or chart scrolls in its own box.
            const widthPx = await page.evaluate(() => document.documentElement.scrollWidth)
            if (widthPx > phoneViewport.width) found[`${main.name} width on a phone`] = widthPx
          },
        })
        if (violations.desktop.length + violations.phone.length > 0) found[main.name] = violations
      }
      expect(found).toEqual({})
      expect(app.browser.consoleErrors).toEqual([])
    })
  }

  it('keeps the rig card inside its preview on a phone', async () => {
    const { page } = app.browser
    const rigCard = (await mainPages()).find((main) => main.name === 'rig-card')!
    await page.setViewportSize(phoneViewport)
    await page.goto(`${app.server.url}${rigCard.path}`)
    await rigCard.ready(page).waitFor()
    const overflowPx = await page
      .locator('.card-sheet')
      .evaluate((sheet) => sheet.scrollWidth - sheet.clientWidth)
    expect(overflowPx).toBeLessThanOrEqual(0)
  })
})
