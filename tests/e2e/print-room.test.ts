import fs from 'node:fs'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { planDesign } from '@/geometry'
import { allText, openPdf, pageImages, pageSizes } from '@/lib/booklet/test-support/read-pdf'
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

    // The button waits for the A4 booklet: it downloads only the booklet previewed.
    const download = page.waitForEvent('download')
    await page.getByRole('button', { name: 'Download PDF' }).click()
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
    await page.getByRole('button', { name: 'Download PDF' }).click()
    const letter = await openPdf(new Uint8Array(fs.readFileSync(await (await letterDownload).path())))
    // ANSI Letter: 8.5 × 11 in = 612 × 792 pt.
    for (const [width, height] of await pageSizes(letter)) expect([width, height]).toEqual([612, 792])
    await context.close()
  })

  it('shows the pages as thumbnails that follow the options, and downloads the pages shown', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true })
    const page = await context.newPage()
    const pageErrors: string[] = []
    page.on('pageerror', (error) => pageErrors.push(String(error)))
    await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    await page.goto(`${baseUrl()}/patterns`)
    await page.getByRole('link', { name: 'Hollyberry Wreath' }).click()
    await page.getByRole('link', { name: 'Print the booklet' }).click()

    // Without touching anything, the booklet of the saved size on Letter is previewed.
    const first = await previewWhenReady(page)
    expect(first.thumbnails).toBeGreaterThan(1)
    expect(first.thumbnails).toBe(first.pageCount)
    expect(first.tiling.length).toBeGreaterThan(0)
    // Built off the main thread, in the app's own worker bundle.
    expect(await page.getByTestId('print-preview').getAttribute('data-built-in')).toBe('worker')
    await expectDrawnThumbnails(page, first.thumbnails)
    // Each thumbnail says which page it is and what it shows; foundation pages name the foundation and the sheet.
    const alts = await page.getByTestId('page-thumbnail').evaluateAll((images) => images.map((image) => image.getAttribute('alt') ?? ''))
    expect(alts[0]).toMatch(/^page 1: cover/)
    expect(alts.some((alt) => /^page \d+: foundation A, sheet 1 of \d+/.test(alt))).toBe(true)

    // Twice the diameter: each foundation is four times the area, so more pages and other tiles.
    const diameter = page.getByLabel(/Finished diameter/)
    const saved = Number(await diameter.inputValue())
    await diameter.fill(String(2 * saved))
    const larger = await previewWhenReady(page, first.pageCount)
    expect(larger.thumbnails).toBe(larger.pageCount)
    expect(larger.pageCount).toBeGreaterThan(first.pageCount)
    expect(larger.tiling).not.toEqual(first.tiling)
    await expectDrawnThumbnails(page, larger.thumbnails)

    // Letter to Tabloid (ANSI: 8.5 × 11 in to 11 × 17 in, a Letter page fits inside either way up): fewer pages.
    await page.getByLabel('Paper').selectOption('tabloid')
    const tabloid = await previewWhenReady(page, larger.pageCount)
    expect(tabloid.pageCount).toBeLessThan(larger.pageCount)
    expect(tabloid.thumbnails).toBe(tabloid.pageCount)

    // The download is the PDF previewed: as many pages as thumbnails, the same bytes.
    const download = page.waitForEvent('download')
    await page.getByRole('button', { name: 'Download PDF' }).click()
    const file = fs.readFileSync(await (await download).path())
    expect((await openPdf(new Uint8Array(file))).numPages).toBe(tabloid.thumbnails)
    expect(String(file.length)).toBe(await page.getByTestId('print-preview').getAttribute('data-booklet-bytes'))
    expect(pageErrors).toEqual([])
    await context.close()
  })

  it('works the fabric amounts out for the width of fabric and extra typed, and shows a colourway’s swatch image in the booklet', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true })
    const page = await context.newPage()
    const pageErrors: string[] = []
    page.on('pageerror', (error) => pageErrors.push(String(error)))
    await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    await page.goto(`${baseUrl()}/patterns`)
    await page.getByRole('link', { name: 'Hollyberry Wreath' }).click()
    await page.waitForURL(/\/patterns\/[^/]+$/)
    const wreathId = new URL(page.url()).pathname.split('/')[2]!
    // A copy of the wreath whose first colourway's background has a swatch: a 32 × 24 px image
    // uploaded through the app, as the fabric panel does (the copy keeps the demo pattern as it is).
    const copyId = await page.evaluate(async (id) => {
      const canvas = document.createElement('canvas')
      canvas.width = 32
      canvas.height = 24
      const drawing = canvas.getContext('2d')!
      drawing.fillStyle = '#7b2d26'
      drawing.fillRect(0, 0, 32, 24)
      const png = await new Promise<Blob>((resolve) => canvas.toBlob((blob) => resolve(blob!), 'image/png'))
      const uploaded = await fetch('/api/uploads?kind=swatch', { method: 'POST', headers: { 'content-type': 'image/png' }, body: png })
      if (uploaded.status !== 201) throw new Error(`the swatch was refused: ${uploaded.status} ${await uploaded.text()}`)
      const swatch = ((await uploaded.json()) as { upload: { id: string } }).upload.id
      const saved = await fetch(`/api/patterns/${id}`)
      if (!saved.ok) throw new Error(`the wreath could not be read: ${saved.status}`)
      const { pattern } = await saved.json()
      const design = pattern.design
      design.colorways[0].fabrics.background.swatch = swatch
      const created = await fetch('/api/patterns', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name: 'Hollyberry swatch proof', design }) })
      if (created.status !== 201) throw new Error(`the copy was refused: ${created.status} ${await created.text()}`)
      return ((await created.json()) as { pattern: { id: string } }).pattern.id
    }, wreathId)
    await page.goto(`${baseUrl()}/patterns/${copyId}/print`)
    await expect.poll(() => page.getByTestId('print-swatches').textContent(), { timeout: 15_000 }).toBe('The swatch image is shown beside the fabric colours.')

    // The demo wreath is drafted in inches: 20 in usable width, no extra.
    await page.getByLabel(/Usable width of fabric \(in\)/).fill('9')
    await expect.poll(() => page.locator('#print-status').textContent()).toContain('The usable width of fabric must be between 10 and 120 in.')
    await page.getByLabel(/Usable width of fabric \(in\)/).fill('20')
    await page.getByLabel('Extra (%)').fill('0')
    await previewWhenReady(page)
    const download = page.waitForEvent('download')
    await page.getByRole('button', { name: /Download PDF/ }).click()
    const pdf = await openPdf(new Uint8Array(fs.readFileSync(await (await download).path())))
    const text = await allText(pdf)
    // 20 in = 50.8 cm (1 in = 2.54 cm exactly).
    expect(text).toContain('Yardage for 20 in (50.8 cm) usable width of fabric, 0 % extra')
    expect(text).toContain('Strips cut across a 20 in usable width of fabric')
    // The swatch is drawn on the fabric page (twice: what to buy, cutting list) and on the cutting diagrams (once).
    let images = 0
    for (let number = 1; number <= pdf.numPages; number += 1) images += (await pageImages(pdf, number)).length
    expect(images).toBe(3)
    expect(pageErrors).toEqual([])
    await context.close()
  })
})

/**
 * Waits until the preview is ready (every thumbnail drawn), with a page count other than
 * `previousCount` when given, and reads it.
 */
async function previewWhenReady(page: Page, previousCount?: number): Promise<{ pageCount: number; thumbnails: number; tiling: string[] }> {
  await page.waitForFunction((previous) => {
    const match = /^Preview ready: (\d+) pages?\./.exec(document.querySelector('#print-status')?.textContent ?? '')
    return match !== null && Number(match[1]) !== previous
  }, previousCount ?? -1, { timeout: 30_000 })
  const pageCount = Number((await page.getByTestId('print-page-count').textContent())?.match(/\d+/)?.[0])
  const thumbnails = await page.getByTestId('page-thumbnail').count()
  const tiling = await page.getByTestId('print-tiling').getByRole('listitem').allTextContents()
  return { pageCount, thumbnails, tiling }
}

/** Every thumbnail is a loaded picture with pixels that are not white. */
async function expectDrawnThumbnails(page: Page, count: number): Promise<void> {
  await page.waitForFunction(() =>
    [...document.querySelectorAll<HTMLImageElement>('[data-testid="page-thumbnail"]')].every((image) => image.complete && image.naturalWidth > 0))
  const inked = await page.getByTestId('page-thumbnail').evaluateAll((images) =>
    (images as HTMLImageElement[]).map((image) => {
      if (!image.complete || image.naturalWidth === 0) return 0
      const canvas = document.createElement('canvas')
      canvas.width = image.naturalWidth
      canvas.height = image.naturalHeight
      const context = canvas.getContext('2d')!
      context.drawImage(image, 0, 0)
      const { data } = context.getImageData(0, 0, canvas.width, canvas.height)
      let dark = 0
      for (let i = 0; i < data.length; i += 4) if (data[i]! < 200 || data[i + 1]! < 200 || data[i + 2]! < 200) dark += 1
      return dark
    }),
  )
  expect(inked).toHaveLength(count)
  for (const pixels of inked) expect(pixels).toBeGreaterThan(0)
}
