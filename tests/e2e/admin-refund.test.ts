import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeDatabase } from '@/lib/db'
import { formatPrice } from '@/lib/shop/price'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { createPatternRow, createUser, TEST_PASSWORD } from '../support/factories'
import { eventually } from '../support/payments'

/**
 * An admin refunds an order from the payment log's "Refund…" button, in Chromium against the built
 * app and the payment fake the test runner starts. The order is bought for real on the fake's page
 * (as tests/e2e/shop-journey.test.ts does), so the fake knows its payment and sends the
 * `charge.refunded` event to the app's webhook; the licence goes only when that event is processed
 * (lib/services/refunds.ts). Who may open the admin desk at all is tests/e2e/admin-desk.test.ts's.
 */

const ADMIN = 'odile@wreathwright.example'
let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
  await closeDatabase()
})

describe('refunding an order from the admin desk', () => {
  it('asks, refunds, and then the row says refunded, the quilter’s library has no such pattern, the audit log has it, and no second refund is offered', async () => {
    // A new pattern on sale, so that its name is this run's alone: 12.50 EUR, in one colourway (emptyDesign's).
    const stamp = Date.now()
    const designer = await createUser({ roles: ['quilter', 'designer'], displayName: 'Wilhelmina Thorne' })
    const patternName = `Sloe Berry Ring ${stamp}`
    const pattern = await createPatternRow(designer, { name: patternName, state: 'published' })
    await pattern.update({ priceCents: 1250, currency: 'EUR' })
    const price = formatPrice(1250, 'EUR')
    const quilter = await createUser({ displayName: 'Perpetua Lindqvist', email: `perpetua.lindqvist.${stamp}@example.test` })

    // The quilter buys it: the shop page's Buy, the fake's Pay, and the licence once the webhook lands.
    const buyer = await (await browser.newContext()).newPage()
    await signInThroughPage(buyer, quilter.email, TEST_PASSWORD)
    await buyer.goto(`${baseUrl()}/shop/${pattern.id}`)
    await buyer.getByRole('button', { name: `Buy · ${price}` }).click()
    await buyer.waitForURL((url) => url.origin === process.env.PAYMENTS_API_URL)
    await buyer.getByRole('button', { name: /^Pay/ }).click()
    await buyer.waitForURL(`${baseUrl()}/shop/checkout/done?order=*`)
    const orderId = new URL(buyer.url()).searchParams.get('order')!
    await buyer.locator('[data-testid="order-state"][data-state="granted"]').waitFor({ timeout: 20_000 })
    const licenceNumber = (await buyer.getByTestId('licence-number').textContent())!
    expect(licenceNumber).toMatch(/^WL-\d{6}$/)
    await buyer.goto(`${baseUrl()}/library`)
    const printHref = (await buyer.getByTestId('licence-row').filter({ hasText: patternName }).getByRole('link', { name: 'Print' }).getAttribute('href'))!
    expect(printHref).toMatch(/^\/library\/[^/]+\/print$/)

    // The admin finds the order's row on the payment log.
    const admin = await (await browser.newContext()).newPage()
    await signInThroughPage(admin, ADMIN, DEMO_PASSWORD)
    await admin.goto(`${baseUrl()}/admin/payments`)
    const row = admin.locator(`[data-testid="order-row"][data-order-id="${orderId}"]`)
    await row.waitFor()
    const rowText = await row.innerText()
    for (const part of [patternName, 'Perpetua Lindqvist', licenceNumber, price]) expect(rowText).toContain(part)

    // "Refund…" asks first, naming amount, buyer and pattern; "Keep the sale" backs out.
    const refundButton = row.getByRole('button', { name: `Refund the order of Perpetua Lindqvist for ${patternName}` })
    await refundButton.click()
    const confirm = row.getByRole('group', { name: 'Confirm the refund' })
    expect(await confirm.innerText()).toContain(`Refund ${price} to Perpetua Lindqvist for “${patternName}”?`)
    await confirm.getByRole('button', { name: 'Keep the sale' }).click()
    await confirm.waitFor({ state: 'detached' })
    await refundButton.click()
    // From the confirmation on, the row must never offer "Refund…" again, not even while the page refreshes.
    await row.evaluate((element) => {
      const seen = window as unknown as { refundOfferedAgain?: boolean }
      new MutationObserver(() => {
        if ([...element.querySelectorAll('button')].some((button) => button.textContent === 'Refund…')) seen.refundOfferedAgain = true
      }).observe(element, { subtree: true, childList: true, characterData: true })
    })
    await confirm.getByRole('button', { name: `Yes, refund ${price}` }).click()

    // At once the row says the refund is asked for (or done already, if the provider's event beat the page).
    const cell = row.getByTestId('order-refund')
    await cell.getByText(/^(asked \d{4}-\d{2}-\d{2}; waiting for the provider|refunded \d{4}-\d{2}-\d{2})$/).waitFor()
    expect(await row.getByRole('alert').count()).toBe(0)
    expect(await admin.evaluate(() => (window as unknown as { refundOfferedAgain?: boolean }).refundOfferedAgain ?? false)).toBe(false)
    // Once the provider's charge.refunded event is processed, the page (reloaded, as an admin would) says refunded.
    await eventually(async () => {
      await admin.reload()
      expect(await cell.innerText()).toMatch(/^refunded \d{4}-\d{2}-\d{2}$/)
    })
    // Not offered a second time.
    expect(await row.getByRole('button').count()).toBe(0)

    // The quilter's library no longer offers the pattern, the API agrees, and the print room is closed.
    await buyer.goto(`${baseUrl()}/library`)
    await buyer.getByRole('heading', { name: 'My library' }).waitFor()
    expect(await buyer.getByTestId('licence-row').filter({ hasText: patternName }).count()).toBe(0)
    const library = (await (await buyer.request.get(`${baseUrl()}/api/library`)).json()) as { licences: { number: string }[] }
    expect(library.licences.map((licence) => licence.number)).not.toContain(licenceNumber)
    expect((await buyer.request.get(`${baseUrl()}${printHref}`)).status()).toBe(404)

    // The audit log names the admin, the refund, the pattern, the buyer and the amount.
    await admin.getByRole('link', { name: 'Audit log' }).click()
    await admin.waitForURL(/\/admin\/audit$/)
    const entry = admin.getByTestId('audit-row').filter({ hasText: patternName })
    expect(await entry.count()).toBe(1)
    expect(await entry.innerText()).toMatch(
      new RegExp(`Odile Fairweather <odile@wreathwright\\.example>\\s+refunded the\\s+order for “${patternName}” bought by Perpetua Lindqvist <perpetua\\.lindqvist\\.${stamp}@example\\.test> \\(${price.replace(/[.$]/g, '\\$&')}\\)`),
    )
  })
})
