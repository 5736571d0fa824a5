import fs from 'node:fs'
import path from 'node:path'
import type { Browser, BrowserContext } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { waitForMail } from '../support/mail'

const ADMIN = 'odile@wreathwright.example'
const DESIGNER = 'marguerite@bramblelane.example'
const QUILTER = 'elsie@quilters.example'
let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

/** Every page of the admin desk, found in app/(admin) so that a new one cannot be missed. */
function adminPages(): string[] {
  const root = path.resolve('app/(admin)')
  return (fs.readdirSync(root, { recursive: true }) as string[])
    .filter((file) => path.basename(file) === 'page.tsx')
    .map((file) => `/${path.dirname(file)}`.replace(/\\/g, '/'))
    .sort()
}

async function signedIn(email: string): Promise<BrowserContext> {
  const context = await browser.newContext()
  await signInThroughPage(await context.newPage(), email, DEMO_PASSWORD)
  return context
}

describe('who gets into the admin desk', () => {
  it('shows designers and quilters the not-found page on every admin page, sends strangers to sign in, opens them to the admin', async () => {
    const pages = adminPages()
    expect(pages).toEqual(expect.arrayContaining(['/admin', '/admin/audit', '/admin/mail', '/admin/requests', '/admin/users']))
    for (const email of [DESIGNER, QUILTER]) {
      const context = await signedIn(email)
      for (const page of pages) {
        const response = await context.request.get(`${baseUrl()}${page}`, { maxRedirects: 0 })
        expect(response.status(), `${page} as ${email}`).toBe(404)
        expect(await response.text()).not.toContain('Admin desk')
      }
      await context.close()
    }
    const stranger = await browser.newContext()
    for (const page of pages) {
      const response = await stranger.request.get(`${baseUrl()}${page}`, { maxRedirects: 0 })
      expect([303, 307], `${page} as a stranger`).toContain(response.status())
      expect(response.headers().location, page).toMatch(/\/sign-in\?next=/)
    }
    await stranger.close()
    const admin = await signedIn(ADMIN)
    for (const page of pages) {
      const response = await admin.request.get(`${baseUrl()}${page}`)
      expect(response.status(), `${page} as the admin`).toBe(200)
    }
    await admin.close()
  })
})

describe('the admin desk', () => {
  it('finds a person who just signed up, grants them the designer role, and the audit log shows it', async () => {
    const email = `juniper.ashgrove.${Date.now()}@example.test`
    const visitor = await browser.newContext()
    const signUp = await visitor.request.post(`${baseUrl()}/api/auth/sign-up`, {
      headers: { origin: baseUrl() },
      data: { email, password: 'feather-stitch-meadow-41', displayName: 'Juniper Ashgrove' },
    })
    expect(signUp.status()).toBe(202)
    await visitor.close()

    const context = await signedIn(ADMIN)
    const page = await context.newPage()
    await page.goto(`${baseUrl()}/admin`)
    await page.waitForURL(/\/admin\/users$/)
    // Hundreds of demo people: the newcomer is found by a part of the address, in other letters' case.
    await page.getByLabel('Find by name or e-mail').fill(email.slice(0, 20).toUpperCase())
    await page.getByRole('button', { name: 'Search' }).click()
    await page.waitForURL(/q=/)
    const row = page.getByTestId('user-row').filter({ hasText: email })
    await row.waitFor()
    expect(await row.getByTestId('user-roles').innerText()).toBe('quilter')
    await row.getByRole('button', { name: 'Grant designer to Juniper Ashgrove' }).click()
    await row.getByRole('button', { name: 'Revoke designer from Juniper Ashgrove' }).waitFor()
    expect(await row.getByTestId('user-roles').innerText()).toBe('designer, quilter')

    await page.getByRole('link', { name: 'Audit log' }).click()
    await page.waitForURL(/\/admin\/audit$/)
    const newest = page.getByTestId('audit-row').first()
    expect(await newest.innerText()).toMatch(/Odile Fairweather <odile@wreathwright\.example>\s+granted the designer role to\s+Juniper Ashgrove <juniper\.ashgrove\.\d+@example\.test>/)
    await context.close()
  })

  it('approves a waiting designer request: the person is e-mailed, the mail log and audit log say so', async () => {
    const context = await signedIn(ADMIN)
    const page = await context.newPage()
    await page.goto(`${baseUrl()}/admin/requests`)
    const row = page.getByTestId('request-row').filter({ hasText: 'isadora@fernhollow.example' })
    await row.getByRole('button', { name: 'Approve Isadora Quennell as a designer' }).click()
    await row.waitFor({ state: 'detached' })

    const mail = await waitForMail({ to: 'isadora@fernhollow.example', kind: 'designer-request-decided' })
    expect(mail.to).toEqual(['isadora@fernhollow.example'])

    await page.getByRole('link', { name: 'Mail log' }).click()
    await page.getByTestId('mail-row').filter({ hasText: 'isadora@fernhollow.example' }).filter({ hasText: 'designer-request-decided' }).first().waitFor()
    expect(await page.getByRole('link', { name: 'the mail catcher’s inbox' }).getAttribute('href')).toMatch(/^http:\/\/127\.0\.0\.1:\d+/)

    await page.getByRole('link', { name: 'Audit log' }).click()
    expect(await page.getByTestId('audit-row').first().innerText()).toMatch(/approved the designer request of\s+Isadora Quennell/)
    await context.close()
  })
})
