import { readFile } from 'node:fs/promises'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openPdf, pageText } from '@/lib/booklet/test-support/read-pdf'
import { closeDatabase, database } from '@/lib/db'
import { formatPrice } from '@/lib/shop/price'
import { Pattern } from '@/models'
import { newPerson, signUpAndVerify } from '../support/accounts'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { createUser, TEST_PASSWORD } from '../support/factories'

/**
 * The whole shop journey in Chromium, against the built app, the payment fake, its webhook and the
 * booklet worker the test runner starts: a new quilter signs up, verifies from the e-mail, finds the
 * demo wreath by search, pays on the provider's page, sees the licence once the webhook lands, and
 * downloads a booklet with their name on it. Nothing is written to the database but the wreath's
 * listing being on sale.
 */

const DEMO_PATTERN = 'Hollyberry Wreath'
let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
  database()
  // The demo wreath on sale and listed, whatever earlier tests did to it.
  const found = await Pattern.findOne({ where: { name: DEMO_PATTERN }, attributes: ['id', 'priceCents'] })
  if (!found) throw new Error(`the demo data has no pattern called ${DEMO_PATTERN}`)
  await Pattern.update({ state: 'published', hiddenAt: null, ...(found.priceCents === null ? { priceCents: 1400, currency: 'USD' as const } : {}) }, { where: { id: found.id } })
})
afterAll(async () => {
  await browser?.close()
  await closeDatabase()
})

describe('from the shop to a printed booklet', () => {
  it('a new quilter signs up, buys the demo wreath, and downloads a booklet with their name on it that nobody else can open', async () => {
    const context = await browser.newContext({ acceptDownloads: true })
    const page = await context.newPage()
    const pageErrors: string[] = []
    page.on('pageerror', (error) => pageErrors.push(error.message))
    const person = await signUpAndVerify(page, newPerson('Marisol Fenwick'))
    if ((await page.getByTestId('signed-in-as').count()) === 0) await signInThroughPage(page, person.email, person.password)

    // Finds the wreath by search.
    await page.goto(`${baseUrl()}/shop`)
    await page.getByLabel('Pattern or designer').fill('hollyberry')
    await page.getByRole('button', { name: 'Show patterns' }).click()
    await page.waitForURL(/\/shop\?q=hollyberry/)
    await page.getByTestId('listing-card').filter({ hasText: DEMO_PATTERN }).getByRole('link', { name: DEMO_PATTERN }).click()
    await page.getByRole('heading', { name: DEMO_PATTERN, level: 1 }).waitFor()

    // Pays the pattern's price on the provider's page.
    const { priceCents, currency } = (await Pattern.findOne({ where: { name: DEMO_PATTERN }, attributes: ['priceCents', 'currency'] }))!
    const price = formatPrice(priceCents!, currency!)
    await page.getByRole('button', { name: `Buy · ${price}` }).click()
    await page.waitForURL((url) => url.origin === process.env.PAYMENTS_API_URL)
    await expect(page.getByTestId('total').textContent()).resolves.toBe(price)
    await page.getByRole('button', { name: /^Pay/ }).click()
    await page.waitForURL(`${baseUrl()}/shop/checkout/done?order=*`)
    // The licence appears only once the verified webhook was processed.
    await page.locator('[data-testid="order-state"][data-state="granted"]').waitFor({ timeout: 20_000 })
    const number = (await page.getByTestId('licence-number').textContent())!
    expect(number).toMatch(/^WL-\d{6}$/)

    // In the library: asks for the booklet and downloads it.
    await page.getByRole('link', { name: 'Open my library' }).click()
    const row = page.getByTestId('licence-row').filter({ hasText: number })
    await expect(row.textContent()).resolves.toContain(DEMO_PATTERN)
    await row.getByRole('button', { name: 'Get the booklet' }).click()
    const panel = row.getByTestId('get-booklet')
    await panel.getByLabel('Paper').selectOption('a4')
    await panel.getByRole('button', { name: 'Build my booklet' }).click()
    const link = row.getByTestId('booklet-download')
    await link.waitFor({ timeout: 45_000 })
    const href = (await link.getAttribute('href'))!
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()])
    const pdf = await openPdf(new Uint8Array(await readFile((await download.path())!)))
    for (const pageNumber of [1, pdf.numPages]) {
      const text = (await pageText(pdf, pageNumber)).map((item) => item.text).join(' ')
      expect(text).toContain('Marisol Fenwick')
      expect(text).toContain(`Licence ${number}`)
    }

    // A second quilter with the very link gets what a missing booklet gets.
    const second = await createUser({ displayName: 'Odran Pike', email: `odran-${Date.now()}@example.test` })
    const otherPage = await (await browser.newContext()).newPage()
    await signInThroughPage(otherPage, second.email, TEST_PASSWORD)
    expect((await otherPage.request.get(`${baseUrl()}${href}`)).status()).toBe(404)
    // And a stranger is not let in either.
    expect([401, 404]).toContain((await (await browser.newContext()).request.get(`${baseUrl()}${href}`)).status())

    expect(pageErrors).toEqual([])
    await context.close()
  })
})
