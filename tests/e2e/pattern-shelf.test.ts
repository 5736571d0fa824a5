import type { Browser, BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

let browser: Browser
let context: BrowserContext
let page: Page
const consoleErrors: string[] = []

beforeAll(async () => {
  browser = await launchBrowser()
  context = await browser.newContext({ viewport: { width: 1280, height: 800 } })
  page = await context.newPage()
  page.on('console', (message) => message.type() === 'error' && consoleErrors.push(message.text()))
})
afterAll(async () => {
  await browser?.close()
})

describe('a demo designer on the pattern shelf', () => {
  it('signs in, creates a pattern, renames it, and finds it renamed after a reload', async () => {
    await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    await page.goto(`${baseUrl()}/patterns`)
    await expect.poll(() => page.getByTestId('pattern-row').count()).toBeGreaterThanOrEqual(3)
    await expect.poll(() => page.getByRole('link', { name: 'Hollyberry Wreath' }).count()).toBe(1)

    const name = `Rosehip Ring ${Date.now()}`
    await page.getByLabel('New pattern').fill(name)
    await page.getByRole('button', { name: 'Create pattern' }).click()
    await page.getByRole('link', { name }).waitFor()

    await page.getByRole('button', { name: `Rename ${name}` }).click()
    const renamed = `${name} (revised)`
    await page.getByLabel(`New name for ${name}`).fill(renamed)
    await page.getByRole('button', { name: 'Save name' }).click()
    await page.getByRole('link', { name: renamed }).waitFor()

    await page.reload()
    await page.getByRole('link', { name: renamed }).waitFor()
    expect(await page.getByRole('link', { name, exact: true }).count()).toBe(0)

    // The pattern page shows both saved revisions.
    await page.getByRole('link', { name: renamed }).click()
    await page.getByRole('heading', { name: renamed }).waitFor()
    expect(await page.getByText(/Revision 2 — /).count()).toBe(1)
    expect(await page.getByText(/Revision 1 — /).count()).toBe(1)
  })

  it('sorts the shelf by name when the Name heading is chosen', async () => {
    await page.goto(`${baseUrl()}/patterns`)
    await expect.poll(() => page.getByTestId('pattern-row').count()).toBeGreaterThanOrEqual(3)
    await page.getByRole('button', { name: /^Name/ }).click()
    const names = await page.getByTestId('pattern-row').locator('td:first-child').allInnerTexts()
    const sorted = [...names].sort((a, b) => a.localeCompare(b, undefined, { sensitivity: 'base', numeric: true }))
    expect(names).toEqual(sorted)
    expect(await page.getByRole('columnheader', { name: /Name/ }).getAttribute('aria-sort')).toBe('ascending')
  })

  it('keeps a quilter out of the studio', async () => {
    const quilterContext = await browser.newContext()
    const quilterPage = await quilterContext.newPage()
    await signInThroughPage(quilterPage, 'elsie@quilters.example', DEMO_PASSWORD)
    await quilterPage.goto(`${baseUrl()}/patterns`)
    await quilterPage.waitForURL(/\/\?denied=1$/)
    await quilterContext.close()
  })

  it('logged no errors in the browser console', () => {
    expect(consoleErrors).toEqual([])
  })
})
