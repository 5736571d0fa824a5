import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

const DESIGNER = 'marguerite@bramblelane.example'
let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

/** Fills the sign-in form already on the page and submits it. */
async function submitSignIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel('E-mail address').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
}

describe('after signing in', () => {
  it('brings a stranger who opened a pattern page back to that page', async () => {
    // The pattern's address, as its designer finds it on the shelf.
    const designer = await browser.newContext()
    const designerPage = await designer.newPage()
    await signInThroughPage(designerPage, DESIGNER, DEMO_PASSWORD)
    await designerPage.goto(`${baseUrl()}/patterns`)
    const href = await designerPage.getByRole('link', { name: 'Hollyberry Wreath' }).getAttribute('href')
    await designer.close()
    expect(href).toMatch(/^\/patterns\/[\w-]+$/)

    const stranger = await browser.newContext()
    const page = await stranger.newPage()
    await page.goto(`${baseUrl()}${href}`)
    await page.waitForURL((url) => url.pathname === '/sign-in')
    expect(new URL(page.url()).searchParams.get('next')).toBe(href)
    await submitSignIn(page, DESIGNER, DEMO_PASSWORD)
    await page.waitForURL((url) => url.pathname === href)
    await page.getByRole('heading', { name: 'Hollyberry Wreath' }).waitFor()
    await stranger.close()
  })

  // The two probes of issue 10, exactly as they were sent; each once sent the browser to evil.example.
  for (const next of ['/%5Cevil.example/', '/%09/evil.example/']) {
    it(`stays on this site for /sign-in?next=${next}`, async () => {
      const context = await browser.newContext()
      const page = await context.newPage()
      const requestedHosts = new Set<string>()
      page.on('request', (request) => requestedHosts.add(new URL(request.url()).host))
      await page.goto(`${baseUrl()}/sign-in?next=${next}`)
      await submitSignIn(page, DESIGNER, DEMO_PASSWORD)
      await page.getByTestId('signed-in-as').waitFor()
      const landed = new URL(page.url())
      expect(landed.origin).toBe(new URL(baseUrl()).origin)
      expect(landed.pathname).toBe('/')
      expect([...requestedHosts]).toEqual([new URL(baseUrl()).host])
      await context.close()
    })
  }
})

describe('the sign-in rate limit behind the real server', () => {
  it('counts the socket address, whatever address headers the client sends', async () => {
    // Wrong passwords for an address with no account, each claiming another client address. The
    // server must count them all as this one socket's: the 11th is refused (10 per account and
    // address in 15 minutes, lib/rate-limits.ts).
    const context = await browser.newContext()
    const email = `nobody-${Date.now()}@example.test`
    const statuses: number[] = []
    for (let i = 1; i <= 11; i++) {
      const response = await context.request.post(`${baseUrl()}/api/auth/sign-in`, {
        headers: { origin: baseUrl(), 'x-wreathwright-peer-address': `203.0.113.${i}`, 'x-forwarded-for': `198.51.100.${i}` },
        data: { email, password: 'not-the-password' },
      })
      statuses.push(response.status())
      if (i === 11) {
        expect(response.headers()['retry-after']).toMatch(/^\d+$/)
        expect((await response.json()).error.message).toMatch(/^Too many sign-in attempts; try again in \d+ minutes?\.$/)
      }
    }
    expect(statuses).toEqual([...Array<number>(10).fill(401), 429])
    await context.close()
  })
})
