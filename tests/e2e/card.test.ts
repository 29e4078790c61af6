import { execFileSync } from 'node:child_process'
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, screenshotDir, type BrowserSession } from '../helpers/browser'
import { startServer, type RunningServer } from '../helpers/e2e-server'
import { submitSignIn } from '../helpers/e2e-app'

// The runtime card in Chromium: printed to PDF it is one page holding the swap times
// (read back with poppler's pdftotext and pdfinfo), and its share link opens signed out until
// it is revoked.

let server: RunningServer
let editor: BrowserSession
let volunteer: BrowserSession | undefined

beforeAll(async () => {
  // The embedded default with the demo seed (docs/api.md, "Demo sign-ins").
  server = await startServer()
  editor = await openBrowser()
})
afterAll(async () => {
  await volunteer?.close()
  await editor?.close()
  await server?.stop()
})

function pdfInfo(file: string): { pages: number; widthPt: number; heightPt: number } {
  const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' })
  const pages = Number(/^Pages:\s+(\d+)/m.exec(info)?.[1])
  const size = /^Page size:\s+([\d.]+) x ([\d.]+) pts/m.exec(info)
  return { pages, widthPt: Number(size?.[1]), heightPt: Number(size?.[2]) }
}

async function printToPdf(page: Page, name: string): Promise<{ file: string; text: string }> {
  mkdirSync(screenshotDir, { recursive: true })
  const file = join(screenshotDir, `${name}.pdf`)
  // The card's own @page rule sets the sheet, as the browser's print dialog would use it.
  await page.pdf({ path: file, preferCSSPageSize: true, printBackground: true })
  return { file, text: execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }) }
}

// Source: ISO 216 (A4 210 × 297 mm, A5 148 × 210 mm) and ANSI/ASME Y14.1 (Letter 8.5 × 11 in,
// half letter 5.5 × 8.5 in), at 72 pt per inch and 25.4 mm per inch.
const mmToPt = (mm: number) => (mm / 25.4) * 72
const sheets = [
  { label: 'A4', widthPt: mmToPt(210), heightPt: mmToPt(297) },
  { label: 'Letter', widthPt: 8.5 * 72, heightPt: 11 * 72 },
  { label: 'A5', widthPt: mmToPt(148), heightPt: mmToPt(210) },
  { label: 'Half letter', widthPt: 5.5 * 72, heightPt: 8.5 * 72 },
]

describe('the runtime card, in Chromium', () => {
  it('prints on one page with the swap times, shares a link that works signed out, and revokes it', async () => {
    const { page } = editor
    await page.goto(`${server.url}/sign-in?redirect=%2Fplans`)
    await submitSignIn(page, 'editor@alder-creek.example')
    await page.waitForURL(`${server.url}/plans`)
    await page.getByText('Saturday market').first().click()
    await page.waitForURL(/\/plans\/\d+$/)
    const planPath = new URL(page.url()).pathname
    await page.getByTestId('plan-card-link').click()
    await page.waitForURL(`${server.url}${planPath}/card`)
    const card = page.getByTestId('runtime-card')
    await card.waitFor()

    // The swap times the server stored with the plan, on the event clock.
    const me = await (await page.request.get(`${server.url}/api/v1/auth/me`)).json()
    const teamId = me.teams[0].id as number
    const plan = await (
      await page.request.get(`${server.url}/api/v1/teams/${teamId}${planPath}`)
    ).json()
    const swapTimes: string[] = plan.summary.swaps.map((swap: { atTime: string }) => swap.atTime)
    expect(swapTimes.length).toBeGreaterThan(0)
    for (const time of swapTimes) await card.getByText(time, { exact: true }).first().waitFor()

    for (const sheet of sheets) {
      await page.getByRole('radio', { name: sheet.label, exact: true }).check({ force: true })
      const printed = await printToPdf(page, `card-${sheet.label.replace(' ', '-').toLowerCase()}`)
      const info = pdfInfo(printed.file)
      expect(info.pages, `${sheet.label}: pages`).toBe(1)
      expect(info.widthPt, `${sheet.label}: width`).toBeCloseTo(sheet.widthPt, 0)
      expect(info.heightPt, `${sheet.label}: height`).toBeCloseTo(sheet.heightPt, 0)
      for (const time of swapTimes) expect(printed.text).toContain(time)
      expect(printed.text).toContain('Saturday market')
      expect(printed.text).toMatch(/SWAP TIMES/i)
      expect(printed.text).toContain('Lithium packs')
      // No navigation or page controls on paper.
      for (const chrome of [
        'Loudhour home',
        'Make a share link',
        'Send the card',
        'Back to the plan',
        'Dark mode',
      ]) {
        expect(printed.text, `${sheet.label}: ${chrome}`).not.toContain(chrome)
      }
    }
    await page.getByRole('radio', { name: 'A4', exact: true }).check({ force: true })

    // A share link: its QR code goes on the card, and it opens signed out.
    await page.getByLabel('Label (optional)').fill('Gate volunteers')
    await page.getByRole('button', { name: 'Make a share link' }).click()
    const row = page
      .getByTestId('share-links')
      .getByRole('listitem')
      .filter({ hasText: 'Gate volunteers' })
    await row.waitFor()
    const shareUrl = await row.getByRole('link', { name: 'Open' }).getAttribute('href')
    expect(shareUrl).toMatch(new RegExp(`^${server.url}/shared/[A-Za-z0-9_-]{43}$`))
    await card.getByRole('img', { name: 'QR code of the link to this card' }).waitFor()
    const withCode = await printToPdf(page, 'card-a4-with-code')
    expect(pdfInfo(withCode.file).pages).toBe(1)
    expect(withCode.text).toContain(shareUrl)
    // The pop-up that confirmed the link stays on screen only.
    expect(withCode.text).not.toContain('Share link made')
    await editor.screenshot('card-plan-view')

    volunteer = await openBrowser({ viewport: { width: 390, height: 844 } })
    await volunteer.page.goto(shareUrl ?? '')
    const shared = volunteer.page.getByTestId('runtime-card')
    await shared.waitFor()
    for (const time of swapTimes) await shared.getByText(time, { exact: true }).first().waitFor()
    // The card alone: no app header, no sign-in, nothing of the team's.
    expect(await volunteer.page.locator('.frame__header').count()).toBe(0)
    expect(await volunteer.page.getByText('Alder Creek Market Crew').count()).toBe(0)
    await volunteer.screenshot('card-shared-phone')

    await row.getByRole('button', { name: /Revoke/ }).click()
    await page.getByRole('button', { name: 'Revoke it' }).click()
    await row.waitFor({ state: 'detached' })
    expect(
      await page.getByTestId('share-links').getByText('No live links to this card.').count(),
    ).toBe(1)

    await volunteer.page.reload()
    await volunteer.page.getByText('No card here').waitFor()
    expect(await volunteer.page.getByTestId('runtime-card').count()).toBe(0)
    await volunteer.screenshot('card-shared-revoked')

    expect(editor.consoleErrors).toEqual([])
    // The only error the volunteer's browser reports is the revoked link's 404 itself.
    expect(volunteer.consoleErrors.filter((error) => !/status of 404/.test(error))).toEqual([])
  })
})
