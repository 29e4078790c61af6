import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { seriousAxeViolations } from '../helpers/browser'
import { submitSignIn, useAppUnderTest } from '../helpers/e2e-app'

// An editor adds a pack and saves a rig built on it; after a reload the rig is still there; a
// viewer of the same team sees both and can change neither. Demo sign-ins: docs/api.md.

const app = useAppUnderTest()

const packName = 'Night market pack 18 V'
const rigName = 'Night market cart'

async function signInThrough(page: Page, path: string, email: string): Promise<void> {
  await page.goto(`${app.server.url}${path}`)
  await page.waitForURL(/\/sign-in\?redirect=/)
  await submitSignIn(page, email)
  await page.waitForURL(`${app.server.url}${path}`)
}

describe('the parts library and saved rigs, in Chromium', () => {
  it('an editor adds a pack, builds and saves a rig, reloads and finds it', async () => {
    const { page } = app.browser
    await signInThrough(page, '/parts', 'editor@alder-creek.example')
    await page.getByRole('heading', { name: 'Parts' }).waitFor()
    // The demo crew's own packs are listed.
    await page.getByTestId('team-packs').getByText('Crew tool pack 36 V, 5 Ah').waitFor()

    await page.getByRole('button', { name: 'Add pack' }).click()
    const form = page.getByTestId('part-form-packs')
    await form.getByLabel('Name').fill(packName)
    // A refused value is named at its field, from the shared schema, before anything is sent.
    await form.getByLabel('Cells in series').fill('0')
    await form.getByRole('button', { name: 'Add pack' }).click()
    await form.getByText('Cells in series must be a whole number from 1 to 100').waitFor()
    // Source: common practice, a "20 V max" tool pack is 5 Li-ion cells in series, 18 V nominal.
    await form.getByLabel('Cells in series').fill('5')
    await form.getByLabel('Cells in parallel').fill('2')
    await form.getByLabel('Cell capacity').fill('2.5')
    await form.getByRole('button', { name: 'Add pack' }).click()
    await page.getByText(`Saved “${packName}”.`).waitFor()
    await page.getByTestId('team-packs').getByText(packName).waitFor()

    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Bench' })
      .click()
    const rigForm = page.locator('form[aria-label="Rig"]')
    // The bench is the largest page: on a busy two-core machine it takes a while to appear.
    await rigForm.waitFor({ timeout: 60_000 })
    await rigForm.getByLabel('Cells in series').fill('5')
    await rigForm.getByLabel('Cells in parallel').fill('2')
    await rigForm.getByLabel('Cell capacity').fill('2.5')
    await page.getByRole('button', { name: 'Save for the team' }).click()
    await page.getByLabel('Rig name').last().fill(rigName)
    await page.getByRole('button', { name: 'Save', exact: true }).click()
    await page.getByText(`Saved “${rigName}” for the team.`).waitFor()
    const status = page.getByTestId('rig-save-status')
    await status.getByText(`Saved rig “${rigName}”, version 1`).waitFor()

    // An edit after saving is an unsaved change, and Save writes version 2.
    await rigForm.getByLabel('Cells in parallel').fill('3')
    await status.getByText('unsaved changes').waitFor()
    await page.getByRole('button', { name: 'Save', exact: true }).click()
    await status.getByText(`Saved rig “${rigName}”, version 2`).waitFor()

    await page.reload()
    await page
      .getByTestId('rig-save-status')
      .getByText(`Saved rig “${rigName}”, version 2`)
      .waitFor()
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Rigs' }).click()
    await page.waitForURL(`${app.server.url}/rigs`)
    const row = page.getByTestId('team-rigs').getByRole('row', { name: new RegExp(rigName) })
    await row.waitFor()
    // The runtime and warnings come from the server's own run of the engine at save.
    expect(await row.textContent()).toMatch(/\d+\s*h|\d+\s*min/)
    expect(await seriousAxeViolations(page)).toEqual([])
    await app.browser.screenshot('rigs-editor')

    await page.getByRole('button', { name: 'Sam Creek (editor)' }).click()
    await page.getByText('Sign out').click()
    await page.waitForURL(`${app.server.url}/sign-in`)
  })

  it('a viewer sees the rig and the pack and cannot change them', async () => {
    const { page } = app.browser
    // Whatever the editor's test left behind, this one starts signed out.
    await app.browser.context.clearCookies()
    await signInThrough(page, '/rigs', 'viewer@alder-creek.example')
    await page.getByTestId('read-only-note').waitFor()
    const row = page.getByTestId('team-rigs').getByRole('row', { name: new RegExp(rigName) })
    await row.waitFor()
    expect(await row.getByRole('button', { name: /Delete|Duplicate/ }).count()).toBe(0)

    await row.getByRole('button', { name: `Open in bench: ${rigName}` }).click()
    await page.getByTestId('rig-read-only').waitFor({ timeout: 60_000 })
    expect(await page.getByRole('button', { name: /^Save/ }).count()).toBe(0)

    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Parts' })
      .click()
    await page.waitForURL(`${app.server.url}/parts`)
    await page.getByTestId('team-packs').getByText(packName).waitFor()
    expect(await page.getByRole('button', { name: 'Add pack' }).count()).toBe(0)
    expect(
      await page.getByRole('button', { name: /^(Edit|Delete|Duplicate|Copy to team):/ }).count(),
    ).toBe(0)
    await app.browser.screenshot('parts-viewer')
    expect(app.browser.consoleErrors).toEqual([])
  })
})
