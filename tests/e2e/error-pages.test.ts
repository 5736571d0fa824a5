/**
 * A page that fails on the server shows the site's own error page (app/error.tsx, or
 * app/global-error.tsx when the layout itself fails), not Next.js's built-in one, whose inline
 * `<style>` element carries no nonce and is refused by the Content-Security-Policy: neither the
 * served HTML nor what React renders in Chromium holds a style element without the page's nonce,
 * and Chromium reports no refusal (launchBrowser fails on any).
 *
 * To make a page fail for real, the test breaks one listing's stored summary (its colourway
 * swatches are not a list) on a hidden copy of a demo pattern that only an admin can open in the
 * shop, and removes it afterwards.
 */
import type { Browser } from 'playwright-core'
import { QueryTypes } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeDatabase, database } from '@/lib/db'
import { Pattern } from '@/models'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

const ADMIN = 'odile@wreathwright.example'

let browser: Browser
let broken: Pattern

beforeAll(async () => {
  browser = await launchBrowser()
  database()
  const demo = await Pattern.findOne({ where: { name: 'Hollyberry Wreath' } })
  if (!demo) throw new Error('the demo data has no Hollyberry Wreath')
  broken = await Pattern.create({
    ownerId: demo.ownerId,
    name: `Broken listing ${Date.now()}`,
    state: 'published',
    design: demo.design,
    priceCents: 1000,
    currency: 'USD',
    hiddenAt: new Date(),
  })
  await database().query("UPDATE patterns SET colorway_swatches = '{}'::jsonb WHERE id = :id", { replacements: { id: broken.id }, type: QueryTypes.UPDATE })
})
afterAll(async () => {
  if (broken) await Pattern.destroy({ where: { id: broken.id } })
  await browser?.close()
  await closeDatabase()
})

/** Style elements of an HTML text that lack the nonce of its Content-Security-Policy. */
function unsignedStyles(html: string, policy: string | null): string[] {
  const nonce = /'nonce-([^']+)'/.exec(policy ?? '')?.[1]
  return (html.match(/<style\b[^>]*>/g) ?? []).filter((tag) => !nonce || !tag.includes(`nonce="${nonce}"`))
}

describe('a page that fails on the server', () => {
  it('shows the site’s error page with no unsigned inline style, in the HTML or in Chromium', async () => {
    const context = await browser.newContext()
    const page = await context.newPage()
    await signInThroughPage(page, ADMIN, DEMO_PASSWORD)
    const address = `${baseUrl()}/shop/${broken.id}`

    // The served HTML, with the admin's session.
    const cookies = (await context.cookies()).map((cookie) => `${cookie.name}=${cookie.value}`).join('; ')
    const served = await fetch(address, { headers: { cookie: cookies } })
    const html = await served.text()
    expect(unsignedStyles(html, served.headers.get('content-security-policy'))).toEqual([])
    // Not Next.js's built-in error page (its words), and no stack or message of the error.
    expect(html).not.toContain('This page couldn’t load')
    expect(html).not.toContain('colorwaySwatches')

    // In Chromium: our error page, and no style element without the nonce once React has rendered it.
    await page.goto(address)
    await page.getByTestId('error-page').waitFor()
    await page.getByRole('heading', { name: 'Something went wrong' }).waitFor()
    const styles = await page.locator('style').evaluateAll((elements) => elements.map((element) => (element as HTMLStyleElement).nonce))
    for (const nonce of styles) expect(nonce).toBeTruthy()
    await context.close()
  })
})
