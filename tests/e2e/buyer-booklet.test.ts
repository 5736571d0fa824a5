import { randomUUID } from 'node:crypto'
import { readFile } from 'node:fs/promises'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openPdf, pageText } from '@/lib/booklet/test-support/read-pdf'
import { closeDatabase, database } from '@/lib/db'
import { Licence, Order, Pattern } from '@/models'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { createUser, TEST_PASSWORD } from '../support/factories'

/**
 * A buyer's booklet in the browser, against the built app and the booklet worker the test runner
 * starts beside it. The licence is made in the database (buying is tests/e2e/checkout.test.ts's
 * business); the booklet is asked for, watched and downloaded through the library page.
 */

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
  database()
})
afterAll(async () => {
  await browser?.close()
  await closeDatabase()
})

/** The demo wreath, published, and a new quilter holding a licence to it. */
async function buyerWithLicence(name: string) {
  const pattern = await Pattern.findOne({ where: { name: 'Hollyberry Wreath' } })
  if (!pattern) throw new Error('the demo data has no Hollyberry Wreath')
  await pattern.update({ state: 'published', priceCents: pattern.priceCents ?? 1400, currency: pattern.currency ?? 'USD' })
  const buyer = await createUser({ displayName: name, email: `${name.toLowerCase().replace(/\W+/g, '-')}-${Date.now()}@example.test` })
  const order = await Order.create({ id: randomUUID(), buyerId: buyer.id, patternId: pattern.id, amountCents: 1400, currency: 'USD', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'paid' })
  const licence = await Licence.create({ userId: buyer.id, patternId: pattern.id, orderId: order.id })
  await licence.reload()
  return { buyer, licence, pattern }
}

describe("the buyer's booklet", () => {
  it('is asked for in the library, shows its progress, downloads with the buyer’s name on it, and opens for nobody else', async () => {
    const { buyer, licence } = await buyerWithLicence('Elsie Varga')
    const page = await (await browser.newContext({ acceptDownloads: true })).newPage()
    await signInThroughPage(page, buyer.email, TEST_PASSWORD)
    await page.goto(`${baseUrl()}/library`)
    const row = page.getByTestId('licence-row').filter({ hasText: licence.number })
    await row.getByRole('button', { name: 'Get the booklet' }).click()
    const panel = row.getByTestId('get-booklet')
    await panel.getByLabel('Paper').selectOption('a4')
    await panel.getByLabel('Orientation').selectOption('landscape')
    // The colourways come from the licensed design.
    await expect.poll(() => panel.getByLabel('Colourway').locator('option').count()).toBeGreaterThan(1)
    await panel.getByRole('button', { name: 'Build my booklet' }).click()
    // The first answer is the queued build: the page says it waits, then counts pages.
    await row.getByTestId('booklet-progress').waitFor({ timeout: 10_000 })
    const link = row.getByTestId('booklet-download')
    await link.waitFor({ timeout: 45_000 })
    const href = await link.getAttribute('href')
    expect(href).toMatch(/^\/api\/booklets\/[0-9a-f-]{36}\/download\?token=/)
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()])
    expect(download.suggestedFilename()).toBe('hollyberry-wreath-a4.pdf')
    const bytes = new Uint8Array(await readFile((await download.path())!))
    const pdf = await openPdf(bytes)
    for (const pageNumber of [1, pdf.numPages]) {
      const text = (await pageText(pdf, pageNumber)).map((item) => item.text).join(' ')
      expect(text).toContain(`Licence ${licence.number}`)
      expect(text).toContain('Elsie Varga')
    }

    // A second quilter with the very link gets what a missing booklet gets.
    const { buyer: second } = await buyerWithLicence('Nora Quill')
    const otherPage = await (await browser.newContext()).newPage()
    await signInThroughPage(otherPage, second.email, TEST_PASSWORD)
    const theirs = await otherPage.request.get(`${baseUrl()}${href}`)
    expect(theirs.status()).toBe(404)
    expect(theirs.headers()['content-type']).toContain('application/json')
    const status = await otherPage.request.get(`${baseUrl()}${href!.split('/download')[0]}`)
    expect(status.status()).toBe(404)
  })
})
