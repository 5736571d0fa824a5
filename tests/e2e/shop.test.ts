import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeDatabase, database } from '@/lib/db'
import { formatPrice } from '@/lib/shop/price'
import { Pattern } from '@/models'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { createUser, TEST_PASSWORD } from '../support/factories'

/** The demo's flagship pattern (scripts/demo-wreath.ts): 4 repeats, two colourways, holly greens in the first. */
const DEMO_PATTERN = 'Hollyberry Wreath'

let browser: Browser
let pattern: Pattern

beforeAll(async () => {
  browser = await launchBrowser()
  // The demo pattern on sale and listed, whatever earlier tests did to it: published, with a
  // price if it has none, not hidden (set through the database: publishing is the studio's business).
  database()
  const found = await Pattern.findOne({ where: { name: DEMO_PATTERN }, attributes: ['id', 'name', 'priceCents', 'colorwaySwatches'] })
  if (!found) throw new Error(`the demo data has no pattern called ${DEMO_PATTERN}`)
  await Pattern.update(
    { state: 'published', hiddenAt: null, ...(found.priceCents === null ? { priceCents: 1400, currency: 'USD' as const } : {}) },
    { where: { id: found.id } },
  )
  pattern = found
})
afterAll(async () => {
  await browser?.close()
  await closeDatabase()
})

const cards = (page: Page) => page.getByTestId('listing-card')

describe('the shop, for a visitor who is not signed in', () => {
  it('finds the demo pattern by name, narrows it by colour and repeats, and shows it in every colourway', async () => {
    const page = await (await browser.newContext()).newPage()
    await page.goto(`${baseUrl()}/shop`)
    await page.getByRole('heading', { name: 'Shop', exact: true }).waitFor()

    await page.getByLabel('Pattern or designer').fill('hollyBERRY')
    await page.getByRole('button', { name: 'Show patterns' }).click()
    await page.waitForURL(/\/shop\?q=hollyBERRY/)
    const card = cards(page).filter({ hasText: DEMO_PATTERN })
    await card.waitFor()
    for (const name of await cards(page).getByRole('heading').allTextContents()) expect(name.toLowerCase()).toContain('hollyberry')
    // The card's cover is the ring drawn on the server, in the first colourway's colours.
    const firstColourway = pattern.colorwaySwatches[0]!
    const cover = card.locator('svg').first()
    await expect(cover.getAttribute('data-colorway')).resolves.toBe(firstColourway.name)
    const fills = await cover.locator('path[data-area]').evaluateAll((paths) => paths.map((path) => path.getAttribute('fill')))
    expect(fills.length).toBeGreaterThan(0)
    for (const fill of fills) expect(firstColourway.colours).toContain(fill)

    // Its colourways hold greens, it has 4 repeats: found with both filters, gone with 7 repeats.
    await page.getByLabel('Colour', { exact: true }).selectOption('greens')
    await page.getByLabel('Repeats', { exact: true }).fill('4')
    await page.getByRole('button', { name: 'Show patterns' }).click()
    await page.waitForURL(/colour=greens/)
    expect(new URL(page.url()).searchParams.get('repeats')).toBe('4')
    await card.waitFor()
    await page.getByLabel('Repeats', { exact: true }).fill('7')
    await page.getByRole('button', { name: 'Show patterns' }).click()
    await page.waitForURL(/repeats=7/)
    await expect(page.getByTestId('result-count').textContent()).resolves.toBe('No pattern matches; try fewer filters.')
    expect(await cards(page).count()).toBe(0)

    await page.getByLabel('Repeats', { exact: true }).fill('4')
    await page.getByRole('button', { name: 'Show patterns' }).click()
    await page.waitForURL(/repeats=4/)
    await card.getByRole('link', { name: DEMO_PATTERN }).click()
    await page.waitForURL(`${baseUrl()}/shop/${pattern.id}`)
    await page.getByRole('heading', { name: DEMO_PATTERN, level: 1 }).waitFor()

    // The preview in every colourway, each drawn in that colourway's own colours.
    const previews = page.getByTestId('colorway-preview')
    expect(await previews.count()).toBe(pattern.colorwaySwatches.length)
    expect(pattern.colorwaySwatches.length).toBeGreaterThan(1)
    for (const colorway of pattern.colorwaySwatches) {
      const preview = page.locator(`[data-testid="colorway-preview"][data-colorway="${colorway.name}"]`)
      const svg = preview.locator('svg')
      await expect(svg.getAttribute('data-colorway')).resolves.toBe(colorway.name)
      const areaFills = await svg.locator('path[data-area]').evaluateAll((paths) => paths.map((path) => path.getAttribute('fill')))
      expect(areaFills.length).toBeGreaterThan(0)
      for (const fill of areaFills) expect(colorway.colours).toContain(fill)
      await expect(svg.boundingBox().then((box) => box!.width)).resolves.toBeGreaterThan(100)
    }
    // Buying starts with signing in, and comes back here.
    const buy = page.getByRole('link', { name: /^Sign in to buy/ })
    expect(new URL((await buy.getAttribute('href'))!, baseUrl()).searchParams.get('next')).toBe(`/shop/${pattern.id}`)
    await expect(page.getByTestId('price').textContent()).resolves.toMatch(/^\$\d+\.\d\d$|^€|^£|^CA\$|^A\$/)
  })

  it('searches and filters without JavaScript, through the query string', async () => {
    const context = await browser.newContext({ javaScriptEnabled: false })
    const page = await context.newPage()
    await page.goto(`${baseUrl()}/shop`)
    await page.getByLabel('Pattern or designer').fill('hollyberry')
    await page.getByLabel('Colour', { exact: true }).selectOption('greens')
    await page.getByRole('button', { name: 'Show patterns' }).click()
    await page.waitForURL(/\/shop\?q=hollyberry&colour=greens/)
    await cards(page).filter({ hasText: DEMO_PATTERN }).waitFor()
    // An address the shop cannot read says what is wrong instead of failing.
    await page.goto(`${baseUrl()}/shop?colour=mauve`)
    await expect(page.getByRole('alert').textContent()).resolves.toContain('colour')
    await context.close()
  })

  it('sends a visitor who wants to buy to sign in, back to the pattern, and on to the payment provider’s page for its price', async () => {
    const quilter = await createUser({ displayName: 'Tamsin Larkspur', email: `tamsin-${Date.now()}@example.test` })
    const page = await (await browser.newContext()).newPage()
    await page.goto(`${baseUrl()}/shop/${pattern.id}`)
    await page.getByRole('link', { name: /^Sign in to buy/ }).click()
    await page.waitForURL(/\/sign-in\?next=/)
    await page.getByLabel('E-mail address').fill(quilter.email)
    await page.getByLabel('Password').fill(TEST_PASSWORD)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(`${baseUrl()}/shop/${pattern.id}`)
    // The price now, whatever an earlier test set it to; the provider's page shows the same.
    const { priceCents, currency } = (await Pattern.findByPk(pattern.id, { attributes: ['priceCents', 'currency'] }))!
    const price = formatPrice(priceCents!, currency!)
    await page.getByRole('button', { name: `Buy · ${price}` }).click()
    await page.waitForURL((url) => url.origin === process.env.PAYMENTS_API_URL)
    await expect(page.getByTestId('total').textContent()).resolves.toBe(price)
  })

  it('answers not found for a pattern that is not for sale', async () => {
    const response = await (await browser.newContext()).request.get(`${baseUrl()}/shop/00000000-0000-4000-8000-000000000000`)
    expect(response.status()).toBe(404)
  })
})

describe('an admin on a pattern’s shop page', () => {
  it('hides the listing from the shop and puts it back', async () => {
    const context = await browser.newContext()
    const page = await context.newPage()
    await signInThroughPage(page, 'odile@wreathwright.example', DEMO_PASSWORD)
    await page.goto(`${baseUrl()}/shop/${pattern.id}`)
    await page.getByRole('button', { name: 'Hide from the shop' }).click()
    await page.getByRole('button', { name: 'Put back in the shop' }).waitFor()
    const stranger = await browser.newContext()
    expect((await stranger.request.get(`${baseUrl()}/shop/${pattern.id}`)).status()).toBe(404)
    await page.goto(`${baseUrl()}/shop?q=hollyberry`)
    expect(await cards(page).count()).toBe(0)

    await page.goto(`${baseUrl()}/shop/${pattern.id}`)
    await page.getByRole('button', { name: 'Put back in the shop' }).click()
    await page.getByRole('button', { name: 'Hide from the shop' }).waitFor()
    expect((await stranger.request.get(`${baseUrl()}/shop/${pattern.id}`)).status()).toBe(200)
    await stranger.close()
    await context.close()
  })
})
