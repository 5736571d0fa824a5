import { chromium, type Browser, type Page } from 'playwright-core'

/** The app under test, started by scripts/run-tests.ts. */
export function baseUrl(): string {
  const url = process.env.E2E_BASE_URL
  if (!url) throw new Error('E2E_BASE_URL is not set: run end-to-end tests through `npm test`')
  return url
}

/**
 * Debian's Chromium, headless. Never a downloaded browser. The flags keep it from reaching for
 * the network, which this machine does not have.
 */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  })
}

/** Signs in through the sign-in page, as a person would. */
export async function signInThroughPage(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl()}/sign-in`)
  await page.getByLabel('E-mail address').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.getByTestId('signed-in-as').waitFor()
}
