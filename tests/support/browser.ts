import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'

/** The app under test, started by scripts/run-tests.ts. */
export function baseUrl(): string {
  const url = process.env.E2E_BASE_URL
  if (!url) throw new Error('E2E_BASE_URL is not set: run end-to-end tests through `npm test`')
  return url
}

/**
 * Debian's Chromium, headless. Never a downloaded browser. The flags keep it from reaching for
 * the network, which this machine does not have.
 *
 * Every page it opens is watched for anything the Content-Security-Policy blocked (in the page or
 * its workers): `close()` then fails, naming what was refused, so every end-to-end test also
 * shows that the policy lets the app work. A test that provokes a refusal on purpose passes
 * `{ allowCspViolations: true }`.
 */
export async function launchBrowser(options: { allowCspViolations?: boolean } = {}): Promise<Browser> {
  const browser = await launchChromium()
  return options.allowCspViolations ? browser : failOnCspViolations(browser)
}

/** Chromium's console line for a blocked resource, script, style, worker or frame, e.g. "Refused to load …". */
function isCspViolation(text: string): boolean {
  return /^Refused to /.test(text) || text.includes('Content Security Policy') || text.includes('Content-Security-Policy')
}

/** Reports what the policy blocks on any page of `context` (and its workers) to `report`. */
export async function watchCspViolations(context: BrowserContext, report: (violation: string) => void): Promise<void> {
  const fromConsole = (text: string, where: string) => isCspViolation(text) && report(`${where}: ${text}`)
  context.on('console', (message) => fromConsole(message.text(), message.location().url || message.page()?.url() || 'a worker'))
  context.on('page', (page) => page.on('worker', (worker) => worker.on('console', (message) => fromConsole(message.text(), worker.url()))))
  // The DOM event too, in case a refusal reaches no console (it fires for every blocked load).
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => {
      console.error(`Refused by the Content-Security-Policy (${event.effectiveDirective}): ${event.blockedURI || 'inline'} in ${event.documentURI}`)
    })
  })
}

function failOnCspViolations(browser: Browser): Browser {
  const violations: string[] = []
  const newContext = browser.newContext.bind(browser)
  const close = browser.close.bind(browser)
  browser.newContext = async (options) => {
    const context = await newContext(options)
    await watchCspViolations(context, (violation) => violations.push(violation))
    return context
  }
  browser.newPage = async (options) => (await browser.newContext(options)).newPage()
  browser.close = async (options) => {
    await close(options)
    const distinct = [...new Set(violations)]
    if (distinct.length > 0) throw new Error(`The Content-Security-Policy blocked ${distinct.length} thing(s):\n${distinct.join('\n')}`)
  }
  return browser
}

function launchChromium(): Promise<Browser> {
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
