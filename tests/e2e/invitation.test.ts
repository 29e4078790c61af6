import { describe, expect, it } from 'vitest'
import { seriousAxeViolations } from '../helpers/browser'
import { useAppUnderTest } from '../helpers/e2e-app'

const app = useAppUnderTest()

const invitee = {
  name: 'Robin Newcomer',
  email: 'robin@crew.example',
  password: 'amber kettle wanders north 41',
}

describe('inviting someone to a team, in Chromium', () => {
  it('prints the demo sign-ins at start', () => {
    // Source: docs/api.md, "Demo sign-ins" (printed at start).
    expect(app.server.output()).toContain('admin@alder-creek.example  loudhour-demo-2026')
  })

  // Written by the first step, followed by the second (the steps run in order, on one page).
  let link: string | null = null

  it('admin invites and the mail arrives in the team outbox', async () => {
    const { page } = app.browser
    // The labels and button names below are unique on their pages.
    const main = page

    await page.goto(`${app.server.url}/team`)
    await page.waitForURL(/\/sign-in\?redirect=(%2F|\/)team$/)
    await main.getByLabel('E-mail').waitFor()
    // Source: WCAG 2.2 via axe-core rules (serious and critical findings only).
    expect(await seriousAxeViolations(page)).toEqual([])
    await main.getByLabel('E-mail').fill('admin@alder-creek.example')
    await main.getByLabel('Password').fill('loudhour-demo-2026')
    await main.locator('form').getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(`${app.server.url}/team`)

    await main.getByText('Members of Alder Creek Market Crew').waitFor()
    await main.getByLabel('E-mail').fill(invitee.email)
    await main.getByText('Editor: also saves and changes them').click()
    expect(
      await main.getByRole('radio', { name: 'Editor: also saves and changes them' }).isChecked(),
    ).toBe(true)
    await main.getByRole('button', { name: 'Send the invitation' }).click()
    await main.getByText(`${invitee.email} as editor`).waitFor()
    expect(await seriousAxeViolations(page)).toEqual([])

    await page.getByRole('button', { name: 'Rowan Alder (admin)' }).click()
    await page.getByText('Mail outbox').click()
    await page.waitForURL(`${app.server.url}/outbox`)
    // The subject is fixed words: the team's name is in the body only.
    await main.getByRole('button', { name: /An invitation to a team on Loudhour/ }).click()
    link = await main.locator('a[href*="/invitations/accept?token="]').getAttribute('href')
    // Source: docs/api.md (links are PUBLIC_URL/invitations/accept?token=…).
    expect(link).toMatch(
      new RegExp(`^${app.server.url}/invitations/accept\\?token=[A-Za-z0-9_-]{43}$`),
    )
    await app.browser.screenshot('invitation-outbox')
    expect(await seriousAxeViolations(page)).toEqual([])
  })

  it('the invitee signs up through the link, signs in, accepts and sees the team', async () => {
    const { page } = app.browser
    const main = page
    expect(link).not.toBeNull()

    await page.getByRole('button', { name: 'Rowan Alder (admin)' }).click()
    await page.getByText('Sign out').click()
    await page.waitForURL(`${app.server.url}/sign-in`)

    await page.goto(link ?? '')
    await page.waitForURL(/\/sign-in\?redirect=/)
    await main.getByRole('link', { name: 'No account yet? Create one' }).click()
    await page.waitForURL(/\/sign-up\?redirect=/)
    await main.getByLabel('Your name').fill(invitee.name)
    await main.getByLabel('E-mail').fill(invitee.email)
    await main.getByLabel('Password').fill(invitee.password)
    await main.getByRole('button', { name: 'Create the account' }).click()
    // Signed in by nobody: the same answer would have come for an address with an account.
    await main.getByText('Check your mail to confirm your address').waitFor()
    await app.browser.screenshot('sign-up-check-mail')
    expect(await seriousAxeViolations(page)).toEqual([])
    // The account is made after the answer: wait until its mail has gone out.
    await expect
      .poll(() => app.server.output(), { timeout: 15_000 })
      .toContain(`mail to ${invitee.email}: "Confirm your address for Loudhour"`)
    await page.locator('.form-card').getByRole('link', { name: 'Sign in', exact: true }).click()
    await page.waitForURL(/\/sign-in\?redirect=/)
    await main.getByLabel('E-mail').fill(invitee.email)
    await main.getByLabel('Password').fill(invitee.password)
    await main.locator('form').getByRole('button', { name: 'Sign in' }).click()

    await page.waitForURL(/\/invitations\/accept\?token=/)
    await main.getByText('You are invited to Alder Creek Market Crew as editor.').waitFor()
    await main.getByRole('button', { name: 'Join Alder Creek Market Crew' }).click()
    await page.waitForURL(`${app.server.url}/team`)
    await main.getByText('Members of Alder Creek Market Crew').waitFor()
    const row = main.getByRole('row', { name: new RegExp(invitee.email) })
    await expect(row.textContent()).resolves.toContain('editor')
    await app.browser.screenshot('invitation-accepted')
    expect(app.browser.consoleErrors).toEqual([])
  })

  it('the invitee confirms the address with the link the operator found on the console', async () => {
    const { page } = app.browser
    const main = page
    // The catcher keeps the link from team admins; the operator's console has it.
    const confirmation = new RegExp(
      `mail to ${invitee.email}: "Confirm your address for Loudhour"[\\s\\S]*?(${app.server.url}/verify-email\\?token=[A-Za-z0-9_-]{43})`,
    ).exec(app.server.output())
    expect(confirmation?.[1]).toBeDefined()
    await page.goto('about:blank')
    await page.goto(confirmation?.[1] ?? '')
    await main.getByRole('button', { name: 'Confirm my address' }).click()
    await main.getByText('Address confirmed.').waitFor()
    await app.browser.screenshot('address-confirmed')
    expect(await seriousAxeViolations(page)).toEqual([])
    expect(app.browser.consoleErrors).toEqual([])
  })
})
