import type { Page } from 'playwright-core'
import { afterAll, beforeAll } from 'vitest'
import { openBrowser, type BrowserSession } from './browser'
import { startServer, type RunningServer } from './e2e-server'

/** Every demo account's password (docs/api.md, "Demo sign-ins"). */
export const demoPassword = 'loudhour-demo-2026'

export interface AppUnderTest {
  server: RunningServer
  browser: BrowserSession
}

/**
 * The real server on the built client with the demo seed, and one Chromium, for the whole test
 * file: started before its first test, stopped after its last.
 */
export function useAppUnderTest(extraEnv: Record<string, string> = {}): AppUnderTest {
  const app = {} as AppUnderTest
  beforeAll(async () => {
    app.server = await startServer(extraEnv)
    app.browser = await openBrowser()
  })
  afterAll(async () => {
    await app.browser?.close()
    await app.server?.stop()
  })
  return app
}

/** Fills and sends the sign-in form on the page it is on; the caller waits for where it leads. */
export async function submitSignIn(
  page: Page,
  email: string,
  password = demoPassword,
): Promise<void> {
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password', { exact: true }).fill(password)
  await page.locator('form').getByRole('button', { name: 'Sign in' }).click()
}

/** Signs the app's browser in as a demo account before the file's tests. */
export function signInBeforeAll(app: AppUnderTest, email: string): void {
  beforeAll(async () => {
    const { page } = app.browser
    await page.goto(`${app.server.url}/sign-in`)
    await submitSignIn(page, email)
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'))
  })
}
