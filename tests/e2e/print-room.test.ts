import fs from 'node:fs'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { planDesign } from '@/geometry'
import { allText, openPdf, pageSizes } from '@/lib/booklet/test-support/read-pdf'
import { parseDesign } from '@/lib/schemas/design'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('the print room', () => {
  it('builds the demo wreath booklet on A4 in the browser and downloads it', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true })
    const page = await context.newPage()
    const pageErrors: string[] = []
    page.on('pageerror', (error) => pageErrors.push(String(error)))
    await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    await page.goto(`${baseUrl()}/patterns`)
    await page.getByRole('link', { name: 'Hollyberry Wreath' }).click()
    // The print dialog sits on the pattern page itself.
    await page.getByRole('link', { name: 'Print the booklet' }).click()
    await page.getByLabel('Paper').selectOption('a4')

    const download = page.waitForEvent('download')
    await page.getByRole('button', { name: 'Build and download PDF' }).click()
    const file = await (await download).path()
    const pdf = await openPdf(new Uint8Array(fs.readFileSync(file)))

    // ISO 216:2007: A4 is 210 × 297 mm = 595.28 × 841.89 pt (1 pt = 1/72 in, ISO 32000-1 §8.3.2.3).
    for (const [width, height] of await pageSizes(pdf)) {
      expect(width).toBeCloseTo(595.28, 1)
      expect(height).toBeCloseTo(841.89, 1)
    }
    // Every area label of the pattern's plan, as the geometry core computes it, is in the booklet.
    const id = new URL(page.url()).pathname.split('/')[2]!
    const saved = await page.evaluate(async (patternId) => (await fetch(`/api/patterns/${patternId}`)).json(), id)
    const parsed = parseDesign(saved.pattern.design)
    if (!parsed.ok) throw new Error('the demo wreath is not a valid design')
    const labels = planDesign(parsed.design).areas.map((area) => area.label)
    expect(labels.length).toBeGreaterThan(0)
    const text = await allText(pdf)
    expect(text).toContain('Hollyberry Wreath')
    for (const label of labels) expect(text).toContain(label)
    expect(text).toMatch(/100 ?%/)
    expect(pageErrors).toEqual([])

    // The print page of its own (for direct links) makes the same booklet, here on US Letter.
    await page.goto(`${baseUrl()}/patterns/${id}/print`)
    const letterDownload = page.waitForEvent('download')
    await page.getByRole('button', { name: 'Build and download PDF' }).click()
    const letter = await openPdf(new Uint8Array(fs.readFileSync(await (await letterDownload).path())))
    // ANSI Letter: 8.5 × 11 in = 612 × 792 pt.
    for (const [width, height] of await pageSizes(letter)) expect([width, height]).toEqual([612, 792])
    await context.close()
  })
})
