import fs from 'node:fs'
import Papa from 'papaparse'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeDatabase, database } from '@/lib/db'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { DEMO_SALES } from '@/scripts/demo-season'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

/** The demo season's sales (scripts/demo-season.ts) as their designer sees them: nothing is written here. */

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
  database()
})
afterAll(async () => {
  await browser?.close()
  await closeDatabase()
})

const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December']

describe('the designer’s sales', () => {
  it('a demo designer opens Sales from the header, sees the season’s months and downloads the sales as CSV', async () => {
    const context = await browser.newContext({ acceptDownloads: true })
    const page = await context.newPage()
    const pageErrors: string[] = []
    page.on('pageerror', (error) => pageErrors.push(error.message))
    await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sales', exact: true }).click()
    await page.waitForURL(`${baseUrl()}/sales`)
    await page.getByRole('heading', { name: 'Sales', level: 1 }).waitFor()

    // The three whole months before this one each have a line (other tests may add this month's sales).
    const now = new Date()
    const seasonMonths = [1, 2, 3].map((back) => {
      const month = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - back, 1))
      return `${MONTH_NAMES[month.getUTCMonth()]} ${month.getUTCFullYear()}`
    })
    const monthCells = await page.getByTestId('sales-month').locator('th').allTextContents()
    for (const month of seasonMonths) expect(monthCells).toContain(month)
    // The refund shows against its month.
    const refunded = page.getByTestId('sale-row').filter({ hasText: 'Ruben Achterberg' }).filter({ hasText: 'Tidepool Halo' })
    expect(await refunded.getByTestId('sale-refunded').textContent()).toMatch(/^\d{4}-\d{2}-\d{2}$/)
    expect(await page.getByTestId('sale-row').filter({ hasText: 'Elsie Varga' }).first().getByTestId('sale-refunded').textContent()).toBe('—')

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download as CSV' }).click()])
    expect(download.suggestedFilename()).toBe('sales-start-today.csv')
    const csv = Papa.parse<Record<string, string>>(fs.readFileSync(await download.path(), 'utf8'), { header: true, skipEmptyLines: true })
    expect(csv.errors).toEqual([])
    // Every row of the page is in the file, the demo's sales among them, each with its licence.
    expect(csv.data).toHaveLength(await page.getByTestId('sale-row').count())
    expect(csv.data.length).toBeGreaterThanOrEqual(DEMO_SALES.length)
    expect(csv.data.filter((row) => row.Buyer === 'Elsie Varga').map((row) => row.Pattern).sort()).toEqual(['Hollyberry Wreath', 'Meadow Rue Circlet', 'Rosehip Garland'])
    for (const row of csv.data) expect(row.Licence).toMatch(/^WL-\d{6}$/)
    expect(csv.data.filter((row) => row.Refunded !== '')).toHaveLength(1)
    // Buyers by display name only: no e-mail address in the file.
    expect(fs.readFileSync(await download.path(), 'utf8')).not.toContain('@')

    expect(pageErrors).toEqual([])
    await context.close()
  })
})
