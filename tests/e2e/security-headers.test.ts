/**
 * Security headers of the running app (a production build, `next start`): a nonce-based
 * Content-Security-Policy on pages, a closed one on API answers, no framing by other sites,
 * nosniff, a referrer policy, no-store on API answers, and no 'unsafe-eval'. In Chromium: a page
 * of another origin cannot frame the signed-in shelf, and the studio's pages (shelf, board, print
 * room with its workers, account pages) work with nothing blocked by the policy.
 */
import http from 'node:http'
import type { AddressInfo } from 'node:net'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage, watchCspViolations } from '../support/browser'

/** The policy as a map from directive name to its source list. */
function directives(policy: string | null): Map<string, string[]> {
  return new Map((policy ?? '').split(';').filter((part) => part.trim()).map((part) => {
    const [name = '', ...sources] = part.trim().split(/\s+/)
    return [name.toLowerCase(), sources]
  }))
}

/** The app's answer's headers after signing in as a demo designer through the API. */
async function signInCookie(): Promise<string> {
  const response = await fetch(`${baseUrl()}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl() },
    body: JSON.stringify({ email: 'tomasz@juniperthread.example', password: DEMO_PASSWORD }),
  })
  expect(response.status).toBe(200)
  const cookie = response.headers.get('set-cookie')?.split(';')[0]
  if (!cookie) throw new Error('signing in set no cookie')
  return cookie
}

describe('the headers of a page', () => {
  it('carry a Content-Security-Policy with a fresh nonce on the scripts, no eval, and no framing', async () => {
    const first = await fetch(`${baseUrl()}/sign-in`)
    const second = await fetch(`${baseUrl()}/sign-in`)
    const html = await first.text()
    const policy = directives(first.headers.get('content-security-policy'))
    const nonce = policy.get('script-src')?.find((source) => source.startsWith("'nonce-"))?.slice(7, -1)
    expect(nonce).toBeTruthy()
    // A nonce is unpredictable only if it is new for every answer (CSP3 §7.1 "Nonce reuse").
    expect(second.headers.get('content-security-policy')).not.toContain(`'nonce-${nonce}'`)
    // Next.js put the nonce on its own scripts, and no script goes without it.
    const scripts = html.match(/<script\b[^>]*>/g) ?? []
    expect(scripts.length).toBeGreaterThan(0)
    for (const script of scripts) expect(script).toContain(`nonce="${nonce}"`)
    // Next.js's CSP guide: 'unsafe-eval' is needed only by `next dev`; this is the production build.
    expect(first.headers.get('content-security-policy')).not.toContain('unsafe-eval')
    expect(policy.get('script-src')).not.toContain("'unsafe-inline'")
    // CSP3 §6.4.2 frame-ancestors 'none'; RFC 7034 X-Frame-Options DENY for older browsers.
    expect(policy.get('frame-ancestors')).toEqual(["'none'"])
    expect(policy.get('object-src')).toEqual(["'none'"])
    expect(first.headers.get('x-frame-options')).toBe('DENY')
    // Fetch standard §3.5 (X-Content-Type-Options: nosniff); Referrer Policy §3 (a value of the list).
    expect(first.headers.get('x-content-type-options')).toBe('nosniff')
    expect(first.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin')
    // The tests serve plain http on loopback: no HSTS there (RFC 6797 §7.2: ignored over http anyway).
    expect(first.headers.get('strict-transport-security')).toBeNull()
  })

  it('are on the signed-in shelf too', async () => {
    const response = await fetch(`${baseUrl()}/patterns`, { headers: { cookie: await signInCookie() } })
    expect(response.status).toBe(200)
    expect(directives(response.headers.get('content-security-policy')).get('frame-ancestors')).toEqual(["'none'"])
    expect(response.headers.get('x-frame-options')).toBe('DENY')
  })
})

describe('the headers of an API answer', () => {
  it('keep personal data out of every cache and let the answer load or run nothing', async () => {
    const cookie = await signInCookie()
    const response = await fetch(`${baseUrl()}/api/patterns`, { headers: { cookie } })
    expect(response.status).toBe(200)
    // RFC 9111 §5.2.2.5 no-store: no cache, shared or private, keeps the answer.
    expect(response.headers.get('cache-control')).toBe('no-store')
    expect(response.headers.get('x-content-type-options')).toBe('nosniff')
    expect(response.headers.get('x-frame-options')).toBe('DENY')
    expect(directives(response.headers.get('content-security-policy'))).toEqual(
      new Map([['default-src', ["'none'"]], ['frame-ancestors', ["'none'"]]]),
    )
    // A stranger's refusal has them as well.
    const refused = await fetch(`${baseUrl()}/api/patterns`)
    expect(refused.status).toBe(401)
    expect(refused.headers.get('cache-control')).toBe('no-store')
    expect(refused.headers.get('x-content-type-options')).toBe('nosniff')
  })
})

describe('in Chromium', () => {
  let browser: Browser
  let outside: http.Server
  let outsideUrl: string

  beforeAll(async () => {
    // This test provokes a refusal (the framing) on purpose, so it watches for them itself.
    browser = await launchBrowser({ allowCspViolations: true })
    // A page of another origin (another loopback port) that frames the shelf, and, as a control,
    // a page of its own origin.
    outside = http.createServer((request, response) => {
      response.setHeader('content-type', 'text/html; charset=utf-8')
      if (request.url === '/own') return response.end('<!doctype html><p id="own">framed fine</p>')
      response.end(`<!doctype html><title>Elsewhere</title>
        <iframe id="shelf" src="${baseUrl()}/patterns" width="800" height="600"></iframe>
        <iframe id="own" src="/own" width="200" height="100"></iframe>`)
    })
    await new Promise<void>((resolve) => outside.listen(0, '127.0.0.1', resolve))
    outsideUrl = `http://127.0.0.1:${(outside.address() as AddressInfo).port}`
  })
  afterAll(async () => {
    await browser?.close()
    await new Promise((resolve) => outside?.close(resolve))
  })

  it('a page of another origin cannot frame the signed-in shelf', async () => {
    const context = await browser.newContext()
    const page = await context.newPage()
    const refusals: string[] = []
    await watchCspViolations(context, (violation) => refusals.push(violation))
    await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    // Signed in: the shelf opens on its own.
    await page.goto(`${baseUrl()}/patterns`)
    await page.getByTestId('signed-in-as').waitFor()

    await page.goto(outsideUrl)
    // The control frame of the outside page's own origin loads: framing as such works here.
    await expect.poll(() => page.frameLocator('#own').locator('#own').count()).toBe(1)
    await expect.poll(() => refusals.some((text) => text.includes('frame-ancestors'))).toBe(true)
    // The shelf's frame shows Chromium's error page, not the shelf.
    const shelfFrame = page.frames().find((frame) => frame !== page.mainFrame() && !frame.url().endsWith('/own'))
    expect(shelfFrame).toBeDefined()
    expect(shelfFrame!.url()).not.toBe(`${baseUrl()}/patterns`)
    expect(await page.frameLocator('#shelf').getByTestId('signed-in-as').count()).toBe(0)
    expect(await page.frameLocator('#shelf').getByTestId('pattern-row').count()).toBe(0)
    await context.close()
  })

  it('the shelf, a pattern, the board, the print room and the account pages run with nothing blocked', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } })
    const refusals: string[] = []
    const pageErrors: string[] = []
    await watchCspViolations(context, (violation) => refusals.push(violation))
    const page: Page = await context.newPage()
    page.on('pageerror', (error) => pageErrors.push(String(error)))

    await page.goto(`${baseUrl()}/`)
    await page.goto(`${baseUrl()}/sign-up`)
    await page.getByRole('button', { name: 'Create account' }).waitFor()
    await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    await page.goto(`${baseUrl()}/patterns`)
    await page.getByRole('link', { name: 'Hollyberry Wreath' }).click()
    await page.getByRole('link', { name: 'Print the booklet' }).waitFor()
    const id = new URL(page.url()).pathname.split('/')[2]!

    // The drafting board: Konva's canvas is drawn and the plan is computed.
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await page.getByTestId('plan-panel').waitFor()
    await expect.poll(() => page.locator('canvas').count()).toBeGreaterThan(0)

    // The print room: the booklet is built in its worker, pdfjs draws thumbnails in its own into
    // blob: images, all with the policy on.
    await page.goto(`${baseUrl()}/patterns/${id}/print`)
    await page.waitForFunction(() => /^Preview ready: \d+ pages?\./.test(document.querySelector('#print-status')?.textContent ?? ''), undefined, {
      timeout: 30_000,
    })
    await page.waitForFunction(() => {
      const images = [...document.querySelectorAll<HTMLImageElement>('[data-testid="page-thumbnail"]')]
      return images.length > 0 && images.every((image) => image.complete && image.naturalWidth > 0)
    })
    expect(await page.getByTestId('page-thumbnail').first().getAttribute('src')).toMatch(/^blob:/)
    // The self-hosted font loaded.
    const fontLoaded = await page.evaluate(async () => {
      await document.fonts.ready
      return [...document.fonts].some((font) => font.status === 'loaded')
    })
    expect(fontLoaded).toBe(true)

    // Back to the shelf through the app's own links (client-side navigation loads more chunks).
    await page.getByRole('link', { name: 'Pattern shelf' }).click()
    await page.getByRole('link', { name: 'Hollyberry Wreath' }).waitFor()

    expect(refusals).toEqual([])
    expect(pageErrors).toEqual([])
    await context.close()
  })
})
