import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeDatabase, database } from '@/lib/db'
import { checkoutAnswerSchema } from '@/lib/schemas/shop'
import { Pattern } from '@/models'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { createUser, TEST_PASSWORD } from '../support/factories'

let browser: Browser
let pattern: Pattern

beforeAll(async () => {
  browser = await launchBrowser()
  // A demo pattern for sale at 14.50 USD, whatever state the demo data left it in (set through the
  // database: publishing is the studio's business, not this test's).
  database()
  const found = await Pattern.findOne({ where: { state: ['published', 'testing', 'draft'] }, order: [['createdAt', 'ASC']], attributes: ['id', 'name', 'state'] })
  if (!found) throw new Error('the demo data has no pattern')
  await Pattern.update({ state: 'published', priceCents: 1450, currency: 'USD' }, { where: { id: found.id } })
  pattern = found
})
afterAll(async () => {
  await browser?.close()
  await closeDatabase()
})

describe('buying a pattern', () => {
  it('a quilter pays on the provider’s page and sees the licence appear in the library once the webhook lands', async () => {
    const quilter = await createUser({ displayName: 'Rosalind Achterberg', email: `rosalind-${Date.now()}@example.test` })
    const page = await (await browser.newContext()).newPage()
    await signInThroughPage(page, quilter.email, TEST_PASSWORD)
    // The shop's pattern pages come later; the page's own fetch starts the checkout as theirs will.
    const answer = await page.evaluate(async (patternId) => {
      const response = await fetch('/api/shop/checkout', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ patternId, amountCents: 1 }) })
      return (await response.json()) as unknown
    }, pattern.id)
    const { url } = checkoutAnswerSchema.parse(answer)
    expect(new URL(url).origin).toBe(process.env.PAYMENTS_API_URL)
    await page.goto(url)
    // The fake's page shows the pattern's price, not the 1 cent the page sent: 1450 cents of USD.
    await expect(page.getByTestId('total').textContent()).resolves.toBe('$14.50')
    await page.getByRole('button', { name: /^Pay/ }).click()
    await page.waitForURL(`${baseUrl()}/shop/checkout/done?order=*`)
    const granted = page.locator('[data-testid="order-state"][data-state="granted"]')
    await granted.waitFor({ timeout: 20_000 })
    const number = await page.getByTestId('licence-number').textContent()
    expect(number).toMatch(/^WL-\d{6}$/)

    await page.getByRole('link', { name: 'Open my library' }).click()
    const row = page.getByTestId('licence-row').filter({ hasText: pattern.name })
    await expect(row.textContent()).resolves.toContain(number!)
    await row.getByRole('link', { name: 'Print' }).click()
    await page.getByRole('heading', { name: `Print room: ${pattern.name}` }).waitFor()
  })
})
